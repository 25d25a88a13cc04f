import type { Pool, PoolClient } from 'pg';
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
  /** Sets the tolerance; returns the one it replaced, or null when the meter run does not exist. */
  setTolerance(meterRunId: string, tolerancePercent: number): Promise<number | null>;
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

    async setTolerance(meterRunId, tolerancePercent) {
      const { rows } = await pool.query<{ before: number }>(
        `UPDATE meter_runs m SET reconciliation_tolerance_percent = $2
           FROM (SELECT id, reconciliation_tolerance_percent AS before FROM meter_runs WHERE id = $1) old
          WHERE m.id = old.id
          RETURNING old.before`,
        [meterRunId, tolerancePercent],
      );
      return rows[0]?.before ?? null;
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
