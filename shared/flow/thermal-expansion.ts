/**
 * Thermal expansion of pipe and element diameters (ISO 5167-1 §5.1 uses d and D at flowing
 * temperature): d = d_ref · (1 + α (T − T_ref)).
 */
import type { MaterialName } from './flow-types';

/**
 * Linear expansion coefficients per kelvin (= per °C). [mem, matches a common AGA-3 table, as
 * TRADE.md §1 marks them]: confirm against the material certificate for custody transfer.
 */
export const EXPANSION_PER_K_BY_MATERIAL: Readonly<Record<MaterialName, number>> = Object.freeze({
  'stainless-304': 1.665e-5,
  'stainless-316': 1.665e-5,
  'carbon-steel': 1.116e-5,
  'uns-n04400': 1.43e-5, // nickel-copper alloy (Monel 400 type)
  'uns-n10276': 1.13e-5, // nickel-molybdenum-chromium alloy
});

/** The usual reference temperature of measured diameters, 20 °C (TRADE.md §1). */
export const DEFAULT_REFERENCE_TEMPERATURE_K = 293.15;

/**
 * The expansion coefficient of a part: a given coefficient wins over a material name.
 * @param coefficientPerK coefficient given in the case, or undefined
 * @param material material name, or undefined
 * @param field name of the field for error messages
 * @returns α in 1/K, or null when neither is given
 */
export function expansionPerK(
  coefficientPerK: number | undefined,
  material: MaterialName | undefined,
  field: string,
): number | null {
  if (coefficientPerK !== undefined) {
    if (!Number.isFinite(coefficientPerK) || Math.abs(coefficientPerK) > 1e-3) {
      throw new Error(`expansionPerK: ${field} must be a finite coefficient per K (got ${coefficientPerK})`);
    }
    return coefficientPerK;
  }
  if (material !== undefined) {
    const alpha = EXPANSION_PER_K_BY_MATERIAL[material];
    if (alpha === undefined) {
      throw new Error(
        `expansionPerK: unknown material '${material}' for ${field} (known: ${Object.keys(EXPANSION_PER_K_BY_MATERIAL).join(', ')})`,
      );
    }
    return alpha;
  }
  return null;
}

/**
 * A diameter at flowing temperature.
 * @param diameterAtReferenceM diameter measured at the reference temperature, m
 * @param expansionCoefficientPerK linear expansion coefficient, 1/K
 * @param temperatureK flowing temperature, K
 * @param referenceTemperatureK temperature at which the diameter was measured, K
 * @returns diameter at flowing temperature, m
 */
export function diameterAtTemperatureM(
  diameterAtReferenceM: number,
  expansionCoefficientPerK: number,
  temperatureK: number,
  referenceTemperatureK: number = DEFAULT_REFERENCE_TEMPERATURE_K,
): number {
  return diameterAtReferenceM * (1 + expansionCoefficientPerK * (temperatureK - referenceTemperatureK));
}
