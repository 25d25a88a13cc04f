import type { Pool } from 'pg';
import type { DirectionPart, DpBandName, PeriodReverse, TotalStatus } from '../../../shared/history/types';
import type { TotalsInterval } from './schema';

/** The site calendar a meter run's contract days and months are counted in. */
export interface SiteCalendar {
  timeZone: string;
  contractHour: number;
  /** When the meter run's history starts (its first configuration version), epoch ms; null without one. */
  historyStartMs: number | null;
}

/** The figures of an hour, contract day or contract month (SI units, epoch milliseconds). */
export interface PeriodFigures {
  startMs: number;
  endMs: number;
  hours: number;
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
  coverage: number;
  flags: string[];
  uncertaintyPercent: number | null;
  /** Days and months store their status; an hour has none (null), it follows from the clock. */
  status: TotalStatus | null;
}

/** A stored total of an hour, contract day or contract month, with its place among its versions. */
export interface StoredTotal extends PeriodFigures {
  /** Reverse flow of a bi-directional meter run (migration 0024); null on a one-way one. The figures above are forward. */
  reverse: PeriodReverse | null;
  /** The record's version (1, 2, … — issue 9); null for a period with no record. */
  version: number | null;
  /** Mass and standard volume of version 1 (the current ones when there is no other); null with no record. */
  firstMassKg: number | null;
  firstStandardVolumeM3: number | null;
}

/** A stored hourly record with what only hours carry: averages, configuration, DP bands. */
export interface StoredHourlyRecord extends StoredTotal {
  averageDpPa: number | null;
  averagePressurePa: number | null;
  averageTemperatureK: number | null;
  integralValue: number | null;
  /** Integral multiplier value (API MPMS 21.1): massKg = IMV × IV × flowTimeS; null without flow or before issue 9. */
  integralMultiplierValue: number | null;
  configVersionId: string | null;
  dpBands: Partial<Record<DpBandName, { timeS: number; massKg: number }>>;
  activeTransmitterTimeS: Record<string, number>;
  computedAtMs: number;
  /**
   * The hour's uncertainty budget as stored with it (migration 0022): per term of U(qm)/qm, its share
   * in percent (k = 2) and its source; null for a record stored before budgets were kept.
   */
  uncertaintyBudget: StoredBudgetTerm[] | null;
  /** The hour's whole reverse part (migration 0024), null on a one-way meter run. */
  reversePart: DirectionPart | null;
}

/** One stored term of an hourly record's uncertainty budget (shared/history/types.ts HourlyRecord). */
export interface StoredBudgetTerm {
  name: string;
  percent: number;
  source: string;
}

/** A transmitter of the meter run as a trend shows it (range in its own unit). */
export interface TrendTransmitter {
  id: string;
  tag: string;
  measures: string;
  unit: string;
  stackRole: string;
  lowerRange: number;
  upperRange: number;
}

/** Readings of one time slice of a trend, reduced in the database; `bucket` counts from 1. */
export interface ReadingBucket {
  bucket: number;
  min: number;
  max: number;
  mean: number;
  count: number;
}

/** The flow of one hourly record: its bounds, mass, standard volume and coverage. */
export interface HourlyFlow {
  startMs: number;
  endMs: number;
  massKg: number;
  standardVolumeM3: number;
  coverage: number;
}

/** The hours of a meter run waiting for recomputation. */
export interface RecomputeQueue {
  pendingHours: number;
  oldestPendingMs: number | null;
}

interface TotalRow {
  start: Date;
  end: Date;
  hours: number;
  flow_time_s: number;
  mass_kg: number;
  volume_m3: number;
  standard_volume_m3: number;
  energy_j: number | null;
  coverage: number;
  flags: string[];
  uncertainty_percent: number | null;
  status: TotalStatus | null;
  version: number;
  first_mass_kg: number;
  first_standard_volume_m3: number;
  /** PeriodReverse for days and months; an hour stores its whole DirectionPart (a superset). */
  reverse: (PeriodReverse & Partial<DirectionPart>) | null;
}

interface HourlyRecordRow extends TotalRow {
  reverse: DirectionPart | null;
  average_dp_pa: number | null;
  average_pressure_pa: number | null;
  average_temperature_k: number | null;
  integral_value: number | null;
  integral_multiplier_value: number | null;
  config_version_id: string | null;
  dp_bands: StoredHourlyRecord['dpBands'];
  active_transmitter_time: Record<string, number>;
  computed_at: Date;
  uncertainty_budget: StoredBudgetTerm[] | null;
}

interface TrendTransmitterRow {
  id: string;
  tag: string;
  measures: string;
  unit: string;
  stack_role: string;
  lower_range: number;
  upper_range: number;
}

const totalColumns = `start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage, flags,
  uncertainty_percent, reverse`;
/** The version and version 1's mass and standard volume (from `withFirstVersion`). */
const versionColumns = `version, coalesce(v1_mass_kg, mass_kg) AS first_mass_kg,
  coalesce(v1_standard_volume_m3, standard_volume_m3) AS first_standard_volume_m3`;

/** Where each interval's totals are stored; an hourly record counts its length in hours (a part of an hour split at a version counts its share) and has no stored status. */
const totalsSource: Record<TotalsInterval, { table: string; columns: string }> = {
  hour: {
    table: 'hourly_records',
    columns: `${totalColumns}, extract(epoch FROM "end" - start)::float8 / 3600 AS hours, NULL::text AS status`,
  },
  day: { table: 'daily_totals', columns: `${totalColumns}, hours, status` },
  month: { table: 'monthly_totals', columns: `${totalColumns}, hours, status` },
};

/** Version 1 of each row where it was replaced (record versions, migration 0006): a primary-key lookup per row. */
const firstVersionJoin: Record<TotalsInterval, string> = {
  hour: `LEFT JOIN hourly_record_versions v1 ON v1.meter_run_id = t.meter_run_id AND v1.start = t.start AND v1.version = 1`,
  day: `LEFT JOIN period_total_versions v1 ON v1.meter_run_id = t.meter_run_id AND v1.kind = 'day' AND v1.period = t.contract_day AND v1.version = 1`,
  month: `LEFT JOIN period_total_versions v1 ON v1.meter_run_id = t.meter_run_id AND v1.kind = 'month' AND v1.period = t.month AND v1.version = 1`,
};

/** The rows of `interval`'s table matching `where` (on alias t), each with version 1's mass and standard volume. */
const withFirstVersion = (interval: TotalsInterval, where: string) =>
  `(SELECT t.*, v1.mass_kg AS v1_mass_kg, v1.standard_volume_m3 AS v1_standard_volume_m3
      FROM ${totalsSource[interval].table} t ${firstVersionJoin[interval]} WHERE ${where}) AS r`;

const storedTotal = (r: TotalRow): StoredTotal => ({
  startMs: r.start.getTime(),
  endMs: r.end.getTime(),
  hours: r.hours,
  flowTimeS: r.flow_time_s,
  massKg: r.mass_kg,
  volumeM3: r.volume_m3,
  standardVolumeM3: r.standard_volume_m3,
  energyJ: r.energy_j,
  coverage: r.coverage,
  flags: r.flags,
  uncertaintyPercent: r.uncertainty_percent,
  status: r.status,
  reverse: r.reverse
    ? {
        flowTimeS: r.reverse.flowTimeS,
        massKg: r.reverse.massKg,
        volumeM3: r.reverse.volumeM3,
        standardVolumeM3: r.reverse.standardVolumeM3,
        energyJ: r.reverse.energyJ,
      }
    : null,
  version: r.version,
  firstMassKg: r.first_mass_kg,
  firstStandardVolumeM3: r.first_standard_volume_m3,
});

/** What the history of a meter run reads: its site calendar, stored totals, hourly records, readings and queue. */
export interface MeterRunHistoryRepository {
  /** @returns null when the meter run does not exist */
  siteCalendar(meterRunId: string): Promise<SiteCalendar | null>;
  /** Totals of the interval overlapping [fromMs, toMs), oldest first. */
  totals(meterRunId: string, interval: TotalsInterval, fromMs: number, toMs: number): Promise<StoredTotal[]>;
  /** Hourly records starting in [fromMs, toMs), oldest first, at most `limit`. */
  hourlyRecords(meterRunId: string, fromMs: number, toMs: number, limit: number): Promise<StoredHourlyRecord[]>;
  recomputeQueue(meterRunId: string): Promise<RecomputeQueue>;
  transmitters(meterRunId: string): Promise<TrendTransmitter[]>;
  /** Min, max, mean and count of a transmitter's readings in each of `buckets` equal slices of [fromMs, toMs). */
  readingBuckets(transmitterId: string, fromMs: number, toMs: number, buckets: number): Promise<ReadingBucket[]>;
  /** The flow of the hourly records starting in [fromMs, toMs), oldest first. */
  hourlyFlows(meterRunId: string, fromMs: number, toMs: number): Promise<HourlyFlow[]>;
}

export function meterRunHistoryRepository(pool: Pool): MeterRunHistoryRepository {
  return {
    async siteCalendar(meterRunId) {
      const { rows } = await pool.query<{ time_zone: string; contract_hour: number; history_start: Date | null }>(
        `SELECT s.time_zone, s.contract_hour,
                (SELECT min(c.effective_from) FROM config_versions c WHERE c.meter_run_id = m.id) AS history_start
           FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = $1`,
        [meterRunId],
      );
      const row = rows[0];
      return row
        ? {
            timeZone: row.time_zone,
            contractHour: row.contract_hour,
            historyStartMs: row.history_start ? row.history_start.getTime() : null,
          }
        : null;
    },

    async totals(meterRunId, interval, fromMs, toMs) {
      const { columns } = totalsSource[interval];
      const { rows } = await pool.query<TotalRow>(
        `SELECT ${columns}, ${versionColumns}
           FROM ${withFirstVersion(interval, `t.meter_run_id = $1 AND t.start < to_timestamp($3 / 1000.0) AND t."end" > to_timestamp($2 / 1000.0)`)}
          ORDER BY start`,
        [meterRunId, fromMs, toMs],
      );
      return rows.map(storedTotal);
    },

    async hourlyRecords(meterRunId, fromMs, toMs, limit) {
      const { rows } = await pool.query<HourlyRecordRow>(
        `SELECT ${totalsSource.hour.columns}, average_dp_pa, average_pressure_pa, average_temperature_k, integral_value,
                integral_multiplier_value, config_version_id::text, dp_bands, active_transmitter_time, computed_at, uncertainty_budget,
                ${versionColumns}
           FROM ${withFirstVersion('hour', `t.meter_run_id = $1 AND t.start >= to_timestamp($2 / 1000.0) AND t.start < to_timestamp($3 / 1000.0)`)}
          ORDER BY start LIMIT $4`,
        [meterRunId, fromMs, toMs, limit],
      );
      return rows.map((r) => ({
        ...storedTotal(r),
        averageDpPa: r.average_dp_pa,
        averagePressurePa: r.average_pressure_pa,
        averageTemperatureK: r.average_temperature_k,
        integralValue: r.integral_value,
        integralMultiplierValue: r.integral_multiplier_value,
        configVersionId: r.config_version_id,
        dpBands: r.dp_bands,
        activeTransmitterTimeS: r.active_transmitter_time,
        computedAtMs: r.computed_at.getTime(),
        uncertaintyBudget: r.uncertainty_budget,
        reversePart: r.reverse,
      }));
    },

    async recomputeQueue(meterRunId) {
      const { rows } = await pool.query<{ n: number; oldest: Date | null }>(
        'SELECT count(*)::int AS n, min(start) AS oldest FROM stale_hours WHERE meter_run_id = $1',
        [meterRunId],
      );
      return { pendingHours: rows[0].n, oldestPendingMs: rows[0].oldest ? rows[0].oldest.getTime() : null };
    },

    async transmitters(meterRunId) {
      const { rows } = await pool.query<TrendTransmitterRow>(
        `SELECT id::text, tag, measures, unit, lower_range, upper_range, stack_role
           FROM transmitters WHERE meter_run_id = $1 ORDER BY transmitters.id`,
        [meterRunId],
      );
      return rows.map((r) => ({
        id: r.id,
        tag: r.tag,
        measures: r.measures,
        unit: r.unit,
        stackRole: r.stack_role,
        lowerRange: r.lower_range,
        upperRange: r.upper_range,
      }));
    },

    async readingBuckets(transmitterId, fromMs, toMs, buckets) {
      const { rows } = await pool.query<{ b: number; min: number; max: number; mean: number; n: number }>(
        `SELECT width_bucket(extract(epoch FROM time) * 1000, $2::float8, $3::float8, $4::int) AS b,
                min(value) AS min, max(value) AS max, avg(value) AS mean, count(*)::int AS n
           FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time < to_timestamp($3 / 1000.0)
          GROUP BY b ORDER BY b`,
        [transmitterId, fromMs, toMs, buckets],
      );
      return rows.map((r) => ({ bucket: r.b, min: r.min, max: r.max, mean: r.mean, count: r.n }));
    },

    async hourlyFlows(meterRunId, fromMs, toMs) {
      const { rows } = await pool.query<{
        start: Date;
        end: Date;
        mass_kg: number;
        standard_volume_m3: number;
        coverage: number;
      }>(
        `SELECT start, "end", mass_kg, standard_volume_m3, coverage FROM hourly_records
          WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0)
          ORDER BY start`,
        [meterRunId, fromMs, toMs],
      );
      return rows.map((r) => ({
        startMs: r.start.getTime(),
        endMs: r.end.getTime(),
        massKg: r.mass_kg,
        standardVolumeM3: r.standard_volume_m3,
        coverage: r.coverage,
      }));
    },
  };
}
