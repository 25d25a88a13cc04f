import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Balance groups (issue 10 §3, §4): a station balance of one site. Inlet and outlet meter runs
 * that should agree, an allowance for fuel and losses (a percent of the inlet, or a fixed volume
 * at base conditions per contract day: exactly one), and a tolerance in percent of the inlet.
 *
 * - A meter run is a member once per group: never on both sides (primary key on group and meter run).
 * - Members belong to the group's site; the API checks it (400 naming the field), the database
 *   cannot without a trigger across tables, so the check lives in the use case.
 * - Every change of a group's definition is audited with its before and after (audit_events);
 *   `version` counts the definitions a group has had.
 * - The alarm `balance-out-of-tolerance` judges each contract day once, in order, after
 *   `alarm_watermark` (server/alarms/balance-alarm.ts).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE balance_groups (
      id                  bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id             bigint NOT NULL REFERENCES sites (id),
      name                text NOT NULL CHECK (length(btrim(name)) > 0),
      allowance_percent   double precision CHECK (allowance_percent >= 0 AND allowance_percent < 100),
      allowance_daily_m3  double precision CHECK (allowance_daily_m3 >= 0),
      tolerance_percent   double precision NOT NULL CHECK (tolerance_percent > 0),
      version             integer NOT NULL DEFAULT 1,
      created_by          bigint REFERENCES users (id),
      created_at          timestamptz NOT NULL DEFAULT now(),
      -- The end of the last contract day judged for the alarm balance-out-of-tolerance.
      alarm_watermark     timestamptz,
      CHECK ((allowance_percent IS NULL) <> (allowance_daily_m3 IS NULL))
    );
    CREATE UNIQUE INDEX balance_groups_site_name_key ON balance_groups (site_id, lower(name));

    CREATE TABLE balance_group_members (
      balance_group_id bigint NOT NULL REFERENCES balance_groups (id) ON DELETE CASCADE,
      meter_run_id     bigint NOT NULL REFERENCES meter_runs (id),
      side             text NOT NULL CHECK (side IN ('inlet', 'outlet')),
      PRIMARY KEY (balance_group_id, meter_run_id)
    );
    CREATE INDEX balance_group_members_meter_run ON balance_group_members (meter_run_id);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE balance_group_members, balance_groups;');
};
