/**
 * The flow engine's public names (ISO 5167 primary elements, solver, stacked pair, range check).
 */
export type * from './flow-types';
export { solveFlowCase, DEFAULT_BASE_CONDITIONS } from './solve-flow-case';
export { calculateFlow, type FlowCalculation } from './calculate-flow';
export { flowResultFromState, type FlowFluidState } from './flow-result-from-state';
export { prepareElement, type PreparedElement } from './prepare-element';
export { evaluateFlow, elementExpansibility, type FlowEvaluation, type FlowFluidProperties } from './evaluate-flow';
export { differentialPressureForMassFlow } from './differential-pressure-for-flow';
export { orificeDischargeCoefficient, prepareOrificeDischargeCoefficient } from './orifice-discharge-coefficient';
export {
  apiOrificeDischargeCoefficient,
  prepareApiOrificeDischargeCoefficient,
  apiExpansionFactorUpstream,
  apiExpansionFactorDownstream,
} from './api-14-3-orifice';
export { nozzleDischargeCoefficient } from './nozzle-discharge-coefficient';
export { venturiDischargeCoefficient, VENTURI_DISCHARGE_COEFFICIENT } from './venturi-discharge-coefficient';
export { prepareCalibration, UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT } from './cone-discharge-coefficient';
export { orificeExpansibility, isentropicExpansibility, coneExpansibility } from './expansibility';
export {
  EXPANSION_PER_K_BY_MATERIAL,
  DEFAULT_REFERENCE_TEMPERATURE_K,
  diameterAtTemperatureM,
  expansionPerK,
} from './thermal-expansion';
export { elementLimits, MINIMUM_PRESSURE_RATIO } from './element-limits';
export { pressureLossPa } from './pressure-loss';
export { massFlowFromEquationKgPerS, pipeReynoldsNumber } from './mass-flow-equation';
export { solveReynoldsNumber } from './reynolds-iteration';
export {
  chooseStackedTransmitter,
  type StackedPairChoice,
  type StackedPairConfig,
  type StackedReading,
  type StackedRole,
} from './stacked-pair';
export {
  rangeCheck,
  rangeCheckWithFluid,
  rangeCheckCurve,
  type RangeCheckInput,
  type RangeCheckResult,
} from './range-check';
export { standardSpanAtOrBelow } from './standard-span';
