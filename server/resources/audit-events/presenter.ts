import { auditKindOf } from '../../../shared/audit/audit-kinds';
import { csvText } from '../../../shared/csv/csv-text';
import type { AuditActor, AuditEventRecord } from './repository';

export function presentAuditEvent(e: AuditEventRecord) {
  return {
    id: e.id,
    occurredAt: e.occurredAt.toISOString(),
    actorEmail: e.actorEmail,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    before: e.before,
    after: e.after,
    reason: e.reason,
    // The event's place in the hash chain; `npm run --silent audit-verify` checks the chain.
    chainSeq: e.chainSeq,
    hash: e.hash,
    previousHash: e.previousHash,
    // Added last (issue 9): who acted, by id (for the user filter), and the action's family.
    actorId: e.actorId,
    kind: auditKindOf(e.action),
    // Added last (issue 14): the acting user's name, so the log says who in words.
    actorName: e.actorName,
  };
}

export const presentAuditActor = (a: AuditActor) => ({ id: a.id, email: a.email });

const json = (value: unknown) => (value === null || value === undefined ? '' : JSON.stringify(value));

/** The CSV of an export: one event a line, newest first, old and new values as JSON text, with the chain columns. */
export function auditEventsCsv(events: readonly AuditEventRecord[]): string {
  return csvText(
    [
      'id',
      'chain_seq',
      'occurred_at',
      'kind',
      'action',
      'entity_type',
      'entity_id',
      'actor_id',
      'actor_email',
      'reason',
      'before',
      'after',
      'hash',
      'previous_hash',
    ],
    events.map((e) => [
      e.id,
      e.chainSeq,
      e.occurredAt.toISOString(),
      auditKindOf(e.action),
      e.action,
      e.entityType,
      e.entityId,
      e.actorId,
      e.actorEmail,
      e.reason,
      json(e.before),
      json(e.after),
      e.hash,
      e.previousHash,
    ]),
  );
}
