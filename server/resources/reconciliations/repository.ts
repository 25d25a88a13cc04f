import pg, { type Pool, type PoolClient } from 'pg';
import type { FieldTotalQuantity } from '../../../shared/reconciliation/reconcile-day';

/** A meter run as reconciliation reads it. */
export interface ReconciliationMeterRun {
  id: string;
  tag: string;
  timeZone: string;
  tolerancePercent: number;
}

/** One quantity of one field total whose period is one of Tallyrun's contract days (SI values). */
export interface FieldTotalDay {
  startMs: number;
  endMs: number;
  quantity: FieldTotalQuantity;
  /** Tallyrun's daily total of the quantity (null: no energy without a heating value). */
  tallyrunSI: number | null;
  fieldSI: number;
  /** The unit of the field total as imported (null for versions imported before units were kept). */
  unit: string | null;
}

/** One dated version of a meter run's reconciliation tolerance. */
export interface ToleranceVersion {
  id: string;
  effectiveFromMs: number;
  tolerancePercent: number;
  reason: string;
  createdBy: string | null;
  createdAtMs: number;
}

interface ToleranceVersionRow {
  id: string;
  effective_from: Date;
  tolerance_percent: number;
  reason: string;
  created_by: string | null;
  created_at: Date;
}

const toleranceVersion = (r: ToleranceVersionRow): ToleranceVersion => ({
  id: r.id,
  effectiveFromMs: r.effective_from.getTime(),
  tolerancePercent: r.tolerance_percent,
  reason: r.reason,
  createdBy: r.created_by,
  createdAtMs: r.created_at.getTime(),
});

const toleranceVersionColumns = 'id::text, effective_from, tolerance_percent, reason, created_by::text, created_at';

/** The advisory lock key space of tolerance changes (one key per meter run; the table is append-only, so no row lock). */
const toleranceLockSpace = 7_200_512;

interface MeterRunRow {
  id: string;
  tag: string;
  time_zone: string;
  reconciliation_tolerance_percent: number;
}

interface FieldTotalDayRow {
  start: Date;
  end: Date;
  quantity: FieldTotalQuantity;
  tallyrun_si: number | null;
  field_si: number;
  unit: string | null;
}

export interface ReconciliationRepository {
  meterRun(meterRunId: string): Promise<ReconciliationMeterRun | null>;
  /** Field totals of contract days starting in [fromMs, toMs), oldest first, quantities in a fixed order. */
  fieldTotalDays(meterRunId: string, fromMs: number, toMs: number): Promise<FieldTotalDay[]>;
  /** When the meter run's history starts (its first configuration version), or null. */
  historyStart(meterRunId: string): Promise<Date | null>;
  /** The tolerance's dated versions, oldest first (ties: the later id wins, so it comes later). */
  toleranceVersions(meterRunId: string): Promise<ToleranceVersion[]>;
  /**
   * Appends a dated tolerance version (with a baseline from 2000-01-01 holding the value before,
   * when the meter run has none yet) and keeps the meter run's "in force now" figure in step, in
   * one transaction under the meter run's advisory lock.
   * @returns the version and the tolerance that was in force at its instant, or null when the meter run does not exist
   */
  addToleranceVersion(
    meterRunId: string,
    version: { effectiveFromMs: number; tolerancePercent: number; reason: string; createdBy: string },
  ): Promise<{ version: ToleranceVersion; before: number } | null>;
  /** Meter runs that have field totals (the alarm judges only these). */
  meterRunsWithFieldTotals(): Promise<string[]>;
  /** The end of the last day judged for the alarm, or null. */
  alarmWatermark(meterRunId: string): Promise<number | null>;
  setAlarmWatermark(meterRunId: string, judgedToMs: number): Promise<void>;
}

export function reconciliationRepository(pool: Pool | PoolClient): ReconciliationRepository {
  return {
    async meterRun(meterRunId) {
      const { rows } = await pool.query<MeterRunRow>(
        `SELECT m.id::text, m.tag, s.time_zone, m.reconciliation_tolerance_percent
           FROM meter_runs m JOIN sites s ON s.id = m.site_id
          WHERE m.id = $1`,
        [meterRunId],
      );
      const r = rows[0];
      return r
        ? { id: r.id, tag: r.tag, timeZone: r.time_zone, tolerancePercent: r.reconciliation_tolerance_percent }
        : null;
    },

    async fieldTotalDays(meterRunId, fromMs, toMs) {
      // A field total is reconciled when its period is exactly a contract day of the meter run's
      // daily totals; the unit is the one of the version in force (the newest of that quantity).
      const { rows } = await pool.query<FieldTotalDayRow>(
        `SELECT d.start, d."end", q.quantity, q.tallyrun_si, q.field_si,
                (SELECT v.unit FROM field_total_versions v
                  WHERE v.meter_run_id = f.meter_run_id AND v.period_start = f.period_start
                    AND v.period_end = f.period_end AND v.quantity = q.quantity
                  ORDER BY v.id DESC LIMIT 1) AS unit
           FROM field_totals f
           JOIN daily_totals d ON d.meter_run_id = f.meter_run_id AND d.start = f.period_start AND d."end" = f.period_end
          CROSS JOIN LATERAL (VALUES (1, 'standard-volume', d.standard_volume_m3, f.standard_volume_m3),
                                     (2, 'mass', d.mass_kg, f.mass_kg),
                                     (3, 'energy', d.energy_j, f.energy_j)) AS q (n, quantity, tallyrun_si, field_si)
          WHERE f.meter_run_id = $1 AND q.field_si IS NOT NULL
            AND f.period_start >= to_timestamp($2 / 1000.0) AND f.period_start < to_timestamp($3 / 1000.0)
          ORDER BY d.start, q.n`,
        [meterRunId, fromMs, toMs],
      );
      return rows.map((r) => ({
        startMs: r.start.getTime(),
        endMs: r.end.getTime(),
        quantity: r.quantity,
        tallyrunSI: r.tallyrun_si,
        fieldSI: r.field_si,
        unit: r.unit,
      }));
    },

    async historyStart(meterRunId) {
      const { rows } = await pool.query<{ start: Date | null }>(
        'SELECT min(effective_from) AS start FROM config_versions WHERE meter_run_id = $1',
        [meterRunId],
      );
      return rows[0]?.start ?? null;
    },

    async toleranceVersions(meterRunId) {
      const { rows } = await pool.query<ToleranceVersionRow>(
        `SELECT ${toleranceVersionColumns} FROM reconciliation_tolerance_versions
          WHERE meter_run_id = $1 ORDER BY effective_from, id`,
        [meterRunId],
      );
      return rows.map(toleranceVersion);
    },

    async addToleranceVersion(meterRunId, version) {
      // Its own transaction: only a pool can lend a connection for it (the alarm's client never writes tolerances).
      if (!(pool instanceof pg.Pool)) throw new Error('addToleranceVersion needs a pool, not a client');
      const client: PoolClient = await pool.connect();
      try {
        await client.query('BEGIN');
        await client.query('SELECT pg_advisory_xact_lock($1, $2::bigint::int)', [toleranceLockSpace, meterRunId]);
        const run = await client.query<{ now_percent: number }>(
          'SELECT reconciliation_tolerance_percent AS now_percent FROM meter_runs WHERE id = $1',
          [meterRunId],
        );
        if (!run.rows[0]) {
          await client.query('ROLLBACK');
          return null;
        }
        // A meter run created after tolerances were dated has no baseline yet: its tolerance so far
        // was the one on the meter run, in force from the start of history.
        await client.query(
          `INSERT INTO reconciliation_tolerance_versions (meter_run_id, effective_from, tolerance_percent, reason)
           SELECT $1, '2000-01-01T00:00:00Z', $2, 'the tolerance in force before the first dated change'
            WHERE NOT EXISTS (SELECT 1 FROM reconciliation_tolerance_versions WHERE meter_run_id = $1)`,
          [meterRunId, run.rows[0].now_percent],
        );
        const before = await client.query<{ tolerance_percent: number }>(
          `SELECT tolerance_percent FROM reconciliation_tolerance_versions
            WHERE meter_run_id = $1 AND effective_from <= to_timestamp($2 / 1000.0)
            ORDER BY effective_from DESC, id DESC LIMIT 1`,
          [meterRunId, version.effectiveFromMs],
        );
        const inserted = await client.query<ToleranceVersionRow>(
          `INSERT INTO reconciliation_tolerance_versions (meter_run_id, effective_from, tolerance_percent, reason, created_by)
           VALUES ($1, to_timestamp($2 / 1000.0), $3, $4, $5)
           RETURNING ${toleranceVersionColumns}`,
          [meterRunId, version.effectiveFromMs, version.tolerancePercent, version.reason, version.createdBy],
        );
        await client.query(
          `UPDATE meter_runs SET reconciliation_tolerance_percent = coalesce((
             SELECT tolerance_percent FROM reconciliation_tolerance_versions
              WHERE meter_run_id = $1 AND effective_from <= now()
              ORDER BY effective_from DESC, id DESC LIMIT 1), reconciliation_tolerance_percent)
            WHERE id = $1`,
          [meterRunId],
        );
        await client.query('COMMIT');
        return {
          version: toleranceVersion(inserted.rows[0]),
          before: before.rows[0]?.tolerance_percent ?? run.rows[0].now_percent,
        };
      } catch (err) {
        await client.query('ROLLBACK').catch(() => undefined);
        throw err;
      } finally {
        client.release();
      }
    },

    async meterRunsWithFieldTotals() {
      const { rows } = await pool.query<{ id: string }>(
        'SELECT DISTINCT meter_run_id::text AS id FROM field_totals ORDER BY 1',
      );
      return rows.map((r) => r.id);
    },

    async alarmWatermark(meterRunId) {
      const { rows } = await pool.query<{ judged_to: Date }>(
        'SELECT judged_to FROM reconciliation_alarm_watermarks WHERE meter_run_id = $1',
        [meterRunId],
      );
      return rows[0]?.judged_to.getTime() ?? null;
    },

    async setAlarmWatermark(meterRunId, judgedToMs) {
      await pool.query(
        `INSERT INTO reconciliation_alarm_watermarks (meter_run_id, judged_to) VALUES ($1, to_timestamp($2 / 1000.0))
         ON CONFLICT (meter_run_id) DO UPDATE SET judged_to = EXCLUDED.judged_to`,
        [meterRunId, judgedToMs],
      );
    },
  };
}
