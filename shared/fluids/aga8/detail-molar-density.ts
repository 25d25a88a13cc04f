import { DETAIL_GAS_CONSTANT as R } from './detail-constants';
import { type DetailMixture } from './prepare-detail-mixture';
import { detailDensityDerivatives, temperatureSlot } from './detail-residual';

const dd = new Float64Array(2);

/** NIST's convergence test: change of ln v below 1e-7 (quadratic convergence leaves ~1e-14). */
const LN_V_TOLERANCE = 1e-7;
const MAX_NEWTON_ITERATIONS = 20;

/** Pressure P(T, D) in kPa at the current scratch values (for the fallback scan). */
function pressureKPa(mix: DetailMixture, slot: number, temperatureK: number, d: number): number {
  detailDensityDerivatives(mix, slot, d, dd);
  return d * R * temperatureK * (1 + dd[0]);
}

/**
 * Molar density of a natural gas from pressure and temperature with the AGA 8 Part 1 DETAIL
 * equation (data sheet §8): Newton iteration on ln v = −ln D with ln P as target, starting
 * from the ideal gas, as NIST's DensityDetail does. Where that fails (unphysical branch or no
 * convergence in 20 steps, e.g. near the phase boundary) a fallback scans D upward from a
 * dilute state and returns the first root on a mechanically stable branch (see fallbackDensity).
 * Like NIST's code it makes no phase check: inside the phase envelope the result may be a
 * metastable or liquid-like root, and the caller must know the gas is single-phase. Unlike
 * NIST's code it never returns the ideal-gas density silently: with no root it throws.
 *
 * Allocation-free; each call costs a handful of evaluations of the 58 terms.
 *
 * @param mix prepared mixture (prepareDetailMixture)
 * @param pressurePa absolute pressure, Pa (> 0)
 * @param temperatureK temperature, K (> 0)
 * @param diagnostics optional object whose usedFallback is set to whether the fallback scan was needed
 * @returns molar density, mol/m³
 * @throws Error naming the function and field for bad input or when no gas-phase root exists
 */
export function detailMolarDensityMolPerM3(
  mix: DetailMixture,
  pressurePa: number,
  temperatureK: number,
  diagnostics?: { usedFallback: boolean },
): number {
  if (!Number.isFinite(pressurePa) || pressurePa <= 0) {
    throw new Error(`detailMolarDensityMolPerM3: pressurePa must be a finite number > 0, got ${pressurePa}`);
  }
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`detailMolarDensityMolPerM3: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  const p = pressurePa / 1000; // kPa
  const rt = R * temperatureK;
  const slot = temperatureSlot(mix, temperatureK);
  const lnP = Math.log(p);
  let y = -Math.log(p / rt); // ln v of the ideal gas
  for (let it = 0; it < MAX_NEWTON_ITERATIONS; it++) {
    if (y < -7 || y > 100) break;
    const d = Math.exp(-y);
    detailDensityDerivatives(mix, slot, d, dd);
    const p2 = d * rt * (1 + dd[0]);
    const dpdd = rt * (1 + 2 * dd[0] + dd[1]);
    if (dpdd < 1e-15 || p2 < 1e-15) {
      // Unphysical branch: lower the density by e^0.1 and retry (NIST's rule).
      y += 0.1;
      continue;
    }
    // dP/d ln v = −D ∂P/∂D, so the Newton step on ln v for ln P is:
    const delta = ((Math.log(p2) - lnP) * p2) / (d * dpdd);
    y += delta;
    if (Math.abs(delta) < LN_V_TOLERANCE) {
      if (diagnostics) diagnostics.usedFallback = false;
      return Math.exp(-y) * 1000;
    }
  }
  if (diagnostics) diagnostics.usedFallback = true;
  return fallbackDensity(mix, slot, p, temperatureK) * 1000;
}

/** Upper limit of the fallback scan in reduced density ρr = K³D (dense liquids stay below about 3). */
const MAX_REDUCED_DENSITY = 3;
const SCAN_FACTOR = 1.05;

/**
 * Fallback when Newton fails: scan D upward from a dilute state in steps of 5 %, bracket each
 * crossing of P(D) = p, refine it by bisection-guarded Newton, and return the first root on a
 * mechanically stable branch (∂P/∂D > 0) — the gas-like root when one exists, otherwise the
 * dense (liquid-like) root, as NIST's method would (no phase check). mol/dm³.
 */
function fallbackDensity(mix: DetailMixture, slot: number, p: number, temperatureK: number): number {
  const rt = R * temperatureK;
  let lo = (p / rt) * 1e-3;
  let fLo = pressureKPa(mix, slot, temperatureK, lo) - p;
  while (lo * mix.k3 < MAX_REDUCED_DENSITY) {
    const hi = lo * SCAN_FACTOR;
    const fHi = pressureKPa(mix, slot, temperatureK, hi) - p;
    if (fLo < 0 && fHi >= 0) {
      const d = refine(mix, slot, p, temperatureK, lo, hi);
      pressureKPa(mix, slot, temperatureK, d);
      if (rt * (1 + 2 * dd[0] + dd[1]) > 0) return d;
    }
    lo = hi;
    fLo = fHi;
  }
  throw new Error(
    `detailMolarDensityMolPerM3: no stable density found at pressurePa ${p * 1000} and temperatureK ${temperatureK}`,
  );
}

/** Bisection-guarded Newton for P(D) = p inside [lo, hi] with P(lo) < p ≤ P(hi). */
function refine(mix: DetailMixture, slot: number, p: number, temperatureK: number, lo: number, hi: number): number {
  const rt = R * temperatureK;
  let d = 0.5 * (lo + hi);
  for (let it = 0; it < 200; it++) {
    const f = pressureKPa(mix, slot, temperatureK, d) - p;
    const slope = rt * (1 + 2 * dd[0] + dd[1]);
    if (f > 0) hi = d;
    else lo = d;
    let next = slope > 0 ? d - f / slope : NaN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - d) <= 1e-15 * d || hi - lo <= 1e-15 * d) return next;
    d = next;
  }
  return d;
}
