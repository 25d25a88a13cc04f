import type { Transaction } from 'sequelize';
import { AuditEvent } from './models';
import type { SignedInUser } from './auth/passport';

/**
 * Writes one audit event (who, when, what, before, after, why), inside the caller's transaction.
 * The table is append-only and each event is chained to the one before by its hash (set by the
 * database; see server/audit-chain.ts), so an event once written stays as written.
 */
export async function recordAuditEvent(
  event: {
    actor: SignedInUser | null;
    action: string;
    entityType: string;
    entityId?: string;
    before?: unknown;
    after?: unknown;
    reason?: string | null;
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
      reason: event.reason ?? null,
    },
    { transaction },
  );
}
