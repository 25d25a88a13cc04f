import type { Pool } from 'pg';
import type { PeriodReverse, TotalStatus } from '../../../shared/history/types';
import { periodIsClosed } from '../../history/closed-periods';

/** A site as the monthly volumes read it: its calendar, base conditions and display units. */
export interface VolumesSite {
  id: string;
  code: string;
  name: string;
  timeZone: string;
  contractHour: number;
  basePressurePa: number;
  baseTemperatureK: number;
  displayUnits: 'si' | 'us';
}

/** A meter run of the site. */
export interface VolumesMeterRun {
  id: string;
  tag: string;
  name: string;
}

/** A stored monthly total (SI units); `month` is YYYY-MM. */
export interface StoredMonthlyTotal {
  meterRunId: string;
  month: string;
  startMs: number;
  endMs: number;
  hours: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
  coverage: number;
  flags: string[];
  uncertaintyPercent: number | null;
  status: TotalStatus;
  version: number;
  /** Reverse flow of a bi-directional meter run's month (migration 0024); null one-way. The figures above are forward. */
  reverse: PeriodReverse | null;
}

interface SiteRow {
  id: string;
  code: string;
  name: string;
  time_zone: string;
  contract_hour: number;
  base_pressure_pa: number;
  base_temperature_k: number;
  display_units: 'si' | 'us';
}

interface MonthlyTotalRow {
  meter_run_id: string;
  month: string;
  start: Date;
  end: Date;
  hours: number;
  mass_kg: number;
  volume_m3: number;
  standard_volume_m3: number;
  energy_j: number | null;
  coverage: number;
  flags: string[];
  uncertainty_percent: number | null;
  status: TotalStatus;
  version: number;
  reverse: PeriodReverse | null;
}

/** What the monthly volumes read: the site, its meter runs, their monthly totals and corrections in force. */
export interface MonthlyVolumesRepository {
  /** @returns null when the site does not exist */
  site(siteId: string): Promise<VolumesSite | null>;
  meterRuns(siteId: string): Promise<VolumesMeterRun[]>;
  /** The stored monthly totals of the site's meter runs for the given months (YYYY-MM). */
  monthlyTotals(siteId: string, months: string[]): Promise<StoredMonthlyTotal[]>;
  /** Approved corrections overlapping [fromMs, toMs), counted per meter run id. */
  correctionsInForce(siteId: string, fromMs: number, toMs: number): Promise<Map<string, number>>;
  /** Whether the month of the meter run is closed (the periods hook of issue 9). */
  isClosed(meterRunId: string, fromMs: number, toMs: number): Promise<boolean>;
}

export function monthlyVolumesRepository(pool: Pool): MonthlyVolumesRepository {
  return {
    async site(siteId) {
      const { rows } = await pool.query<SiteRow>(
        `SELECT id::text, code, name, time_zone, contract_hour, base_pressure_pa, base_temperature_k, display_units
           FROM sites WHERE id = $1`,
        [siteId],
      );
      const r = rows[0];
      if (!r) return null;
      return {
        id: r.id,
        code: r.code,
        name: r.name,
        timeZone: r.time_zone,
        contractHour: r.contract_hour,
        basePressurePa: r.base_pressure_pa,
        baseTemperatureK: r.base_temperature_k,
        displayUnits: r.display_units,
      };
    },

    async meterRuns(siteId) {
      const { rows } = await pool.query<VolumesMeterRun>(
        'SELECT id::text, tag, name FROM meter_runs WHERE site_id = $1 ORDER BY tag',
        [siteId],
      );
      return rows;
    },

    async monthlyTotals(siteId, months) {
      const { rows } = await pool.query<MonthlyTotalRow>(
        `SELECT t.meter_run_id::text, to_char(t.month, 'YYYY-MM') AS month, t.start, t."end", t.hours, t.mass_kg,
                t.volume_m3, t.standard_volume_m3, t.energy_j, t.coverage, t.flags, t.uncertainty_percent, t.status,
                t.version, t.reverse
           FROM monthly_totals t JOIN meter_runs m ON m.id = t.meter_run_id
          WHERE m.site_id = $1 AND to_char(t.month, 'YYYY-MM') = ANY($2::text[])`,
        [siteId, months],
      );
      return rows.map((r) => ({
        meterRunId: r.meter_run_id,
        month: r.month,
        startMs: r.start.getTime(),
        endMs: r.end.getTime(),
        hours: r.hours,
        massKg: r.mass_kg,
        volumeM3: r.volume_m3,
        standardVolumeM3: r.standard_volume_m3,
        energyJ: r.energy_j,
        coverage: r.coverage,
        flags: r.flags,
        uncertaintyPercent: r.uncertainty_percent,
        status: r.status,
        version: r.version,
        reverse: r.reverse,
      }));
    },

    async correctionsInForce(siteId, fromMs, toMs) {
      const { rows } = await pool.query<{ meter_run_id: string; count: number }>(
        `SELECT c.meter_run_id::text, count(*)::int AS count
           FROM corrections c JOIN meter_runs m ON m.id = c.meter_run_id
          WHERE m.site_id = $1 AND c.status = 'approved'
            AND c.start < to_timestamp($3 / 1000.0) AND c."end" > to_timestamp($2 / 1000.0)
          GROUP BY c.meter_run_id`,
        [siteId, fromMs, toMs],
      );
      return new Map(rows.map((r) => [r.meter_run_id, r.count]));
    },

    isClosed: (meterRunId, fromMs, toMs) => periodIsClosed(pool, meterRunId, fromMs, toMs),
  };
}
