/**
 * The live board's order and its summary line, kept pure so they are tested without a browser.
 * "Worst first" ranks a meter run by its alarms before anything else (the alarm list is the record
 * of what needs a person), then by how low its DP sits in the span (the bottom of the span is where
 * the flow is least certain), then by tag, so the order is stable between updates.
 */
import type { Alarm } from '@/hooks/api/alarms';
import type { AlarmPriority } from '@/shared/alarms/alarm-codes';

export const boardOrders = ['worst', 'dp-share', 'name'] as const;
export type BoardOrder = (typeof boardOrders)[number];

/** @returns the order named in the address, worst first when it names none or an unknown one */
export function boardOrderFrom(value: unknown): BoardOrder {
  return boardOrders.find((order) => order === value) ?? 'worst';
}

/** One meter run's alarms as the board draws them. */
export interface RunAlarms {
  /** Alarms not yet back to normal (any state but normal). */
  open: number;
  /** Of those, waiting for acknowledgement. */
  unacknowledged: number;
  /** The highest priority among the active or unacknowledged ones, or null. */
  worst: AlarmPriority | null;
  /** Whether the worst one still waits for acknowledgement. */
  worstUnacknowledged: boolean;
}

const rank: Record<AlarmPriority, number> = { high: 3, medium: 2, low: 1 };
const unacknowledgedStates = new Set(['active-unacknowledged', 'returned-unacknowledged']);
/** Shelved and out-of-service alarms are suppressed on purpose (ISA-18.2): they do not rank a meter run. */
const suppressedStates = new Set(['shelved', 'out-of-service', 'normal']);

/** @returns each meter run's alarms, keyed by meter run id */
export function alarmsByRun(alarms: readonly Alarm[]): Map<string, RunAlarms> {
  const byRun = new Map<string, RunAlarms>();
  for (const alarm of alarms) {
    if (alarm.state === 'normal') continue;
    const entry = byRun.get(alarm.meterRunId) ?? {
      open: 0,
      unacknowledged: 0,
      worst: null,
      worstUnacknowledged: false,
    };
    entry.open += 1;
    const waiting = unacknowledgedStates.has(alarm.state);
    if (waiting) entry.unacknowledged += 1;
    if (!suppressedStates.has(alarm.state)) {
      const better = entry.worst === null || rank[alarm.priority] > rank[entry.worst];
      const tie = entry.worst !== null && rank[alarm.priority] === rank[entry.worst];
      if (better) entry.worstUnacknowledged = waiting;
      else if (tie) entry.worstUnacknowledged ||= waiting;
      if (better) entry.worst = alarm.priority;
    }
    byRun.set(alarm.meterRunId, entry);
  }
  return byRun;
}

export interface OrderableRun {
  meterRunId: string;
  tag: string;
  /** DP as a share of span (null with no DP in use). */
  dpShareOfSpan: number | null;
  /** Abnormal states the board works out itself (stale, over range, …). */
  stateCount: number;
}

/** Worse is larger: unacknowledged beats acknowledged at the same priority. */
function alarmScore(alarms: RunAlarms | undefined): number {
  if (!alarms?.worst) return 0;
  return rank[alarms.worst] * 2 + (alarms.worstUnacknowledged ? 1 : 0);
}

/** A missing DP share sorts after every measured one: there is nothing to rank. */
function shareKey(share: number | null): number {
  return share === null ? Number.POSITIVE_INFINITY : share;
}

const byTag = (a: OrderableRun, b: OrderableRun) =>
  a.tag.localeCompare(b.tag, undefined, { numeric: true, sensitivity: 'base' });

/**
 * @param runs the board's meter runs
 * @param alarms each meter run's alarms (alarmsByRun)
 * @param order worst first, DP share (lowest first) or name
 * @returns a new array in that order
 */
export function sortRuns<T extends OrderableRun>(
  runs: readonly T[],
  alarms: ReadonlyMap<string, RunAlarms>,
  order: BoardOrder,
): T[] {
  const list = [...runs];
  if (order === 'name') return list.sort(byTag);
  if (order === 'dp-share')
    return list.sort((a, b) => shareKey(a.dpShareOfSpan) - shareKey(b.dpShareOfSpan) || byTag(a, b));
  return list.sort(
    (a, b) =>
      alarmScore(alarms.get(b.meterRunId)) - alarmScore(alarms.get(a.meterRunId)) ||
      shareKey(a.dpShareOfSpan) - shareKey(b.dpShareOfSpan) ||
      byTag(a, b),
  );
}

/** @returns whether a meter run needs a look: a state of its own or an alarm not yet suppressed or acknowledged away */
export function needsAttention(run: OrderableRun, alarms: RunAlarms | undefined): boolean {
  return run.stateCount > 0 || (alarms?.worst ?? null) !== null || (alarms?.unacknowledged ?? 0) > 0;
}

/**
 * @returns the board's one-line summary; "all normal" only when no meter run has a state of its own
 *   nor an active or unacknowledged alarm, so it never contradicts the alarm banner or list
 */
export function boardSummary(runs: readonly OrderableRun[], alarms: ReadonlyMap<string, RunAlarms>): string {
  const attention = runs.filter((run) => needsAttention(run, alarms.get(run.meterRunId))).length;
  const n = runs.length;
  if (attention === 0) return `All ${n} meter run${n === 1 ? '' : 's'} normal.`;
  return `${attention} of ${n} meter run${n === 1 ? '' : 's'} need${attention === 1 ? 's' : ''} attention.`;
}
