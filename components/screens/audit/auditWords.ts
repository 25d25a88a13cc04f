/**
 * An audit event in words: who did what to which record ("Dana Reyes changed meter run KFG-101's
 * gap limit from 300 s to 600 s"), and its change as a list of "field: old → new" lines. The raw
 * JSON stays available behind the row's "details" toggle.
 */
import { formatDuration, formatInstant } from '@/shared/format/time';

/** Field names whose words are decided for the whole product, or read badly when split. */
const fieldWords: Record<string, string> = {
  maxGapS: 'gap limit',
  tag: 'tag',
  timeZone: 'time zone',
  contractHour: 'contract hour',
  displayUnits: 'display units',
  basePressurePa: 'base pressure (Pa)',
  baseTemperatureK: 'base temperature (K)',
  disabled: 'disabled',
  role: 'role',
};

const verbs: Record<string, string> = {
  create: 'added',
  update: 'changed',
  delete: 'removed',
  close: 'closed',
  reopen: 'reopened',
  resolve: 'resolved',
  propose: 'proposed',
  'sign-in': 'signed in',
  'sign-in-refused': 'was refused sign-in',
  'download-original': 'downloaded the original of',
};

/** @returns a camelCase field name in words, its unit suffix dropped when the value is shown with it */
export function fieldInWords(field: string): string {
  if (fieldWords[field]) return fieldWords[field];
  const bare = field.replace(/(S|Ms)$/, '');
  return bare
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]/g, ' ')
    .toLowerCase();
}

/** @returns a value as a person reads it: durations for fields in seconds, local times for instants */
export function valueInWords(field: string, value: unknown, timeZone?: string): string {
  if (value === null || value === undefined) return '(none)';
  if (typeof value === 'number' && /S$/.test(field)) return formatDuration(value);
  if (typeof value === 'number' && /Ms$/.test(field)) return formatInstant(value, timeZone);
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value)) return formatInstant(value, timeZone);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

export interface FieldChange {
  field: string;
  before: string;
  after: string;
}

const asRecord = (v: unknown): Record<string, unknown> | null =>
  v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null;

/** Fields that carry bookkeeping, not the user's change. */
const quietFields = new Set(['id', 'createdAt', 'updatedAt', 'createdBy', 'updatedBy', 'version']);

/** @returns each field whose value differs between before and after (added fields when only after exists) */
export function changedFields(before: unknown, after: unknown, timeZone?: string): FieldChange[] {
  const b = asRecord(before) ?? {};
  const a = asRecord(after) ?? {};
  const fields = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((f) => !quietFields.has(f));
  return fields
    .filter((f) => JSON.stringify(b[f]) !== JSON.stringify(a[f]))
    .map((f) => ({
      field: fieldInWords(f),
      before: valueInWords(f, b[f], timeZone),
      after: valueInWords(f, a[f], timeZone),
    }));
}

/** @returns the record's name as people know it: its tag, name, code or e-mail, else its number */
function recordName(event: AuditEventLike): string | null {
  for (const side of [event.after, event.before]) {
    const r = asRecord(side);
    for (const key of ['tag', 'name', 'code', 'email', 'label'] as const)
      if (r && typeof r[key] === 'string' && r[key]) return String(r[key]);
  }
  return event.entityId ? `#${event.entityId}` : null;
}

export interface AuditEventLike {
  action: string;
  entityType: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
}

/**
 * @param event the audit event
 * @param who the actor's name (or e-mail; "The system" when none)
 * @returns e.g. "Dana Reyes changed meter run KFG-101's gap limit from 5 min to 10 min"
 */
export function auditSentence(event: AuditEventLike, who: string, timeZone?: string): string {
  const step = event.action.includes('.') ? event.action.slice(event.action.lastIndexOf('.') + 1) : event.action;
  const verb = verbs[step] ?? step.replace(/-/g, ' ');
  const entity = event.entityType.replace(/[-_]/g, ' ');
  if (step === 'sign-in' || step === 'sign-in-refused') return `${who} ${verb}`;
  const name = recordName(event);
  const subject = name ? `${entity} ${name}` : entity;
  const changes = changedFields(event.before, event.after, timeZone);
  if (step === 'update' && changes.length === 1) {
    const [c] = changes;
    return `${who} changed ${subject}'s ${c.field} from ${c.before} to ${c.after}`;
  }
  if (step === 'update' && changes.length > 1) return `${who} changed ${changes.length} fields of ${subject}`;
  return `${who} ${verb} ${subject}`;
}
