/**
 * The flow result of a case once the fluid state at upstream conditions is known: element
 * prepared at flowing temperature, C iterated on Re_D, ε, qm, volumes and every limit broken.
 */
import { apiDownstreamCompressibilityRatio } from './api-14-3-compressibility-ratio';
import { formatNumber, operatingPointWarnings } from './element-limits';
import { evaluateFlow } from './evaluate-flow';
import type { FlowCase, FlowResult, FlowWarning } from './flow-types';
import { prepareElement } from './prepare-element';
import { pressureLossPa } from './pressure-loss';

/** The part of the fluids module's FluidState that the flow equation uses. */
export interface FlowFluidState {
  densityKgPerM3: number;
  compressibility: number | null;
  baseDensityKgPerM3: number | null;
  isentropicExponent: number;
  viscosityPaS: number;
  compressible: boolean;
  warnings: FlowWarning[];
}

/**
 * @param flowCase the case (element, conditions; fluid already evaluated)
 * @param state fluid state at the upstream pressure and temperature
 * @returns the result of DESIGN.md's calculation interface
 */
export function flowResultFromState(flowCase: FlowCase, state: FlowFluidState): FlowResult {
  const { differentialPressurePa, staticPressurePa, temperatureK } = flowCase.conditions;
  if (!(differentialPressurePa > 0)) {
    throw new Error(
      `flowResultFromState: conditions.differentialPressurePa must be > 0 (got ${differentialPressurePa})`,
    );
  }
  if (!(staticPressurePa > differentialPressurePa)) {
    throw new Error(
      `flowResultFromState: conditions.staticPressurePa (absolute, ${staticPressurePa} Pa) must exceed conditions.differentialPressurePa (${differentialPressurePa} Pa)`,
    );
  }
  if (!(state.densityKgPerM3 > 0) || !(state.viscosityPaS > 0) || !(state.isentropicExponent > 0)) {
    throw new Error(
      `flowResultFromState: fluid state needs density, viscosity and isentropic exponent > 0 (got ${state.densityKgPerM3}, ${state.viscosityPaS}, ${state.isentropicExponent})`,
    );
  }
  const element = prepareElement(flowCase.element, temperatureK);
  const flow = evaluateFlow(
    element,
    differentialPressurePa,
    staticPressurePa,
    element.expansibilityModel === 'api-14.3-downstream' && state.compressible
      ? {
          ...state,
          downstreamCompressibilityRatio: apiDownstreamCompressibilityRatio(
            flowCase.fluid,
            staticPressurePa,
            differentialPressurePa,
            temperatureK,
          ),
        }
      : state,
  );
  const warnings: FlowWarning[] = [...state.warnings, ...element.warnings];
  // An API 14.3 run referred downstream measures p2 (as installed): p1 = p2 + Δp (AGA 3 Part 4 §4.3.2.6).
  const downstreamTap = element.expansibilityModel === 'api-14.3-downstream';
  const pressureRatio = !state.compressible
    ? null
    : downstreamTap
      ? staticPressurePa / (staticPressurePa + differentialPressurePa)
      : (staticPressurePa - differentialPressurePa) / staticPressurePa;
  warnings.push(
    ...operatingPointWarnings(element.limits, element.beta, element.pipeDiameterM, flow.reynoldsNumber, pressureRatio),
  );
  const calibration = element.calibration;
  if (
    calibration &&
    (flow.reynoldsNumber < calibration.minimumReynoldsNumber || flow.reynoldsNumber > calibration.maximumReynoldsNumber)
  ) {
    warnings.push({
      code: 'flow.calibrationExtrapolated',
      message: `Re_D = ${formatNumber(flow.reynoldsNumber)} is outside the calibrated range ${formatNumber(calibration.minimumReynoldsNumber)} to ${formatNumber(calibration.maximumReynoldsNumber)}; C is held at the end value ${formatNumber(flow.dischargeCoefficient)}`,
    });
  }
  return {
    beta: element.beta,
    dischargeCoefficient: flow.dischargeCoefficient,
    expansibility: flow.expansibility,
    reynoldsNumber: flow.reynoldsNumber,
    densityKgPerM3: state.densityKgPerM3,
    compressibility: state.compressibility,
    baseDensityKgPerM3: state.baseDensityKgPerM3,
    massFlowKgPerS: flow.massFlowKgPerS,
    volumeFlowM3PerS: flow.massFlowKgPerS / state.densityKgPerM3,
    standardVolumeFlowM3PerS:
      state.baseDensityKgPerM3 && state.baseDensityKgPerM3 > 0 ? flow.massFlowKgPerS / state.baseDensityKgPerM3 : null,
    pressureLossPa: pressureLossPa(element.kind, element.beta, flow.dischargeCoefficient, differentialPressurePa),
    warnings,
  };
}
