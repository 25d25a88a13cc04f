/** IAPWS-IF97 water and steam properties and IAPWS R12-08 viscosity (public surface of this folder). */
export type { WaterState } from './water-state';
export { waterStatePT } from './water-state-pt';
export { if97Region } from './if97-region';
export { region1State } from './region1';
export { region2State } from './region2';
export { region3StateRhoT, region3DensityKgPerM3 } from './region3';
export { region5State } from './region5';
export { saturationPressurePa, saturationTemperatureK } from './saturation';
export { boundary23PressurePa, boundary23TemperatureK } from './boundary23';
export { waterViscosityPaS } from './water-viscosity';
export * from './constants';
