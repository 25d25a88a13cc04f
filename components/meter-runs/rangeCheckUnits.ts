/**
 * The range check's figures that constants/units-display has no unit for: density (kg/m³ or
 * lb/ft³) and a liquid's volumetric expansion (per K or per °F). The factors come from the exact
 * definitions in shared/units (the pound and the foot), so none is written twice.
 */
import type { DisplayUnits } from '@/constants/units-display';
import { CUBIC_METRES_PER_UNIT, KILOGRAMS_PER_UNIT } from '@/shared/units';

/** kg/m³ per lb/ft³: 0.45359237 kg / 0.028316846592 m³ = 16.01846337 (both exact by definition). */
const KG_PER_M3_PER_LB_PER_FT3 = KILOGRAMS_PER_UNIT.lb / CUBIC_METRES_PER_UNIT.ft3;

/** A kelvin is 1.8 degrees Fahrenheit (exact), so an expansion per K is 1.8 times the one per °F. */
const FAHRENHEIT_PER_KELVIN = 1.8;

/**
 * @param displayUnits the site's units
 * @returns how a density is written there
 */
export function densityLabel(displayUnits: DisplayUnits): string {
  return displayUnits === 'us' ? 'lb/ft³' : 'kg/m³';
}

/**
 * @param kgPerM3 a density in SI
 * @param displayUnits the site's units
 * @returns the density in kg/m³ (SI) or lb/ft³ (US)
 */
export function densityForDisplay(kgPerM3: number, displayUnits: DisplayUnits): number {
  return displayUnits === 'us' ? kgPerM3 / KG_PER_M3_PER_LB_PER_FT3 : kgPerM3;
}

/**
 * @param value a density as typed in the site's units
 * @param displayUnits the site's units
 * @returns the density in kg/m³
 */
export function densityFromDisplay(value: number, displayUnits: DisplayUnits): number {
  return displayUnits === 'us' ? value * KG_PER_M3_PER_LB_PER_FT3 : value;
}

/**
 * @param displayUnits the site's units
 * @returns how a volumetric expansion coefficient is written there
 */
export function expansionLabel(displayUnits: DisplayUnits): string {
  return displayUnits === 'us' ? 'per °F' : 'per K';
}

/**
 * @param perK a volumetric expansion coefficient per kelvin
 * @param displayUnits the site's units
 * @returns the coefficient per K (SI) or per °F (US)
 */
export function expansionForDisplay(perK: number, displayUnits: DisplayUnits): number {
  return displayUnits === 'us' ? perK / FAHRENHEIT_PER_KELVIN : perK;
}

/**
 * @param value a volumetric expansion coefficient as typed in the site's units
 * @param displayUnits the site's units
 * @returns the coefficient per kelvin
 */
export function expansionFromDisplay(value: number, displayUnits: DisplayUnits): number {
  return displayUnits === 'us' ? value * FAHRENHEIT_PER_KELVIN : value;
}
