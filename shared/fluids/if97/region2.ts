import { IF97_GAS_CONSTANT_J_PER_KG_K } from './constants';
import { type WaterState, waterStateFromGibbs } from './water-state';

// IAPWS R7-97(2012) Table 10: ideal-gas part of the region-2 Gibbs free energy, eq. (16):
// γ° = ln π + Σ n°ᵢ τ^J°ᵢ, with π = p/1 MPa, τ = 540 K/T.
const J0 = new Float64Array([0, 1, -5, -4, -3, -2, -1, 2, 3]);
const N0 = new Float64Array([
  -0.96927686500217e1, 0.10086655968018e2, -0.5608791128302e-2, 0.71452738081455e-1, -0.40710498223928,
  0.14240819171444e1, -0.4383951131945e1, -0.28408632460772, 0.21268463753307e-1,
]);

// IAPWS R7-97(2012) Table 11: residual part, eq. (17): γʳ = Σ nᵢ π^Iᵢ (τ − 0.5)^Jᵢ.
// (Values as reproduced in Debian's python3-iapws 1.5.2, iapws97.py, _Region2.)
const IR = new Float64Array([
  1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10, 10, 10, 16, 16, 18, 20, 20,
  20, 21, 22, 23, 24, 24, 24,
]);
const JR = new Float64Array([
  0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36, 13, 4, 10, 14, 29, 50, 57, 20,
  35, 48, 21, 53, 39, 26, 40, 58,
]);
const NR = new Float64Array([
  -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1, -0.5032527872793e-1,
  -0.33032641670203e-4, -0.18948987516315e-3, -0.39392777243355e-2, -0.43797295650573e-1, -0.26674547914087e-4,
  0.20481737692309e-7, 0.43870667284435e-6, -0.3227767723857e-4, -0.15033924542148e-2, -0.40668253562649e-1,
  -0.78847309559367e-9, 0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10,
  -0.21171472321355e-2, -0.23895741934104e2, -0.5905956432427e-17, -0.12621808899101e-5, -0.38946842435739e-1,
  0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7, 0.10406965210174e-18, -0.10234747095929e-12,
  -0.10018179379511e-8, -0.80882908646985e-10, 0.10693031879409, -0.33662250574171, 0.89185845355421e-24,
  0.30629316876232e-12, -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14,
  0.73087610595061e-28, 0.55414715350778e-16, -0.9436970724121e-6,
]);

/**
 * Properties of steam from the IAPWS-IF97 region-2 basic equation (R7-97(2012) §6.1,
 * eqs. (15)–(17), Table 12). No range check here: `waterStatePT` selects the region.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns the state computed with the region-2 equation
 */
export function region2State(pressurePa: number, temperatureK: number): WaterState {
  const pi = pressurePa / 1e6;
  const tau = 540 / temperatureK;
  // Ideal-gas part.
  let g = Math.log(pi);
  let gt = 0;
  let gtt = 0;
  for (let k = 0; k < 9; k++) {
    const j = J0[k];
    const term = N0[k] * Math.pow(tau, j);
    g += term;
    gt += (j * term) / tau;
    gtt += (j * (j - 1) * term) / (tau * tau);
  }
  let gp = 1 / pi;
  let gpp = -1 / (pi * pi);
  let gpt = 0;
  // Residual part; b = τ − 0.5 stays > 0.0032 for T ≤ 1073.15 K.
  const b = tau - 0.5;
  for (let k = 0; k < 43; k++) {
    const i = IR[k];
    const j = JR[k];
    const term = NR[k] * Math.pow(pi, i) * Math.pow(b, j);
    g += term;
    const ti = (i * term) / pi;
    const tj = (j * term) / b;
    gp += ti;
    gpp += (i * (i - 1) * term) / (pi * pi);
    gt += tj;
    gtt += (j * (j - 1) * term) / (b * b);
    gpt += (i * tj) / pi;
  }
  return waterStateFromGibbs(
    2,
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
