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

/**
 * How a datasheet states a transmitter's accuracy. 'expanded-k2': an expanded uncertainty with
 * coverage factor k = 2 (about 95 %). 'rectangular-limit': a ± limit the error never exceeds, with
 * no distribution stated, which GUM (JCGM 100:2008) §4.3.7 models as rectangular: u = a/√3.
 */
export type AccuracyKind = 'expanded-k2' | 'rectangular-limit';

/** Where each kind of accuracy figure is converted, for the uncertainty breakdown. */
export const ACCURACY_KIND_SOURCE: Readonly<Record<AccuracyKind, string>> = Object.freeze({
  'expanded-k2': 'datasheet accuracy taken as an expanded uncertainty, k = 2 (GUM §6.2)',
  'rectangular-limit': 'datasheet ± limit taken as rectangular, u = a/√3 (GUM §4.3.7), U = 2u (GUM §6.2)',
});

/**
 * @param accuracyPercent the stated accuracy, any percent basis (of span or of reading)
 * @param kind how the datasheet states it
 * @returns the expanded (k = 2) uncertainty on the same basis: unchanged for 'expanded-k2',
 *   2a/√3 for a rectangular ± limit a (GUM §4.3.7 gives u = a/√3; the budget works in k = 2)
 */
export function expandedAccuracyPercent(accuracyPercent: number, kind: AccuracyKind): number {
  if (!(accuracyPercent >= 0))
    throw new Error(`expandedAccuracyPercent: accuracyPercent must be ≥ 0 (got ${accuracyPercent})`);
  if (kind === 'expanded-k2') return accuracyPercent;
  if (kind === 'rectangular-limit') return (2 * accuracyPercent) / Math.sqrt(3);
  throw new Error(
    `expandedAccuracyPercent: accuracyKind must be expanded-k2 or rectangular-limit (got ${String(kind)})`,
  );
}
