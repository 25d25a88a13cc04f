import type { PeriodTotal } from '../../../shared/history/types';
import type { RecomputeQueue } from './repository';
import type { HistoryHourlyRecord, HistoryTotal, Trend } from './use-cases';

const iso = (ms: number) => new Date(ms).toISOString();

/** The figures of a total or an hourly record: instants as ISO 8601 strings, quantities in SI. */
const presentFigures = (t: HistoryTotal): PeriodTotal => ({
  start: iso(t.startMs),
  end: iso(t.endMs),
  hours: t.hours,
  flowTimeS: t.flowTimeS,
  massKg: t.massKg,
  volumeM3: t.volumeM3,
  standardVolumeM3: t.standardVolumeM3,
  energyJ: t.energyJ,
  coverage: t.coverage,
  flags: t.flags,
  uncertaintyPercent: t.uncertaintyPercent,
  status: t.status,
});

/**
 * Reverse and net flow (issue 13 §11), only for a period with reverse flow (a bi-directional meter
 * run): a one-way meter run's totals keep their shape. The figures before them are forward flow.
 */
const presentDirections = (t: HistoryTotal) =>
  t.reverse && t.net
    ? {
        reverse: {
          flowTimeS: t.reverse.flowTimeS,
          massKg: t.reverse.massKg,
          volumeM3: t.reverse.volumeM3,
          standardVolumeM3: t.reverse.standardVolumeM3,
          energyJ: t.reverse.energyJ,
        },
        net: {
          massKg: t.net.massKg,
          volumeM3: t.net.volumeM3,
          standardVolumeM3: t.net.standardVolumeM3,
          energyJ: t.net.energyJ,
        },
      }
    : {};

/** An hour's whole reverse part (null on a one-way meter run), its budget terms named as the forward budget's. */
const presentReversePart = (r: HistoryHourlyRecord) =>
  r.reversePart
    ? {
        flowTimeS: r.reversePart.flowTimeS,
        massKg: r.reversePart.massKg,
        volumeM3: r.reversePart.volumeM3,
        standardVolumeM3: r.reversePart.standardVolumeM3,
        energyJ: r.reversePart.energyJ,
        averageDpPa: r.reversePart.averageDpPa,
        averagePressurePa: r.reversePart.averagePressurePa,
        averageTemperatureK: r.reversePart.averageTemperatureK,
        integralValue: r.reversePart.integralValue,
        integralMultiplierValue: r.reversePart.integralMultiplierValue,
        uncertaintyPercent: r.reversePart.uncertaintyPercent,
        uncertaintyBudget: r.reversePart.uncertaintyBudget.map((t) => ({
          term: t.name,
          percent: t.percent,
          source: t.source,
        })),
      }
    : null;

/** Added last (issue 9): the record's version and version 1's mass and standard volume (null: no record). */
const presentVersion = (t: HistoryTotal) => ({
  version: t.version,
  firstMassKg: t.firstMassKg,
  firstStandardVolumeM3: t.firstStandardVolumeM3,
});

/** One entry of `GET /api/meter-runs/:id/totals`. */
export const presentTotal = (t: HistoryTotal) => ({
  ...presentFigures(t),
  ...presentDirections(t),
  ...presentVersion(t),
});

/** One entry of `GET /api/meter-runs/:id/hourly-records`: the total of the hour and what only an hour carries. */
export const presentHourlyRecord = (r: HistoryHourlyRecord) => ({
  ...presentFigures(r),
  averageDpPa: r.averageDpPa,
  averagePressurePa: r.averagePressurePa,
  averageTemperatureK: r.averageTemperatureK,
  integralValue: r.integralValue,
  integralMultiplierValue: r.integralMultiplierValue,
  configVersionId: r.configVersionId,
  dpBands: r.dpBands,
  activeTransmitterTimeS: r.activeTransmitterTimeS,
  computedAt: iso(r.computedAtMs),
  ...presentVersion(r),
  // Added last (issue 13): each term of U(qm)/qm (k = 2, percent) with where its input comes from.
  uncertaintyBudget: r.uncertaintyBudget?.map((t) => ({ term: t.name, percent: t.percent, source: t.source })) ?? null,
  // Added last (issue 13 §11): the hour's reverse flow (null on a one-way meter run) and net, forward − reverse (null likewise).
  reverse: presentReversePart(r),
  net: r.net,
});

export const presentRecomputeStatus = (q: RecomputeQueue) => ({
  pendingHours: q.pendingHours,
  oldestPendingHour: q.oldestPendingMs === null ? null : iso(q.oldestPendingMs),
});

/** The trend, echoing the window as the caller wrote it. */
export const presentTrend = (window: { from: string; to: string }, trend: Trend) => ({
  from: window.from,
  to: window.to,
  buckets: trend.buckets,
  series: trend.series.map((s) => ({
    transmitterId: s.id,
    tag: s.tag,
    measures: s.measures,
    unit: s.unit,
    stackRole: s.stackRole,
    lowerRange: s.lowerRange,
    upperRange: s.upperRange,
    points: s.points.map((p) => ({ time: iso(p.timeMs), min: p.min, max: p.max, mean: p.mean, count: p.count })),
  })),
  flow: trend.flow.map((f) => ({
    time: iso(f.startMs),
    massFlowKgPerS: f.massFlowKgPerS,
    standardVolumeFlowM3PerS: f.standardVolumeFlowM3PerS,
    coverage: f.coverage,
    partial: f.partial,
  })),
});
