/**
 * Pressure units (transmitter unit codes of DESIGN.md). Inches of water carry their reference
 * temperature: the water column's density differs by 0.2 % between 4 °C and 20 °C (TRADE.md §4).
 */
import { INCH_M, POUND_FORCE_N, STANDARD_GRAVITY_M_PER_S2 } from './defining-constants';

/**
 * Water densities for the inch-of-water units, kg/m³.
 * - 4 °C (39.2 °F): 999.972, the maximum density of water under the 1901–1964 litre
 *   (1 L = 1.000028 dm³ held 1 kg of water at its maximum density: 1000/1.000028); the
 *   value behind NIST SP 811's 1 inH2O (39.2 °F) = 249.082 Pa and pint's water_39F.
 * - 60 °F: 999.001, the conventional value behind NIST SP 811's 1 inH2O (60 °F) = 248.84 Pa
 *   and pint's water_60F [mem]; IAPWS-95 gives 999.017 for air-free water at 101.325 kPa
 *   (16 ppm more; 0.004 Pa per inH2O, far below any transmitter's accuracy).
 * - 68 °F (20 °C): 998.2067, Tanaka et al. 2001 (Metrologia 38, 301), the CIPM table for
 *   air-free water at 101.325 kPa [mem]; IAPWS-95 gives 998.2072.
 */
export const WATER_DENSITY_KG_PER_M3 = Object.freeze({ '4C': 999.972, '60F': 999.001, '68F': 998.2067 });

/** Pascals per unit. */
export const PASCALS_PER_UNIT = Object.freeze({
  Pa: 1,
  kPa: 1e3,
  MPa: 1e6,
  mbar: 100, // 1 bar = 1e5 Pa exactly (SI Brochure, Table 8)
  bar: 1e5,
  psi: POUND_FORCE_N / (INCH_M * INCH_M), // 1 lbf/in² = 6894.757293168361 Pa
  'inH2O-4C': WATER_DENSITY_KG_PER_M3['4C'] * STANDARD_GRAVITY_M_PER_S2 * INCH_M,
  'inH2O-60F': WATER_DENSITY_KG_PER_M3['60F'] * STANDARD_GRAVITY_M_PER_S2 * INCH_M,
  'inH2O-68F': WATER_DENSITY_KG_PER_M3['68F'] * STANDARD_GRAVITY_M_PER_S2 * INCH_M,
});

export type PressureUnit = keyof typeof PASCALS_PER_UNIT;

/**
 * Absolute pressure from a transmitter reading.
 * @param valueInUnit reading in its unit
 * @param unit pressure unit code
 * @param reference 'absolute' or 'gauge' (gauge adds the atmospheric pressure)
 * @param atmosphericPressurePa local atmospheric pressure, Pa (required for gauge)
 * @returns absolute pressure, Pa
 */
export function absolutePressurePa(
  valueInUnit: number,
  unit: PressureUnit,
  reference: 'absolute' | 'gauge',
  atmosphericPressurePa?: number,
): number {
  const factor = PASCALS_PER_UNIT[unit];
  if (factor === undefined)
    throw new Error(
      `absolutePressurePa: unknown pressure unit '${String(unit)}' (known: ${Object.keys(PASCALS_PER_UNIT).join(' ')})`,
    );
  const pa = valueInUnit * factor;
  if (reference === 'absolute') return pa;
  if (reference !== 'gauge')
    throw new Error(`absolutePressurePa: pressureReference must be absolute or gauge (got ${String(reference)})`);
  if (atmosphericPressurePa === undefined || !(atmosphericPressurePa > 0)) {
    throw new Error(
      `absolutePressurePa: atmosphericPressurePa (> 0) is required for a gauge reading (got ${atmosphericPressurePa})`,
    );
  }
  return pa + atmosphericPressurePa;
}
