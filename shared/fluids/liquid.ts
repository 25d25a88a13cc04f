/**
 * Density of a liquid at temperature T from its density at a reference temperature and a
 * constant volumetric (cubic) thermal expansion coefficient β:
 *
 *   ρ(T) = ρ_ref / (1 + β (T − T_ref))
 *
 * Why this form: β is defined on volume, V(T) = V_ref (1 + β (T − T_ref)), and mass is
 * conserved, so density is the reciprocal; this is the form in which a "volumetric expansion
 * coefficient" is usually quoted (common practice). The often-seen ρ_ref (1 − β ΔT) is its
 * first-order approximation and differs by (β ΔT)² (e.g. 8e-5 relative for β = 9e-4 /K and
 * ΔT = 10 K); the petroleum tables (API MPMS 11.1) use an exponential form that a constant β
 * cannot represent anyway. Pressure is ignored (the liquid is taken as incompressible), which
 * is consistent with ε = 1 in the flow equation.
 *
 * @param temperatureK flowing temperature, K (> 0)
 * @param referenceDensityKgPerM3 density at the reference temperature, kg/m³ (> 0)
 * @param referenceTemperatureK reference temperature, K (> 0)
 * @param expansionPerK volumetric expansion coefficient β, 1/K (finite; 1 + β ΔT must stay > 0)
 * @returns density at T, kg/m³
 * @throws Error naming the field when an input is invalid
 */
export function liquidDensityKgPerM3(
  temperatureK: number,
  referenceDensityKgPerM3: number,
  referenceTemperatureK: number,
  expansionPerK: number,
): number {
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`liquidDensityKgPerM3: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  if (!Number.isFinite(referenceDensityKgPerM3) || referenceDensityKgPerM3 <= 0) {
    throw new Error(`liquidDensityKgPerM3: densityKgPerM3 must be a finite number > 0, got ${referenceDensityKgPerM3}`);
  }
  if (!Number.isFinite(referenceTemperatureK) || referenceTemperatureK <= 0) {
    throw new Error(
      `liquidDensityKgPerM3: referenceTemperatureK must be a finite number > 0, got ${referenceTemperatureK}`,
    );
  }
  if (!Number.isFinite(expansionPerK)) {
    throw new Error(`liquidDensityKgPerM3: expansionPerK must be a finite number, got ${expansionPerK}`);
  }
  const factor = 1 + expansionPerK * (temperatureK - referenceTemperatureK);
  if (!(factor > 0)) {
    throw new Error(
      `liquidDensityKgPerM3: expansionPerK ${expansionPerK} gives a non-positive volume factor at ${temperatureK} K`,
    );
  }
  return referenceDensityKgPerM3 / factor;
}
