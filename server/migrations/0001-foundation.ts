import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/** Users, the audit trail and the captured mail of the SMTP stand-in. */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TYPE user_role AS ENUM ('operator', 'engineer', 'accountant', 'admin');
    CREATE TABLE users (
      id            bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      email         text NOT NULL,
      name          text NOT NULL,
      role          user_role NOT NULL,
      password_hash text NOT NULL,
      disabled      boolean NOT NULL DEFAULT false,
      created_at    timestamptz NOT NULL DEFAULT now(),
      updated_at    timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX users_email_key ON users (lower(email));

    -- Who changed what, when, with the values before and after (API MPMS 21.1 event log).
    CREATE TABLE audit_events (
      id          bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      occurred_at timestamptz NOT NULL DEFAULT now(),
      actor_id    bigint REFERENCES users (id),
      actor_email text,
      action      text NOT NULL,
      entity_type text NOT NULL,
      entity_id   text,
      before      jsonb,
      after       jsonb
    );
    CREATE INDEX audit_events_occurred_at_idx ON audit_events (occurred_at DESC);
    CREATE INDEX audit_events_entity_idx ON audit_events (entity_type, entity_id);

    CREATE TABLE mail_messages (
      id        bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      sent_at   timestamptz NOT NULL DEFAULT now(),
      sender    text,
      recipients text[] NOT NULL,
      subject   text NOT NULL DEFAULT '',
      text      text NOT NULL DEFAULT '',
      raw       text NOT NULL
    );
    CREATE INDEX mail_messages_sent_at_idx ON mail_messages (sent_at DESC);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE mail_messages; DROP TABLE audit_events; DROP TABLE users; DROP TYPE user_role;
  `);
};
