import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Bi-directional meter runs (issue 13 §11).
 *
 * - `config_versions.reverse_element`: the element's constants in reverse flow; present ⇔ the meter
 *   run is bi-directional from that version's effective time (dated, so making a run bi-directional
 *   never rewrites the hours before). `direction_source`: how the direction is known, 'dp-sign' (a
 *   negative DP is reverse flow) or 'direction-input' (a transmitter measuring `flow-direction`);
 *   only with a reverse element.
 * - `transmitter_measure` gains 'flow-direction' (unit `sign`: > 0 forward, < 0 reverse, 0 no flow).
 * - `reverse`: the reverse-flow part of an hourly record or a period total (jsonb, NULL on a one-way
 *   meter run). The record's own figures stay forward flow; nothing is netted in a record. The column
 *   is among the figures a version copies, so a recompute that changes only the reverse part is a new
 *   version, never a silent overwrite: the trigger functions of 0022 (hours) and 0011 (totals) are
 *   re-created with it.
 *
 * down(): PostgreSQL cannot drop a value from an enum type, so 'flow-direction' stays in
 * `transmitter_measure` (unused once the columns are gone); everything else is restored as 0022 left it.
 */
const figures0007 = `"end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, average_dp_pa,
  average_pressure_pa, average_temperature_k, integral_value, coverage, flags, uncertainty_percent, config_version_id,
  integral_multiplier_value`;
const hourFigures0022 = `${figures0007}, uncertainty_budget`;
const hourFigures = `${hourFigures0022}, reverse`;
const totalFiguresButStatus0011 = `start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j,
  coverage, flags, uncertainty_percent`;
const totalFiguresButStatus = `${totalFiguresButStatus0011}, reverse`;
const prefixed = (columns: string, row: string) =>
  columns
    .split(',')
    .map((c) => `${row}.${c.trim()}`)
    .join(', ');

/** The two trigger functions of 0007/0022 that copy a record's figures into a version, over `figures`. */
const hourFunctions = (figures: string) => `
    CREATE OR REPLACE FUNCTION hourly_record_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (${prefixed(figures, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(figures, 'OLD')})
         OR coalesce(OLD.as_of, OLD.computed_at) < OLD."end" THEN
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      INSERT INTO hourly_record_versions (meter_run_id, start, version, ${figures}, dp_bands,
        active_transmitter_time, cause, cause_reference, computed_at)
      VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(figures, 'OLD')}, OLD.dp_bands,
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

    CREATE OR REPLACE FUNCTION hourly_record_keep_deleted() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF coalesce(OLD.as_of, OLD.computed_at) >= OLD."end" THEN
        INSERT INTO hourly_record_versions (meter_run_id, start, version, ${figures}, dp_bands,
          active_transmitter_time, cause, cause_reference, computed_at)
        VALUES (OLD.meter_run_id, OLD.start, OLD.version, ${prefixed(figures, 'OLD')}, OLD.dp_bands,
          OLD.active_transmitter_time, OLD.cause, OLD.cause_reference, OLD.computed_at);
      END IF;
      RETURN OLD;
    END $$;`;

/** The period-total trigger function of 0011 (a change of status alone to or from 'closed' is no change), over `butStatus`. */
const totalFunction = (butStatus: string) => {
  const figures = `${butStatus}, status`;
  return `
    CREATE OR REPLACE FUNCTION period_total_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      period_kind text := TG_ARGV[0];
      period_key date;
    BEGIN
      IF ((${prefixed(butStatus, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(butStatus, 'OLD')})
         AND (NEW.status IS NOT DISTINCT FROM OLD.status OR 'closed' IN (NEW.status, OLD.status)))
         OR OLD.status = 'provisional' THEN
        NEW.version := OLD.version;
        NEW.cause := OLD.cause;
        NEW.cause_reference := OLD.cause_reference;
        RETURN NEW;
      END IF;
      period_key := to_jsonb(OLD)->>(CASE WHEN period_kind = 'day' THEN 'contract_day' ELSE 'month' END);
      INSERT INTO period_total_versions (meter_run_id, kind, period, version, ${figures}, cause, cause_reference,
        computed_at)
      VALUES (OLD.meter_run_id, period_kind, period_key, OLD.version, ${prefixed(figures, 'OLD')}, OLD.cause,
        OLD.cause_reference, OLD.computed_at);
      NEW.version := OLD.version + 1;
      NEW.cause := coalesce(NEW.recompute_cause, 'correction');
      NEW.cause_reference := NEW.recompute_reference;
      RETURN NEW;
    END $$;`;
};

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TYPE transmitter_measure ADD VALUE IF NOT EXISTS 'flow-direction'`);
  await qi.sequelize.query(`
    ALTER TABLE config_versions
      ADD COLUMN reverse_element jsonb,
      ADD COLUMN direction_source text CHECK (direction_source IN ('dp-sign', 'direction-input')),
      ADD CONSTRAINT config_versions_direction_source_needs_reverse
        CHECK (direction_source IS NULL OR reverse_element IS NOT NULL);
    ALTER TABLE hourly_records ADD COLUMN reverse jsonb;
    ALTER TABLE hourly_record_versions ADD COLUMN reverse jsonb;
    ALTER TABLE daily_totals ADD COLUMN reverse jsonb;
    ALTER TABLE monthly_totals ADD COLUMN reverse jsonb;
    ALTER TABLE period_total_versions ADD COLUMN reverse jsonb;
    ${hourFunctions(hourFigures)}
    ${totalFunction(totalFiguresButStatus)}
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ${hourFunctions(hourFigures0022)}
    ${totalFunction(totalFiguresButStatus0011)}
    ALTER TABLE period_total_versions DROP COLUMN reverse;
    ALTER TABLE monthly_totals DROP COLUMN reverse;
    ALTER TABLE daily_totals DROP COLUMN reverse;
    ALTER TABLE hourly_record_versions DROP COLUMN reverse;
    ALTER TABLE hourly_records DROP COLUMN reverse;
    ALTER TABLE config_versions DROP CONSTRAINT config_versions_direction_source_needs_reverse,
      DROP COLUMN direction_source, DROP COLUMN reverse_element;
  `);
};
