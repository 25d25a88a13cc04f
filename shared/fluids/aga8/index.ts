/** AGA 8 Part 1 (2017) DETAIL equation of state for natural gas (public surface of this folder). */
export { prepareDetailMixture } from './prepare-detail-mixture';
export type { DetailMixture } from './prepare-detail-mixture';
export { detailMolarDensityMolPerM3 } from './detail-molar-density';
export { detailPropertiesPT, detailPropertiesTD } from './detail-properties';
export type { DetailProperties } from './detail-properties';
export { canonicalComponentName, lookUpComponentName, parseDetailComposition } from './detail-composition';
export type { ComponentLookup } from './detail-composition';
export { detailStateWarnings, detailCompositionWarnings } from './detail-range';
export { DETAIL_COMPONENTS, DETAIL_GAS_CONSTANT } from './detail-constants';
export type { DetailComponent } from './detail-constants';
