import { recordExport } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import type { AuditEventFilter, AuditEventsRepository } from './repository';

/** Events shown on screen when no limit is asked for. */
export const DEFAULT_AUDIT_LIMIT = 100;
/** The most events one CSV export holds (far above a year of set-up changes and sign-ins). */
export const AUDIT_EXPORT_MAX_ROWS = 100_000;

type Filter = Omit<AuditEventFilter, 'limit'> & { limit?: number };

/** The audit log, newest first; a plain read, kept as a use case so the router never reaches the repository. */
export function auditLog(repository: AuditEventsRepository, filter: Filter) {
  return repository.newest({ ...filter, limit: filter.limit ?? DEFAULT_AUDIT_LIMIT });
}

/**
 * The events of a CSV export (all that match, up to AUDIT_EXPORT_MAX_ROWS unless a limit is
 * given), with the export itself recorded in the audit trail: who, when, the filters, the rows.
 * The export event is written before the file is sent, so an export that cannot be recorded fails.
 * @param filters the filters as the request gave them, kept in the export's audit event
 */
export async function exportAuditLog(
  repository: AuditEventsRepository,
  request: { filter: Filter; filters: Record<string, unknown>; actor: SignedInUser },
) {
  const events = await repository.newest({ ...request.filter, limit: request.filter.limit ?? AUDIT_EXPORT_MAX_ROWS });
  await recordExport({
    actor: request.actor,
    what: 'audit-events',
    format: 'csv',
    filters: request.filters,
    rows: events.length,
  });
  return events;
}

/** Everyone who has acted in the audit trail, for the screen's user filter (the users list is for admins only). */
export function auditActors(repository: AuditEventsRepository) {
  return repository.actors();
}
