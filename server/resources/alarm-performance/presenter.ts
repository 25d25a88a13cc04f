import type { AlarmPerformanceReport } from './use-cases';

const round = (x: number, places = 3) => Math.round(x * 10 ** places) / 10 ** places;
const iso = (ms: number | null) => (ms === null ? null : new Date(ms).toISOString());

/** The monthly alarm performance of a site, each alarm point with its tags. */
export function presentAlarmPerformance(r: AlarmPerformanceReport) {
  const point = (pointKey: string) => {
    const p = r.points.get(pointKey);
    return {
      meterRunId: p?.meterRunId ?? null,
      meterRunTag: p?.meterRunTag ?? null,
      transmitterId: p?.transmitterId ?? null,
      transmitterTag: p?.transmitterTag ?? null,
      condition: p?.condition ?? null,
    };
  };
  return {
    siteId: r.siteId,
    month: r.month,
    timeZone: r.timeZone,
    from: r.from.toISOString(),
    to: r.to.toISOString(),
    operatorPositions: r.operatorPositions,
    periods: r.periods,
    annunciations: r.annunciations,
    averagePer10MinPerOperator: round(r.averagePer10MinPerOperator),
    peakPer10MinPerOperator: r.peakPer10MinPerOperator,
    floodPeriods: r.floodPeriods,
    floodPercentOfTime: round(r.floodPercentOfTime),
    chattering: r.chattering.map((c) => ({
      ...point(c.pointKey),
      raises: c.raises,
      mostInOneMinute: c.mostInOneMinute,
    })),
    stale: r.stale.map((s) => ({
      alarmId: s.id,
      ...point(s.pointKey),
      raisedAt: iso(s.raisedMs),
      clearedAt: iso(s.clearedMs),
      activeHours: round(s.activeMs / 3_600_000, 2),
    })),
    topTen: r.topTen.map((t) => ({ ...point(t.pointKey), raises: t.raises, sharePercent: round(t.sharePercent, 1) })),
    topTenSharePercent: round(r.topTenSharePercent, 1),
    benchmarks: r.benchmarks,
  };
}
