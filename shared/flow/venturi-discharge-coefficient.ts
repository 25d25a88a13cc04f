/**
 * Discharge coefficients of classical Venturi tubes, ISO 5167-4:2003 §5.5.2–5.5.4: constants
 * within each type's limits of use (TRADE.md §2).
 */
import type { VenturiType } from './flow-types';

/** C of each classical Venturi tube type (ISO 5167-4:2003 §5.5.2, 5.5.3, 5.5.4). */
export const VENTURI_DISCHARGE_COEFFICIENT: Readonly<Record<VenturiType, number>> = Object.freeze({
  'as-cast': 0.984,
  machined: 0.995,
  'rough-welded': 0.985,
});

/**
 * @param venturiType as-cast, machined or rough-welded convergent
 * @returns C
 */
export function venturiDischargeCoefficient(venturiType: VenturiType): number {
  const c = VENTURI_DISCHARGE_COEFFICIENT[venturiType];
  if (c === undefined) {
    throw new Error(
      `venturiDischargeCoefficient: element.venturiType must be as-cast, machined or rough-welded (got ${String(venturiType)})`,
    );
  }
  return c;
}
