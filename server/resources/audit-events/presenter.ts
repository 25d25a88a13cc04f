import type { AuditEventRecord } from './repository';

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
  };
}
