import { CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K, IF97_MIN_TEMPERATURE_K } from './constants';

// IAPWS R7-97(2012) Table 34: coefficients n1..n10 of the region-4 saturation-pressure
// equation (implicit quadratic, eq. (29)); index 0 unused so the names match the release.
const N = [
  0, 0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** Saturation pressure at 273.15 K, the lower end of IF97 (eq. (30) evaluated there), Pa. */
export const SATURATION_PRESSURE_AT_273_15_K_PA = 611.212677;

/**
 * Saturation pressure of water from IAPWS-IF97 region 4, R7-97(2012) eq. (30),
 * valid for 273.15 K ≤ T ≤ 647.096 K.
 *
 * @param temperatureK temperature, K
 * @returns the saturation (vapour) pressure, Pa
 * @throws Error naming the field if T is not finite or outside 273.15…647.096 K
 */
export function saturationPressurePa(temperatureK: number): number {
  if (
    !Number.isFinite(temperatureK) ||
    temperatureK < IF97_MIN_TEMPERATURE_K ||
    temperatureK > CRITICAL_TEMPERATURE_K
  ) {
    throw new Error(
      `saturationPressurePa: temperatureK must be within 273.15…647.096 K (IF97 region 4), got ${temperatureK}`,
    );
  }
  const theta = temperatureK + N[9] / (temperatureK - N[10]);
  const A = theta * theta + N[1] * theta + N[2];
  const B = N[3] * theta * theta + N[4] * theta + N[5];
  const C = N[6] * theta * theta + N[7] * theta + N[8];
  const x = (2 * C) / (-B + Math.sqrt(B * B - 4 * A * C));
  return x * x * x * x * 1e6;
}

/**
 * Saturation temperature of water from IAPWS-IF97 region 4, R7-97(2012) eq. (31)
 * (the backward equation, consistent with eq. (30) to within the release's tolerance),
 * valid for 611.213 Pa ≤ p ≤ 22.064 MPa.
 *
 * @param pressurePa absolute pressure, Pa
 * @returns the saturation temperature, K
 * @throws Error naming the field if p is not finite or outside the saturation range
 */
export function saturationTemperatureK(pressurePa: number): number {
  // 611.212677 Pa is psat(273.15 K) from eq. (30); allow a sliver below for rounding.
  if (!Number.isFinite(pressurePa) || pressurePa < 611.2126 || pressurePa > CRITICAL_PRESSURE_PA) {
    throw new Error(
      `saturationTemperatureK: pressurePa must be within 611.213 Pa…22.064 MPa (IF97 region 4), got ${pressurePa}`,
    );
  }
  const beta = Math.pow(pressurePa / 1e6, 0.25);
  const E = beta * beta + N[3] * beta + N[6];
  const F = N[1] * beta * beta + N[4] * beta + N[7];
  const G = N[2] * beta * beta + N[5] * beta + N[8];
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  return (N[10] + D - Math.sqrt((N[10] + D) * (N[10] + D) - 4 * (N[9] + N[10] * D))) / 2;
}
