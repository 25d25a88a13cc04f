import { IF97_GAS_CONSTANT_J_PER_KG_K } from './constants';
import { type WaterState, waterStateFromGibbs } from './water-state';

// IAPWS R7-97(2012) Table 37: ideal-gas part of the region-5 Gibbs free energy, eq. (33):
// γ° = ln π + Σ n°ᵢ τ^J°ᵢ, π = p/1 MPa, τ = 1000 K/T.
const J0 = new Float64Array([0, 1, -3, -2, -1, 2]);
const N0 = new Float64Array([
  -0.13179983674201e2, 0.68540841634434e1, -0.24805148933466e-1, 0.36901534980333, -0.31161318213925e1,
  -0.32961626538917,
]);
// R7-97(2012) Table 38: residual part, eq. (34): γʳ = Σ nᵢ π^Iᵢ τ^Jᵢ.
const IR = new Float64Array([1, 1, 1, 2, 2, 3]);
const JR = new Float64Array([1, 2, 3, 3, 9, 7]);
const NR = new Float64Array([
  0.15736404855259e-2, 0.90153761673944e-3, -0.50270077677648e-2, 0.22440037409485e-5, -0.41163275453471e-5,
  0.37919454822955e-7,
]);

/**
 * Properties of high-temperature steam from the IAPWS-IF97 region-5 basic equation
 * (R7-97(2012) §8, eqs. (32)–(34), Table 39): 1073.15 K < T ≤ 2273.15 K, p ≤ 50 MPa.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns the state computed with the region-5 equation
 */
export function region5State(pressurePa: number, temperatureK: number): WaterState {
  const pi = pressurePa / 1e6;
  const tau = 1000 / temperatureK;
  let g = Math.log(pi);
  let gp = 1 / pi;
  let gpp = -1 / (pi * pi);
  let gt = 0;
  let gtt = 0;
  let gpt = 0;
  for (let k = 0; k < 6; k++) {
    const j = J0[k];
    const term = N0[k] * Math.pow(tau, j);
    g += term;
    gt += (j * term) / tau;
    gtt += (j * (j - 1) * term) / (tau * tau);
  }
  for (let k = 0; k < 6; k++) {
    const i = IR[k];
    const j = JR[k];
    const term = NR[k] * Math.pow(pi, i) * Math.pow(tau, j);
    g += term;
    const ti = (i * term) / pi;
    const tj = (j * term) / tau;
    gp += ti;
    gpp += (i * (i - 1) * term) / (pi * pi);
    gt += tj;
    gtt += (j * (j - 1) * term) / (tau * tau);
    gpt += (i * tj) / pi;
  }
  return waterStateFromGibbs(
    5,
    pressurePa,
    temperatureK,
    pi,
    tau,
    g,
    gp,
    gpp,
    gt,
    gtt,
    gpt,
    IF97_GAS_CONSTANT_J_PER_KG_K,
  );
}
