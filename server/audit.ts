import type { Transaction } from 'sequelize';
import { AuditEvent } from './models';
import type { SignedInUser } from './auth/passport';

/** Writes one audit event (who, when, what, before, after), inside the caller's transaction. */
export async function recordAuditEvent(
  event: {
    actor: SignedInUser | null;
    action: string;
    entityType: string;
    entityId?: string;
    before?: unknown;
    after?: unknown;
  },
  transaction?: Transaction,
) {
  await AuditEvent.create(
    {
      actorId: event.actor?.id ?? null,
      actorEmail: event.actor?.email ?? null,
      action: event.action,
      entityType: event.entityType,
      entityId: event.entityId ?? null,
      before: event.before ?? null,
      after: event.after ?? null,
    },
    { transaction },
  );
}
