import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Database roles (issue 9 §7): the server connects as `tallyrun_app`, which owns nothing and so
 * may not create tables. The monthly partitions of `readings` are still made on demand by the
 * ingest path; this function makes one as its owner (SECURITY DEFINER, owned by whoever runs the
 * migrations: `tallyrun_owner`). It is the app's only way to add a table, it adds exactly one kind,
 * with a name and bounds it computes itself from an instant, and only the app role may call it
 * (granted in server/db/roles.ts), so that is the least the app needs.
 *
 * Same steps as the writer did them itself before: the month's partition in UTC,
 * `readings_yYYYYmMM`; readings of that month that fell into the default partition move into it;
 * one maker at a time (advisory lock), and a partition already there is left alone.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE FUNCTION ensure_readings_partition(instant timestamptz) RETURNS text
      LANGUAGE plpgsql SECURITY DEFINER SET search_path = public, pg_temp SET "TimeZone" = 'UTC' AS $$
    DECLARE
      from_utc timestamp := date_trunc('month', instant AT TIME ZONE 'UTC');
      partition_name text := format('readings_y%sm%s', to_char(from_utc, 'YYYY'), to_char(from_utc, 'MM'));
      from_at timestamptz := from_utc AT TIME ZONE 'UTC';
      to_at timestamptz := (from_utc + interval '1 month') AT TIME ZONE 'UTC';
    BEGIN
      IF instant IS NULL THEN
        RAISE EXCEPTION 'ensure_readings_partition: instant is required' USING ERRCODE = 'null_value_not_allowed';
      END IF;
      IF EXISTS (SELECT 1 FROM pg_class WHERE relname = partition_name) THEN
        RETURN partition_name;
      END IF;
      PERFORM pg_advisory_xact_lock(hashtext('readings-partitions'));
      -- A new statement, a new snapshot: sees a partition another maker committed while we waited.
      IF EXISTS (SELECT 1 FROM pg_class WHERE relname = partition_name) THEN
        RETURN partition_name;
      END IF;
      EXECUTE format('CREATE TABLE %I (LIKE readings INCLUDING DEFAULTS INCLUDING CONSTRAINTS)', partition_name);
      EXECUTE format(
        'WITH moved AS (DELETE FROM readings_default WHERE time >= $1 AND time < $2 RETURNING *) INSERT INTO %I SELECT * FROM moved',
        partition_name) USING from_at, to_at;
      EXECUTE format('ALTER TABLE readings ATTACH PARTITION %I FOR VALUES FROM (%L) TO (%L)', partition_name, from_at, to_at);
      RETURN partition_name;
    END $$;
    REVOKE ALL ON FUNCTION ensure_readings_partition(timestamptz) FROM PUBLIC;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP FUNCTION ensure_readings_partition(timestamptz)');
};
