import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * The reconciliation tolerance as a dated setting (the rule of issue 9: no setting changes the
 * past without a dated version). A contract day is judged against the version in force at its
 * start; a new tolerance judges the days from its `effective_from` on and leaves earlier verdicts
 * as they were. Versions are append-only (a mistyped one is followed by another, the later id
 * winning at the same instant); `meter_runs.reconciliation_tolerance_percent` stays "the value in
 * force now" for the screens that show one figure.
 *
 * Every existing meter run gets one version in force from 2000-01-01 (the start of history used
 * for meter runs created without an effective date) with the tolerance it had.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE reconciliation_tolerance_versions (
      id                bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id      bigint NOT NULL REFERENCES meter_runs (id),
      effective_from    timestamptz NOT NULL,
      tolerance_percent double precision NOT NULL CHECK (tolerance_percent > 0 AND tolerance_percent <= 100),
      created_by        bigint REFERENCES users (id),
      reason            text NOT NULL DEFAULT '',
      created_at        timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE INDEX reconciliation_tolerance_versions_idx
      ON reconciliation_tolerance_versions (meter_run_id, effective_from, id);
    CREATE TRIGGER reconciliation_tolerance_versions_append_only BEFORE UPDATE OR DELETE ON reconciliation_tolerance_versions
      FOR EACH ROW EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER reconciliation_tolerance_versions_no_truncate BEFORE TRUNCATE ON reconciliation_tolerance_versions
      FOR EACH STATEMENT EXECUTE FUNCTION record_versions_append_only();

    INSERT INTO reconciliation_tolerance_versions (meter_run_id, effective_from, tolerance_percent, reason)
    SELECT id, '2000-01-01T00:00:00Z', reconciliation_tolerance_percent, 'the tolerance in force before tolerances were dated'
      FROM meter_runs ORDER BY id;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE reconciliation_tolerance_versions;');
};
