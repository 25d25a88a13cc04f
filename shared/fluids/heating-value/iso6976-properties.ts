import { parseDetailComposition } from '../aga8/detail-composition';
import type { Warning } from '../warning';
import {
  AIR_COMPRESSIBILITY,
  COMBUSTION_TEMPERATURES_K,
  ISO6976_AIR_MOLAR_MASS,
  ISO6976_COMPONENTS,
  ISO6976_GAS_CONSTANT,
  ISO6976_REFERENCE_PRESSURE_PA,
  METERING_TEMPERATURES_K,
  WATER_VAPORISATION_KJ_PER_MOL,
} from './iso6976-data';

/** Calorific values, density, relative density and Wobbe indices of a gas, ISO 6976:2016 (SI units). */
export interface Iso6976Properties {
  molarMassKgPerMol: number;
  /** Real-gas compression factor at the metering conditions, from the summation factors. */
  compressibility: number;
  superiorMolarJPerMol: number;
  inferiorMolarJPerMol: number;
  superiorMassJPerKg: number;
  inferiorMassJPerKg: number;
  /** Real-gas volumetric calorific values at the metering conditions, J/m³. */
  superiorVolumetricJPerM3: number;
  inferiorVolumetricJPerM3: number;
  /** Real-gas density at the metering conditions, kg/m³. */
  densityKgPerM3: number;
  /** Real-gas relative density (to dry air at the same conditions). */
  relativeDensity: number;
  idealRelativeDensity: number;
  superiorWobbeIndexJPerM3: number;
  inferiorWobbeIndexJPerM3: number;
  warnings: Warning[];
}

function tableIndex(temperatureK: number, table: readonly number[], field: string): number {
  const i = table.findIndex((t) => Math.abs(t - temperatureK) < 0.01);
  if (i < 0 || !Number.isFinite(temperatureK)) {
    throw new Error(
      `iso6976Properties: ${field} must be one of ${table.map((t) => `${t} K`).join(', ')} (ISO 6976:2016 reference temperatures), got ${temperatureK}`,
    );
  }
  return i;
}

/**
 * Superior (gross) and inferior (net) calorific values on molar, mass and volumetric bases,
 * density, relative density and Wobbe indices of a natural gas from its composition, by
 * ISO 6976:2016:
 * - molar CV (clause 5): H̃ = Σ xⱼ H̃ⱼ(t₁); net H̃ⱼ = gross − (bⱼ/2) L°(t₁), bⱼ hydrogen atoms;
 *   the real-gas molar CV is taken equal to the ideal one, as the 2016 edition does;
 * - compression factor: Z = 1 − (p₂/p₀)(Σ xⱼ sⱼ(t₂))²;
 * - volumetric CV: H̃ · p₂/(R T₂) / Z; mass CV: H̃ / M;
 * - relative density d = (M/M_air) Z_air(t₂)/Z; Wobbe index W = H_v / √d.
 *
 * @param composition mole fractions keyed by component name (the 21 AGA 8 DETAIL components, lenient names)
 * @param options combustion and metering reference temperatures (K; one of the standard's
 *   tabulated values, default 15 °C / 15 °C) and metering pressure (Pa, default 101.325 kPa;
 *   the summation factors hold near atmospheric pressure, so 90…110 kPa is accepted)
 * @returns the properties and any normalisation warning
 * @throws Error naming the function and field for bad input
 */
export function iso6976Properties(
  composition: Record<string, number>,
  options: { combustionTemperatureK?: number; meteringTemperatureK?: number; meteringPressurePa?: number } = {},
): Iso6976Properties {
  const t1 = tableIndex(options.combustionTemperatureK ?? 288.15, COMBUSTION_TEMPERATURES_K, 'combustionTemperatureK');
  const t2 = tableIndex(options.meteringTemperatureK ?? 288.15, METERING_TEMPERATURES_K, 'meteringTemperatureK');
  const p2 = options.meteringPressurePa ?? ISO6976_REFERENCE_PRESSURE_PA;
  if (!Number.isFinite(p2) || p2 < 90e3 || p2 > 110e3) {
    throw new Error(`iso6976Properties: meteringPressurePa must be within 90…110 kPa, got ${p2}`);
  }
  const { moleFractions: x, warnings } = parseDetailComposition(composition, 'iso6976Properties');
  let m = 0;
  let sumS = 0;
  let gross = 0;
  let net = 0;
  const l = WATER_VAPORISATION_KJ_PER_MOL[t1];
  for (let j = 0; j < x.length; j++) {
    if (x[j] === 0) continue;
    const comp = ISO6976_COMPONENTS[j];
    m += x[j] * comp.molarMass;
    sumS += x[j] * comp.summationFactor[t2];
    gross += x[j] * comp.grossKJPerMol[t1];
    net += x[j] * (comp.grossKJPerMol[t1] - (comp.hydrogenAtoms / 2) * l);
  }
  const z = 1 - (p2 / ISO6976_REFERENCE_PRESSURE_PA) * sumS * sumS;
  const molesPerM3Ideal = p2 / (ISO6976_GAS_CONSTANT * METERING_TEMPERATURES_K[t2]);
  const idealRelativeDensity = m / ISO6976_AIR_MOLAR_MASS;
  const relativeDensity = (idealRelativeDensity * AIR_COMPRESSIBILITY[t2]) / z;
  const hsV = (gross * 1e3 * molesPerM3Ideal) / z;
  const hiV = (net * 1e3 * molesPerM3Ideal) / z;
  return {
    molarMassKgPerMol: m / 1000,
    compressibility: z,
    superiorMolarJPerMol: gross * 1e3,
    inferiorMolarJPerMol: net * 1e3,
    superiorMassJPerKg: (gross / m) * 1e6,
    inferiorMassJPerKg: (net / m) * 1e6,
    superiorVolumetricJPerM3: hsV,
    inferiorVolumetricJPerM3: hiV,
    densityKgPerM3: ((m / 1000) * molesPerM3Ideal) / z,
    relativeDensity,
    idealRelativeDensity,
    superiorWobbeIndexJPerM3: hsV / Math.sqrt(relativeDensity),
    inferiorWobbeIndexJPerM3: hiV / Math.sqrt(relativeDensity),
    warnings,
  };
}
