import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Each hourly record keeps its uncertainty budget (issue 13 §8): the terms of U(qm)/qm (ISO
 * 5167-1:2003 §8), each with its share in percent (k = 2) and where its input comes from, as a jsonb
 * array `[{ name, percent, source }]`. A record version keeps the budget it had: the column is among
 * the figures a version copies (0006, 0007), so a recompute that changes only the budget is a new
 * version, not a silent overwrite. Records stored before this migration have no budget (NULL).
 */
const figures0007 = `"end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, average_dp_pa,
  average_pressure_pa, average_temperature_k, integral_value, coverage, flags, uncertainty_percent, config_version_id,
  integral_multiplier_value`;
const versionedFigures = `${figures0007}, uncertainty_budget`;
const prefixed = (columns: string, row: string) =>
  columns
    .split(',')
    .map((c) => `${row}.${c.trim()}`)
    .join(', ');

/** The two trigger functions of 0007 that copy a record's figures into a version, over `figures`. */
const keepFunctions = (figures: string) => `
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

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE hourly_records ADD COLUMN uncertainty_budget jsonb;
    ALTER TABLE hourly_record_versions ADD COLUMN uncertainty_budget jsonb;
    ${keepFunctions(versionedFigures)}
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ${keepFunctions(figures0007)}
    ALTER TABLE hourly_record_versions DROP COLUMN uncertainty_budget;
    ALTER TABLE hourly_records DROP COLUMN uncertainty_budget;
  `);
};
