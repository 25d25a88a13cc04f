import type { Pool } from 'pg';
import type { RecordCause } from '../../history/record-causes';
import type { PeriodFigures } from '../meter-run-history/repository';
import type { TotalStatus } from '../../../shared/history/types';
import type { VersionedInterval } from './schema';

/** The figures of one version of an hourly record or a total (SI units, epoch milliseconds). */
export interface StoredVersion extends PeriodFigures {
  version: number;
  cause: RecordCause;
  causeReference: string | null;
  /** The hour's configuration version; a total has none (null). */
  configVersionId: string | null;
  computedAtMs: number;
  /** When the next version replaced it; null for the version in force. */
  supersededAtMs: number | null;
}

/** Which total: the one starting at an instant, or the one a plain date names. */
export type PeriodSelector = { startMs: number } | { date: string };

interface VersionRow {
  version: number;
  cause: RecordCause;
  cause_reference: string | null;
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
  config_version_id: string | null;
  computed_at: Date;
  superseded_at: Date | null;
}

const figures = `start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage, flags,
  uncertainty_percent, version, cause, cause_reference, computed_at`;

const storedVersion = (r: VersionRow): StoredVersion => ({
  version: r.version,
  cause: r.cause,
  causeReference: r.cause_reference,
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
  configVersionId: r.config_version_id,
  computedAtMs: r.computed_at.getTime(),
  supersededAtMs: r.superseded_at ? r.superseded_at.getTime() : null,
});

const tables: Record<VersionedInterval, { table: string; keyColumn: string; dateKey: string }> = {
  day: { table: 'daily_totals', keyColumn: 'contract_day', dateKey: '$2::date' },
  month: { table: 'monthly_totals', keyColumn: 'month', dateKey: "date_trunc('month', $2::date)::date" },
};

/** What the versions of a meter run's records read: whether it exists, and every version of one record. */
export interface RecordVersionsRepository {
  meterRunExists(meterRunId: string): Promise<boolean>;
  /** Every version of the hour starting at `startMs`, oldest first (the one in force last); empty when there is no record. */
  hourlyVersions(meterRunId: string, startMs: number): Promise<StoredVersion[]>;
  /** Every version of the contract day or month selected, oldest first (the one in force last); empty when there is none. */
  periodVersions(meterRunId: string, interval: VersionedInterval, period: PeriodSelector): Promise<StoredVersion[]>;
}

export function recordVersionsRepository(pool: Pool): RecordVersionsRepository {
  return {
    async meterRunExists(meterRunId) {
      const { rowCount } = await pool.query('SELECT 1 FROM meter_runs WHERE id = $1', [meterRunId]);
      return rowCount === 1;
    },

    async hourlyVersions(meterRunId, startMs) {
      const { rows } = await pool.query<VersionRow>(
        `SELECT ${figures}, 1 AS hours, NULL::text AS status, config_version_id::text, superseded_at
           FROM hourly_record_versions WHERE meter_run_id = $1 AND start = to_timestamp($2 / 1000.0)
         UNION ALL
         SELECT ${figures}, 1, NULL, config_version_id::text, NULL
           FROM hourly_records WHERE meter_run_id = $1 AND start = to_timestamp($2 / 1000.0)
         ORDER BY version`,
        [meterRunId, startMs],
      );
      return rows.map(storedVersion);
    },

    async periodVersions(meterRunId, interval, period) {
      const { table, keyColumn, dateKey } = tables[interval];
      // The row in force is found by its start or its key; its versions share its key.
      const match = 'startMs' in period ? `start = to_timestamp($2 / 1000.0)` : `${keyColumn} = ${dateKey}`;
      const { rows } = await pool.query<VersionRow>(
        `WITH current AS (SELECT * FROM ${table} WHERE meter_run_id = $1 AND ${match})
         SELECT ${figures}, hours, status, NULL::text AS config_version_id, superseded_at
           FROM period_total_versions v
          WHERE v.meter_run_id = $1 AND v.kind = '${interval}' AND v.period = (SELECT ${keyColumn} FROM current)
         UNION ALL
         SELECT ${figures}, hours, status, NULL, NULL FROM current
         ORDER BY version`,
        [meterRunId, 'startMs' in period ? period.startMs : period.date],
      );
      return rows.map(storedVersion);
    },
  };
}
