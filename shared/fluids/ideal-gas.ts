/**
 * Molar gas constant, J/(mol K): the exact SI value since the 2019 redefinition
 * (R = N_A k = 6.02214076e23 × 1.380649e-23 = 8.314462618… J/(mol K); CODATA 2018).
 */
export const MOLAR_GAS_CONSTANT_J_PER_MOL_K = 8.314462618;

/**
 * Density of a gas from the real-gas law with a given compressibility factor,
 * ρ = p M / (Z R T).
 *
 * @param pressurePa absolute pressure, Pa (> 0)
 * @param temperatureK temperature, K (> 0)
 * @param molarMassKgPerMol molar mass, kg/mol (> 0), e.g. 0.02896546 for dry air (ISO 6976:2016 Table A.3 [mem])
 * @param compressibility compressibility factor Z (> 0); 1 for an ideal gas
 * @returns density, kg/m³
 * @throws Error naming the field when an input is not a finite positive number
 */
export function idealGasDensityKgPerM3(
  pressurePa: number,
  temperatureK: number,
  molarMassKgPerMol: number,
  compressibility = 1,
): number {
  if (!Number.isFinite(pressurePa) || pressurePa <= 0) {
    throw new Error(`idealGasDensityKgPerM3: pressurePa must be a finite number > 0, got ${pressurePa}`);
  }
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`idealGasDensityKgPerM3: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  if (!Number.isFinite(molarMassKgPerMol) || molarMassKgPerMol <= 0) {
    throw new Error(`idealGasDensityKgPerM3: molarMassKgPerMol must be a finite number > 0, got ${molarMassKgPerMol}`);
  }
  if (!Number.isFinite(compressibility) || compressibility <= 0) {
    throw new Error(`idealGasDensityKgPerM3: compressibility must be a finite number > 0, got ${compressibility}`);
  }
  return (pressurePa * molarMassKgPerMol) / (compressibility * MOLAR_GAS_CONSTANT_J_PER_MOL_K * temperatureK);
}
