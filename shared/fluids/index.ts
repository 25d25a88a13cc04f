/**
 * Fluid properties for the flow engine — THE CONTRACT other code imports:
 * Warning, FluidSpec, FluidState, fluidState (names and shapes fixed; see DESIGN.md
 * "Interfaces"). The property routines behind it are re-exported for benchmarks and tools.
 */
export type { Warning } from './warning';
export type { FluidSpec, FluidState } from './fluid-types';
export {
  fluidState,
  WATER_MOLAR_MASS_KG_PER_MOL,
  IDEAL_GAS_DEFAULT_ISENTROPIC_EXPONENT,
  IDEAL_GAS_DEFAULT_VISCOSITY_PA_S,
  LIQUID_DEFAULT_VISCOSITY_PA_S,
} from './fluid-state';
export { cachedDetailMixture } from './natural-gas-state';
export { idealGasDensityKgPerM3, MOLAR_GAS_CONSTANT_J_PER_MOL_K } from './ideal-gas';
export { liquidDensityKgPerM3 } from './liquid';
export { leeGonzalezEakinViscosityPaS } from './lee-gonzalez-eakin-viscosity';
export { waterStatePT, waterViscosityPaS, saturationPressurePa, saturationTemperatureK, if97Region } from './if97';
export type { WaterState } from './if97';
export {
  prepareDetailMixture,
  detailMolarDensityMolPerM3,
  detailPropertiesPT,
  detailPropertiesTD,
  canonicalComponentName,
  lookUpComponentName,
  DETAIL_COMPONENTS,
} from './aga8';
export type { DetailMixture, DetailProperties, DetailComponent, ComponentLookup } from './aga8';
export { iso6976Properties } from './heating-value';
export type { Iso6976Properties } from './heating-value';
export type { DetailComposition } from './aga8/detail-composition';
