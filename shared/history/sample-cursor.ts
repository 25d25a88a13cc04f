/**
 * A forward-only cursor over time-sorted samples: the latest sample at or before a time, and the
 * latest usable one (quality not bad, value finite). Queries must come in non-decreasing time,
 * as the hour is walked from start to end; each query is amortised O(1).
 */
import type { Sample } from './types';

export interface SampleCursor {
  /**
   * Moves to a time.
   * @param timeMs query time, epoch ms (never less than the previous query)
   */
  moveTo(timeMs: number): void;
  /** The latest sample at or before the query time, whatever its quality; null if none. */
  latest(): Sample | null;
  /** The latest usable (not bad, finite) sample at or before the query time; null if none. */
  latestUsable(): Sample | null;
}

/** A sample is usable unless its quality is bad or its value is not a finite number. */
export function isUsableSample(sample: Sample): boolean {
  return sample.quality !== 'bad' && Number.isFinite(sample.value);
}

/**
 * @param samples samples sorted by timeMs (checked: an unsorted series throws, naming the field)
 * @param field the field name for error messages, e.g. 'staticPressure'
 * @returns a cursor positioned before the first sample
 */
export function sampleCursor(samples: readonly Sample[], field: string): SampleCursor {
  for (let i = 1; i < samples.length; i++) {
    if (!(samples[i].timeMs >= samples[i - 1].timeMs)) {
      throw new Error(
        `computeHour: ${field} must be sorted by timeMs (sample ${i} at ${samples[i].timeMs} follows ${samples[i - 1].timeMs})`,
      );
    }
  }
  let next = 0;
  let latest: Sample | null = null;
  let latestUsable: Sample | null = null;
  let lastTimeMs = -Infinity;
  return {
    moveTo(timeMs: number) {
      if (timeMs < lastTimeMs)
        throw new Error(`sampleCursor: ${field} was queried backwards in time (${timeMs} < ${lastTimeMs})`);
      lastTimeMs = timeMs;
      while (next < samples.length && samples[next].timeMs <= timeMs) {
        latest = samples[next];
        if (isUsableSample(latest)) latestUsable = latest;
        next++;
      }
    },
    latest: () => latest,
    latestUsable: () => latestUsable,
  };
}
