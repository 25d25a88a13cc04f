/**
 * A meter run's event log: every change of its configuration and constants, with when it takes
 * effect, when it was recorded, who made it, why, and each field's old and new value. Built from
 * the configuration history (element and fluid versions, with their field-by-field changes) and
 * the audit events of the meter run (its own settings, its transmitters' ranges and accuracies,
 * alarm limits, corrections…). A configuration version is audited too; its entry comes from the
 * history, which already carries the difference from the version before, so its audit event is
 * left out rather than shown twice.
 */
import type { AuditEvent } from '@/hooks/api/auditEvents';
import type { ConfigVersion } from '@/hooks/api/meterRuns';
import { AUDIT_KIND_LABELS } from '@/shared/audit/audit-kinds';
import { configDifference, type FieldChange } from '@/shared/config/config-difference';

export interface EventLogEntry {
  key: string;
  /** When the change takes effect (a configuration version's effective time; otherwise when it was made). */
  effectiveAt: string;
  /** When it was recorded. */
  recordedAt: string;
  who: string;
  /** What happened, in words ("Configuration version", "transmitter.update on transmitter 12"). */
  what: string;
  kindLabel: string;
  reason: string | null;
  changes: FieldChange[];
}

/** Fields every audited record carries that say nothing about the change itself. */
const bookkeeping = new Set(['id', 'createdAt', 'updatedAt']);

/** A change, field by field; a value that is not plain JSON is shown as a whole rather than dropped. */
function changesOf(before: unknown, after: unknown): FieldChange[] {
  try {
    return configDifference(before ?? null, after ?? null).filter((c) => !bookkeeping.has(c.path));
  } catch {
    return [{ path: '(record)', before: JSON.stringify(before ?? null), after: JSON.stringify(after ?? null) }];
  }
}

const effectiveFromOf = (value: unknown): string | null => {
  if (typeof value !== 'object' || value === null) return null;
  const effectiveFrom = (value as { effectiveFrom?: unknown }).effectiveFrom;
  return typeof effectiveFrom === 'string' ? effectiveFrom : null;
};

/**
 * @param versions the meter run's configuration versions (any order)
 * @param events the meter run's audit events (any order); empty when the viewer may not read the audit log
 * @returns the entries, newest recorded first (ties: the later effective first)
 */
export function buildEventLog(versions: readonly ConfigVersion[], events: readonly AuditEvent[]): EventLogEntry[] {
  const fromVersions = versions.map((v): EventLogEntry => ({
    key: `config-version-${v.id}`,
    effectiveAt: v.effectiveFrom,
    recordedAt: v.createdAt,
    who: v.createdBy?.email ?? 'unknown',
    what: v.first ? 'First configuration' : 'Configuration version',
    kindLabel: AUDIT_KIND_LABELS.configuration,
    reason: v.reason,
    changes: v.first
      ? changesOf(null, { element: v.element, fluid: v.fluid })
      : (v.changes ?? []).map((c) => ({ path: c.path, before: c.before, after: c.after }) as FieldChange),
  }));
  const fromEvents = events
    .filter((e) => e.action !== 'config-version.create' && e.kind !== 'export' && e.kind !== 'sign-in')
    .map((e): EventLogEntry => ({
      key: `audit-event-${e.id}`,
      effectiveAt: effectiveFromOf(e.after) ?? e.occurredAt,
      recordedAt: e.occurredAt,
      who: e.actorEmail ?? 'system',
      what: e.entityId ? `${e.action} on ${e.entityType} ${e.entityId}` : e.action,
      kindLabel: AUDIT_KIND_LABELS[e.kind],
      reason: e.reason ?? null,
      changes: changesOf(e.before, e.after),
    }));
  const ms = (iso: string) => Date.parse(iso);
  // A log is read in the order things were recorded: a version found late and back-dated is news
  // at the top, showing the earlier time it takes effect from.
  return [...fromVersions, ...fromEvents].sort(
    (a, b) => ms(b.recordedAt) - ms(a.recordedAt) || ms(b.effectiveAt) - ms(a.effectiveAt),
  );
}

/** A field's value in a line: text as is, numbers and other JSON as JSON, a missing side as "—". */
export function valueInWords(value: unknown): string {
  if (value === null || value === undefined) return '—';
  return typeof value === 'string' ? value : JSON.stringify(value);
}
