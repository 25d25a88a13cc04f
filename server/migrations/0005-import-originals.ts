import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Imported files are kept as part of the record (issue 9, item 3).
 *
 * - An import keeps its original file: `sha256` (hex, of the bytes uploaded) and `original_path`
 *   (where the file lies, relative to the data folder: `originals/<yyyy>/<mm>/<id>-<sha256>.csv`).
 *   Its name, size, uploader and upload time were already recorded (`filename`, `bytes_total`,
 *   `created_by`, `created_at`). Imports made before this migration have neither: their files
 *   were deleted after import.
 * - Field totals keep every version: `field_totals` still holds the value in force for a meter run
 *   and period (the newest import's), and `field_total_versions` keeps each value every import
 *   gave, with the import and the line of the file it came from. It is append-only, like the
 *   audit trail, so a re-import can no longer overwrite a figure without trace. The values in
 *   force today are copied in as the first versions (their lines are unknown).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE imports
      ADD COLUMN sha256        text CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      ADD COLUMN original_path text;

    CREATE TABLE field_total_versions (
      id           bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id bigint NOT NULL REFERENCES meter_runs (id),
      period_start timestamptz NOT NULL,
      period_end   timestamptz NOT NULL,
      quantity     text NOT NULL CHECK (quantity IN ('standard-volume', 'mass', 'energy')),
      -- SI: m³ at base conditions, kg or J
      value_si     double precision NOT NULL,
      import_id    bigint REFERENCES imports (id),
      line         integer,
      recorded_at  timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX field_total_versions_period ON field_total_versions (meter_run_id, period_start, period_end, id);

    INSERT INTO field_total_versions (meter_run_id, period_start, period_end, quantity, value_si, import_id)
      SELECT meter_run_id, period_start, period_end, q.quantity, q.value_si, import_id
        FROM field_totals,
             LATERAL (VALUES ('standard-volume', standard_volume_m3), ('mass', mass_kg), ('energy', energy_j))
               AS q (quantity, value_si)
       WHERE q.value_si IS NOT NULL
       ORDER BY meter_run_id, period_start, period_end;

    CREATE FUNCTION field_total_versions_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'field_total_versions is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER field_total_versions_append_only BEFORE UPDATE OR DELETE ON field_total_versions
      FOR EACH ROW EXECUTE FUNCTION field_total_versions_refuse_change();
    CREATE TRIGGER field_total_versions_no_truncate BEFORE TRUNCATE ON field_total_versions
      FOR EACH STATEMENT EXECUTE FUNCTION field_total_versions_refuse_change();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE field_total_versions;
    DROP FUNCTION field_total_versions_refuse_change();
    ALTER TABLE imports DROP COLUMN original_path, DROP COLUMN sha256;
  `);
};
