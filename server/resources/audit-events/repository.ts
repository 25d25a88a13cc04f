import { AuditEvent } from '../../models';

/** One audit event: who did what to which record, with the values before and after. */
export interface AuditEventRecord {
  id: string;
  occurredAt: Date;
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
}

export interface AuditEventFilter {
  entityType?: string;
  entityId?: string;
  limit: number;
}

export interface AuditEventsRepository {
  /** The newest events first (ties by id). */
  newest(filter: AuditEventFilter): Promise<AuditEventRecord[]>;
}

export function auditEventsRepository(): AuditEventsRepository {
  return {
    async newest({ entityType, entityId, limit }) {
      const events = await AuditEvent.findAll({
        where: { ...(entityType ? { entityType } : {}), ...(entityId ? { entityId } : {}) },
        order: [
          ['occurredAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit,
      });
      return events.map((e) => ({
        id: String(e.id),
        occurredAt: e.occurredAt,
        actorEmail: e.actorEmail,
        action: e.action,
        entityType: e.entityType,
        entityId: e.entityId,
        before: e.before,
        after: e.after,
        reason: e.reason,
        chainSeq: String(e.chainSeq),
        hash: e.hash,
        previousHash: e.previousHash,
      }));
    },
  };
}
