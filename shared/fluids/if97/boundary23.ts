// IAPWS R7-97(2012) Table 1: coefficients of the B23 equation, the boundary between
// regions 2 and 3 (eqs. (5) and (6)), with p in MPa and T in K.
const N1 = 0.34805185628969e3;
const N2 = -0.11671859879975e1;
const N3 = 0.10192970039326e-2;
const N4 = 0.57254459862746e3;
const N5 = 0.139188397787e2;

/**
 * Pressure on the region-2/region-3 boundary at a given temperature, R7-97(2012) eq. (5),
 * for 623.15 K ≤ T ≤ 863.15 K.
 *
 * @param temperatureK temperature, K
 * @returns boundary pressure, Pa
 */
export function boundary23PressurePa(temperatureK: number): number {
  return (N1 + N2 * temperatureK + N3 * temperatureK * temperatureK) * 1e6;
}

/**
 * Temperature on the region-2/region-3 boundary at a given pressure, R7-97(2012) eq. (6),
 * for 16.5292 MPa ≤ p ≤ 100 MPa.
 *
 * @param pressurePa absolute pressure, Pa
 * @returns boundary temperature, K
 */
export function boundary23TemperatureK(pressurePa: number): number {
  return N4 + Math.sqrt((pressurePa / 1e6 - N5) / N3);
}
