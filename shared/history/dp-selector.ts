/**
 * Which DP reading is in use at a moment: the single transmitter's latest sample, or for a
 * stacked pair the one chosen with hysteresis by shared/flow/stacked-pair.ts. A DP sample
 * covers at most maxGapS after its time; a bad sample covers its interval as missing time (it
 * is not used, and an older good sample is not revived in its place).
 */
import { chooseStackedTransmitter, type StackedPairConfig, type StackedReading } from '../flow/stacked-pair';
import { isUsableSample, sampleCursor, type SampleCursor } from './sample-cursor';
import type { DpSeries, Sample } from './types';

export type StackChoice = 'low' | 'high';

export interface DpSelection {
  /** The transmitter in use, or null when no usable reading covers the moment. */
  series: DpSeries | null;
  sample: Sample | null;
  /** A bad sample of either transmitter covers the moment. */
  badSampleInForce: boolean;
}

export interface DpSelector {
  /** Selection at a time (queries in non-decreasing time). */
  at(timeMs: number): DpSelection;
  /** The stacked pair's latest choice (the initial one until a choice is made); null for a single transmitter. */
  stackChoice(): StackChoice | null;
}

export interface DpSelectorOptions {
  maxGapMs: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
  initialStackChoice?: StackChoice;
}

/**
 * @param dp one series (single) or two (a low and a high)
 * @param options coverage limit of a sample and the pair's hysteresis
 * @returns a selector walked forward in time
 */
export function dpSelector(dp: readonly DpSeries[], options: DpSelectorOptions): DpSelector {
  dp.forEach((series, i) => {
    if (!(series.upperRangePa > series.lowerRangePa)) {
      throw new Error(
        `computeHour: dp.${i}.upperRangePa must exceed lowerRangePa (got ${series.lowerRangePa} to ${series.upperRangePa})`,
      );
    }
    if (!(series.accuracyPercentOfSpan >= 0))
      throw new Error(`computeHour: dp.${i}.accuracyPercentOfSpan must be ≥ 0 (got ${series.accuracyPercentOfSpan})`);
  });
  const cursors: SampleCursor[] = dp.map((series, i) => sampleCursor(series.samples, `dp.${i}.samples`));
  /** The latest sample if it still covers the time (t ≤ time < t + maxGap). */
  const fresh = (i: number, timeMs: number): Sample | null => {
    cursors[i].moveTo(timeMs);
    const s = cursors[i].latest();
    return s !== null && timeMs - s.timeMs < options.maxGapMs ? s : null;
  };

  if (dp.length === 1) {
    const series = dp[0];
    return {
      at(timeMs) {
        const s = fresh(0, timeMs);
        if (s === null) return { series: null, sample: null, badSampleInForce: false };
        return isUsableSample(s)
          ? { series, sample: s, badSampleInForce: false }
          : { series: null, sample: null, badSampleInForce: s.quality === 'bad' };
      },
      stackChoice: () => null,
    };
  }

  const lowIndex = dp.findIndex((s) => s.stackRole === 'low');
  const highIndex = dp.findIndex((s) => s.stackRole === 'high');
  if (dp.length !== 2 || lowIndex < 0 || highIndex < 0) {
    throw new Error(
      `computeHour: dp must hold one series, or two with stackRole 'low' and 'high' (got ${dp.length}: ${dp.map((s) => s.stackRole).join(', ')})`,
    );
  }
  const low = dp[lowIndex];
  const high = dp[highIndex];
  const config: StackedPairConfig = {
    lowLowerRangePa: low.lowerRangePa,
    lowUpperRangePa: low.upperRangePa,
    highUpperRangePa: high.upperRangePa,
    switchUpShare: options.stackSwitchUpShare,
    switchDownShare: options.stackSwitchDownShare,
  };
  let previous: StackChoice | null = options.initialStackChoice ?? null;
  let first = true;
  let lastLow: Sample | null = null;
  let lastHigh: Sample | null = null;
  let lastSelection: DpSelection = { series: null, sample: null, badSampleInForce: false };
  /**
   * The sample in force just before a time (the previous hour's last piece): the latest one
   * before it, if its coverage reaches the time (it covers [t, t + maxGap)). HourInputs.dp
   * includes the latest sample before startMs, so an hour knows it without the previous hour.
   */
  const inForceJustBefore = (samples: readonly Sample[], timeMs: number): Sample | null => {
    let j = samples.length - 1;
    while (j >= 0 && !(samples[j].timeMs < timeMs)) j--;
    return j >= 0 && samples[j].timeMs + options.maxGapMs >= timeMs ? samples[j] : null;
  };
  const reading = (s: Sample | null): StackedReading | null =>
    s === null ? null : { valuePa: s.value, quality: s.quality };
  const selectionOf = (use: StackChoice | null, lowSample: Sample | null, highSample: Sample | null): DpSelection => {
    const badSampleInForce = lowSample?.quality === 'bad' || highSample?.quality === 'bad';
    if (use === null) return { series: null, sample: null, badSampleInForce };
    return use === 'low'
      ? { series: low, sample: lowSample, badSampleInForce }
      : { series: high, sample: highSample, badSampleInForce };
  };
  return {
    at(timeMs) {
      const lowSample = fresh(lowIndex, timeMs);
      const highSample = fresh(highIndex, timeMs);
      // The choice is made when the pair of readings in force changes, not at every piece, so
      // that cutting the time line (at an hour boundary, a P or T sample) never changes it.
      if (!first && lowSample === lastLow && highSample === lastHigh) return lastSelection;
      const lowReading = reading(lowSample);
      const highReading = reading(highSample);
      let use = chooseStackedTransmitter(lowReading, highReading, previous, config).use;
      if (
        first &&
        previous !== null &&
        use !== previous &&
        lowSample === inForceJustBefore(low.samples, timeMs) &&
        highSample === inForceJustBefore(high.samples, timeMs)
      ) {
        // The previous hour ended on `previous`, chosen on these same readings (the pair in force
        // just before this hour is still in force): a continuous walk would not choose again
        // here, so keep it when some history could have chosen it for this pair. When a new
        // reading arrives exactly at the boundary, the choice is made on it from `previous`, as
        // a continuous walk would.
        const other: StackChoice = previous === 'low' ? 'high' : 'low';
        const reachable = [other, null].some(
          (before) => chooseStackedTransmitter(lowReading, highReading, before, config).use === previous,
        );
        if (reachable) use = previous;
      }
      first = false;
      lastLow = lowSample;
      lastHigh = highSample;
      if (use !== null) previous = use;
      lastSelection = selectionOf(use, lowSample, highSample);
      return lastSelection;
    },
    stackChoice: () => previous,
  };
}
