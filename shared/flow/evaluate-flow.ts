/**
 * The historian's fast path: a prepared element plus a known fluid state gives C, ε, Re_D and
 * qm. No allocation beyond the result object, no warnings (see operatingPointWarnings).
 */
import { apiExpansionFactorDownstream, apiExpansionFactorUpstream } from './api-14-3-orifice';
import { coneExpansibility, isentropicExpansibility, orificeExpansibility } from './expansibility';
import type { PreparedElement } from './prepare-element';
import { solveReynoldsNumber } from './reynolds-iteration';

/** The fluid properties the flow equation needs at the upstream tap. */
export interface FlowFluidProperties {
  densityKgPerM3: number;
  viscosityPaS: number;
  isentropicExponent: number;
  /** false for liquids: ε = 1 (TRADE.md §1). */
  compressible: boolean;
  /**
   * API 14.3 referred to the downstream tap: Z_f2/Z_f1 at this Δp (api-14-3-compressibility-ratio.ts),
   * computed by the caller, which knows the fluid; 1 when not given.
   */
  downstreamCompressibilityRatio?: number;
}

export interface FlowEvaluation {
  massFlowKgPerS: number;
  dischargeCoefficient: number;
  expansibility: number;
  reynoldsNumber: number;
}

/**
 * ε for an element at an operating point (1 for an incompressible fluid).
 * @param element prepared element
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa p1 absolute, Pa
 * @param fluid fluid properties
 * @returns ε
 */
export function elementExpansibility(
  element: PreparedElement,
  differentialPressurePa: number,
  staticPressurePa: number,
  fluid: FlowFluidProperties,
): number {
  if (!fluid.compressible) return 1;
  switch (element.expansibilityModel) {
    case 'orifice':
      return orificeExpansibility(element.beta, differentialPressurePa, staticPressurePa, fluid.isentropicExponent);
    case 'api-14.3-upstream':
      return apiExpansionFactorUpstream(
        element.beta,
        differentialPressurePa,
        staticPressurePa,
        fluid.isentropicExponent,
      );
    case 'api-14.3-downstream':
      // staticPressurePa is the downstream tap's; Z_f2/Z_f1 comes with the fluid (the caller knows the fluid).
      return apiExpansionFactorDownstream(
        element.beta,
        differentialPressurePa,
        staticPressurePa,
        fluid.isentropicExponent,
        fluid.downstreamCompressibilityRatio ?? 1,
      );
    case 'cone':
      return coneExpansibility(element.beta, differentialPressurePa, staticPressurePa, fluid.isentropicExponent);
    default:
      return isentropicExpansibility(element.beta, differentialPressurePa, staticPressurePa, fluid.isentropicExponent);
  }
}

/**
 * Mass flow through a prepared element (ISO 5167-1 eq. 1, C iterated on Re_D per Annex C).
 * Δp ≤ 0 is no flow: qm = 0, Re_D = 0, and C is the fixed C or NaN (undefined at zero flow).
 * @param element prepared element (diameters at flowing temperature)
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa upstream absolute pressure p1, Pa
 * @param fluid density, viscosity, κ and compressibility at p1, T
 * @returns qm, C, ε, Re_D
 */
export function evaluateFlow(
  element: PreparedElement,
  differentialPressurePa: number,
  staticPressurePa: number,
  fluid: FlowFluidProperties,
): FlowEvaluation {
  if (!(differentialPressurePa > 0)) {
    return {
      massFlowKgPerS: 0,
      dischargeCoefficient: element.fixedDischargeCoefficient ?? NaN,
      expansibility: 1,
      reynoldsNumber: 0,
    };
  }
  const expansibility = elementExpansibility(element, differentialPressurePa, staticPressurePa, fluid);
  // qm per unit C: ε (π/4) d² sqrt(2Δpρ)/sqrt(1 − β⁴).
  const massFlowPerC =
    expansibility * element.flowAreaM2 * Math.sqrt(2 * differentialPressurePa * fluid.densityKgPerM3);
  // Re_D per unit C: A1 of ISO 5167-1 Annex C = 4 qm/(C π μ D).
  const invariantA1 = (4 * massFlowPerC) / (Math.PI * fluid.viscosityPaS * element.pipeDiameterM);
  let dischargeCoefficient: number;
  let reynoldsNumber: number;
  if (element.dischargeCoefficientAt === null) {
    dischargeCoefficient = element.fixedDischargeCoefficient as number;
    reynoldsNumber = dischargeCoefficient * invariantA1;
  } else {
    const solution = solveReynoldsNumber(
      invariantA1,
      element.dischargeCoefficientAt,
      element.startDischargeCoefficient,
    );
    dischargeCoefficient = solution.dischargeCoefficient;
    reynoldsNumber = solution.reynoldsNumber;
  }
  return { massFlowKgPerS: dischargeCoefficient * massFlowPerC, dischargeCoefficient, expansibility, reynoldsNumber };
}
