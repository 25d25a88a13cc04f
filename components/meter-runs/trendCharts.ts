/**
 * The meter run's four trend charts (DP, static pressure, temperature, flow) built from the
 * trend endpoint's answer, converted to the site's display units. DP shows each transmitter of
 * a stacked pair with its span and the bottom tenth of each span hatched: below 10 % of span
 * the DP error as a share of the reading grows (TRADE.md §6).
 */
import type { ChartProps, ChartZone, ChartLine } from '@/components/charts/chartTypes';
import {
  defaultFlowRateUnit,
  displayUnitFor,
  flowRateForDisplay,
  formatPlain,
  readingForDisplay,
  unitsFor,
  type DisplayUnits,
} from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Transmitter } from '@/hooks/api/transmitters';
import type { Trend, TrendSeries } from '@/hooks/api/trends';
import { alignBuckets, hourlySteps, type BucketSeries } from './trendData';

export interface TrendChartSet {
  dp: ChartProps;
  staticPressure: ChartProps;
  temperature: ChartProps;
  flow: ChartProps;
}

interface TrendContext {
  run: MeterRun;
  transmitters: readonly Transmitter[];
  displayUnits: DisplayUnits;
  atmosphericPressurePa: number;
  timeZone: string;
}

const roleWords: Record<TrendSeries['stackRole'], string> = { single: '', low: ' low range', high: ' high range' };

/** The high-range transmitter of a pair is the main (solid) line; the low-range one dashed. */
function rankOf(series: TrendSeries, index: number): number {
  if (series.stackRole === 'high') return 0;
  if (series.stackRole === 'low') return 1;
  return index;
}

function seconds(iso: string): number {
  return Date.parse(iso) / 1000;
}

/** The chosen window in epoch seconds: every chart of the meter run spans the same time. */
function windowOf(trend: Trend): [number, number] {
  return [seconds(trend.from), seconds(trend.to)];
}

function buildChart(
  trend: Trend,
  measures: TrendSeries['measures'],
  context: TrendContext,
  scale: string,
  title: string,
  gapS: number,
): { chart: ChartProps; highest: number } {
  const set = unitsFor(context.displayUnits);
  const chosen = trend.series.filter((s) => s.measures === measures);
  let highest = -Infinity;
  const buckets: BucketSeries[] = chosen.map((s, i) => {
    const source = {
      ...s,
      pressureReference: context.transmitters.find((t) => t.id === s.transmitterId)?.pressureReference,
    };
    const shown = (v: number) => readingForDisplay(v, source, set, context.atmosphericPressurePa);
    return {
      label: `${s.tag}${roleWords[s.stackRole]}`,
      scale,
      rank: rankOf(s, i),
      points: s.points.map((p) => {
        const max = shown(p.max);
        highest = Math.max(highest, max);
        return { x: seconds(p.time), mean: shown(p.mean), min: shown(p.min), max };
      }),
    };
  });
  const aligned = alignBuckets(buckets, gapS);
  const unit = displayUnitFor({ measures }, set);
  return {
    chart: {
      title,
      x: { values: aligned.x, kind: 'time', label: 'Time', timeZone: context.timeZone, range: windowOf(trend) },
      axes: [{ scale, label: unit, side: 'left' }],
      series: aligned.series,
      syncKey: `meter-run-${context.run.id}`,
      emptyText:
        chosen.length === 0
          ? `No ${title.toLowerCase()} transmitter on this meter run.`
          : `No ${title.toLowerCase()} readings in this window.`,
    },
    highest,
  };
}

/**
 * @param trend the trend endpoint's answer
 * @param context the meter run, its transmitters and the site's units, zone and atmosphere
 * @returns the four charts' props
 */
export function trendCharts(trend: Trend, context: TrendContext): TrendChartSet {
  const set = unitsFor(context.displayUnits);
  const bucketS = (Date.parse(trend.to) - Date.parse(trend.from)) / 1000 / trend.buckets;
  // Closer than the meter run's gap limit (or a few buckets, for a long window) is continuous.
  const gapS = Math.max(context.run.maxGapS, 2.5 * bucketS);

  const dp = buildChart(trend, 'differential-pressure', context, 'dp', 'Differential pressure', gapS);
  const dpSeries = trend.series.filter((s) => s.measures === 'differential-pressure');
  const zones: ChartZone[] = [];
  const lines: ChartLine[] = [];
  let top = dp.highest;
  for (const s of dpSeries) {
    const shown = (v: number) => readingForDisplay(v, s, set, context.atmosphericPressurePa);
    const lower = shown(s.lowerRange);
    const upper = shown(s.upperRange);
    top = Math.max(top, upper);
    zones.push({ scale: 'dp', from: lower, to: lower + 0.1 * (upper - lower), label: `bottom 10 % of ${s.tag}` });
    lines.push({
      scale: 'dp',
      value: upper,
      label: `${s.tag} span ${formatPlain(upper)} ${set.differentialPressure.label}`,
    });
  }
  dp.chart.zones = zones;
  dp.chart.lines = lines;
  // The whole of the largest span stays in view, so where a reading sits in it is plain.
  if (dpSeries.length > 0 && Number.isFinite(top)) dp.chart.axes = [{ ...dp.chart.axes[0], range: [0, top * 1.08] }];
  dp.chart.height = 260;

  const staticPressure = buildChart(trend, 'static-pressure', context, 'p', 'Static pressure', gapS).chart;
  const temperature = buildChart(trend, 'temperature', context, 't', 'Temperature', gapS).chart;

  const rateUnit = defaultFlowRateUnit(context.displayUnits, context.run.fluid?.kind);
  const steps = hourlySteps(
    trend.flow.map((hour) => ({
      x: seconds(hour.time),
      value:
        flowRateForDisplay(
          { massKgPerS: hour.massFlowKgPerS, standardVolumeM3PerS: hour.standardVolumeFlowM3PerS },
          rateUnit,
        ) ?? 0,
    })),
  );
  const flow: ChartProps = {
    title: 'Flow',
    x: { values: steps.x, kind: 'time', label: 'Time', timeZone: context.timeZone, range: windowOf(trend) },
    axes: [{ scale: 'q', label: rateUnit.label, side: 'left', range: [0, null] }],
    series: [
      {
        // The hour still in progress is a rate over its elapsed seconds, said in the legend.
        label: `Hourly flow, ${rateUnit.label}${trend.flow.some((hour) => hour.partial) ? ' (last hour in progress: rate so far)' : ''}`,
        values: steps.values,
        scale: 'q',
        rank: 0,
        stepped: true,
      },
    ],
    syncKey: `meter-run-${context.run.id}`,
    emptyText: 'No hourly records in this window yet.',
  };
  return { dp: dp.chart, staticPressure, temperature, flow };
}
