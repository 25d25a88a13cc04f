import { IF97_GAS_CONSTANT_J_PER_KG_K } from './constants';
import { type WaterState, waterStateFromGibbs } from './water-state';

// IAPWS R7-97(2012) Table 2: coefficients and exponents of the region-1 Gibbs free energy,
// eq. (7): γ(π,τ) = Σ nᵢ (7.1 − π)^Iᵢ (τ − 1.222)^Jᵢ, with π = p/16.53 MPa, τ = 1386 K/T.
// Transcribed from the release (values as reproduced in Debian's python3-iapws 1.5.2,
// iapws97.py, _Region1, which the tests also use as an independent check).
const I1 = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32,
]);
const J1 = new Float64Array([
  -2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39,
  -40, -41,
]);
const N1 = new Float64Array([
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872, 0.15772038513228,
  -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1,
  -0.32529748770505e-1, -0.21841717175414e-1, -0.5283835796993e-4, -0.47184321073267e-3, -0.30001780793026e-3,
  0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4, -0.28270797985312e-5,
  -0.85205128120103e-9, -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12, -0.40516996860117e-6,
  -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22,
  -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
]);

/** Reducing pressure p* of region 1, R7-97(2012) eq. (7): 16.53 MPa. */
const P_STAR_PA = 16.53e6;
/** Reducing temperature T* of region 1, R7-97(2012) eq. (7): 1386 K. */
const T_STAR_K = 1386;

/**
 * Properties of compressed liquid water from the IAPWS-IF97 region-1 basic equation
 * (R7-97(2012) §5.1, eq. (7), Table 3). No range check here: `waterStatePT` selects the region.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns the state computed with the region-1 equation
 */
export function region1State(pressurePa: number, temperatureK: number): WaterState {
  const pi = pressurePa / P_STAR_PA;
  const tau = T_STAR_K / temperatureK;
  const a = 7.1 - pi; // > 0.9 for p ≤ 100 MPa
  const b = tau - 1.222; // > 1 for T ≤ 623.15 K
  let g = 0;
  let gp = 0;
  let gpp = 0;
  let gt = 0;
  let gtt = 0;
  let gpt = 0;
  for (let k = 0; k < 34; k++) {
    const i = I1[k];
    const j = J1[k];
    const term = N1[k] * Math.pow(a, i) * Math.pow(b, j);
    g += term;
    // d/dπ of (7.1 − π)^I is −I (7.1 − π)^(I−1): hence the minus signs.
    const ti = (i * term) / a;
    const tj = (j * term) / b;
    gp -= ti;
    gpp += (i * (i - 1) * term) / (a * a);
    gt += tj;
    gtt += (j * (j - 1) * term) / (b * b);
    gpt -= (i * tj) / a;
  }
  return waterStateFromGibbs(
    1,
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
