/**
 * Expanded uncertainty of a flow rate from a DP meter, ISO 5167-1:2003 §8 / GUM (TRADE.md §6):
 * (U_qm/qm)² = (U_C/C)² + (U_ε/ε)² + (s_D U_D/D)² + (s_d U_d/d)² + ¼(U_Δp/Δp)² + ¼(U_ρ/ρ)²
 *   [+ ¼(∂lnρ/∂lnp · U_p/p)² + ¼(∂lnρ/∂lnT · U_T/T)² when the P and T transmitters are given: they
 *   reach qm through ρ, so ½ is ISO 5167-1:2003 §8's sensitivity of qm to ρ [mem]],
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
  /** U(ρ)/ρ of the equation of state (or density line) alone, percent. */
  densityPercent: number;
  /**
   * The static pressure and temperature transmitters' relative expanded uncertainties, percent of
   * the reading (absolute pressure, kelvin), and the sensitivities of ln ρ to ln p and ln T. They
   * reach qm through the density with ISO 5167-1:2003 §8's sensitivity ½ [mem]. Left out (no
   * contribution listed) when not given, as before.
   */
  staticPressurePercent?: number;
  temperaturePercent?: number;
  densityPressureSensitivity?: number;
  densityTemperatureSensitivity?: number;
  /** Where each input comes from, by contribution name (overrides DEFAULT_UNCERTAINTY_SOURCES). */
  sources?: Partial<Record<string, string>>;
}

/**
 * Where each term's input comes from when the caller says nothing more precise. [mem] marks a
 * clause quoted from memory, not checked against the printed standard in this repository.
 */
export const DEFAULT_UNCERTAINTY_SOURCES: Readonly<Record<string, string>> = Object.freeze({
  dischargeCoefficient: "ISO 5167-1:2003 §8; U(C) from the element's part of ISO 5167",
  expansibility: "ISO 5167-1:2003 §8; U(ε) from the element's part of ISO 5167",
  pipeDiameter: 'allowance for a measured pipe bore, ISO 5167-1:2003 §8 practice [mem]',
  elementDiameter: 'allowance for a measured bore or cone diameter, ISO 5167-1:2003 §8 practice [mem]',
  differentialPressure: 'DP transmitter accuracy as % of reading (percent of span × span / reading)',
  density: 'equation of state or density line alone, allowance by fluid kind',
  staticPressure:
    'static pressure transmitter accuracy as % of reading, through ρ (ISO 5167-1:2003 §8, sensitivity ½ × ∂lnρ/∂lnp)',
  temperature:
    'temperature transmitter accuracy as % of the kelvin reading, through ρ (ISO 5167-1:2003 §8, sensitivity ½ × |∂lnρ/∂lnT|)',
});

export interface UncertaintyContribution {
  name: string;
  /** |∂ ln qm / ∂ ln x| */
  sensitivity: number;
  /** sensitivity × input, percent */
  percent: number;
  /** Where the input comes from (clause of ISO 5167 or the GUM, a certificate, an allowance). */
  source: string;
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
  const term = (name: string, sensitivity: number, inputPercent: number): UncertaintyContribution => ({
    name,
    sensitivity,
    percent: sensitivity * inputPercent,
    source: input.sources?.[name] ?? DEFAULT_UNCERTAINTY_SOURCES[name],
  });
  const contributions: UncertaintyContribution[] = [
    term('dischargeCoefficient', 1, input.dischargeCoefficientPercent),
    term('expansibility', 1, input.expansibilityPercent),
    term('pipeDiameter', Math.abs(s.pipe), input.pipeDiameterPercent),
    term('elementDiameter', Math.abs(s.element), input.elementDiameterPercent),
    term('differentialPressure', 0.5, input.differentialPressurePercent),
    term('density', 0.5, input.densityPercent),
  ];
  for (const [name, percent, densitySensitivity] of [
    ['staticPressure', input.staticPressurePercent, input.densityPressureSensitivity ?? 1],
    ['temperature', input.temperaturePercent, input.densityTemperatureSensitivity ?? 1],
  ] as const) {
    if (percent === undefined) continue;
    if (!(percent >= 0 && Number.isFinite(percent)))
      throw new Error(`flowRateUncertainty: ${name}Percent must be a finite percentage ≥ 0 (got ${percent})`);
    contributions.push(term(name, 0.5 * Math.abs(densitySensitivity), percent));
  }
  const expandedPercent = Math.sqrt(contributions.reduce((sum, c) => sum + c.percent * c.percent, 0));
  return { expandedPercent, standardPercent: expandedPercent / 2, coverageFactor: 2, contributions };
}
