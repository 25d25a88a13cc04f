import { CRITICAL_DENSITY_KG_PER_M3, CRITICAL_TEMPERATURE_K, IF97_GAS_CONSTANT_J_PER_KG_K } from './constants';
import { type WaterState } from './water-state';

// IAPWS R7-97(2012) Table 30: region-3 Helmholtz free energy, eq. (28):
// φ(δ,τ) = n₁ ln δ + Σᵢ₌₂⁴⁰ nᵢ δ^Iᵢ τ^Jᵢ, δ = ρ/322 kg/m³, τ = 647.096 K/T.
// (Values as reproduced in Debian's python3-iapws 1.5.2, iapws97.py, _Region3.)
const N_LN = 0.10658070028513e1;
const I3 = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 4, 5, 5, 5, 6, 6, 6, 7, 8, 9, 9, 10, 10,
  11,
]);
const J3 = new Float64Array([
  0, 1, 2, 7, 10, 12, 23, 2, 6, 15, 17, 0, 2, 6, 7, 22, 26, 0, 2, 4, 16, 26, 0, 2, 4, 26, 1, 3, 26, 0, 2, 26, 2, 26, 2,
  26, 0, 1, 26,
]);
const N3 = new Float64Array([
  -0.15732845290239e2, 0.20944396974307e2, -0.76867707878716e1, 0.26185947787954e1, -0.2808078114862e1,
  0.12053369696517e1, -0.84566812812502e-2, -0.12654315477714e1, -0.11524407806681e1, 0.88521043984318,
  -0.64207765181607, 0.38493460186671, -0.85214708824206, 0.48972281541877e1, -0.30502617256965e1, 0.39420536879154e-1,
  0.12558408424308, -0.2799932969871, 0.1389979956946e1, -0.2018991502357e1, -0.82147637173963e-2, -0.47596035734923,
  0.439840744735e-1, -0.44476435428739, 0.90572070719733, 0.70522450087967, 0.10770512626332, -0.32913623258954,
  -0.50871062041158, -0.22175400873096e-1, 0.94260751665092e-1, 0.16436278447961, -0.13503372241348e-1,
  -0.14834345352472e-1, 0.57922953628084e-3, 0.32308904703711e-2, 0.80964802996215e-4, -0.16557679795037e-3,
  -0.44923899061815e-4,
]);

/** Scratch for the Helmholtz derivatives: [φ, φδ, φδδ, φτ, φττ, φδτ]. */
const phi = new Float64Array(6);

function helmholtz(delta: number, tau: number): void {
  let f = N_LN * Math.log(delta);
  let fd = N_LN / delta;
  let fdd = -N_LN / (delta * delta);
  let ft = 0;
  let ftt = 0;
  let fdt = 0;
  for (let k = 0; k < 39; k++) {
    const i = I3[k];
    const j = J3[k];
    const term = N3[k] * Math.pow(delta, i) * Math.pow(tau, j);
    f += term;
    const ti = (i * term) / delta;
    const tj = (j * term) / tau;
    fd += ti;
    fdd += (i * (i - 1) * term) / (delta * delta);
    ft += tj;
    ftt += (j * (j - 1) * term) / (tau * tau);
    fdt += (i * tj) / delta;
  }
  phi[0] = f;
  phi[1] = fd;
  phi[2] = fdd;
  phi[3] = ft;
  phi[4] = ftt;
  phi[5] = fdt;
}

/**
 * Properties from the IAPWS-IF97 region-3 basic equation as a function of density and
 * temperature (R7-97(2012) §7, eq. (28), Table 31).
 *
 * @param densityKgPerM3 density, kg/m³
 * @param temperatureK temperature, K
 * @returns the state (its pressure follows from the equation)
 */
export function region3StateRhoT(densityKgPerM3: number, temperatureK: number): WaterState {
  const delta = densityKgPerM3 / CRITICAL_DENSITY_KG_PER_M3;
  const tau = CRITICAL_TEMPERATURE_K / temperatureK;
  helmholtz(delta, tau);
  const [f, fd, fdd, ft, ftt, fdt] = phi;
  const R = IF97_GAS_CONSTANT_J_PER_KG_K;
  const rt = R * temperatureK;
  const p = densityKgPerM3 * rt * delta * fd;
  const a = delta * fd - delta * tau * fdt;
  const b = 2 * delta * fd + delta * delta * fdd;
  const cv = -R * tau * tau * ftt;
  const cp = R * (-tau * tau * ftt + (a * a) / b);
  const w2 = rt * (b - (a * a) / (tau * tau * ftt));
  return {
    region: 3,
    pressurePa: p,
    temperatureK,
    densityKgPerM3,
    specificVolumeM3PerKg: 1 / densityKgPerM3,
    specificEnthalpyJPerKg: rt * (tau * ft + delta * fd),
    specificInternalEnergyJPerKg: rt * tau * ft,
    specificEntropyJPerKgK: R * (tau * ft - f),
    isobaricHeatCapacityJPerKgK: cp,
    isochoricHeatCapacityJPerKgK: cv,
    speedOfSoundMPerS: Math.sqrt(w2),
    isentropicExponent: (w2 * densityKgPerM3) / p,
  };
}

/** Pressure p(ρ,T) and (∂p/∂ρ)_T from eq. (28); returns [p, dp/dρ] in `out`. */
function pressureAndSlope(densityKgPerM3: number, temperatureK: number, out: Float64Array): void {
  const delta = densityKgPerM3 / CRITICAL_DENSITY_KG_PER_M3;
  helmholtz(delta, CRITICAL_TEMPERATURE_K / temperatureK);
  const rt = IF97_GAS_CONSTANT_J_PER_KG_K * temperatureK;
  out[0] = densityKgPerM3 * rt * delta * phi[1];
  out[1] = rt * (2 * delta * phi[1] + delta * delta * phi[2]);
}

const ps = new Float64Array(2);
/** Region-3 densities span about 110…720 kg/m³; these scan limits lie safely outside. */
const SCAN_LOW_KG_PER_M3 = 40;
const SCAN_HIGH_KG_PER_M3 = 800;
/** Relative step of the bracketing scan: fine enough not to jump across the van der Waals loop near Tc. */
const SCAN_STEP = 1.005;

/**
 * Density in IF97 region 3 at given pressure and temperature, by solving eq. (28)'s p(ρ,T) = p.
 * The release gives no p,T form for region 3 (the 2005 supplementary backward equations are an
 * approximation); solving the basic equation keeps full consistency with it.
 *
 * Branch choice: below Tc a region-3 isotherm has a liquid-like and a vapour-like branch. For
 * p ≥ psat(T) the liquid root (largest density) is wanted, found by scanning down from high
 * density; for p < psat(T), or T ≥ Tc, the vapour root (smallest density), scanning up. The
 * scan brackets the first sign change; a safeguarded Newton iteration then refines it.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @param liquidBranch true to take the liquid (largest) root
 * @returns density, kg/m³
 * @throws Error if no root is found on the requested branch
 */
export function region3DensityKgPerM3(pressurePa: number, temperatureK: number, liquidBranch: boolean): number {
  let lo: number;
  let hi: number;
  if (liquidBranch) {
    hi = SCAN_HIGH_KG_PER_M3;
    pressureAndSlope(hi, temperatureK, ps);
    if (!(ps[0] > pressurePa)) {
      throw new Error(
        `region3DensityKgPerM3: pressurePa ${pressurePa} above the region-3 equation's range at ${temperatureK} K`,
      );
    }
    lo = hi / SCAN_STEP;
    for (;;) {
      pressureAndSlope(lo, temperatureK, ps);
      if (ps[0] <= pressurePa) break;
      if (ps[1] <= 0 || lo < SCAN_LOW_KG_PER_M3) {
        throw new Error(
          `region3DensityKgPerM3: no liquid-branch density for pressurePa ${pressurePa} at ${temperatureK} K`,
        );
      }
      hi = lo;
      lo = lo / SCAN_STEP;
    }
  } else {
    lo = SCAN_LOW_KG_PER_M3;
    pressureAndSlope(lo, temperatureK, ps);
    if (!(ps[0] < pressurePa)) {
      throw new Error(
        `region3DensityKgPerM3: pressurePa ${pressurePa} below the region-3 equation's range at ${temperatureK} K`,
      );
    }
    hi = lo * SCAN_STEP;
    for (;;) {
      pressureAndSlope(hi, temperatureK, ps);
      if (ps[0] >= pressurePa) break;
      if (ps[1] <= 0 || hi > SCAN_HIGH_KG_PER_M3) {
        throw new Error(
          `region3DensityKgPerM3: no vapour-branch density for pressurePa ${pressurePa} at ${temperatureK} K`,
        );
      }
      lo = hi;
      hi = hi * SCAN_STEP;
    }
  }
  // Safeguarded Newton inside [lo, hi] (p(lo) ≤ target ≤ p(hi)).
  let rho = 0.5 * (lo + hi);
  for (let it = 0; it < 100; it++) {
    pressureAndSlope(rho, temperatureK, ps);
    const f = ps[0] - pressurePa;
    if (f > 0) hi = rho;
    else lo = rho;
    let next = ps[1] > 0 ? rho - f / ps[1] : NaN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - rho) <= 1e-14 * rho) return next;
    rho = next;
    if (hi - lo <= 1e-14 * rho) return rho;
  }
  return rho;
}
