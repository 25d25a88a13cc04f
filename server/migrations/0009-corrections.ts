import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Corrections with four eyes (issue 9 §6, §8). An engineer proposes a correction of a meter run's
 * figures over [start, end): a quantity substitution (`mass_kg`), a substitution of one
 * transmitter's readings (`substitute`: `{ transmitterId, value }` in the transmitter's unit or
 * `{ transmitterId, hold: true }`), or an adjustment (`factor`). Somebody else approves or rejects it.
 *
 * - Rows are never deleted. Once written, only the decision changes, once, from 'proposed' to
 *   'approved' or 'rejected', with who, when and why; a trigger refuses anything else (an edit of
 *   the figures, a second decision, a DELETE or a TRUNCATE), whatever connection tries it.
 * - Four eyes is also a constraint: the decider is never the proposer.
 * - `origin` 'estimate' marks a substitution proposed from an estimate for missing time; `estimate`
 *   keeps how it was made (method, uncertainty, basis) as it was when proposed.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE corrections (
      id              bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id    bigint NOT NULL REFERENCES meter_runs (id),
      start           timestamptz NOT NULL,
      "end"           timestamptz NOT NULL,
      kind            text NOT NULL CHECK (kind IN ('substitute', 'adjust')),
      mass_kg         double precision,
      factor          double precision,
      substitute      jsonb,
      origin          text NOT NULL DEFAULT 'manual' CHECK (origin IN ('manual', 'estimate')),
      estimate        jsonb,
      reason          text NOT NULL CHECK (length(btrim(reason)) > 0),
      status          text NOT NULL DEFAULT 'proposed' CHECK (status IN ('proposed', 'approved', 'rejected')),
      proposed_by     bigint NOT NULL REFERENCES users (id),
      proposed_at     timestamptz NOT NULL DEFAULT clock_timestamp(),
      decided_by      bigint REFERENCES users (id),
      decided_at      timestamptz,
      decision_reason text,
      CHECK ("end" > start),
      -- A substitution gives a quantity or readings (not both); an adjustment gives a factor above 0.
      CHECK (
        (kind = 'substitute' AND factor IS NULL AND ((mass_kg IS NOT NULL AND mass_kg >= 0) <> (substitute IS NOT NULL)))
        OR (kind = 'adjust' AND factor > 0 AND mass_kg IS NULL AND substitute IS NULL)
      ),
      CHECK (origin = 'manual' OR (kind = 'substitute' AND mass_kg IS NOT NULL AND estimate IS NOT NULL)),
      CHECK ((status = 'proposed') = (decided_by IS NULL AND decided_at IS NULL AND decision_reason IS NULL)),
      CHECK (decided_by IS NULL OR decided_by <> proposed_by)
    );
    CREATE INDEX corrections_meter_run ON corrections (meter_run_id, start);
    CREATE INDEX corrections_status ON corrections (status, id);

    CREATE FUNCTION corrections_decide_once() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP <> 'UPDATE' THEN
        RAISE EXCEPTION 'corrections are never deleted: % refused', TG_OP;
      END IF;
      IF OLD.status <> 'proposed' THEN
        RAISE EXCEPTION 'correction % is already %: its decision is final', OLD.id, OLD.status;
      END IF;
      IF NEW.status = 'proposed'
         OR (NEW.id, NEW.meter_run_id, NEW.start, NEW."end", NEW.kind, NEW.mass_kg, NEW.factor, NEW.substitute,
             NEW.origin, NEW.estimate, NEW.reason, NEW.proposed_by, NEW.proposed_at)
            IS DISTINCT FROM
            (OLD.id, OLD.meter_run_id, OLD.start, OLD."end", OLD.kind, OLD.mass_kg, OLD.factor, OLD.substitute,
             OLD.origin, OLD.estimate, OLD.reason, OLD.proposed_by, OLD.proposed_at) THEN
        RAISE EXCEPTION 'correction %: only the decision may change, once', OLD.id;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER corrections_decide_once BEFORE UPDATE OR DELETE ON corrections
      FOR EACH ROW EXECUTE FUNCTION corrections_decide_once();
    CREATE TRIGGER corrections_no_truncate BEFORE TRUNCATE ON corrections
      FOR EACH STATEMENT EXECUTE FUNCTION corrections_decide_once();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE corrections;
    DROP FUNCTION corrections_decide_once();
  `);
};
