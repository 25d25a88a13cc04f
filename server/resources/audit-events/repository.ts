import type { Pool } from 'pg';
import { auditKindMatch, type AuditKind } from '../../../shared/audit/audit-kinds';

/** One audit event: who did what to which record, with the values before and after. */
export interface AuditEventRecord {
  id: string;
  occurredAt: Date;
  actorId: string | null;
  actorEmail: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
  reason: string | null;
  chainSeq: string;
  hash: string;
  previousHash: string | null;
  /** The acting user's name as it is now (null for the system or a user no longer known). */
  actorName: string | null;
}

export interface AuditEventFilter {
  entityType?: string;
  entityId?: string;
  /** The meter run's own events and those of what belongs to it (see `newest`). */
  meterRunId?: string;
  /** Events done by this user. */
  userId?: string;
  kind?: AuditKind;
  /** Events that occurred in [fromMs, toMs). */
  fromMs?: number;
  toMs?: number;
  limit: number;
}

/** Someone who appears in the audit trail as the one who acted. */
export interface AuditActor {
  id: string;
  email: string;
}

export interface AuditEventsRepository {
  /** The newest events first (ties by id). */
  newest(filter: AuditEventFilter): Promise<AuditEventRecord[]>;
  /** Everyone who has acted in the audit trail, by email. */
  actors(): Promise<AuditActor[]>;
}

interface AuditEventRow {
  id: string;
  occurred_at: Date;
  actor_id: string | null;
  actor_email: string | null;
  action: string;
  entity_type: string;
  entity_id: string | null;
  before: unknown;
  after: unknown;
  reason: string | null;
  chain_seq: string;
  hash: string;
  previous_hash: string | null;
  actor_name: string | null;
}

/** Escapes LIKE's wildcards in a prefix (`_` appears in none today, but a prefix is data, not a pattern). */
const likePrefix = (prefix: string) => `${prefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * The WHERE clause and parameters of a filter. "Belongs to a meter run" is decided from what
 * every audited record already carries, without a column of its own: the event's entity is the
 * meter run (its set-up, configuration versions, alarm limits are audited on it), or one of its
 * transmitters, or the record before or after the change names the meter run as `meterRunId`
 * (transmitters, corrections, settings versions, calibrations as the API shows them), or the
 * record after it names one of the run's transmitters as `transmitterId` (a resolved reading conflict).
 */
function whereOf(filter: AuditEventFilter): { sql: string; params: unknown[] } {
  const params: unknown[] = [];
  const clauses: string[] = [];
  const param = (value: unknown) => {
    params.push(value);
    return `$${params.length}`;
  };
  if (filter.entityType) clauses.push(`entity_type = ${param(filter.entityType)}`);
  if (filter.entityId) clauses.push(`entity_id = ${param(filter.entityId)}`);
  if (filter.meterRunId) {
    const id = param(filter.meterRunId);
    clauses.push(`(
      (entity_type = 'meter-run' AND entity_id = ${id})
      OR (entity_type = 'transmitter' AND entity_id IN (SELECT id::text FROM transmitters WHERE meter_run_id = ${id}::bigint))
      OR after->>'meterRunId' = ${id}
      OR before->>'meterRunId' = ${id}
      OR after->>'transmitterId' IN (SELECT id::text FROM transmitters WHERE meter_run_id = ${id}::bigint))`);
  }
  if (filter.userId) clauses.push(`actor_id = ${param(filter.userId)}::bigint`);
  if (filter.kind) {
    const match = auditKindMatch(filter.kind);
    const inKind = `(action = ANY(${param(match.actions)}::text[])
      OR (action LIKE ANY(${param(match.prefixes.map(likePrefix))}::text[]) AND NOT action = ANY(${param(match.excluded)}::text[])))`;
    clauses.push(match.negate ? `NOT ${inKind}` : inKind);
  }
  if (filter.fromMs !== undefined) clauses.push(`occurred_at >= to_timestamp(${param(filter.fromMs)} / 1000.0)`);
  if (filter.toMs !== undefined) clauses.push(`occurred_at < to_timestamp(${param(filter.toMs)} / 1000.0)`);
  return { sql: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params };
}

const record = (r: AuditEventRow): AuditEventRecord => ({
  id: r.id,
  occurredAt: r.occurred_at,
  actorId: r.actor_id,
  actorEmail: r.actor_email,
  action: r.action,
  entityType: r.entity_type,
  entityId: r.entity_id,
  before: r.before,
  after: r.after,
  reason: r.reason,
  chainSeq: r.chain_seq,
  hash: r.hash,
  previousHash: r.previous_hash,
  actorName: r.actor_name,
});

export function auditEventsRepository(pool: Pool): AuditEventsRepository {
  return {
    async newest(filter) {
      const where = whereOf(filter);
      const { rows } = await pool.query<AuditEventRow>(
        `SELECT id::text, occurred_at, actor_id::text, actor_email, action, entity_type, entity_id, before, after,
                reason, chain_seq::text, hash, previous_hash,
                (SELECT u.name FROM users u WHERE u.id = audit_events.actor_id) AS actor_name
           FROM audit_events ${where.sql}
          ORDER BY occurred_at DESC, audit_events.id DESC
          LIMIT ${Number(filter.limit)}`,
        where.params,
      );
      return rows.map(record);
    },

    async actors() {
      const { rows } = await pool.query<{ id: string; email: string }>(
        `SELECT DISTINCT ON (actor_id) actor_id::text AS id, actor_email AS email
           FROM audit_events WHERE actor_id IS NOT NULL AND actor_email IS NOT NULL
          ORDER BY actor_id, occurred_at DESC`,
      );
      return rows.sort((a, b) => a.email.localeCompare(b.email));
    },
  };
}
