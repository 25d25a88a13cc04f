import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Record versions (issue 9): an hourly record or a contract-day or contract-month total is never
 * overwritten silently. `hourly_records`, `daily_totals` and `monthly_totals` keep the figures in
 * force, and gain `version` (1, 2, …) and `cause` / `cause_reference` (what made this version:
 * 'initial', 'late-readings', 'configuration-version' with the version's id, 'correction',
 * 'reopen', 'scheduled'). When a recompute changes the figures of a final record, the figures it
 * replaces are copied into `hourly_record_versions` or `period_total_versions` first.
 *
 * - The copy is made by a BEFORE UPDATE trigger, not by the worker's SQL: it sees the exact row it
 *   replaces under the row lock (two rounds rolling up the same day cannot both take version 3),
 *   and every path that updates a record (the worker, a later correction, a hand-written UPDATE)
 *   keeps the old figures. Nothing is copied when the figures are equal, so a recompute that
 *   changes nothing adds no version.
 * - A running figure is not a record yet: an hour computed before it ended (`as_of` < `end`) and
 *   a total still provisional (its period running, or an hour of it not recorded) are replaced
 *   without a version, or a live hour would keep a version every ten seconds. Once an hour has
 *   been computed to its end, or a total is complete, every change keeps a version.
 * - The writer of a recompute says why in `recompute_cause` / `recompute_reference` (the stale-hours
 *   queue's reason); it becomes the cause of the new version only if the figures changed. A
 *   different configuration version in an hour's record is itself the cause
 *   ('configuration-version', with its id), unless a correction or a reopen queued the hour.
 * - `stale_hours.cause`: why an hour waits. Its default, 'late-readings', is what the reading
 *   writer means (its hot statement stays as it is); an hour with no record yet gets version 1,
 *   cause 'initial', whatever queued it.
 * - The versions tables are append-only (UPDATE, DELETE and TRUNCATE refused), as the audit trail.
 */
const hourFigures = `"end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, average_dp_pa,
  average_pressure_pa, average_temperature_k, integral_value, coverage, flags, uncertainty_percent, config_version_id`;
const totalFigures = `start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage,
  flags, uncertainty_percent, status`;
const prefixed = (columns: string, row: string) =>
  columns
    .split(',')
    .map((c) => `${row}.${c.trim()}`)
    .join(', ');

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE stale_hours
      ADD COLUMN cause           text NOT NULL DEFAULT 'late-readings',
      ADD COLUMN cause_reference text;

    ALTER TABLE hourly_records
      ADD COLUMN version             integer NOT NULL DEFAULT 1,
      ADD COLUMN cause               text NOT NULL DEFAULT 'initial',
      ADD COLUMN cause_reference     text,
      ADD COLUMN recompute_cause     text,
      ADD COLUMN recompute_reference text,
      ADD COLUMN as_of               timestamptz;
    ALTER TABLE daily_totals
      ADD COLUMN version             integer NOT NULL DEFAULT 1,
      ADD COLUMN cause               text NOT NULL DEFAULT 'initial',
      ADD COLUMN cause_reference     text,
      ADD COLUMN recompute_cause     text,
      ADD COLUMN recompute_reference text;
    ALTER TABLE monthly_totals
      ADD COLUMN version             integer NOT NULL DEFAULT 1,
      ADD COLUMN cause               text NOT NULL DEFAULT 'initial',
      ADD COLUMN cause_reference     text,
      ADD COLUMN recompute_cause     text,
      ADD COLUMN recompute_reference text;

    -- Every superseded version of an hourly record: its figures, what made it, when it was
    -- computed and when it was replaced (the next version says why).
    CREATE TABLE hourly_record_versions (
      meter_run_id          bigint NOT NULL REFERENCES meter_runs (id),
      start                 timestamptz NOT NULL,
      version               integer NOT NULL,
      "end"                 timestamptz NOT NULL,
      flow_time_s           double precision NOT NULL,
      mass_kg               double precision NOT NULL,
      volume_m3             double precision NOT NULL,
      standard_volume_m3    double precision NOT NULL,
      energy_j              double precision,
      average_dp_pa         double precision,
      average_pressure_pa   double precision,
      average_temperature_k double precision,
      integral_value        double precision,
      coverage              double precision NOT NULL,
      flags                 text[] NOT NULL,
      uncertainty_percent   double precision,
      config_version_id     bigint REFERENCES config_versions (id),
      dp_bands              jsonb NOT NULL,
      active_transmitter_time jsonb NOT NULL,
      cause                 text NOT NULL,
      cause_reference       text,
      computed_at           timestamptz NOT NULL,
      superseded_at         timestamptz NOT NULL DEFAULT clock_timestamp(),
      PRIMARY KEY (meter_run_id, start, version)
    );

    -- Every superseded version of a contract-day ('day') or contract-month ('month') total.
    CREATE TABLE period_total_versions (
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      kind                text NOT NULL CHECK (kind IN ('day', 'month')),
      period              date NOT NULL,
      version             integer NOT NULL,
      start               timestamptz NOT NULL,
      "end"               timestamptz NOT NULL,
      hours               smallint NOT NULL,
      flow_time_s         double precision NOT NULL,
      mass_kg             double precision NOT NULL,
      volume_m3           double precision NOT NULL,
      standard_volume_m3  double precision NOT NULL,
      energy_j            double precision,
      coverage            double precision NOT NULL,
      flags               text[] NOT NULL,
      uncertainty_percent double precision,
      status              text NOT NULL,
      cause               text NOT NULL,
      cause_reference     text,
      computed_at         timestamptz NOT NULL,
      superseded_at       timestamptz NOT NULL DEFAULT clock_timestamp(),
      PRIMARY KEY (meter_run_id, kind, period, version)
    );

    CREATE FUNCTION hourly_record_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (${prefixed(hourFigures, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(hourFigures, 'OLD')})
         OR coalesce(OLD.as_of, OLD.computed_at) < OLD."end" THEN
        -- Same figures, or a running hour replaced: the version and its cause stay.
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      INSERT INTO hourly_record_versions (meter_run_id, start, version, ${hourFigures}, dp_bands,
        active_transmitter_time, cause, cause_reference, computed_at)
      VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(hourFigures, 'OLD')}, OLD.dp_bands,
        OLD.active_transmitter_time, OLD.cause, OLD.cause_reference, OLD.computed_at);
      NEW.version := OLD.version + 1;
      IF NEW.config_version_id IS DISTINCT FROM OLD.config_version_id
         AND coalesce(NEW.recompute_cause, 'scheduled') IN ('late-readings', 'scheduled', 'configuration-version') THEN
        NEW.cause := 'configuration-version';
        NEW.cause_reference := NEW.config_version_id::text;
      ELSE
        NEW.cause := coalesce(NEW.recompute_cause, 'correction');
        NEW.cause_reference := NEW.recompute_reference;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER hourly_records_keep_version BEFORE UPDATE ON hourly_records
      FOR EACH ROW EXECUTE FUNCTION hourly_record_keep_version();

    -- TG_ARGV[0]: 'day' or 'month'.
    CREATE FUNCTION period_total_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      period_kind text := TG_ARGV[0];
      period_key date;
    BEGIN
      IF (${prefixed(totalFigures, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(totalFigures, 'OLD')})
         OR OLD.status = 'provisional' THEN
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      period_key := to_jsonb(OLD)->>(CASE WHEN period_kind = 'day' THEN 'contract_day' ELSE 'month' END);
      INSERT INTO period_total_versions (meter_run_id, kind, period, version, ${totalFigures}, cause, cause_reference,
        computed_at)
      VALUES (OLD.meter_run_id, period_kind, period_key, OLD.version, ${prefixed(totalFigures, 'OLD')}, OLD.cause,
        OLD.cause_reference, OLD.computed_at);
      NEW.version := OLD.version + 1;
      NEW.cause := coalesce(NEW.recompute_cause, 'correction');
      NEW.cause_reference := NEW.recompute_reference;
      RETURN NEW;
    END $$;
    CREATE TRIGGER daily_totals_keep_version BEFORE UPDATE ON daily_totals
      FOR EACH ROW EXECUTE FUNCTION period_total_keep_version('day');
    CREATE TRIGGER monthly_totals_keep_version BEFORE UPDATE ON monthly_totals
      FOR EACH ROW EXECUTE FUNCTION period_total_keep_version('month');

    CREATE FUNCTION record_versions_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP;
    END $$;
    CREATE TRIGGER hourly_record_versions_append_only BEFORE UPDATE OR DELETE ON hourly_record_versions
      FOR EACH ROW EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER hourly_record_versions_no_truncate BEFORE TRUNCATE ON hourly_record_versions
      FOR EACH STATEMENT EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER period_total_versions_append_only BEFORE UPDATE OR DELETE ON period_total_versions
      FOR EACH ROW EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER period_total_versions_no_truncate BEFORE TRUNCATE ON period_total_versions
      FOR EACH STATEMENT EXECUTE FUNCTION record_versions_append_only();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE period_total_versions, hourly_record_versions;
    DROP TRIGGER hourly_records_keep_version ON hourly_records;
    DROP TRIGGER daily_totals_keep_version ON daily_totals;
    DROP TRIGGER monthly_totals_keep_version ON monthly_totals;
    DROP FUNCTION record_versions_append_only(), period_total_keep_version(), hourly_record_keep_version();
    ALTER TABLE hourly_records DROP COLUMN version, DROP COLUMN cause, DROP COLUMN cause_reference,
      DROP COLUMN recompute_cause, DROP COLUMN recompute_reference, DROP COLUMN as_of;
    ALTER TABLE daily_totals DROP COLUMN version, DROP COLUMN cause, DROP COLUMN cause_reference,
      DROP COLUMN recompute_cause, DROP COLUMN recompute_reference;
    ALTER TABLE monthly_totals DROP COLUMN version, DROP COLUMN cause, DROP COLUMN cause_reference,
      DROP COLUMN recompute_cause, DROP COLUMN recompute_reference;
    ALTER TABLE stale_hours DROP COLUMN cause, DROP COLUMN cause_reference;
  `);
};
