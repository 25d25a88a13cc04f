import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Alarms (ISA-18.2 lifecycle, one row per occurrence at an alarm point), their event log (every
 * transition with its time and user), alarm limits per meter run or transmitter, the
 * evaluator's per-meter-run state and watermark, and the log of alarm mails (per-alarm interval,
 * flood summaries, daily digests).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Settings that differ from the defaults (shared/alarms/alarm-limits.ts): for a whole meter
    -- run (transmitter_id NULL) or one transmitter, which wins over the meter run.
    CREATE TABLE alarm_limits (
      id             bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id   bigint NOT NULL REFERENCES meter_runs (id),
      transmitter_id bigint REFERENCES transmitters (id),
      condition      text NOT NULL,
      settings       jsonb NOT NULL DEFAULT '{}'::jsonb,
      updated_by     bigint REFERENCES users (id),
      updated_at     timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX alarm_limits_point_key ON alarm_limits (meter_run_id, coalesce(transmitter_id, 0), condition);

    CREATE TABLE alarms (
      id               bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id     bigint NOT NULL REFERENCES meter_runs (id),
      transmitter_id   bigint REFERENCES transmitters (id),
      condition        text NOT NULL,
      priority         text NOT NULL CHECK (priority IN ('high', 'medium', 'low')),
      state            text NOT NULL CHECK (state IN ('active-unacknowledged', 'active-acknowledged', 'returned-unacknowledged', 'normal', 'shelved', 'out-of-service')),
      -- the process condition now, tracked also while shelved or out of service
      condition_active boolean NOT NULL,
      onset_at         timestamptz NOT NULL,
      raised_at        timestamptz NOT NULL,
      cleared_at       timestamptz,
      acknowledged_at  timestamptz,
      acknowledged_by  bigint REFERENCES users (id),
      shelved_until    timestamptz,
      shelve_reason    text,
      activations      integer NOT NULL DEFAULT 1,
      message          text NOT NULL,
      detail           jsonb NOT NULL DEFAULT '{}'::jsonb,
      notify_status    text NOT NULL DEFAULT 'pending' CHECK (notify_status IN ('pending', 'sent', 'summarised', 'not-needed')),
      notified_at      timestamptz,
      created_at       timestamptz NOT NULL DEFAULT now()
    );
    -- At most one open (not normal) alarm per alarm point.
    CREATE UNIQUE INDEX alarms_open_point_key ON alarms (meter_run_id, coalesce(transmitter_id, 0), condition) WHERE state <> 'normal';
    CREATE INDEX alarms_meter_run_raised_idx ON alarms (meter_run_id, raised_at DESC);
    CREATE INDEX alarms_raised_idx ON alarms (raised_at DESC);
    CREATE INDEX alarms_pending_mail_idx ON alarms (created_at) WHERE notify_status = 'pending';
    CREATE INDEX alarms_shelved_idx ON alarms (shelved_until) WHERE state = 'shelved';

    CREATE TABLE alarm_events (
      id          bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      alarm_id    bigint NOT NULL REFERENCES alarms (id),
      -- when it happened: the readings' time for raises and clears, the clock for people's actions
      occurred_at timestamptz NOT NULL,
      recorded_at timestamptz NOT NULL DEFAULT now(),
      action      text NOT NULL,
      from_state  text,
      to_state    text NOT NULL,
      user_id     bigint REFERENCES users (id),
      user_email  text,
      note        text
    );
    CREATE INDEX alarm_events_alarm_idx ON alarm_events (alarm_id, id);

    -- The evaluator's position per meter run: readings up to the watermark have been judged.
    CREATE TABLE alarm_evaluations (
      meter_run_id bigint PRIMARY KEY REFERENCES meter_runs (id),
      watermark    timestamptz,
      state        jsonb NOT NULL,
      updated_at   timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE alarm_mails (
      id           bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id      bigint REFERENCES sites (id),
      kind         text NOT NULL CHECK (kind IN ('alarm', 'flood', 'digest')),
      alarm_id     bigint REFERENCES alarms (id),
      contract_day date,
      recipients   text[] NOT NULL,
      subject      text NOT NULL,
      sent_at      timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX alarm_mails_digest_key ON alarm_mails (site_id, contract_day) WHERE kind = 'digest';
    CREATE INDEX alarm_mails_site_sent_idx ON alarm_mails (site_id, kind, sent_at DESC);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE alarm_mails, alarm_evaluations, alarm_events, alarms, alarm_limits;');
};
