import {
  BINARY_EIJ,
  BINARY_GIJ,
  BINARY_KIJ,
  BINARY_UIJ,
  COMPONENT_EI,
  COMPONENT_FI,
  COMPONENT_GI,
  COMPONENT_KI,
  COMPONENT_MI,
  COMPONENT_QI,
  COMPONENT_SI,
  COMPONENT_WI,
  DETAIL_COMPONENT_COUNT as NC,
  DETAIL_GAS_CONSTANT,
  DETAIL_TERM_COUNT as NT,
  IDEAL_N0,
  IDEAL_THETA0,
  TERM_A,
  TERM_F,
  TERM_G,
  TERM_Q,
  TERM_S,
  TERM_U,
  TERM_W,
} from './detail-constants';
import { parseDetailComposition } from './detail-composition';
import { detailCompositionWarnings } from './detail-range';
import type { Warning } from '../warning';

/** Full symmetric 21×21 matrix (row-major) from the non-default pairs; default and diagonal 1. */
function binaryMatrix(pairs: ReadonlyArray<readonly [number, number, number]>): Float64Array {
  const m = new Float64Array(NC * NC).fill(1);
  for (const [i, j, v] of pairs) {
    m[i * NC + j] = v;
    m[j * NC + i] = v;
  }
  return m;
}
const EIJ = binaryMatrix(BINARY_EIJ);
const UIJ = binaryMatrix(BINARY_UIJ);
const KIJ = binaryMatrix(BINARY_KIJ);
const GIJ = binaryMatrix(BINARY_GIJ);

/**
 * Reference density of the ideal-gas part, mol/dm³: ideal gas at 298.15 K and 101.325 kPa
 * with the DETAIL R (data sheet §6).
 */
const IDEAL_REFERENCE_DENSITY = 101.325 / (DETAIL_GAS_CONSTANT * 298.15);

/** Number of doubles in one temperature-cache slot: T^-uₙ (58), C*ₙT^-uₙ (58), B(T), Σ₁₃..₁₈ C*ₙT^-uₙ, T. */
export const T_SLOT_SIZE = 2 * NT + 3;

/**
 * Composition-dependent parameters of the AGA 8 DETAIL equation, computed once per
 * composition (data sheet §3) so that each density solve only does the T- and D-dependent
 * work. Treat as opaque and immutable except for the internal temperature cache.
 */
export interface DetailMixture {
  /** Mole fractions in DETAIL component order (normalised). */
  readonly moleFractions: Float64Array;
  /** Molar mass with the DETAIL component molar masses, g/mol (sheet §9). */
  readonly molarMassGPerMol: number;
  /** Same in kg/mol. */
  readonly molarMassKgPerMol: number;
  /** Normalisation and normal-range warnings found when the composition was read. */
  readonly warnings: readonly Warning[];
  /** Mixture size parameter cubed, K³ (dm³/mol). */
  readonly k3: number;
  /** B*ₙ, n = 1..18 (index 0..17), dm³/mol (sheet §3). */
  readonly bStar: Float64Array;
  /** C*ₙ, n = 13..58 at index 12..57 (0 below), sheet §3. */
  readonly cStar: Float64Array;
  /** Ideal-gas part: components present, their x, adjusted n0 (7 each) and θ0₄..₇ (4 each). */
  readonly idealCount: number;
  readonly idealX: Float64Array;
  readonly idealN: Float64Array;
  readonly idealTheta: Float64Array;
  /** Two-slot cache of temperature-dependent sums (see T_SLOT_SIZE); slot t at offset t·T_SLOT_SIZE. */
  readonly tCache: Float64Array;
  /** Which slot to overwrite next. */
  tCacheNext: number;
}

/**
 * Prepare a natural-gas composition for the AGA 8 Part 1 (2017) DETAIL equation: read and
 * normalise the mole fractions, then compute the mixture parameters K, U, G, Q, F, the
 * temperature-independent second-virial coefficients B*ₙ and the density-term coefficients
 * C*ₙ (data sheet §3). Call once per composition and keep the result (fluidState caches it
 * per composition object).
 *
 * @param composition mole fractions keyed by component name (kebab-case; lenient, see canonicalComponentName)
 * @returns the prepared mixture
 * @throws Error naming the function and the component for unknown components or bad fractions
 */
export function prepareDetailMixture(composition: Record<string, number>): DetailMixture {
  const { moleFractions: x, warnings } = parseDetailComposition(composition, 'prepareDetailMixture');
  warnings.push(...detailCompositionWarnings(x));

  let molarMass = 0;
  let k5a = 0;
  let u5a = 0;
  let g = 0;
  let q = 0;
  let f = 0;
  for (let i = 0; i < NC; i++) {
    if (x[i] === 0) continue;
    molarMass += x[i] * COMPONENT_MI[i];
    k5a += x[i] * Math.pow(COMPONENT_KI[i], 2.5);
    u5a += x[i] * Math.pow(COMPONENT_EI[i], 2.5);
    g += x[i] * COMPONENT_GI[i];
    q += x[i] * COMPONENT_QI[i];
    f += x[i] * x[i] * COMPONENT_FI[i];
  }
  let k5 = k5a * k5a;
  let u5 = u5a * u5a;
  const bStar = new Float64Array(18);
  for (let i = 0; i < NC; i++) {
    if (x[i] === 0) continue;
    for (let j = i; j < NC; j++) {
      if (x[j] === 0) continue;
      const ij = i * NC + j;
      if (j > i) {
        const xij2 = 2 * x[i] * x[j];
        k5 += xij2 * (Math.pow(KIJ[ij], 5) - 1) * Math.pow(COMPONENT_KI[i] * COMPONENT_KI[j], 2.5);
        u5 += xij2 * (Math.pow(UIJ[ij], 5) - 1) * Math.pow(COMPONENT_EI[i] * COMPONENT_EI[j], 2.5);
        g += xij2 * (GIJ[ij] - 1) * ((COMPONENT_GI[i] + COMPONENT_GI[j]) / 2);
      }
      // Second-virial pair sums (sheet §3): both i = j (weight x_i²) and i < j (weight 2 x_i x_j).
      const w = (j > i ? 2 : 1) * x[i] * x[j];
      const eij = EIJ[ij] * Math.sqrt(COMPONENT_EI[i] * COMPONENT_EI[j]);
      const gij = (GIJ[ij] * (COMPONENT_GI[i] + COMPONENT_GI[j])) / 2;
      const qq = COMPONENT_QI[i] * COMPONENT_QI[j];
      const ff = Math.sqrt(COMPONENT_FI[i] * COMPONENT_FI[j]);
      const ss = COMPONENT_SI[i] * COMPONENT_SI[j];
      const ww = COMPONENT_WI[i] * COMPONENT_WI[j];
      const kk = Math.pow(COMPONENT_KI[i] * COMPONENT_KI[j], 1.5);
      for (let n = 0; n < 18; n++) {
        // A flag of 0 makes its factor exactly 1 (sheet §11: 0⁰ = 1).
        let bn = 1;
        if (TERM_G[n] === 1) bn *= gij;
        if (TERM_Q[n] === 1) bn *= qq;
        if (TERM_F[n] === 1) bn *= ff;
        if (TERM_S[n] === 1) bn *= ss;
        if (TERM_W[n] === 1) bn *= ww;
        bStar[n] += w * Math.pow(eij, TERM_U[n]) * kk * bn;
      }
    }
  }
  for (let n = 0; n < 18; n++) bStar[n] *= TERM_A[n];

  const k3 = Math.pow(k5, 0.6);
  const u = Math.pow(u5, 0.2);
  const cStar = new Float64Array(NT);
  for (let n = 12; n < NT; n++) {
    let c = TERM_A[n] * Math.pow(u, TERM_U[n]);
    if (TERM_G[n] === 1) c *= g;
    if (TERM_Q[n] === 1) c *= q * q;
    if (TERM_F[n] === 1) c *= f;
    cStar[n] = c;
  }

  // Ideal-gas part (sheet §6): only components present; n0₁ → n0₁ − ln d₀, n0₃ → n0₃ − 1.
  const present: number[] = [];
  for (let i = 0; i < NC; i++) if (x[i] > 0) present.push(i);
  const idealX = new Float64Array(present.length);
  const idealN = new Float64Array(present.length * 7);
  const idealTheta = new Float64Array(present.length * 4);
  present.forEach((i, k) => {
    idealX[k] = x[i];
    for (let m = 0; m < 7; m++) idealN[k * 7 + m] = IDEAL_N0[i][m];
    idealN[k * 7] -= Math.log(IDEAL_REFERENCE_DENSITY);
    idealN[k * 7 + 2] -= 1;
    for (let m = 0; m < 4; m++) idealTheta[k * 4 + m] = IDEAL_THETA0[i][m];
  });

  const tCache = new Float64Array(2 * T_SLOT_SIZE);
  tCache[T_SLOT_SIZE - 1] = NaN;
  tCache[2 * T_SLOT_SIZE - 1] = NaN;
  return {
    moleFractions: x,
    molarMassGPerMol: molarMass,
    molarMassKgPerMol: molarMass / 1000,
    warnings,
    k3,
    bStar,
    cStar,
    idealCount: present.length,
    idealX,
    idealN,
    idealTheta,
    tCache,
    tCacheNext: 0,
  };
}
