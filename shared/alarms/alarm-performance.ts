/**
 * Alarms an operator can act on (issue 13 item 9, ISA-18.2 / IEC 62682 alarm management):
 * grouping consequential alarms under a first-out, and the monthly alarm performance measures.
 * Pure: the server reads the rows, this works them out.
 */
import type { AlarmCondition } from './alarm-codes';

const MINUTE_MS = 60_000;

/**
 * Consequential alarms: alarms of one site whose conditions share a cause. A site that stops
 * reporting leaves every transmitter stale or of bad quality at once, so those two are one family;
 * every other condition is a family of its own.
 */
export const CONDITION_FAMILY: Partial<Record<AlarmCondition, string>> = {
  stale: 'signal-loss',
  'bad-quality': 'signal-loss',
};
export const familyOf = (condition: AlarmCondition) => CONDITION_FAMILY[condition] ?? condition;

/** An alarm joins a group when raised within this time after the group's first-out. */
export const GROUP_WINDOW_MS = 2 * MINUTE_MS;

export interface GroupableAlarm {
  id: string;
  siteId: string;
  condition: AlarmCondition;
  raisedAt: Date;
}

export interface AlarmGrouping {
  /** The first-out's id (an alarm alone is its own group). */
  groupId: string;
  /** The first-out's id, or null when the alarm is itself the first-out. */
  firstOutId: string | null;
  /** On a first-out: how many consequential alarms are listed under it; 0 on the others. */
  consequentialCount: number;
}

/**
 * The rule: alarms of one site and one condition family, raised within GROUP_WINDOW_MS (2 min)
 * after the earliest of them, form a group; the earliest raised (lowest id on a tie) is the
 * first-out. The window is measured from the first-out, not chained from alarm to alarm, so a
 * slow trickle does not grow one group for ever. Only the alarms given are grouped.
 * @returns the grouping of each alarm by id
 */
export function groupConsequential(alarms: readonly GroupableAlarm[]): Map<string, AlarmGrouping> {
  const sorted = [...alarms].sort(
    (a, b) => a.raisedAt.getTime() - b.raisedAt.getTime() || Number(BigInt(a.id) - BigInt(b.id)),
  );
  const open = new Map<string, { firstOutId: string; raisedMs: number }>();
  const result = new Map<string, AlarmGrouping>();
  for (const a of sorted) {
    const key = `${a.siteId}|${familyOf(a.condition)}`;
    const group = open.get(key);
    if (group && a.raisedAt.getTime() - group.raisedMs <= GROUP_WINDOW_MS) {
      result.set(a.id, { groupId: group.firstOutId, firstOutId: group.firstOutId, consequentialCount: 0 });
      result.get(group.firstOutId)!.consequentialCount += 1;
    } else {
      open.set(key, { firstOutId: a.id, raisedMs: a.raisedAt.getTime() });
      result.set(a.id, { groupId: a.id, firstOutId: null, consequentialCount: 0 });
    }
  }
  return result;
}

/** A 10-minute period, the unit of ISA-18.2's alarm rate measures. */
export const PERIOD_MS = 10 * MINUTE_MS;
/** A flood: more than 10 alarms in 10 minutes for one operator (ISA-18.2-2016, from memory). */
export const FLOOD_MORE_THAN = 10;
/** Chattering: 3 or more annunciations of one alarm point within 1 minute (ISA-18.2-2016 guidance, from memory). */
export const CHATTER_RAISES = 3;
export const CHATTER_WINDOW_MS = MINUTE_MS;
/** Stale: an alarm that stays in alarm longer than 24 hours. */
export const STALE_AFTER_MS = 24 * 60 * MINUTE_MS;

/**
 * The benchmark values printed beside ours. They come from memory of the published performance
 * table of ANSI/ISA-18.2-2016 (with EEMUA 191 giving the same rates), not from a copy at hand.
 */
export const ALARM_BENCHMARKS = {
  source: 'ANSI/ISA-18.2-2016 performance table and EEMUA 191 (values from memory of the published tables)',
  averagePer10MinVeryLikelyAcceptable: 1,
  averagePer10MinMaximumManageable: 2,
  floodPercentOfTimeAtMost: 1,
  chatteringAlarms: 0,
  staleAlarms: 0,
} as const;

/** One annunciation: an alarm point going into alarm (raised, or returned to alarm). */
export interface Annunciation {
  /** The alarm point: meter run, transmitter (or none) and condition. */
  pointKey: string;
  atMs: number;
}

export interface AlarmOccurrence {
  id: string;
  pointKey: string;
  raisedMs: number;
  clearedMs: number | null;
}

export interface PerformanceInput {
  fromMs: number;
  toMs: number;
  /** Operator positions watching the site; one unless a setting says otherwise. */
  operatorPositions: number;
  annunciations: readonly Annunciation[];
  /** Alarm occurrences overlapping the month (for stale alarms). */
  occurrences: readonly AlarmOccurrence[];
  /** The clock, so a still-open alarm is measured to now when the month is not over. */
  nowMs: number;
}

export interface AlarmPerformance {
  periods: number;
  annunciations: number;
  averagePer10MinPerOperator: number;
  peakPer10MinPerOperator: number;
  floodPeriods: number;
  floodPercentOfTime: number;
  chattering: { pointKey: string; raises: number; mostInOneMinute: number }[];
  stale: { id: string; pointKey: string; raisedMs: number; clearedMs: number | null; activeMs: number }[];
  topTen: { pointKey: string; raises: number; sharePercent: number }[];
  topTenSharePercent: number;
}

/** The month's measures for one site. Annunciations outside [fromMs, toMs) are ignored. */
export function alarmPerformance(input: PerformanceInput): AlarmPerformance {
  const { fromMs, toMs, operatorPositions } = input;
  if (!(toMs > fromMs)) throw new RangeError('the period must end after it starts');
  if (!(operatorPositions >= 1)) throw new RangeError('operatorPositions must be at least 1');
  const periods = Math.ceil((toMs - fromMs) / PERIOD_MS);
  const inside = input.annunciations.filter((a) => a.atMs >= fromMs && a.atMs < toMs);
  const perPeriod = new Map<number, number>();
  const byPoint = new Map<string, number[]>();
  for (const a of inside) {
    const p = Math.floor((a.atMs - fromMs) / PERIOD_MS);
    perPeriod.set(p, (perPeriod.get(p) ?? 0) + 1);
    byPoint.set(a.pointKey, [...(byPoint.get(a.pointKey) ?? []), a.atMs]);
  }
  const perOperator = (n: number) => n / operatorPositions;
  const counts = [...perPeriod.values()];
  const floodPeriods = counts.filter((n) => perOperator(n) > FLOOD_MORE_THAN).length;

  const chattering: AlarmPerformance['chattering'] = [];
  for (const [pointKey, times] of byPoint) {
    const sorted = [...times].sort((x, y) => x - y);
    let most = 0;
    for (let i = 0, j = 0; j < sorted.length; j++) {
      while (sorted[j] - sorted[i] >= CHATTER_WINDOW_MS) i++;
      most = Math.max(most, j - i + 1);
    }
    if (most >= CHATTER_RAISES) chattering.push({ pointKey, raises: sorted.length, mostInOneMinute: most });
  }

  const stale = input.occurrences
    .filter((o) => o.raisedMs < toMs && (o.clearedMs === null || o.clearedMs >= fromMs))
    .map((o) => ({ ...o, activeMs: (o.clearedMs ?? Math.min(toMs, input.nowMs)) - o.raisedMs }))
    .filter((o) => o.activeMs > STALE_AFTER_MS);

  const total = inside.length;
  const share = (n: number) => (total ? (100 * n) / total : 0);
  const topTen = [...byPoint]
    .map(([pointKey, times]) => ({ pointKey, raises: times.length, sharePercent: share(times.length) }))
    .sort((a, b) => b.raises - a.raises || a.pointKey.localeCompare(b.pointKey))
    .slice(0, 10);
  return {
    periods,
    annunciations: total,
    averagePer10MinPerOperator: perOperator(total) / periods,
    peakPer10MinPerOperator: perOperator(Math.max(0, ...counts)),
    floodPeriods,
    floodPercentOfTime: (100 * floodPeriods) / periods,
    chattering,
    stale,
    topTen,
    topTenSharePercent: share(topTen.reduce((s, t) => s + t.raises, 0)),
  };
}
