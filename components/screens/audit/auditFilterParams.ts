/**
 * The audit screen's filters as choices and as words: the kinds, the period presets and the
 * window each gives, the users matching typed text, and the line that says what is shown.
 */
import type { AuditFilters } from '@/hooks/api/auditEvents';
import { AUDIT_KIND_LABELS, AUDIT_KINDS, type AuditKind } from '@/shared/audit/audit-kinds';

export const kindChoices: readonly { value: AuditKind | ''; label: string }[] = [
  { value: '', label: 'Any kind' },
  ...AUDIT_KINDS.map((kind) => ({ value: kind, label: AUDIT_KIND_LABELS[kind] })),
];

export const periodPresets = ['all', '24h', '7d', '30d', 'custom'] as const;
export type PeriodPreset = (typeof periodPresets)[number];

export const periodChoices: readonly { value: PeriodPreset; label: string }[] = [
  { value: 'all', label: 'All time' },
  { value: '24h', label: 'Last 24 h' },
  { value: '7d', label: 'Last 7 days' },
  { value: '30d', label: 'Last 30 days' },
  { value: 'custom', label: 'Dates…' },
];

const hourMs = 3_600_000;
const presetHours: Record<Exclude<PeriodPreset, 'all' | 'custom'>, number> = {
  '24h': 24,
  '7d': 24 * 7,
  '30d': 24 * 30,
};
const datePattern = /^\d{4}-\d\d-\d\d$/;

/** The screen's period: a preset, or two dates (inclusive, on the viewer's own calendar) typed for `custom`. */
export interface PeriodChoice {
  preset: PeriodPreset;
  fromDate?: string;
  toDate?: string;
}

/** Midnight at the start of a date YYYY-MM-DD on the viewer's calendar; null when it is not a real date. */
function localMidnightMs(date: string): number | null {
  if (!datePattern.test(date)) return null;
  const [y, m, d] = date.split('-').map(Number);
  const at = new Date(y, m - 1, d);
  return at.getFullYear() === y && at.getMonth() === m - 1 && at.getDate() === d ? at.getTime() : null;
}

/**
 * @param choice the preset or the typed dates
 * @param nowMs the current instant (the end of a preset's window)
 * @returns the window as ISO instants, `{}` for all time, or an error naming the date at fault
 */
export function periodWindow(
  choice: PeriodChoice,
  nowMs: number,
): { from?: string; to?: string; error?: { field: 'fromDate' | 'toDate'; message: string } } {
  if (choice.preset === 'all') return {};
  if (choice.preset !== 'custom') {
    return {
      from: new Date(nowMs - presetHours[choice.preset] * hourMs).toISOString(),
      to: new Date(nowMs).toISOString(),
    };
  }
  const fromMs = localMidnightMs(choice.fromDate ?? '');
  if (fromMs === null) return { error: { field: 'fromDate', message: 'From: a date YYYY-MM-DD' } };
  const toStartMs = localMidnightMs(choice.toDate ?? '');
  if (toStartMs === null) return { error: { field: 'toDate', message: 'To: a date YYYY-MM-DD' } };
  // The "to" date is included: the window ends at the next midnight (a local day may be 23 or 25 h).
  const [y, m, d] = (choice.toDate ?? '').split('-').map(Number);
  const toMs = new Date(y, m - 1, d + 1).getTime();
  if (toMs <= fromMs) return { error: { field: 'toDate', message: 'To: on or after the from date' } };
  return { from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString() };
}

/** @returns up to `max` users whose email contains the typed text (any letter case), in the list's order */
export function matchingActors<T extends { email: string }>(actors: readonly T[], text: string, max = 6): T[] {
  const needle = text.trim().toLowerCase();
  if (!needle) return [];
  return actors.filter((a) => a.email.toLowerCase().includes(needle)).slice(0, max);
}

/** @returns what the filters show, in a line, e.g. "KFG-101 · Configuration · anyone · last 7 days" */
export function describeAuditFilters(
  filters: Pick<AuditFilters, 'meterRunId' | 'userId' | 'kind'>,
  period: PeriodChoice,
  names: { meterRunTag?: string; userEmail?: string },
): string {
  const run = filters.meterRunId ? (names.meterRunTag ?? `meter run ${filters.meterRunId}`) : 'all meter runs';
  const kind = filters.kind ? AUDIT_KIND_LABELS[filters.kind] : 'any kind';
  const user = filters.userId ? (names.userEmail ?? `user ${filters.userId}`) : 'anyone';
  const when =
    period.preset === 'custom'
      ? `${period.fromDate ?? '?'} to ${period.toDate ?? '?'}`
      : (periodChoices.find((c) => c.value === period.preset)?.label ?? period.preset).toLowerCase();
  return [run, kind, user, when].join(' · ');
}
