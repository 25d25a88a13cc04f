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
  };
}
