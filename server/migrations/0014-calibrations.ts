import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Calibrations of transmitters (issue 11 §1). Append-only: a calibration once recorded stays as
 * recorded (the trigger refuses UPDATE and DELETE, and server/db/roles.ts takes those rights from
 * the app role for every table with an `…_append_only` trigger). A mistake is put right by a new
 * record that names the one it corrects (`corrects_id`); the corrected one is then no longer the
 * latest, but stays in the history.
 *
 * - Points (as found, as left) are JSON arrays of `{ appliedValue, indicatedValue, errorPercentOfSpan,
 *   tolerancePercentOfSpan, pass }` in the transmitter's unit; the error is the server's own
 *   computation, (indicated − applied) / span × 100, with the range kept beside them.
 * - The certificate, when there is one, is a file under `<data dir>/certificates` (its path
 *   relative to the data folder and its SHA-256); server/certificates/store.ts keeps it read-only.
 * - The calibration alarms read the latest calibration's `next_due` (transmitters.calibration_due
 *   stays the fallback for a transmitter without one).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE transmitter_calibrations (
      id                      bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      transmitter_id          bigint NOT NULL REFERENCES transmitters (id),
      calibrated_on           date NOT NULL,
      laboratory              text NOT NULL CHECK (length(btrim(laboratory)) > 0),
      accreditation_standard  text,
      accreditation_number    text,
      unit                    text NOT NULL,
      lower_range             double precision NOT NULL,
      upper_range             double precision NOT NULL CHECK (upper_range > lower_range),
      as_found                jsonb NOT NULL CHECK (jsonb_typeof(as_found) = 'array'),
      as_left                 jsonb NOT NULL CHECK (jsonb_typeof(as_left) = 'array'),
      as_found_pass           boolean NOT NULL,
      as_left_pass            boolean NOT NULL,
      performed_by            text NOT NULL CHECK (length(btrim(performed_by)) > 0),
      next_due                date NOT NULL,
      notes                   text,
      certificate_path        text,
      certificate_sha256      text CHECK (certificate_sha256 ~ '^[0-9a-f]{64}$'),
      certificate_type        text CHECK (certificate_type IN ('application/pdf', 'image/png', 'image/jpeg')),
      certificate_size_bytes  bigint,
      certificate_name        text,
      corrects_id             bigint REFERENCES transmitter_calibrations (id),
      created_by              bigint REFERENCES users (id),
      created_at              timestamptz NOT NULL DEFAULT now(),
      CHECK (next_due >= calibrated_on),
      CHECK ((certificate_path IS NULL) = (certificate_sha256 IS NULL))
    );
    CREATE INDEX transmitter_calibrations_transmitter ON transmitter_calibrations (transmitter_id, calibrated_on DESC, id DESC);
    CREATE UNIQUE INDEX transmitter_calibrations_corrects ON transmitter_calibrations (corrects_id);
    CREATE TRIGGER transmitter_calibrations_append_only BEFORE UPDATE OR DELETE ON transmitter_calibrations
      FOR EACH ROW EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER transmitter_calibrations_no_truncate BEFORE TRUNCATE ON transmitter_calibrations
      FOR EACH STATEMENT EXECUTE FUNCTION record_versions_append_only();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE transmitter_calibrations;');
};
