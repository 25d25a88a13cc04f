import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Records of a primary element's care (issue 11 §2, §3): its laboratory calibrations (C against
 * Re_D with the certificate's stated uncertainty), the gas analyses that set its fluid, and the
 * inspections of the element. Each is a record as taken, never changed afterwards (append-only,
 * so the app role cannot UPDATE or DELETE them); what it changes in the figures is a
 * configuration version (`config_version_id`), dated at the sample, calibration or inspection.
 * An inspection that found the element as configured has no version.
 */
const appendOnly = (table: string) => `
    CREATE TRIGGER ${table}_append_only BEFORE UPDATE OR DELETE ON ${table}
      FOR EACH ROW EXECUTE FUNCTION element_care_refuse();
    CREATE TRIGGER ${table}_no_truncate BEFORE TRUNCATE ON ${table}
      FOR EACH STATEMENT EXECUTE FUNCTION element_care_refuse();`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE FUNCTION element_care_refuse() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP;
    END $$;

    CREATE TABLE element_calibrations (
      id                  bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      calibrated_at       timestamptz NOT NULL,
      effective_from      timestamptz NOT NULL,
      laboratory          text NOT NULL CHECK (length(btrim(laboratory)) > 0),
      certificate         text,
      -- the laboratory's stated expanded uncertainty of C (k = 2), percent
      uncertainty_percent double precision NOT NULL CHECK (uncertainty_percent > 0),
      -- [{ reynoldsNumber, dischargeCoefficient }], ordered by Re_D
      points              jsonb NOT NULL,
      config_version_id   bigint NOT NULL REFERENCES config_versions (id),
      created_by          bigint NOT NULL REFERENCES users (id),
      created_at          timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE INDEX element_calibrations_meter_run ON element_calibrations (meter_run_id, calibrated_at);

    CREATE TABLE gas_analyses (
      id                  bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      sampled_at          timestamptz NOT NULL,
      laboratory          text NOT NULL CHECK (length(btrim(laboratory)) > 0),
      certificate         text,
      -- the components as the laboratory reported them (names and numbers as given)
      components          jsonb NOT NULL,
      -- mole fractions by canonical component name, as the configuration version took them
      composition         jsonb NOT NULL,
      sum_tolerance       double precision NOT NULL CHECK (sum_tolerance >= 0),
      config_version_id   bigint NOT NULL REFERENCES config_versions (id),
      created_by          bigint NOT NULL REFERENCES users (id),
      created_at          timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE INDEX gas_analyses_meter_run ON gas_analyses (meter_run_id, sampled_at);

    CREATE TABLE element_inspections (
      id                  bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      inspected_at        timestamptz NOT NULL,
      kind                text NOT NULL,
      measured            jsonb NOT NULL,
      condition           text NOT NULL CHECK (length(btrim(condition)) > 0),
      certificate         text,
      config_version_id   bigint REFERENCES config_versions (id),
      created_by          bigint NOT NULL REFERENCES users (id),
      created_at          timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE INDEX element_inspections_meter_run ON element_inspections (meter_run_id, inspected_at);
    ${appendOnly('element_calibrations')}
    ${appendOnly('gas_analyses')}
    ${appendOnly('element_inspections')}
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE element_inspections, gas_analyses, element_calibrations;
    DROP FUNCTION element_care_refuse();
  `);
};
