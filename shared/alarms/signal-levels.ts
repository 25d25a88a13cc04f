/**
 * Where a transmitter's reading sits against the limits of its 4–20 mA output, after NAMUR
 * NE 43 ("Standardisation of the signal level for the failure information of digital
 * transmitters"). The levels below are from the recommendation's published text as remembered
 * here [mem], not checked against a copy on this machine:
 * - measurement information: 3.8 mA to 20.5 mA (4–20 mA is the range, the rest is the linear
 *   under- and over-range a transmitter still drives);
 * - failure information: ≤ 3.6 mA or ≥ 21.0 mA.
 * Mapped onto the transmitter's range (4 mA = lower range value, 20 mA = upper range value, so
 * 1 mA = span/16): at or above upper + 0.5/16 of span the output is at its saturation limit;
 * beyond upper + 1/16 (or below lower − 0.4/16) it is a failure level. A flat reading at a
 * saturation limit is the process beyond the range (over or under range), not a frozen signal.
 */

/** NE 43 levels in mA [mem]: the measurement range and the failure thresholds. */
export const NE43_MILLIAMPS = {
  rangeLow: 4,
  rangeHigh: 20,
  saturationLow: 3.8,
  saturationHigh: 20.5,
  failureLow: 3.6,
  failureHigh: 21.0,
} as const;

export type SignalLevel = 'failure-low' | 'saturated-low' | 'in-span' | 'saturated-high' | 'failure-high';

/** Readings this share of span inside a saturation limit still count as at it (displayed values are rounded). */
const AT_LIMIT_TOLERANCE_SHARE_OF_SPAN = 1e-5;

/**
 * @param value the reading, in the same unit as the range
 * @param lowerRange the transmitter's lower range value (4 mA)
 * @param upperRange the transmitter's upper range value (20 mA), above lowerRange
 * @returns 'in-span' between the saturation limits (this includes the linear over- and
 *   under-range between 4/20 mA and the limits), 'saturated-…' at or beyond a saturation limit
 *   up to the failure threshold, 'failure-…' at or beyond a failure threshold
 */
export function signalLevel(value: number, lowerRange: number, upperRange: number): SignalLevel {
  const span = upperRange - lowerRange;
  if (!(span > 0))
    throw new Error(`signalLevel: upperRange must exceed lowerRange (got ${lowerRange} to ${upperRange})`);
  const { rangeLow, rangeHigh, saturationLow, saturationHigh, failureLow, failureHigh } = NE43_MILLIAMPS;
  const mA = rangeLow + ((value - lowerRange) / span) * (rangeHigh - rangeLow);
  const tolerance = AT_LIMIT_TOLERANCE_SHARE_OF_SPAN * (rangeHigh - rangeLow);
  if (mA >= failureHigh) return 'failure-high';
  if (mA <= failureLow) return 'failure-low';
  if (mA >= saturationHigh - tolerance) return 'saturated-high';
  if (mA <= saturationLow + tolerance) return 'saturated-low';
  return 'in-span';
}
