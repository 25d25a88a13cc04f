import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Period close per site and contract month (issue 10 §5).
 *
 * - `period_closes`: the history of closes and reopens of a site's contract month ('YYYY-MM'),
 *   one row per action, never changed (append-only, as the audit trail); a month's status is its
 *   latest row. Each row keeps the month's bounds [start_at, end_at) on the site's contract
 *   calendar as they were at the action, so "is this instant in a closed month?" is one indexed
 *   query with no calendar arithmetic (a dated contract hour inside a closed month is refused, so
 *   the bounds stay true while it is closed).
 * - `held_hours`: hours the history worker did not recompute because their month is closed (late
 *   readings, an import): they are listed as pending and recomputed when the month is reopened.
 *   An ordinary table: the reopen empties the month's rows.
 * - `daily_totals` / `monthly_totals`: a close sets `status` to 'closed' and keeps the status it
 *   replaces in `status_before_close`; a reopen puts it back. The record-versions trigger is
 *   redefined so that this change of status alone is no change of figures (no new version).
 */
const totalFiguresButStatus = `start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage,
  flags, uncertainty_percent`;
const totalFigures = `${totalFiguresButStatus}, status`;
const prefixed = (columns: string, row: string) =>
  columns
    .split(',')
    .map((c) => `${row}.${c.trim()}`)
    .join(', ');

/** The trigger function of 0006 with a condition for "no figure changed" (`unchanged`). */
const keepVersionFunction = (unchanged: string) => `
    CREATE OR REPLACE FUNCTION period_total_keep_version() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      period_kind text := TG_ARGV[0];
      period_key date;
    BEGIN
      IF ${unchanged} OR OLD.status = 'provisional' THEN
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
    END $$;`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE period_closes (
      id         bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id    bigint NOT NULL REFERENCES sites (id),
      month      text NOT NULL CHECK (month ~ '^[0-9]{4}-(0[1-9]|1[0-2])$'),
      action     text NOT NULL CHECK (action IN ('close', 'reopen')),
      start_at   timestamptz NOT NULL,
      end_at     timestamptz NOT NULL,
      -- what was not final when it was closed (confirm: true), as listed then
      incomplete jsonb,
      reason     text,
      acted_by   bigint NOT NULL REFERENCES users (id),
      acted_at   timestamptz NOT NULL DEFAULT clock_timestamp(),
      CHECK (end_at > start_at),
      CHECK (action = 'close' OR length(btrim(coalesce(reason, ''))) > 0)
    );
    CREATE INDEX period_closes_site_month ON period_closes (site_id, month, id);

    CREATE FUNCTION period_closes_refuse() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP;
    END $$;
    CREATE TRIGGER period_closes_append_only BEFORE UPDATE OR DELETE ON period_closes
      FOR EACH ROW EXECUTE FUNCTION period_closes_refuse();
    CREATE TRIGGER period_closes_no_truncate BEFORE TRUNCATE ON period_closes
      FOR EACH STATEMENT EXECUTE FUNCTION period_closes_refuse();

    CREATE TABLE held_hours (
      meter_run_id    bigint NOT NULL REFERENCES meter_runs (id),
      start           timestamptz NOT NULL,
      cause           text NOT NULL,
      cause_reference text,
      held_at         timestamptz NOT NULL DEFAULT clock_timestamp(),
      PRIMARY KEY (meter_run_id, start)
    );

    ALTER TABLE daily_totals ADD COLUMN status_before_close text;
    ALTER TABLE monthly_totals ADD COLUMN status_before_close text;
    ${keepVersionFunction(
      `((${prefixed(totalFiguresButStatus, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(totalFiguresButStatus, 'OLD')})
         AND (NEW.status IS NOT DISTINCT FROM OLD.status OR 'closed' IN (NEW.status, OLD.status)))`,
    )}
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ${keepVersionFunction(`(${prefixed(totalFigures, 'NEW')}) IS NOT DISTINCT FROM (${prefixed(totalFigures, 'OLD')})`)}
    ALTER TABLE daily_totals DROP COLUMN status_before_close;
    ALTER TABLE monthly_totals DROP COLUMN status_before_close;
    DROP TABLE held_hours, period_closes;
    DROP FUNCTION period_closes_refuse();
  `);
};
