import type { Pool } from 'pg';
import { loadMeterRunContext, type MeterRunContext } from '../../history/load-context';
import type { DpBandName } from '../../../shared/history/types';

/** One hourly record as the range-health report reads it (SI units, epoch milliseconds). */
export interface RangeHealthHour {
  startMs: number;
  flowTimeS: number;
  massKg: number;
  standardVolumeM3: number;
  uncertaintyPercent: number | null;
  dpBands: Partial<Record<DpBandName, { timeS: number; massKg: number }>>;
  /** Seconds each DP transmitter (by id) was the one in use. */
  active: Record<string, number>;
  pressurePa: number | null;
  temperatureK: number | null;
}

interface HourlyRecordRow {
  start: Date;
  flow_time_s: number;
  mass_kg: number;
  standard_volume_m3: number;
  uncertainty_percent: number | null;
  dp_bands: RangeHealthHour['dpBands'] | null;
  active_transmitter_time: Record<string, number> | null;
  average_pressure_pa: number | null;
  average_temperature_k: number | null;
}

/** What the range-health report reads: the meter run's context, its transmitters' tags and its hourly records. */
export interface RangeHealthRepository {
  meterRunContext(meterRunId: string): Promise<MeterRunContext | null>;
  transmitterTags(meterRunId: string): Promise<Map<string, string>>;
  hourlyRecords(meterRunId: string, fromMs: number, toMs: number): Promise<RangeHealthHour[]>;
}

export function rangeHealthRepository(pool: Pool): RangeHealthRepository {
  return {
    meterRunContext: (meterRunId) => loadMeterRunContext(pool, meterRunId),

    async transmitterTags(meterRunId) {
      const { rows } = await pool.query<{ id: string; tag: string }>(
        'SELECT id::text, tag FROM transmitters WHERE meter_run_id = $1',
        [meterRunId],
      );
      return new Map(rows.map((r) => [r.id, r.tag]));
    },

    async hourlyRecords(meterRunId, fromMs, toMs) {
      const { rows } = await pool.query<HourlyRecordRow>(
        `SELECT start, flow_time_s, mass_kg, standard_volume_m3, uncertainty_percent, dp_bands, active_transmitter_time,
                average_pressure_pa, average_temperature_k
           FROM hourly_records
          WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0)
          ORDER BY start`,
        [meterRunId, fromMs, toMs],
      );
      return rows.map((r) => ({
        startMs: r.start.getTime(),
        flowTimeS: r.flow_time_s,
        massKg: r.mass_kg,
        standardVolumeM3: r.standard_volume_m3,
        uncertaintyPercent: r.uncertainty_percent,
        dpBands: r.dp_bands ?? {},
        active: r.active_transmitter_time ?? {},
        pressurePa: r.average_pressure_pa,
        temperatureK: r.average_temperature_k,
      }));
    },
  };
}
