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

/**
 * Records an export (who took which data out, when, filtered how, how many rows), so the audit
 * trail answers "who has seen this". Every export route calls it before it sends the file; if
 * the event cannot be written, the export fails rather than leave unrecorded.
 * @param event.what what was exported, e.g. `audit-events`, `monthly-volumes`; the action is `export.<what>`
 * @param event.filters the filters as the request gave them (plain JSON), so the same file can be asked for again
 */
export async function recordExport(
  event: {
    actor: SignedInUser;
    what: string;
    format: string;
    filters: Record<string, unknown>;
    rows: number;
    reason?: string | null;
  },
  transaction?: Transaction,
) {
  await recordAuditEvent(
    {
      actor: event.actor,
      action: `export.${event.what}`,
      entityType: 'export',
      after: { what: event.what, format: event.format, filters: event.filters, rows: event.rows },
      reason: event.reason ?? null,
    },
    transaction,
  );
}
