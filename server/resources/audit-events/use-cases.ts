import type { AuditEventFilter, AuditEventsRepository } from './repository';

/** The audit log, newest first; a plain read, kept as a use case so the router never reaches the repository. */
export function auditLog(repository: AuditEventsRepository, filter: AuditEventFilter) {
  return repository.newest(filter);
}
