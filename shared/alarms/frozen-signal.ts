/**
 * A frozen (flat-lined) transmitter: its readings over a window show no variation. A live
 * transmitter always shows some noise (a digital value stuck at its last output repeats to the
 * last digit), so a standard deviation at or below a tiny share of span means the value no
 * longer follows the process. Uses simple-statistics' sample standard deviation.
 */
import { sampleStandardDeviation } from 'simple-statistics';

export interface FrozenLimits {
  /** Readings needed in the window (≥ 2). */
  minSamples: number;
  /** σ at or below this share of span is "no variation". */
  maxStdDevShareOfSpan: number;
}

/**
 * @param values the readings over the window (one unit), at least minSamples of them to judge
 * @param span the transmitter's span in the same unit (> 0)
 * @param limits minimum count and the σ limit
 * @returns true when frozen, false when varying, null when too few readings to judge
 */
export function isFrozenSignal(values: readonly number[], span: number, limits: FrozenLimits): boolean | null {
  if (!(span > 0)) throw new Error(`isFrozenSignal: span must be > 0 (got ${span})`);
  if (values.length < Math.max(2, limits.minSamples)) return null;
  const sigma = sampleStandardDeviation(values as number[]);
  return sigma <= limits.maxStdDevShareOfSpan * span;
}
