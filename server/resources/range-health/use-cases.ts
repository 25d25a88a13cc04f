import { quantile } from 'simple-statistics';
import { contractDayOf } from '../../../shared/history/contract-day';
import { bandShares, type BandHour } from '../../../shared/range-health/band-shares';
import { rangeAdvice } from '../../../shared/range-health/range-advice';
import {
  DENSITY_MODEL_UNCERTAINTY_PERCENT,
  ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
  PIPE_DIAMETER_UNCERTAINTY_PERCENT,
} from '../../../shared/history/sample-uncertainty';
import { toSI } from '../../../shared/units';
import { inEffectAt } from '../../../shared/history/dated';
import type { PointTransmitter } from '../../../shared/history/sample-uncertainty';
import type { DpBandName } from '../../../shared/history/types';
import type { MeterRunContext } from '../../history/load-context';
import type { RangeHealthHour, RangeHealthRepository } from './repository';

/** Hours shorter than this in flow are left out of the flow range (a start-up minute is not a rate). */
const MIN_FLOW_TIME_FOR_RATE_S = 600;

type DpTransmitter = MeterRunContext['transmitters'][number];

export interface RangeHealthRequest {
  meterRunId: string;
  fromMs: number;
  toMs: number;
  uncertaintyLimitPercent: number;
}

/**
 * Range health of a meter run: the share of flowing time, mass and standard volume in each band
 * of the active DP span, per DP transmitter of a stacked pair, the uncertainty each band
 * contributes, the shares month by month, and a recommendation from the range check.
 *
 * Per transmitter: an hour in which one DP transmitter was in use all its flowing time is
 * attributed to it exactly; an hour in which both were in use (the pair switched) is shared out
 * in proportion to each one's time in use, and the report says how much flowing time was shared
 * out that way (attribution.apportionedFlowTimeS).
 * @returns the report, or null when the meter run does not exist
 */
export async function rangeHealthReport(repository: RangeHealthRepository, request: RangeHealthRequest) {
  const { meterRunId, fromMs, toMs } = request;
  const ctx = await repository.meterRunContext(meterRunId);
  if (!ctx) return null;
  const tags = await repository.transmitterTags(meterRunId);
  const hours = await repository.hourlyRecords(meterRunId, fromMs, toMs);
  const dps = ctx.transmitters.filter((t) => t.measures === 'differential-pressure');
  const tagOf = (t: DpTransmitter) => tags.get(t.id) ?? t.id;

  const summary = bandShares(hours);
  const { perTransmitter, apportionedFlowTimeS } = attributeToTransmitters(hours, dps);
  const transmitters = dps.map((t) => {
    const s = bandShares(perTransmitter.get(t.id) ?? []);
    return {
      transmitterId: t.id,
      tag: tagOf(t),
      stackRole: t.stackRole,
      unit: t.unit,
      lowerRange: t.lowerRange,
      upperRange: t.upperRange,
      accuracyPercentOfSpan: t.accuracyPercentOfSpan,
      activeTimeS: hours.reduce((a, h) => a + (h.active[t.id] ?? 0), 0),
      flowTimeShare: summary.flowTimeS > 0 ? s.flowTimeS / summary.flowTimeS : 0,
      massShare: summary.massKg > 0 ? s.massKg / summary.massKg : 0,
      ...s,
    };
  });

  return {
    meterRunId,
    fromMs,
    toMs,
    hours: hours.length,
    ...summary,
    transmitters,
    attribution: {
      method: 'whole hours exact; hours with a switch of the pair shared out by time in use',
      apportionedFlowTimeS,
    },
    months: sharesByContractMonth(hours, ctx),
    recommendation: recommendation({ ctx, hours, dps, tagOf, summary, toMs, limit: request.uncertaintyLimitPercent }),
  };
}

export type RangeHealthReport = NonNullable<Awaited<ReturnType<typeof rangeHealthReport>>>;

/** Splits each hour's flow between the DP transmitters in use: whole hours exactly, switched hours by time in use. */
function attributeToTransmitters(hours: RangeHealthHour[], dps: DpTransmitter[]) {
  let apportionedFlowTimeS = 0;
  const perTransmitter = new Map<string, BandHour[]>(dps.map((t) => [t.id, []]));
  for (const h of hours) {
    const inUse = dps.filter((t) => (h.active[t.id] ?? 0) > 0);
    const totalActiveS = inUse.reduce((a, t) => a + h.active[t.id], 0);
    if (inUse.length > 1) apportionedFlowTimeS += h.flowTimeS;
    for (const t of inUse) {
      const share = inUse.length === 1 ? 1 : h.active[t.id] / totalActiveS;
      const dpBands: BandHour['dpBands'] = {};
      for (const [band, v] of Object.entries(h.dpBands) as [DpBandName, { timeS: number; massKg: number }][]) {
        dpBands[band] = { timeS: v.timeS * share, massKg: v.massKg * share };
      }
      perTransmitter.get(t.id)?.push({
        flowTimeS: h.flowTimeS * share,
        massKg: h.massKg * share,
        standardVolumeM3: h.standardVolumeM3 * share,
        uncertaintyPercent: h.uncertaintyPercent,
        dpBands,
      });
    }
  }
  return { perTransmitter, apportionedFlowTimeS };
}

/** Band shares per contract month of the site, for the trend of a well drifting down the span. */
function sharesByContractMonth(hours: RangeHealthHour[], ctx: MeterRunContext) {
  const byMonth = new Map<string, RangeHealthHour[]>();
  for (const h of hours) {
    const month = contractDayOf(h.startMs, ctx.timeZone, ctx.contractHour).slice(0, 7);
    const list = byMonth.get(month) ?? [];
    list.push(h);
    byMonth.set(month, list);
  }
  return [...byMonth.entries()].map(([month, list]) => {
    const s = bandShares(list);
    return {
      month,
      flowTimeS: s.flowTimeS,
      massKg: s.massKg,
      standardVolumeM3: s.standardVolumeM3,
      uncertaintyPercent: s.uncertaintyPercent,
      bands: Object.fromEntries(
        s.bands.map((b) => [
          b.band,
          { flowTimeShare: b.flowTimeShare, massShare: b.massShare, standardVolumeShare: b.standardVolumeShare },
        ]),
      ),
    };
  });
}

/** A mass-weighted average over the hours that have the value. */
function massWeighted(hours: RangeHealthHour[], pick: (h: RangeHealthHour) => number | null): number | null {
  let sum = 0;
  let massKg = 0;
  for (const h of hours) {
    const v = pick(h);
    if (v !== null && h.massKg > 0) {
      sum += v * h.massKg;
      massKg += h.massKg;
    }
  }
  return massKg > 0 ? sum / massKg : null;
}

/** The range check run on the period's own flows and conditions, turned into plain advice. */
function recommendation(input: {
  ctx: MeterRunContext;
  hours: RangeHealthHour[];
  dps: DpTransmitter[];
  tagOf: (t: DpTransmitter) => string;
  summary: ReturnType<typeof bandShares>;
  toMs: number;
  limit: number;
}) {
  const { ctx, hours, dps, tagOf, summary, toMs } = input;
  const rates = hours
    .filter((h) => h.flowTimeS >= MIN_FLOW_TIME_FOR_RATE_S && h.massKg > 0)
    .map((h) => h.massKg / h.flowTimeS);
  const version = [...ctx.configVersions].reverse().find((v) => v.effectiveFromMs < toMs);
  if (!rates.length || !version || !dps.length) {
    return {
      kind: 'unavailable',
      text: 'No recommendation: the period has no hour with flow (or the meter run has no DP transmitter or configuration).',
      numbers: {},
    };
  }
  const pressurePa = massWeighted(hours, (h) => h.pressurePa);
  const temperatureK = massWeighted(hours, (h) => h.temperatureK);
  if (pressurePa === null || temperatureK === null) {
    return {
      kind: 'unavailable',
      text: 'No recommendation: no average pressure and temperature in the period.',
      numbers: {},
    };
  }
  const timeShareOf = (name: DpBandName) => summary.bands.find((b) => b.band === name)?.flowTimeShare ?? 0;
  try {
    const advice = rangeAdvice({
      element: version.element,
      fluid: version.fluid,
      conditions: { staticPressurePa: pressurePa, temperatureK },
      // The lowest hourly rate is the 5th percentile, so a start-up hour does not set it.
      flowRange: {
        minimumKgPerS: quantile(rates, 0.05),
        normalKgPerS: quantile(rates, 0.5),
        maximumKgPerS: Math.max(...rates),
      },
      transmitters: dps.map((t) => ({
        id: t.id,
        tag: tagOf(t),
        stackRole: t.stackRole,
        spanPa: toSI(t.upperRange, t.unit) - toSI(t.lowerRange, t.unit),
        accuracyPercentOfSpan: t.accuracyPercentOfSpan,
        accuracyKind: rangeAt(t, toMs).accuracyKind,
        unit: t.unit,
      })),
      lowInRangeTimeShare: timeShareOf('0-10'),
      overRangeTimeShare: timeShareOf('over'),
      uncertaintyLimitPercent: input.limit,
      pipeDiameterPercent: PIPE_DIAMETER_UNCERTAINTY_PERCENT,
      elementDiameterPercent: ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
      densityPercent: DENSITY_MODEL_UNCERTAINTY_PERCENT[version.fluid.kind] ?? 0,
      // The hourly records' own budget, with the P and T transmitters as they stood at the period's
      // end, so the advice's U at a flow is the U an hourly record at that flow carries.
      hourlyBudget: {
        staticPressureTransmitter: pointTransmitterAt(ctx, 'static-pressure', toMs),
        temperatureTransmitter: pointTransmitterAt(ctx, 'temperature', toMs),
      },
    });
    const rc = advice.rangeCheck;
    return {
      kind: advice.kind,
      text: advice.text,
      numbers: advice.numbers,
      rangeCheck: {
        rangeCovered: rc.rangeCovered,
        flows: rc.flows.map((f) => ({
          label: f.label,
          massFlowKgPerS: f.massFlowKgPerS,
          differentialPressurePa: f.differentialPressurePa,
          transmitters: f.transmitters,
        })),
        transmitters: rc.transmitters,
        suggestedLowRangeSpan: rc.suggestedLowRangeSpan,
        warnings: rc.warnings,
      },
    };
  } catch (err) {
    return {
      kind: 'unavailable',
      text: `No recommendation: the range check failed (${err instanceof Error ? err.message : String(err)}).`,
      numbers: {},
    };
  }
}

/** A transmitter's range in force at the last instant before a time (the period's end is exclusive). */
function rangeAt(t: MeterRunContext['transmitters'][number], atMs: number) {
  return inEffectAt(t.ranges, atMs - 1);
}

/** The static pressure or temperature transmitter for the hourly budget, as the history worker builds it. */
function pointTransmitterAt(
  ctx: MeterRunContext,
  measures: 'static-pressure' | 'temperature',
  atMs: number,
): PointTransmitter | undefined {
  const transmitter = ctx.transmitters.find((t) => t.measures === measures);
  if (!transmitter) return undefined;
  const range = rangeAt(transmitter, atMs);
  const span = toSI(range.upperRange, transmitter.unit) - toSI(range.lowerRange, transmitter.unit);
  if (!(span > 0)) return undefined;
  return { accuracyPercentOfSpan: range.accuracyPercentOfSpan, span, accuracyKind: range.accuracyKind };
}
