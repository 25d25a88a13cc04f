/**
 * Expanded uncertainty of a flow rate from a DP meter, ISO 5167-1:2003 §8 / GUM (TRADE.md §6):
 * (U_qm/qm)² = (U_C/C)² + (U_ε/ε)² + (s_D U_D/D)² + (s_d U_d/d)² + ¼(U_Δp/Δp)² + ¼(U_ρ/ρ)²,
 * with every input a relative expanded uncertainty (k = 2) so the result is one too; the
 * inputs are taken as uncorrelated. For orifices, nozzles and venturis s_D = 2β⁴/(1 − β⁴) and
 * s_d = 2/(1 − β⁴); a cone meter's area is π/4 (D² − dc²), so its sensitivities differ
 * (see diameterSensitivities).
 */
import type { ElementKind } from '../flow/flow-types';

export interface FlowRateUncertaintyInput {
  kind: ElementKind;
  beta: number;
  /** All relative expanded uncertainties (k = 2), percent. */
  dischargeCoefficientPercent: number;
  expansibilityPercent: number;
  pipeDiameterPercent: number;
  /** Bore d (or cone diameter dc for a cone meter). */
  elementDiameterPercent: number;
  differentialPressurePercent: number;
  densityPercent: number;
}

export interface UncertaintyContribution {
  name: string;
  /** |∂ ln qm / ∂ ln x| */
  sensitivity: number;
  /** sensitivity × input, percent */
  percent: number;
}

export interface FlowRateUncertainty {
  /** U = 2 u_c, percent of the flow rate. */
  expandedPercent: number;
  /** u_c, percent. */
  standardPercent: number;
  coverageFactor: 2;
  contributions: UncertaintyContribution[];
}

/**
 * Sensitivities of ln qm to ln D and ln d (ln dc for a cone meter).
 * Orifice, nozzle, venturi: qm ∝ d²/sqrt(1 − β⁴), β = d/D → −2β⁴/(1−β⁴) and 2/(1−β⁴).
 * Cone: qm ∝ (D² − dc²)/sqrt(1 − β⁴), β² = 1 − dc²/D² →
 * ∂/∂ln D = 2/β² + 2β²/(1+β²), ∂/∂ln dc = −2(1−β²)/β² − 2β²/(1+β²) (derived here; checked in the test by a finite difference of the flow equation).
 * @param kind element kind
 * @param beta β
 * @returns { pipe, element } sensitivities (signed)
 */
export function diameterSensitivities(kind: ElementKind, beta: number): { pipe: number; element: number } {
  if (!(beta > 0 && beta < 1)) throw new Error(`diameterSensitivities: beta must be in (0, 1) (got ${beta})`);
  const b2 = beta * beta;
  const b4 = b2 * b2;
  if (kind === 'cone') {
    return { pipe: 2 / b2 + (2 * b2) / (1 + b2), element: (-2 * (1 - b2)) / b2 - (2 * b2) / (1 + b2) };
  }
  return { pipe: (-2 * b4) / (1 - b4), element: 2 / (1 - b4) };
}

/**
 * @param input element, β and the relative expanded uncertainties of the inputs, percent
 * @returns expanded (k = 2) and standard uncertainty of qm in percent, and each contribution
 */
export function flowRateUncertainty(input: FlowRateUncertaintyInput): FlowRateUncertainty {
  for (const key of [
    'dischargeCoefficientPercent',
    'expansibilityPercent',
    'pipeDiameterPercent',
    'elementDiameterPercent',
    'differentialPressurePercent',
    'densityPercent',
  ] as const) {
    if (!(input[key] >= 0 && Number.isFinite(input[key])))
      throw new Error(`flowRateUncertainty: ${key} must be a finite percentage ≥ 0 (got ${input[key]})`);
  }
  const s = diameterSensitivities(input.kind, input.beta);
  const contributions: UncertaintyContribution[] = [
    { name: 'dischargeCoefficient', sensitivity: 1, percent: input.dischargeCoefficientPercent },
    { name: 'expansibility', sensitivity: 1, percent: input.expansibilityPercent },
    { name: 'pipeDiameter', sensitivity: Math.abs(s.pipe), percent: Math.abs(s.pipe) * input.pipeDiameterPercent },
    {
      name: 'elementDiameter',
      sensitivity: Math.abs(s.element),
      percent: Math.abs(s.element) * input.elementDiameterPercent,
    },
    { name: 'differentialPressure', sensitivity: 0.5, percent: 0.5 * input.differentialPressurePercent },
    { name: 'density', sensitivity: 0.5, percent: 0.5 * input.densityPercent },
  ];
  const expandedPercent = Math.sqrt(contributions.reduce((sum, c) => sum + c.percent * c.percent, 0));
  return { expandedPercent, standardPercent: expandedPercent / 2, coverageFactor: 2, contributions };
}
