import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * The audit trail becomes append-only and chained.
 *
 * - A reason column: every change may say why (corrections and back-dated versions must).
 * - Each event gets a place in the chain (`chain_seq`, 1, 2, 3 … with no gaps), the hash of the
 *   event before it and its own hash: SHA-256 of a canonical text of its columns and the
 *   previous hash. Editing any column of any event, or removing one, breaks the chain at that
 *   event, and `npm run --silent audit-verify` names it. The canonical text is PostgreSQL's own
 *   `jsonb_build_array(...)::text`, so the verifier recomputes it with a built-in function, not
 *   with the trigger below (which a superuser could replace).
 * - The hash is set by a BEFORE INSERT trigger, so every path that writes an event (the model,
 *   raw SQL in the seed) is chained. An advisory lock held to the end of the transaction
 *   serialises writers, so the chain follows commit order; audit events are rare (set-up
 *   changes, sign-ins), so the lock costs nothing measurable.
 * - UPDATE, DELETE and TRUNCATE are refused by triggers. A superuser can still disable them;
 *   the chain is what proves they were not.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE audit_events
      ADD COLUMN reason        text,
      ADD COLUMN chain_seq     bigint,
      ADD COLUMN previous_hash text,
      ADD COLUMN hash          text;

    -- The canonical text of an event, hashed with the previous event's hash.
    CREATE FUNCTION audit_event_canonical(e audit_events, previous text) RETURNS text
      LANGUAGE sql STABLE AS $$
        SELECT jsonb_build_array(
          e.chain_seq, e.id, to_char(e.occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"'),
          e.actor_id, e.actor_email, e.action, e.entity_type, e.entity_id, e.before, e.after, e.reason, previous
        )::text
      $$;

    -- Chain the events already written, in the order they were written.
    DO $$
    DECLARE
      e audit_events;
      previous text := NULL;
      seq bigint := 0;
    BEGIN
      FOR e IN SELECT * FROM audit_events ORDER BY id LOOP
        seq := seq + 1;
        e.chain_seq := seq;
        UPDATE audit_events
           SET chain_seq = seq,
               previous_hash = previous,
               hash = encode(sha256(convert_to(audit_event_canonical(e, previous), 'UTF8')), 'hex')
         WHERE id = e.id
         RETURNING hash INTO previous;
      END LOOP;
    END $$;

    ALTER TABLE audit_events
      ALTER COLUMN chain_seq SET NOT NULL,
      ALTER COLUMN hash SET NOT NULL;
    CREATE UNIQUE INDEX audit_events_chain_seq_key ON audit_events (chain_seq);

    CREATE FUNCTION audit_events_chain() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      last audit_events;
    BEGIN
      -- One writer at a time, to the end of its transaction (key: 'audit' in ASCII).
      PERFORM pg_advisory_xact_lock(1635083369);
      SELECT * INTO last FROM audit_events ORDER BY chain_seq DESC LIMIT 1;
      NEW.chain_seq := coalesce(last.chain_seq, 0) + 1;
      NEW.previous_hash := last.hash;
      NEW.hash := encode(sha256(convert_to(audit_event_canonical(NEW, last.hash), 'UTF8')), 'hex');
      RETURN NEW;
    END $$;
    CREATE TRIGGER audit_events_chain BEFORE INSERT ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_chain();

    CREATE FUNCTION audit_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'audit_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER audit_events_append_only BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_refuse_change();
    CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_refuse_change();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER audit_events_no_truncate ON audit_events;
    DROP TRIGGER audit_events_append_only ON audit_events;
    DROP TRIGGER audit_events_chain ON audit_events;
    DROP FUNCTION audit_events_refuse_change();
    DROP FUNCTION audit_events_chain();
    DROP FUNCTION audit_event_canonical(audit_events, text);
    DROP INDEX audit_events_chain_seq_key;
    ALTER TABLE audit_events DROP COLUMN hash, DROP COLUMN previous_hash, DROP COLUMN chain_seq, DROP COLUMN reason;
  `);
};
