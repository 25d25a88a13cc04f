import { DateTime } from 'luxon';
import { notFound } from '../../errors';
import { ALARM_BENCHMARKS, alarmPerformance, type AlarmPerformance } from '../../../shared/alarms/alarm-performance';
import type { AlarmPerformanceRepository, AlarmPointRecord } from './repository';

/**
 * One operator position per site: Tallyrun has no setting for how many operators watch a site,
 * so the per-operator rates are the site's rates.
 */
export const OPERATOR_POSITIONS_PER_SITE = 1;

export interface AlarmPerformanceReport extends AlarmPerformance {
  siteId: string;
  month: string;
  timeZone: string;
  from: Date;
  to: Date;
  operatorPositions: number;
  points: Map<string, AlarmPointRecord>;
  benchmarks: typeof ALARM_BENCHMARKS;
}

/**
 * The alarm performance of one site over one calendar month, from local midnight on the 1st in
 * the site's zone to the same on the 1st of the next month (so a DST month has its true length).
 * @throws not found when the site does not exist
 */
export async function alarmPerformanceReport(
  repository: AlarmPerformanceRepository,
  input: { siteId: string; month: string; nowMs: number },
): Promise<AlarmPerformanceReport> {
  const timeZone = await repository.siteTimeZone(input.siteId);
  if (!timeZone) throw notFound('Site');
  const start = DateTime.fromISO(`${input.month}-01T00:00:00`, { zone: timeZone });
  const from = start.toJSDate();
  const to = start.plus({ months: 1 }).toJSDate();
  const [annunciations, occurrences] = await Promise.all([
    repository.annunciations(input.siteId, from, to),
    repository.occurrences(input.siteId, from, to),
  ]);
  const measures = alarmPerformance({
    fromMs: from.getTime(),
    toMs: to.getTime(),
    operatorPositions: OPERATOR_POSITIONS_PER_SITE,
    annunciations: annunciations.map((a) => ({ pointKey: a.pointKey, atMs: a.at.getTime() })),
    occurrences: occurrences.map((o) => ({
      id: o.id,
      pointKey: o.pointKey,
      raisedMs: o.raisedAt.getTime(),
      clearedMs: o.clearedAt?.getTime() ?? null,
    })),
    nowMs: input.nowMs,
  });
  const keys = new Set([
    ...measures.topTen.map((t) => t.pointKey),
    ...measures.chattering.map((c) => c.pointKey),
    ...measures.stale.map((s) => s.pointKey),
  ]);
  const points = new Map((await repository.points(input.siteId, [...keys])).map((p) => [p.pointKey, p]));
  return {
    ...measures,
    siteId: input.siteId,
    month: input.month,
    timeZone,
    from,
    to,
    operatorPositions: OPERATOR_POSITIONS_PER_SITE,
    points,
    benchmarks: ALARM_BENCHMARKS,
  };
}
