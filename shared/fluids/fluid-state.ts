import type { FluidSpec, FluidState } from './fluid-types';
import type { Warning } from './warning';
import { waterStatePT } from './if97/water-state-pt';
import { waterViscosityPaS } from './if97/water-viscosity';
import { SATURATION_PRESSURE_AT_273_15_K_PA, saturationPressurePa, saturationTemperatureK } from './if97/saturation';
import { CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K, IF97_GAS_CONSTANT_J_PER_KG_K } from './if97/constants';
import { naturalGasState } from './natural-gas-state';
import { idealGasDensityKgPerM3 } from './ideal-gas';
import { liquidDensityKgPerM3 } from './liquid';

/** Molar mass of water, IAPWS R6-95 (IAPWS-95): 18.015268 g/mol [mem]. */
export const WATER_MOLAR_MASS_KG_PER_MOL = 0.018015268;
/** Default κ of an ideal gas: 1.4, the diatomic value (air, N₂, O₂) (common practice). */
export const IDEAL_GAS_DEFAULT_ISENTROPIC_EXPONENT = 1.4;
/** Default viscosity of an ideal gas: 1.8e-5 Pa·s, air near 20 °C (1.81e-5) [mem]. */
export const IDEAL_GAS_DEFAULT_VISCOSITY_PA_S = 1.8e-5;
/** Default viscosity of a liquid: 1.0e-3 Pa·s, water near 20 °C (1.002e-3) [mem]. */
export const LIQUID_DEFAULT_VISCOSITY_PA_S = 1.0e-3;
/** Margin to saturation below which a water/steam state is flagged, K. */
const NEAR_SATURATION_K = 1;

function positive(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new Error(`fluidState: ${field} must be a finite number > 0, got ${String(value)}`);
  }
  return value;
}

function optionalPositive(value: unknown, field: string): number | undefined {
  return value === undefined ? undefined : positive(value, field);
}

/** Run an inner property routine, prefixing its error message so it names fluidState. */
function guarded<T>(what: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    throw new Error(`fluidState: ${what}${(e as Error).message}`, { cause: e });
  }
}

function waterState(
  fluid: { kind: 'water' | 'steam'; isentropicExponent?: number; viscosityPaS?: number },
  pressurePa: number,
  temperatureK: number,
  base: { pressurePa: number; temperatureK: number } | undefined,
  kappa: number | undefined,
  viscosity: number | undefined,
): FluidState {
  const s = guarded('', () => waterStatePT(pressurePa, temperatureK));
  const subcritical = temperatureK < CRITICAL_TEMPERATURE_K;
  const liquid = s.region === 1 || (s.region === 3 && subcritical && pressurePa >= saturationPressurePa(temperatureK));
  const warnings: Warning[] = [];
  if (fluid.kind === 'water' && !liquid) {
    warnings.push({
      code: 'fluid.waterIsVapour',
      message: `Fluid is 'water' but IAPWS-IF97 gives a vapour/supercritical state at ${pressurePa} Pa, ${temperatureK} K; steam properties were used.`,
    });
  }
  if (fluid.kind === 'steam' && liquid) {
    warnings.push({
      code: 'fluid.steamIsLiquid',
      message: `Fluid is 'steam' but IAPWS-IF97 gives liquid water at ${pressurePa} Pa, ${temperatureK} K; liquid properties were used (ε = 1).`,
    });
  }
  if (s.region === 3) {
    warnings.push({
      code: 'if97.region3',
      message:
        'State is in IAPWS-IF97 region 3 (near the critical point): properties change steeply and the DP flow equations are poorly suited there.',
    });
  }
  if (s.region === 5) {
    warnings.push({ code: 'if97.region5', message: 'State is in IAPWS-IF97 region 5 (above 1073.15 K).' });
  }
  if (pressurePa < CRITICAL_PRESSURE_PA && pressurePa >= SATURATION_PRESSURE_AT_273_15_K_PA) {
    const margin = Math.abs(temperatureK - saturationTemperatureK(pressurePa));
    if (margin < NEAR_SATURATION_K) {
      warnings.push({
        code: 'if97.nearSaturation',
        message: `State is within ${margin.toFixed(3)} K of saturation: wet steam or flashing across the element would bias the measurement.`,
      });
    }
  }
  const baseDensity =
    base === undefined
      ? null
      : guarded('base: ', () => waterStatePT(base.pressurePa, base.temperatureK)).densityKgPerM3;
  return {
    densityKgPerM3: s.densityKgPerM3,
    compressibility: liquid ? null : pressurePa / (s.densityKgPerM3 * IF97_GAS_CONSTANT_J_PER_KG_K * temperatureK),
    baseDensityKgPerM3: baseDensity,
    isentropicExponent: kappa ?? s.isentropicExponent,
    viscosityPaS: viscosity ?? waterViscosityPaS(s.densityKgPerM3, temperatureK),
    molarMassKgPerMol: WATER_MOLAR_MASS_KG_PER_MOL,
    compressible: !liquid,
    warnings,
  };
}

/**
 * Density, compressibility, isentropic exponent and viscosity of a meter run's fluid at
 * flowing conditions (and density at base conditions), from the fluid's specification:
 * - 'water' / 'steam': IAPWS-IF97 (R7-97(2012)) with IAPWS R12-08 viscosity;
 * - 'natural-gas': AGA 8 Part 1 DETAIL (Z, density, κ from its caloric properties),
 *   Lee–Gonzalez–Eakin viscosity unless given (warning 'fluid.defaultViscosity');
 * - 'ideal-gas': ρ = pM/(ZRT), Z default 1 (1 at base), κ default 1.4 and μ default 1.8e-5 Pa·s,
 *   each default with a warning;
 * - 'liquid': ρ = ρ_ref/(1 + β(T − T_ref)), incompressible (κ = Infinity unless given),
 *   μ default 1.0e-3 Pa·s with a warning.
 * Repeated calls with the same composition object reuse the prepared AGA 8 mixture.
 *
 * @param fluid the fluid specification
 * @param pressurePa absolute static pressure at flowing conditions, Pa
 * @param temperatureK flowing temperature, K
 * @param base base (reference) conditions for baseDensityKgPerM3, optional
 * @returns the fluid state
 * @throws Error whose message starts with "fluidState:" and names the field, for bad input
 */
export function fluidState(
  fluid: FluidSpec,
  pressurePa: number,
  temperatureK: number,
  base?: { pressurePa: number; temperatureK: number },
): FluidState {
  if (fluid === null || typeof fluid !== 'object') {
    throw new Error('fluidState: fluid must be an object with a kind');
  }
  positive(pressurePa, 'pressurePa');
  positive(temperatureK, 'temperatureK');
  if (base !== undefined) {
    if (base === null || typeof base !== 'object')
      throw new Error('fluidState: base must be an object { pressurePa, temperatureK }');
    positive(base.pressurePa, 'base.pressurePa');
    positive(base.temperatureK, 'base.temperatureK');
  }
  const kappa = optionalPositive(fluid.isentropicExponent, 'fluid.isentropicExponent');
  const viscosity = optionalPositive(fluid.viscosityPaS, 'fluid.viscosityPaS');
  switch (fluid.kind) {
    case 'water':
    case 'steam':
      return waterState(fluid, pressurePa, temperatureK, base, kappa, viscosity);
    case 'natural-gas':
      return guarded('', () => naturalGasState(fluid.composition, pressurePa, temperatureK, base, kappa, viscosity));
    case 'ideal-gas': {
      const m = positive(fluid.molarMassKgPerMol, 'fluid.molarMassKgPerMol');
      const z = optionalPositive(fluid.compressibility, 'fluid.compressibility') ?? 1;
      const warnings: Warning[] = [];
      if (kappa === undefined) {
        warnings.push({
          code: 'fluid.defaultIsentropicExponent',
          message: `Isentropic exponent not given: ${IDEAL_GAS_DEFAULT_ISENTROPIC_EXPONENT} (diatomic ideal gas) assumed.`,
        });
      }
      if (viscosity === undefined) {
        warnings.push({
          code: 'fluid.defaultViscosity',
          message: `Viscosity not given: ${IDEAL_GAS_DEFAULT_VISCOSITY_PA_S} Pa·s (air near 20 °C) assumed; it affects only the Reynolds number.`,
        });
      }
      return {
        densityKgPerM3: idealGasDensityKgPerM3(pressurePa, temperatureK, m, z),
        compressibility: z,
        // Z = 1 at base: the given Z describes flowing conditions; base conditions are near-atmospheric.
        baseDensityKgPerM3:
          base === undefined ? null : idealGasDensityKgPerM3(base.pressurePa, base.temperatureK, m, 1),
        isentropicExponent: kappa ?? IDEAL_GAS_DEFAULT_ISENTROPIC_EXPONENT,
        viscosityPaS: viscosity ?? IDEAL_GAS_DEFAULT_VISCOSITY_PA_S,
        molarMassKgPerMol: m,
        compressible: true,
        warnings,
      };
    }
    case 'liquid': {
      const rhoRef = positive(fluid.densityKgPerM3, 'fluid.densityKgPerM3');
      const tRef = positive(fluid.referenceTemperatureK, 'fluid.referenceTemperatureK');
      if (typeof fluid.expansionPerK !== 'number' || !Number.isFinite(fluid.expansionPerK)) {
        throw new Error(`fluidState: fluid.expansionPerK must be a finite number, got ${String(fluid.expansionPerK)}`);
      }
      const beta = fluid.expansionPerK;
      const warnings: Warning[] = [];
      if (viscosity === undefined) {
        warnings.push({
          code: 'fluid.defaultViscosity',
          message: `Viscosity not given: ${LIQUID_DEFAULT_VISCOSITY_PA_S} Pa·s (water near 20 °C) assumed; give the liquid's viscosity, as it sets the Reynolds number.`,
        });
      }
      return {
        densityKgPerM3: guarded('', () => liquidDensityKgPerM3(temperatureK, rhoRef, tRef, beta)),
        compressibility: null,
        baseDensityKgPerM3:
          base === undefined
            ? null
            : guarded('base: ', () => liquidDensityKgPerM3(base.temperatureK, rhoRef, tRef, beta)),
        isentropicExponent: kappa ?? Number.POSITIVE_INFINITY,
        viscosityPaS: viscosity ?? LIQUID_DEFAULT_VISCOSITY_PA_S,
        molarMassKgPerMol: null,
        compressible: false,
        warnings,
      };
    }
    default:
      throw new Error(
        `fluidState: fluid.kind must be one of water, steam, natural-gas, ideal-gas, liquid; got ${String((fluid as { kind?: unknown }).kind)}`,
      );
  }
}
