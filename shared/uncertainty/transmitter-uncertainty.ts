/**
 * A transmitter's accuracy stated as a percentage of its calibrated span becomes a larger
 * percentage of the reading low in the range (TRADE.md §6): U_reading = U_span × span / |reading|.
 */

/**
 * @param accuracyPercentOfSpan stated accuracy, percent of span (e.g. 0.075)
 * @param spanInUnit calibrated span (upper − lower range value), in the transmitter's unit
 * @param readingInUnit the reading, same unit (its distance from zero, not from the lower range value)
 * @returns uncertainty as a percent of the reading (Infinity at a zero reading)
 */
export function readingUncertaintyPercent(
  accuracyPercentOfSpan: number,
  spanInUnit: number,
  readingInUnit: number,
): number {
  if (!(accuracyPercentOfSpan >= 0))
    throw new Error(`readingUncertaintyPercent: accuracyPercentOfSpan must be ≥ 0 (got ${accuracyPercentOfSpan})`);
  if (!(spanInUnit > 0)) throw new Error(`readingUncertaintyPercent: spanInUnit must be > 0 (got ${spanInUnit})`);
  const reading = Math.abs(readingInUnit);
  return reading === 0 ? Infinity : (accuracyPercentOfSpan * spanInUnit) / reading;
}
