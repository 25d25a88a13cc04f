import { CRITICAL_DENSITY_KG_PER_M3, CRITICAL_TEMPERATURE_K } from './constants';

// IAPWS R12-08 (2008), "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
// Water Substance". Table 1: coefficients Hᵢ of the dilute-gas term μ̄₀, eq. (11).
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];
// Table 2: coefficients Hᵢⱼ of the residual term μ̄₁, eq. (12); only the 21 non-zero ones,
// with their i (power of 1/T̄ − 1) and j (power of ρ̄ − 1).
// (Values as reproduced in Debian's python3-iapws 1.5.2, _iapws.py, _Viscosity.)
const I1 = [0, 1, 2, 3, 0, 1, 2, 3, 5, 0, 1, 2, 3, 4, 0, 1, 0, 3, 4, 3, 5];
const J1 = [0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 4, 4, 5, 6, 6];
const H1 = [
  0.520094, 0.850895e-1, -0.108374e1, -0.289555, 0.222531, 0.999115, 0.188797e1, 0.126613e1, 0.120573, -0.281378,
  -0.906851, -0.772479, -0.489837, -0.25704, 0.161913, 0.257399, -0.325372e-1, 0.698452e-1, 0.872102e-2, -0.435673e-2,
  -0.593264e-3,
];
/** Reference viscosity μ* of R12-08 eq. (4): 1 µPa·s. */
const MU_STAR_PA_S = 1e-6;

/**
 * Dynamic viscosity of water and steam by IAPWS R12-08, as recommended there for industrial
 * use (§3.2): μ̄ = μ̄₀(T̄) · μ̄₁(T̄, ρ̄), with the density taken from IAPWS-IF97.
 *
 * The critical enhancement μ̄₂ (eq. (14)) is omitted (μ̄₂ = 1), as R12-08 §3.2 allows for
 * industrial use: it exceeds 2 % only in a tiny region around the critical point (roughly
 * 645.91 K < T < 650.77 K and 245.8 < ρ < 405.3 kg/m³) where DP metering is not practised, and
 * it needs the isothermal compressibility at a reference temperature, which costs a second
 * property evaluation on every call.
 *
 * @param densityKgPerM3 density, kg/m³ (> 0)
 * @param temperatureK temperature, K (> 0)
 * @returns dynamic viscosity, Pa·s
 * @throws Error naming the field if an input is not a finite positive number
 */
export function waterViscosityPaS(densityKgPerM3: number, temperatureK: number): number {
  if (!Number.isFinite(densityKgPerM3) || densityKgPerM3 <= 0) {
    throw new Error(`waterViscosityPaS: densityKgPerM3 must be a finite number > 0, got ${densityKgPerM3}`);
  }
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`waterViscosityPaS: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  const t = temperatureK / CRITICAL_TEMPERATURE_K;
  const d = densityKgPerM3 / CRITICAL_DENSITY_KG_PER_M3;
  // eq. (11): μ̄₀ = 100 √T̄ / Σ Hᵢ / T̄ⁱ
  let s0 = 0;
  for (let i = 0; i < 4; i++) s0 += H0[i] / Math.pow(t, i);
  const mu0 = (100 * Math.sqrt(t)) / s0;
  // eq. (12): μ̄₁ = exp[ρ̄ Σ Σ Hᵢⱼ (1/T̄ − 1)ⁱ (ρ̄ − 1)ʲ]
  const x = 1 / t - 1;
  const y = d - 1;
  let s1 = 0;
  for (let k = 0; k < 21; k++) s1 += H1[k] * Math.pow(x, I1[k]) * Math.pow(y, J1[k]);
  const mu1 = Math.exp(d * s1);
  return mu0 * mu1 * MU_STAR_PA_S;
}
