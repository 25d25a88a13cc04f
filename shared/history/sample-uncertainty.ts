/**
 * Expanded (k = 2) uncertainty of one sample's flow rate, ISO 5167-1:2003 §8 (TRADE.md §6),
 * from shared/uncertainty: C and ε from the element's part of ISO 5167, the DP transmitter's
 * accuracy (percent of span, taken as an expanded uncertainty) turned into percent of the
 * reading at the actual DP, and fixed allowances for the diameters and the density model.
 * Not included, because the hour's inputs do not carry them: the static pressure and
 * temperature transmitters' own uncertainties (which add to the density's). A laboratory curve
 * with a certificate's stated U(C) (element.calibrationUncertaintyPercent) replaces the default U(C).
 */
import type { ElementSpec } from '../flow/flow-types';
import type { PreparedElement } from '../flow/prepare-element';
import type { FluidSpec } from '../fluids';
import {
  dischargeCoefficientUncertaintyPercent,
  expansibilityUncertaintyPercent,
  flowRateUncertainty,
  readingUncertaintyPercent,
} from '../uncertainty';

/** U(D)/D, percent: a measured pipe bore as ISO 5167 practice allows [mem]. */
export const PIPE_DIAMETER_UNCERTAINTY_PERCENT = 0.4;
/** U(d)/d, percent: a measured orifice bore or cone diameter [mem]. */
export const ELEMENT_DIAMETER_UNCERTAINTY_PERCENT = 0.07;

/**
 * U(ρ)/ρ of the equation of state alone, percent, by fluid kind:
 * AGA 8 DETAIL 0.1 % in its normal range (AGA Report No. 8 Part 1 [mem]); IAPWS-IF97 0.05 %
 * (its consistency with IAPWS-95 and IAPWS-95's own uncertainty in steam [mem]); an ideal gas
 * with a stated Z, 1 % and a liquid density line, 0.5 % (allowances chosen here, no standard).
 */
export const DENSITY_MODEL_UNCERTAINTY_PERCENT: Readonly<Record<FluidSpec['kind'], number>> = Object.freeze({
  'natural-gas': 0.1,
  water: 0.05,
  steam: 0.05,
  'ideal-gas': 1,
  liquid: 0.5,
});

export interface SampleUncertaintyInput {
  element: PreparedElement;
  spec: ElementSpec;
  fluidKind: FluidSpec['kind'];
  reynoldsNumber: number;
  differentialPressurePa: number;
  staticPressurePa: number;
  isentropicExponent: number;
  compressible: boolean;
  /** The active DP transmitter's accuracy, percent of span, and its span, Pa. */
  accuracyPercentOfSpan: number;
  spanPa: number;
}

/**
 * @param input element, operating point and the active transmitter
 * @returns U(qm)/qm, expanded (k = 2), percent
 */
export function sampleUncertaintyPercent(input: SampleUncertaintyInput): number {
  const { element, spec } = input;
  const dischargeCoefficientPercent = dischargeCoefficientUncertaintyPercent({
    kind: element.kind,
    beta: element.beta,
    pipeDiameterM: element.pipeDiameterM,
    reynoldsNumber: input.reynoldsNumber,
    venturiType: spec.venturiType,
    nozzleType: spec.nozzleType,
    calibrated: element.calibration !== null,
    certificateUncertaintyPercent: element.calibration !== null ? spec.calibrationUncertaintyPercent : undefined,
  });
  const expansibilityPercent = expansibilityUncertaintyPercent(
    element.kind,
    element.beta,
    input.differentialPressurePa,
    input.staticPressurePa,
    input.isentropicExponent,
    input.compressible,
  );
  return flowRateUncertainty({
    kind: element.kind,
    beta: element.beta,
    dischargeCoefficientPercent,
    expansibilityPercent,
    pipeDiameterPercent: PIPE_DIAMETER_UNCERTAINTY_PERCENT,
    elementDiameterPercent: ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
    differentialPressurePercent: readingUncertaintyPercent(
      input.accuracyPercentOfSpan,
      input.spanPa,
      input.differentialPressurePa,
    ),
    densityPercent: DENSITY_MODEL_UNCERTAINTY_PERCENT[input.fluidKind],
  }).expandedPercent;
}
