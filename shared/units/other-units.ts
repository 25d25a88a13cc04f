/**
 * Volume, mass and energy units: SI per unit, each derived from exact definitions.
 */
import { FOOT_M, IT_CALORIE_J, POUND_KG, US_GALLON_M3 } from './defining-constants';

/** Cubic metres per unit. Mscf is 1000 ft³ of gas at the base conditions the figure is stated at (the unit only scales). */
export const CUBIC_METRES_PER_UNIT = Object.freeze({
  m3: 1,
  ft3: FOOT_M * FOOT_M * FOOT_M, // 0.028316846592 m³
  Mscf: 1000 * FOOT_M * FOOT_M * FOOT_M,
  bbl: 42 * US_GALLON_M3, // oil barrel, 42 US gal = 0.158987294928 m³
});

/** Kilograms per unit. */
export const KILOGRAMS_PER_UNIT = Object.freeze({ kg: 1, lb: POUND_KG, t: 1000 });

/**
 * International Table British thermal unit: 1 Btu_IT/(lb·°F) = 1 cal_IT/(g·°C), so
 * Btu_IT = 4.1868 J × 453.59237 g × 5/9 = 1055.05585262 J.
 */
export const BTU_IT_J = (IT_CALORIE_J * POUND_KG * 1000 * 5) / 9;

/** Joules per unit (MMBtu = 1e6 Btu_IT). */
export const JOULES_PER_UNIT = Object.freeze({ J: 1, GJ: 1e9, MMBtu: 1e6 * BTU_IT_J });
