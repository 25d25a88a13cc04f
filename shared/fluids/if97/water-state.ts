/**
 * The result type of every IAPWS-IF97 property routine in this folder.
 * SI units: Pa, K, kg/m³, J/kg, J/(kg K), m/s.
 */
export interface WaterState {
  /** IF97 region the state was computed in: 1 compressed liquid, 2 vapour, 3 near-critical, 5 high-temperature steam. */
  region: 1 | 2 | 3 | 5;
  pressurePa: number;
  temperatureK: number;
  densityKgPerM3: number;
  specificVolumeM3PerKg: number;
  specificEnthalpyJPerKg: number;
  specificInternalEnergyJPerKg: number;
  specificEntropyJPerKgK: number;
  isobaricHeatCapacityJPerKgK: number;
  isochoricHeatCapacityJPerKgK: number;
  speedOfSoundMPerS: number;
  /**
   * Isentropic exponent as ISO 5167-1 uses it: κ = w² ρ / p (the ratio of the relative
   * variation in pressure to that in density for an isentropic change). Equal to cp/cv only
   * for an ideal gas; for liquid water it is in the thousands.
   */
  isentropicExponent: number;
}

/**
 * Assemble a WaterState from the dimensionless derivatives of a Gibbs free energy
 * g(p,T)/(RT) = γ(π, τ), as in R7-97(2012) Table 3 (region 1), Table 12 (region 2)
 * and Table 39 (region 5).
 *
 * The region-2/5 form (ideal part γ° plus residual γʳ) and the region-1 form (one γ)
 * are both covered by passing the total derivatives: γπ, γππ, γτ, γττ, γπτ, all with
 * respect to the region's own reduced variables π = p/p_red, τ = T_red/T (reducing values of the region).
 *
 * @param region IF97 region number
 * @param pressurePa absolute pressure
 * @param temperatureK temperature
 * @param pi reduced pressure π = p/p_red of the region
 * @param tau reduced temperature τ = T_red/T of the region
 * @param g γ
 * @param gp ∂γ/∂π
 * @param gpp ∂²γ/∂π²
 * @param gt ∂γ/∂τ
 * @param gtt ∂²γ/∂τ²
 * @param gpt ∂²γ/∂π∂τ
 * @param gasConstant specific gas constant, J/(kg K)
 * @returns the full state
 */
export function waterStateFromGibbs(
  region: 1 | 2 | 5,
  pressurePa: number,
  temperatureK: number,
  pi: number,
  tau: number,
  g: number,
  gp: number,
  gpp: number,
  gt: number,
  gtt: number,
  gpt: number,
  gasConstant: number,
): WaterState {
  const rt = gasConstant * temperatureK;
  // v = (RT/p) π γπ — same expression in all three Gibbs regions.
  const v = (rt / pressurePa) * pi * gp;
  const h = rt * tau * gt;
  const u = rt * (tau * gt - pi * gp);
  const s = gasConstant * (tau * gt - g);
  const cp = -gasConstant * tau * tau * gtt;
  // cv = R[-τ²γττ + (γπ − τγπτ)²/γππ]  (R7-97(2012) Table 3; Tables 12 and 39 are the same
  // identity written with the ideal part expanded).
  const a = gp - tau * gpt;
  const cv = gasConstant * (-tau * tau * gtt + (a * a) / gpp);
  // w² = RT γπ² / [(γπ − τγπτ)²/(τ²γττ) − γππ]
  const w2 = (rt * gp * gp) / ((a * a) / (tau * tau * gtt) - gpp);
  const w = Math.sqrt(w2);
  const rho = 1 / v;
  return {
    region,
    pressurePa,
    temperatureK,
    densityKgPerM3: rho,
    specificVolumeM3PerKg: v,
    specificEnthalpyJPerKg: h,
    specificInternalEnergyJPerKg: u,
    specificEntropyJPerKgK: s,
    isobaricHeatCapacityJPerKgK: cp,
    isochoricHeatCapacityJPerKgK: cv,
    speedOfSoundMPerS: w,
    isentropicExponent: (w2 * rho) / pressurePa,
  };
}
