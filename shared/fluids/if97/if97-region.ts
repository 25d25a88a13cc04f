import {
  CRITICAL_TEMPERATURE_K,
  IF97_MAX_PRESSURE_PA,
  IF97_MAX_PRESSURE_REGION_5_PA,
  IF97_MAX_TEMPERATURE_K,
  IF97_MAX_TEMPERATURE_REGION_2_K,
  IF97_MIN_TEMPERATURE_K,
  REGION_1_3_TEMPERATURE_K,
} from './constants';
import { boundary23PressurePa } from './boundary23';
import { saturationPressurePa } from './saturation';

/**
 * The IAPWS-IF97 region of a (p, T) state, following R7-97(2012) §4 and Fig. 1:
 * - 1: 273.15 K ≤ T ≤ 623.15 K and psat(T) ≤ p ≤ 100 MPa (liquid);
 * - 2: 273.15 K ≤ T ≤ 623.15 K and 0 < p < psat(T); 623.15 K < T ≤ 863.15 K and p ≤ p_B23(T);
 *      863.15 K < T ≤ 1073.15 K and p ≤ 100 MPa (vapour / superheated / supercritical steam);
 * - 3: 623.15 K < T ≤ T_B23(p), p_B23(T) < p ≤ 100 MPa (around the critical point);
 * - 5: 1073.15 K < T ≤ 2273.15 K and p ≤ 50 MPa.
 * A state exactly on the saturation line is taken as liquid (region 1).
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns the region number
 * @throws Error naming the field when p or T is not finite or outside IF97's range of validity
 */
export function if97Region(pressurePa: number, temperatureK: number): 1 | 2 | 3 | 5 {
  if (!Number.isFinite(pressurePa) || pressurePa <= 0) {
    throw new Error(`if97Region: pressurePa must be a finite number > 0, got ${pressurePa}`);
  }
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`if97Region: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  if (temperatureK < IF97_MIN_TEMPERATURE_K || temperatureK > IF97_MAX_TEMPERATURE_K) {
    throw new Error(`if97Region: temperatureK ${temperatureK} outside IAPWS-IF97 validity (273.15…2273.15 K)`);
  }
  if (temperatureK > IF97_MAX_TEMPERATURE_REGION_2_K) {
    if (pressurePa > IF97_MAX_PRESSURE_REGION_5_PA) {
      throw new Error(
        `if97Region: pressurePa ${pressurePa} outside IAPWS-IF97 validity (≤ 50 MPa above 1073.15 K, region 5)`,
      );
    }
    return 5;
  }
  if (pressurePa > IF97_MAX_PRESSURE_PA) {
    throw new Error(`if97Region: pressurePa ${pressurePa} outside IAPWS-IF97 validity (≤ 100 MPa)`);
  }
  if (temperatureK <= REGION_1_3_TEMPERATURE_K) {
    return pressurePa >= saturationPressurePa(temperatureK) ? 1 : 2;
  }
  return pressurePa > boundary23PressurePa(temperatureK) ? 3 : 2;
}

/** True when T is below the critical temperature (a liquid/vapour distinction exists). */
export function isSubcritical(temperatureK: number): boolean {
  return temperatureK < CRITICAL_TEMPERATURE_K;
}
