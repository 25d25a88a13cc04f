/**
 * The flow equation inverted: the DP a prepared element develops at a given mass flow. Re_D
 * follows from qm directly (Re_D = 4qm/(πμD)), so C needs no iteration; ε depends on Δp, so
 * Δp = (qm/(C ε A))²/(2ρ) is iterated from ε = 1 (a contraction: ε changes slowly with Δp).
 */
import { elementExpansibility, type FlowEvaluation, type FlowFluidProperties } from './evaluate-flow';
import { pipeReynoldsNumber } from './mass-flow-equation';
import type { PreparedElement } from './prepare-element';

export interface DifferentialPressureSolution extends FlowEvaluation {
  differentialPressurePa: number;
}

/**
 * @param element prepared element
 * @param massFlowKgPerS qm, kg/s (0 gives Δp = 0)
 * @param staticPressurePa upstream absolute pressure p1, Pa
 * @param fluid fluid properties at p1, T
 * @returns Δp and the C, ε, Re_D at that flow
 */
export function differentialPressureForMassFlow(
  element: PreparedElement,
  massFlowKgPerS: number,
  staticPressurePa: number,
  fluid: FlowFluidProperties,
): DifferentialPressureSolution {
  if (!(massFlowKgPerS >= 0 && Number.isFinite(massFlowKgPerS))) {
    throw new Error(`differentialPressureForMassFlow: massFlowKgPerS must be finite and ≥ 0 (got ${massFlowKgPerS})`);
  }
  if (massFlowKgPerS === 0) {
    return {
      differentialPressurePa: 0,
      massFlowKgPerS: 0,
      reynoldsNumber: 0,
      expansibility: 1,
      dischargeCoefficient: element.fixedDischargeCoefficient ?? NaN,
    };
  }
  const reynoldsNumber = pipeReynoldsNumber(massFlowKgPerS, fluid.viscosityPaS, element.pipeDiameterM);
  const dischargeCoefficient = element.dischargeCoefficientAt
    ? element.dischargeCoefficientAt(reynoldsNumber)
    : (element.fixedDischargeCoefficient as number);
  const incompressibleDp =
    (massFlowKgPerS / (dischargeCoefficient * element.flowAreaM2)) ** 2 / (2 * fluid.densityKgPerM3);
  let dp = incompressibleDp;
  for (let i = 0; i < 200; i++) {
    if (!(dp < staticPressurePa)) {
      throw new Error(
        `differentialPressureForMassFlow: massFlowKgPerS ${massFlowKgPerS} would need a DP of at least ${dp} Pa, not below the static pressure ${staticPressurePa} Pa`,
      );
    }
    const expansibility = elementExpansibility(element, dp, staticPressurePa, fluid);
    const next = incompressibleDp / (expansibility * expansibility);
    if (Math.abs(next - dp) <= 1e-13 * next) {
      dp = next;
      break;
    }
    dp = next;
  }
  return {
    differentialPressurePa: dp,
    massFlowKgPerS,
    reynoldsNumber,
    dischargeCoefficient,
    expansibility: elementExpansibility(element, dp, staticPressurePa, fluid),
  };
}
