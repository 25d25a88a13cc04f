/**
 * solveFlowCase: the flow calculation case of DESIGN.md → its result. The fluid state comes
 * from shared/fluids (IAPWS-IF97, AGA 8, ideal gas, liquid line) at the upstream absolute
 * pressure and flowing temperature; base density at the case's base conditions.
 */
import { fluidState } from '../fluids';
import type { BaseConditions, FlowCase, FlowResult } from './flow-types';
import { flowResultFromState } from './flow-result-from-state';

/** Base conditions when a case gives none: 101.325 kPa and 15 °C (ISO 13443 standard reference conditions). */
export const DEFAULT_BASE_CONDITIONS: Readonly<BaseConditions> = Object.freeze({
  pressurePa: 101325,
  temperatureK: 288.15,
});

/**
 * @param flowCase a case validated by shared/schemas/flow-case.ts
 * @returns beta, dischargeCoefficient, expansibility, reynoldsNumber, densityKgPerM3, compressibility,
 *   baseDensityKgPerM3, massFlowKgPerS, volumeFlowM3PerS, standardVolumeFlowM3PerS, pressureLossPa, warnings
 */
export function solveFlowCase(flowCase: FlowCase): FlowResult {
  const base = flowCase.base ?? DEFAULT_BASE_CONDITIONS;
  const { staticPressurePa, temperatureK } = flowCase.conditions;
  const state = fluidState(flowCase.fluid, staticPressurePa, temperatureK, {
    pressurePa: base.pressurePa,
    temperatureK: base.temperatureK,
  });
  return flowResultFromState(flowCase, state);
}
