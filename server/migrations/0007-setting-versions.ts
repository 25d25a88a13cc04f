import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Effective-dated settings (issue 9 §2, §4). Until now only the element and fluid
 * (config_versions) were dated; a re-range, a new hold limit or a new base pressure changed every
 * past hour at its next recompute. Each setting that shapes a result now has a dated version
 * table, append-only like the record versions of 0006:
 * - `transmitter_range_versions`: a transmitter's lower and upper range and accuracy;
 * - `meter_run_setting_versions`: hold limit, largest gap, no-flow cutoff (share of the DP span,
 *   a new column, formerly a constant 0.005) and the stacked pair's switch shares;
 * - `site_setting_versions`: contract hour, base conditions and atmospheric pressure.
 * The base tables keep their columns as "the latest values" (every other reader keeps working);
 * the set-up use cases write both together. Several versions may share an instant: the later one
 * (higher id) wins, so a mistyped version is corrected by another rather than by an UPDATE.
 * Existing rows get one version effective from the start of their meter run's history
 * (its first configuration version, or 2000-01-01 when that is later).
 *
 * Hourly records (API MPMS 21.1) are now split at every instant inside an hour where a version
 * takes effect, one record per part, keyed by the part's start. So:
 * - `integral_multiplier_value` is stored with each record (quantity = IMV × IV × flow time);
 * - deleting a record (a part that no longer exists after a version moved) keeps it as a version
 *   first, like an UPDATE does, and a record inserted again at a start that has versions continues
 *   their numbering, so nothing disappears without a trace.
 */
const versionedFigures = `"end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, average_dp_pa,
  average_pressure_pa, average_temperature_k, integral_value, coverage, flags, uncertainty_percent, config_version_id,
  integral_multiplier_value`;
const prefixed = (columns: string, row: string) =>
  columns
    .split(',')
    .map((c) => `${row}.${c.trim()}`)
    .join(', ');

/** The start of a meter run's history: its first configuration version, or 2000-01-01 if that is later. */
const historyStart = (meterRunId: string) =>
  `least(timestamptz '2000-01-01T00:00:00Z',
         coalesce((SELECT min(c.effective_from) FROM config_versions c WHERE c.meter_run_id = ${meterRunId}),
                  timestamptz '2000-01-01T00:00:00Z'))`;

const appendOnly = (table: string) => `
    CREATE TRIGGER ${table}_append_only BEFORE UPDATE OR DELETE ON ${table}
      FOR EACH ROW EXECUTE FUNCTION record_versions_append_only();
    CREATE TRIGGER ${table}_no_truncate BEFORE TRUNCATE ON ${table}
      FOR EACH STATEMENT EXECUTE FUNCTION record_versions_append_only();`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE meter_runs ADD COLUMN no_flow_cutoff_share double precision NOT NULL DEFAULT 0.005;
    ALTER TABLE hourly_records ADD COLUMN integral_multiplier_value double precision;
    ALTER TABLE hourly_record_versions ADD COLUMN integral_multiplier_value double precision;

    CREATE TABLE transmitter_range_versions (
      id                       bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      transmitter_id           bigint NOT NULL REFERENCES transmitters (id),
      effective_from           timestamptz NOT NULL,
      lower_range              double precision NOT NULL,
      upper_range              double precision NOT NULL,
      accuracy_percent_of_span double precision NOT NULL,
      created_by               bigint REFERENCES users (id),
      reason                   text NOT NULL DEFAULT '',
      created_at               timestamptz NOT NULL DEFAULT now(),
      CHECK (upper_range > lower_range)
    );
    CREATE INDEX transmitter_range_versions_idx ON transmitter_range_versions (transmitter_id, effective_from);

    CREATE TABLE meter_run_setting_versions (
      id                      bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id            bigint NOT NULL REFERENCES meter_runs (id),
      effective_from          timestamptz NOT NULL,
      hold_limit_s            double precision NOT NULL CHECK (hold_limit_s > 0),
      max_gap_s               double precision NOT NULL CHECK (max_gap_s > 0),
      no_flow_cutoff_share    double precision NOT NULL CHECK (no_flow_cutoff_share >= 0 AND no_flow_cutoff_share < 1),
      stack_switch_up_share   double precision NOT NULL,
      stack_switch_down_share double precision NOT NULL,
      created_by              bigint REFERENCES users (id),
      reason                  text NOT NULL DEFAULT '',
      created_at              timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX meter_run_setting_versions_idx ON meter_run_setting_versions (meter_run_id, effective_from);

    CREATE TABLE site_setting_versions (
      id                      bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id                 bigint NOT NULL REFERENCES sites (id),
      effective_from          timestamptz NOT NULL,
      contract_hour           smallint NOT NULL CHECK (contract_hour BETWEEN 0 AND 23),
      base_pressure_pa        double precision NOT NULL,
      base_temperature_k      double precision NOT NULL,
      atmospheric_pressure_pa double precision NOT NULL,
      created_by              bigint REFERENCES users (id),
      reason                  text NOT NULL DEFAULT '',
      created_at              timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX site_setting_versions_idx ON site_setting_versions (site_id, effective_from);

    INSERT INTO transmitter_range_versions (transmitter_id, effective_from, lower_range, upper_range,
      accuracy_percent_of_span, reason)
    SELECT t.id, ${historyStart('t.meter_run_id')}, t.lower_range, t.upper_range, t.accuracy_percent_of_span,
           'the transmitter as it was when settings became dated'
      FROM transmitters t;
    INSERT INTO meter_run_setting_versions (meter_run_id, effective_from, hold_limit_s, max_gap_s, no_flow_cutoff_share,
      stack_switch_up_share, stack_switch_down_share, reason)
    SELECT m.id, ${historyStart('m.id')}, m.hold_limit_s, m.max_gap_s, m.no_flow_cutoff_share, m.stack_switch_up_share,
           m.stack_switch_down_share, 'the meter run as it was when settings became dated'
      FROM meter_runs m;
    INSERT INTO site_setting_versions (site_id, effective_from, contract_hour, base_pressure_pa, base_temperature_k,
      atmospheric_pressure_pa, reason)
    SELECT s.id,
           least(timestamptz '2000-01-01T00:00:00Z',
                 coalesce((SELECT min(c.effective_from) FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id
                            WHERE m.site_id = s.id), timestamptz '2000-01-01T00:00:00Z')),
           s.contract_hour, s.base_pressure_pa, s.base_temperature_k, s.atmospheric_pressure_pa,
           'the site as it was when settings became dated'
      FROM sites s;
    ${appendOnly('transmitter_range_versions')}
    ${appendOnly('meter_run_setting_versions')}
    ${appendOnly('site_setting_versions')}

    -- As in 0006, with the integral multiplier value among the figures a version keeps.
    CREATE OR REPLACE FUNCTION hourly_record_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (${prefixed(versionedFigures, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(versionedFigures, 'OLD')})
         OR coalesce(OLD.as_of, OLD.computed_at) < OLD."end" THEN
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      INSERT INTO hourly_record_versions (meter_run_id, start, version, ${versionedFigures}, dp_bands,
        active_transmitter_time, cause, cause_reference, computed_at)
      VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(versionedFigures, 'OLD')}, OLD.dp_bands,
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

    -- A part of an hour that no longer exists (its version instant moved) is kept as a version
    -- before it goes; a running figure is not a record yet and goes without one.
    CREATE FUNCTION hourly_record_keep_deleted() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF coalesce(OLD.as_of, OLD.computed_at) >= OLD."end" THEN
        INSERT INTO hourly_record_versions (meter_run_id, start, version, ${versionedFigures}, dp_bands,
          active_transmitter_time, cause, cause_reference, computed_at)
        VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(versionedFigures, 'OLD')}, OLD.dp_bands,
          OLD.active_transmitter_time, OLD.cause, OLD.cause_reference, OLD.computed_at);
      END IF;
      RETURN OLD;
    END $$;
    CREATE TRIGGER hourly_records_keep_deleted BEFORE DELETE ON hourly_records
      FOR EACH ROW EXECUTE FUNCTION hourly_record_keep_deleted();

    -- A record stored again at a start whose earlier record was deleted continues its versions.
    CREATE FUNCTION hourly_record_continue_versions() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      last_version integer;
    BEGIN
      SELECT max(version) INTO last_version FROM hourly_record_versions
       WHERE meter_run_id = NEW.meter_run_id AND start = NEW.start;
      IF last_version IS NOT NULL THEN
        NEW.version := last_version + 1;
        NEW.cause := coalesce(NEW.recompute_cause, 'scheduled');
        NEW.cause_reference := NEW.recompute_reference;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER hourly_records_continue_versions BEFORE INSERT ON hourly_records
      FOR EACH ROW EXECUTE FUNCTION hourly_record_continue_versions();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const figures0006 = versionedFigures.replace(/,\s*integral_multiplier_value/, '');
  await qi.sequelize.query(`
    DROP TRIGGER hourly_records_continue_versions ON hourly_records;
    DROP TRIGGER hourly_records_keep_deleted ON hourly_records;
    DROP FUNCTION hourly_record_continue_versions(), hourly_record_keep_deleted();
    CREATE OR REPLACE FUNCTION hourly_record_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (${prefixed(figures0006, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(figures0006, 'OLD')})
         OR coalesce(OLD.as_of, OLD.computed_at) < OLD."end" THEN
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      INSERT INTO hourly_record_versions (meter_run_id, start, version, ${figures0006}, dp_bands,
        active_transmitter_time, cause, cause_reference, computed_at)
      VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(figures0006, 'OLD')}, OLD.dp_bands,
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
    DROP TABLE site_setting_versions, meter_run_setting_versions, transmitter_range_versions;
    ALTER TABLE hourly_record_versions DROP COLUMN integral_multiplier_value;
    ALTER TABLE hourly_records DROP COLUMN integral_multiplier_value;
    ALTER TABLE meter_runs DROP COLUMN no_flow_cutoff_share;
  `);
};
