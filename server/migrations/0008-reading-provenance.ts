import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Reading provenance and conflicts of re-sent readings (issue 9, item 3).
 *
 * - Each reading carries where it came from: `device_id` (the device whose credentials published
 *   it over MQTT), `import_id` (the CSV import it came in with) and `arrived_at` (the server's
 *   receipt time). The columns are added to the partitioned parent, so they reach every monthly
 *   partition and the default one, and partitions made later (`LIKE readings INCLUDING DEFAULTS`)
 *   are made with them. Readings stored before this migration keep NULL in all three: their
 *   arrival is unknown, and stamping them with the migration's time would be false. The default
 *   is set after the columns are added for that reason.
 * - No foreign keys on these columns: a check per row would slow the hot ingest path, and a
 *   reading's provenance must stay readable even if its device is later removed.
 * - `reading_conflicts`: a reading re-sent for the same transmitter and time with another value or
 *   quality. The first reading stays stored; the offer is kept here beside a copy of what was
 *   stored, for an engineer to resolve (by a correction). An identical re-send (QoS 1 redelivery,
 *   a file imported twice) is no conflict. The same offer made again is recorded once (unique).
 * - `reading_conflict_resolutions`: one row per resolved conflict (who, when, why, and the
 *   correction that settled it, if any). A separate table rather than updatable columns on the
 *   conflict: both tables are then strictly append-only, as the audit trail, and "resolved once"
 *   is the primary key's guarantee, not an application check. A conflict is open while it has no
 *   resolution. `correction_id` has no foreign key yet: corrections come in migration 0009, which
 *   may add it.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE readings
      ADD COLUMN device_id  bigint,
      ADD COLUMN import_id  bigint,
      ADD COLUMN arrived_at timestamptz;
    ALTER TABLE readings ALTER COLUMN arrived_at SET DEFAULT now();

    ALTER TABLE imports ADD COLUMN conflicts bigint NOT NULL DEFAULT 0;

    CREATE TABLE reading_conflicts (
      id                 bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      transmitter_id     bigint NOT NULL REFERENCES transmitters (id),
      time               timestamptz NOT NULL,
      -- The reading kept (the first one), as it was stored, in the transmitter's own unit.
      stored_value       double precision NOT NULL,
      stored_quality     smallint NOT NULL,
      stored_source      smallint NOT NULL,
      stored_device_id   bigint,
      stored_import_id   bigint,
      stored_arrived_at  timestamptz,
      -- The reading offered later and not stored.
      offered_value      double precision NOT NULL,
      offered_quality    smallint NOT NULL,
      offered_source     smallint NOT NULL,
      offered_device_id  bigint,
      offered_import_id  bigint REFERENCES imports (id),
      offered_arrived_at timestamptz NOT NULL,
      recorded_at        timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE UNIQUE INDEX reading_conflicts_offer_key
      ON reading_conflicts (transmitter_id, time, offered_value, offered_quality);
    CREATE INDEX reading_conflicts_offered_import_idx ON reading_conflicts (offered_import_id)
      WHERE offered_import_id IS NOT NULL;

    CREATE TABLE reading_conflict_resolutions (
      conflict_id   bigint PRIMARY KEY REFERENCES reading_conflicts (id),
      resolution    text NOT NULL CHECK (btrim(resolution) <> ''),
      correction_id bigint,
      resolved_by   bigint NOT NULL REFERENCES users (id),
      resolved_at   timestamptz NOT NULL DEFAULT clock_timestamp()
    );

    CREATE FUNCTION reading_conflicts_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER reading_conflicts_append_only BEFORE UPDATE OR DELETE ON reading_conflicts
      FOR EACH ROW EXECUTE FUNCTION reading_conflicts_refuse_change();
    CREATE TRIGGER reading_conflicts_no_truncate BEFORE TRUNCATE ON reading_conflicts
      FOR EACH STATEMENT EXECUTE FUNCTION reading_conflicts_refuse_change();
    CREATE TRIGGER reading_conflict_resolutions_append_only BEFORE UPDATE OR DELETE ON reading_conflict_resolutions
      FOR EACH ROW EXECUTE FUNCTION reading_conflicts_refuse_change();
    CREATE TRIGGER reading_conflict_resolutions_no_truncate BEFORE TRUNCATE ON reading_conflict_resolutions
      FOR EACH STATEMENT EXECUTE FUNCTION reading_conflicts_refuse_change();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE reading_conflict_resolutions, reading_conflicts;
    DROP FUNCTION reading_conflicts_refuse_change();
    ALTER TABLE imports DROP COLUMN conflicts;
    ALTER TABLE readings DROP COLUMN device_id, DROP COLUMN import_id, DROP COLUMN arrived_at;
  `);
};
