import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Reconciliation against field totals (issue 10 §2).
 *
 * - `meter_runs.reconciliation_tolerance_percent`: how far (in percent of the field total) Tallyrun's
 *   contract-day total may differ from the field device's before the day is outside tolerance.
 *   A plain column: a change is audited (audit_events, before and after), not dated, because the
 *   tolerance judges a comparison and changes no figure.
 * - `field_total_versions.unit`: the unit the field device stated its total in, so Tallyrun's
 *   figure is shown in the same unit. Null on versions imported before this column (shown in SI).
 * - `reconciliation_alarm_watermarks`: per meter run, the end of the last contract day judged for
 *   the alarm `reconciliation-out-of-tolerance`; days are judged once, in order, like readings.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE meter_runs
      ADD COLUMN reconciliation_tolerance_percent double precision NOT NULL DEFAULT 0.5
        CHECK (reconciliation_tolerance_percent > 0 AND reconciliation_tolerance_percent <= 100);

    ALTER TABLE field_total_versions ADD COLUMN unit text;

    CREATE TABLE reconciliation_alarm_watermarks (
      meter_run_id bigint PRIMARY KEY REFERENCES meter_runs (id),
      judged_to    timestamptz NOT NULL
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE reconciliation_alarm_watermarks;
    ALTER TABLE field_total_versions DROP COLUMN unit;
    ALTER TABLE meter_runs DROP COLUMN reconciliation_tolerance_percent;
  `);
};
