import { DETAIL_TERM_COUNT as NT, TERM_B, TERM_K, TERM_U } from './detail-constants';
import { type DetailMixture, T_SLOT_SIZE } from './prepare-detail-mixture';

// Term exponents as small integers for the inner loops (bₙ ∈ 1..9, kₙ ∈ 0..4).
const B_INT = Int32Array.from(TERM_B);
const K_INT = Int32Array.from(TERM_K);
// Offsets inside a temperature slot.
const OFF_CT = NT; // C*ₙ T^-uₙ
const OFF_BT = 2 * NT; // B(T)
const OFF_C1318 = 2 * NT + 1; // Σ₁₃..₁₈ C*ₙ T^-uₙ
const OFF_T = 2 * NT + 2; // the temperature of the slot

/**
 * Offset of the temperature slot for T in the mixture's two-slot cache, filling it if needed:
 * T^-uₙ, C*ₙT^-uₙ, B(T) = Σ₁..₁₈ B*ₙT^-uₙ and Σ₁₃..₁₈ C*ₙT^-uₙ (data sheet §3–§4). Two slots
 * so that alternating flowing and base temperatures does not recompute.
 *
 * @param mix prepared mixture
 * @param temperatureK temperature, K
 * @returns offset into mix.tCache
 */
export function temperatureSlot(mix: DetailMixture, temperatureK: number): number {
  const c = mix.tCache;
  if (c[OFF_T] === temperatureK) return 0;
  if (c[T_SLOT_SIZE + OFF_T] === temperatureK) return T_SLOT_SIZE;
  const o = mix.tCacheNext * T_SLOT_SIZE;
  mix.tCacheNext ^= 1;
  const lnT = Math.log(temperatureK);
  let bt = 0;
  let c1318 = 0;
  for (let n = 0; n < NT; n++) {
    const tn = Math.exp(-TERM_U[n] * lnT);
    c[o + n] = tn;
    const ct = mix.cStar[n] * tn;
    c[o + OFF_CT + n] = ct;
    if (n < 18) bt += mix.bStar[n] * tn;
    if (n >= 12 && n < 18) c1318 += ct;
  }
  c[o + OFF_BT] = bt;
  c[o + OFF_C1318] = c1318;
  c[o + OFF_T] = temperatureK;
  return o;
}

/** Scratch: ρr^0..ρr^9 and exp(−ρr^k), k = 1..4. */
const rp = new Float64Array(10);
const ex = new Float64Array(5);

function fillPowers(rhoR: number): void {
  rp[0] = 1;
  for (let k = 1; k < 10; k++) rp[k] = rp[k - 1] * rhoR;
  ex[0] = 1;
  for (let k = 1; k < 5; k++) ex[k] = Math.exp(-rp[k]);
}

/**
 * δ₁ = D ∂αʳ/∂D and δ₂ = D² ∂²αʳ/∂D² of the DETAIL residual Helmholtz energy (data sheet §5),
 * the two quantities the density solve needs: Z = 1 + δ₁, ∂P/∂D = RT(1 + 2δ₁ + δ₂).
 * Allocation-free; results in out[0], out[1].
 *
 * @param mix prepared mixture
 * @param slot temperature slot offset from temperatureSlot
 * @param molarDensity D, mol/dm³
 * @param out receives [δ₁, δ₂]
 */
export function detailDensityDerivatives(
  mix: DetailMixture,
  slot: number,
  molarDensity: number,
  out: Float64Array,
): void {
  const c = mix.tCache;
  const rhoR = mix.k3 * molarDensity;
  fillPowers(rhoR);
  // Linear pieces: Σλₙ = D·B(T) − ρr Σ₁₃..₁₈ C*ₙT^-uₙ.
  let d1 = molarDensity * c[slot + OFF_BT] - rhoR * c[slot + OFF_C1318];
  let d2 = 0;
  for (let n = 12; n < NT; n++) {
    const k = K_INT[n];
    const b = B_INT[n];
    const tau = c[slot + OFF_CT + n] * rp[b] * ex[k];
    if (k === 0) {
      d1 += b * tau;
      d2 += b * (b - 1) * tau;
    } else {
      const rk = rp[k];
      const p = b - k * rk;
      d1 += p * tau;
      d2 += (p * (p - 1) - k * k * rk) * tau;
    }
  }
  out[0] = d1;
  out[1] = d2;
}

/** Index names of the full residual derivative vector filled by detailResidualDerivatives. */
export const AR = 0;
export const D1 = 1;
export const D2 = 2;
export const D3 = 3;
export const T1 = 4;
export const T2 = 5;
export const T11 = 6;

/**
 * All dimensionless residual derivatives the caloric properties need (data sheet §5):
 * out = [αʳ, δ₁, δ₂, δ₃, θ₁, θ₂, θ₁₁], with δₖ = Dᵏ ∂ᵏαʳ/∂Dᵏ, θ₁ = T ∂αʳ/∂T,
 * θ₂ = T² ∂²αʳ/∂T², θ₁₁ = D T ∂²αʳ/∂D∂T.
 *
 * @param mix prepared mixture
 * @param temperatureK temperature, K
 * @param molarDensity D, mol/dm³
 * @param out receives the seven values
 */
export function detailResidualDerivatives(
  mix: DetailMixture,
  temperatureK: number,
  molarDensity: number,
  out: Float64Array,
): void {
  const slot = temperatureSlot(mix, temperatureK);
  const c = mix.tCache;
  const rhoR = mix.k3 * molarDensity;
  fillPowers(rhoR);
  let ar = 0;
  let d1 = 0;
  let d2 = 0;
  let d3 = 0;
  let t1 = 0;
  let t2 = 0;
  let t11 = 0;
  // Linear pieces λₙ, n = 1..18: D ∂λ/∂D = λ, higher density derivatives 0.
  for (let n = 0; n < 18; n++) {
    let lam = mix.bStar[n] * molarDensity * c[slot + n];
    if (n >= 12) lam -= rhoR * c[slot + OFF_CT + n];
    const u = TERM_U[n];
    ar += lam;
    d1 += lam;
    t1 -= u * lam;
    t2 += u * (u + 1) * lam;
    t11 -= u * lam;
  }
  // Exponential pieces τₙ, n = 13..58.
  for (let n = 12; n < NT; n++) {
    const k = K_INT[n];
    const b = B_INT[n];
    const u = TERM_U[n];
    const tau = c[slot + OFF_CT + n] * rp[b] * ex[k];
    let p = b;
    let h = 0;
    if (k !== 0) {
      const rk = rp[k];
      p = b - k * rk;
      h = k * k * rk;
    }
    const q2 = p * (p - 1) - h;
    ar += tau;
    d1 += p * tau;
    d2 += q2 * tau;
    d3 += ((p - 2) * q2 + h * (1 - k - 2 * p)) * tau;
    t1 -= u * tau;
    t2 += u * (u + 1) * tau;
    t11 -= u * p * tau;
  }
  out[AR] = ar;
  out[D1] = d1;
  out[D2] = d2;
  out[D3] = d3;
  out[T1] = t1;
  out[T2] = t2;
  out[T11] = t11;
}
