/**
 * Expanded (k = 2) uncertainty of one sample's flow rate, ISO 5167-1:2003 §8 (TRADE.md §6),
 * from shared/uncertainty: C and ε from the element's part of ISO 5167, the DP transmitter's
 * accuracy turned into percent of the reading at the actual DP (its kind says whether the
 * datasheet figure is a k = 2 uncertainty or a rectangular ± limit, GUM §4.3.7), fixed allowances
 * for the diameters and the density model, and, when the hour's inputs carry them, the static
 * pressure and temperature transmitters through the density (sensitivity ½ × ∂lnρ/∂ln x).
 * A laboratory curve with a certificate's stated U(C) (element.calibrationUncertaintyPercent)
 * replaces the default U(C). Outside a calibrated CONE's Re_D range C is held at the curve's end
 * point; the rule chosen here widens U(C) by a rectangular term whose half-width is the difference
 * between that end-point C and the uncalibrated cone's C of ISO 5167-5 (0.82), relative to C:
 * U_extra = 2 |C_end − 0.82| / (√3 C_end) (GUM §4.3.7, k = 2), added in quadrature to the
 * certificate's U(C). Why: beyond its points the certificate vouches for nothing, and the only
 * other value the trade would use there is the uncalibrated one, so the spread between the two
 * bounds what we do not know. Other kinds with a curve are not widened yet (their correlation C
 * would be the comparison).
 */
import type { ElementSpec } from '../flow/flow-types';
import type { PreparedElement } from '../flow/prepare-element';
import type { FluidSpec } from '../fluids';
import { UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT } from '../flow/cone-discharge-coefficient';
import {
  ACCURACY_KIND_SOURCE,
  dischargeCoefficientUncertaintyPercent,
  expandedAccuracyPercent,
  expansibilityUncertaintyPercent,
  flowRateUncertainty,
  readingUncertaintyPercent,
  type AccuracyKind,
  type FlowRateUncertainty,
} from '../uncertainty';

/** U(D)/D, percent: a measured pipe bore, ISO 5167-1:2003 §8 / ISO 5167-2:2003 §6.4 practice [mem]. */
export const PIPE_DIAMETER_UNCERTAINTY_PERCENT = 0.4;
/** U(d)/d, percent: a measured orifice bore or cone diameter, ISO 5167-2:2003 §5.1.8.1 tolerance practice [mem]. */
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
  /** How the DP datasheet states its accuracy; 'expanded-k2' when not given (the behaviour before). */
  accuracyKind?: AccuracyKind;
  /** The static pressure transmitter (span in Pa) and temperature transmitter (span in K), when known. */
  staticPressureTransmitter?: PointTransmitter;
  temperatureTransmitter?: PointTransmitter;
  temperatureK?: number;
  /** ∂lnρ/∂lnT at the operating point (−1 for a gas when not given; 0 for a liquid: a gap, see header). */
  densityTemperatureSensitivity?: number;
  /** ∂lnρ/∂lnp (1 for a gas, 0 for a liquid when not given). */
  densityPressureSensitivity?: number;
}

/** A P or T transmitter's stated accuracy, percent of span, its span and the kind of the figure. */
export interface PointTransmitter {
  accuracyPercentOfSpan: number;
  span: number;
  accuracyKind: AccuracyKind;
}

/**
 * Rectangular widening of U(C) outside a calibrated cone's Re_D range (rule in the header).
 * @param heldC the curve's end-point C used at this Re_D
 * @returns the extra expanded (k = 2) U(C)/C, percent
 */
export function coneExtrapolationUncertaintyPercent(heldC: number): number {
  return (200 * Math.abs(heldC - UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT)) / (Math.sqrt(3) * heldC);
}

/**
 * U(C)/C of the element as configured, percent (k = 2): the certificate's stated U(C) when C comes
 * from a calibration (a laboratory curve, or a fixed C marked dischargeCoefficientCalibrated),
 * otherwise the default of the element's part of ISO 5167 (shared/uncertainty).
 * @param element the prepared element
 * @param spec its configuration
 * @param reynoldsNumber Re_D at the operating point
 * @returns U(C)/C, percent
 */
export function elementDischargeCoefficientUncertaintyPercent(
  element: PreparedElement,
  spec: ElementSpec,
  reynoldsNumber: number,
): number {
  const calibrated = element.calibration !== null || spec.dischargeCoefficientCalibrated === true;
  return dischargeCoefficientUncertaintyPercent({
    kind: element.kind,
    beta: element.beta,
    pipeDiameterM: element.pipeDiameterM,
    reynoldsNumber,
    venturiType: spec.venturiType,
    nozzleType: spec.nozzleType,
    calibrated,
    certificateUncertaintyPercent: calibrated ? spec.calibrationUncertaintyPercent : undefined,
  });
}

/**
 * @param input element, operating point and the active transmitter
 * @returns U(qm)/qm, expanded (k = 2), percent
 */
export function sampleUncertaintyPercent(input: SampleUncertaintyInput): number {
  return sampleUncertaintyBreakdown(input).expandedPercent;
}

/**
 * @param input element, operating point and the transmitters
 * @returns the budget: expanded (k = 2) U(qm)/qm and each term with its sensitivity and source
 */
export function sampleUncertaintyBreakdown(input: SampleUncertaintyInput): FlowRateUncertainty {
  const { element, spec } = input;
  const calibrated = element.calibration !== null || spec.dischargeCoefficientCalibrated === true;
  let dischargeCoefficientPercent = elementDischargeCoefficientUncertaintyPercent(element, spec, input.reynoldsNumber);
  let dischargeCoefficientSource = DISCHARGE_COEFFICIENT_SOURCES[element.kind];
  if (calibrated) {
    dischargeCoefficientSource =
      spec.calibrationUncertaintyPercent !== undefined
        ? 'calibration certificate U(C) (ISO 5167-1:2003 §8)'
        : 'typical laboratory U(C) of a calibrated cone, 0.5 % [mem]; no certificate figure given';
  }
  const curve = element.calibration;
  if (curve !== null) {
    const re = input.reynoldsNumber;
    if (element.kind === 'cone' && (re < curve.minimumReynoldsNumber || re > curve.maximumReynoldsNumber)) {
      const extra = coneExtrapolationUncertaintyPercent(curve.dischargeCoefficientAt(re));
      dischargeCoefficientPercent = Math.hypot(dischargeCoefficientPercent, extra);
      dischargeCoefficientSource +=
        '; calibration extrapolated: + rectangular |C_end − 0.82|/C, u = a/√3 (GUM §4.3.7), ISO 5167-5:2016 uncalibrated C';
    }
  }
  const expansibilityPercent = expansibilityUncertaintyPercent(
    element.kind,
    element.beta,
    input.differentialPressurePa,
    input.staticPressurePa,
    input.isentropicExponent,
    input.compressible,
  );
  const dpKind = input.accuracyKind ?? 'expanded-k2';
  const pointPercent = (t: PointTransmitter | undefined, reading: number | undefined) =>
    t === undefined || reading === undefined
      ? undefined
      : readingUncertaintyPercent(expandedAccuracyPercent(t.accuracyPercentOfSpan, t.accuracyKind), t.span, reading);
  const p = input.staticPressureTransmitter;
  const t = input.temperatureTransmitter;
  return flowRateUncertainty({
    kind: element.kind,
    beta: element.beta,
    dischargeCoefficientPercent,
    expansibilityPercent,
    pipeDiameterPercent: PIPE_DIAMETER_UNCERTAINTY_PERCENT,
    elementDiameterPercent: ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
    differentialPressurePercent: readingUncertaintyPercent(
      expandedAccuracyPercent(input.accuracyPercentOfSpan, dpKind),
      input.spanPa,
      input.differentialPressurePa,
    ),
    densityPercent: DENSITY_MODEL_UNCERTAINTY_PERCENT[input.fluidKind],
    staticPressurePercent: pointPercent(p, input.staticPressurePa),
    temperaturePercent: pointPercent(t, input.temperatureK),
    densityPressureSensitivity: input.densityPressureSensitivity ?? (input.compressible ? 1 : 0),
    densityTemperatureSensitivity: input.densityTemperatureSensitivity ?? (input.compressible ? -1 : 0),
    sources: {
      dischargeCoefficient: dischargeCoefficientSource,
      expansibility: input.compressible ? EXPANSIBILITY_SOURCES[element.kind] : 'ε = 1 for a liquid (no uncertainty)',
      differentialPressure: `DP transmitter: ${ACCURACY_KIND_SOURCE[dpKind]}, as % of reading`,
      density: DENSITY_SOURCES[input.fluidKind],
      ...(p
        ? {
            staticPressure: `static pressure transmitter: ${ACCURACY_KIND_SOURCE[p.accuracyKind]}; through ρ, ISO 5167-1:2003 §8 sensitivity ½ [mem]`,
          }
        : {}),
      ...(t
        ? {
            temperature: `temperature transmitter: ${ACCURACY_KIND_SOURCE[t.accuracyKind]}; through ρ, ISO 5167-1:2003 §8 sensitivity ½ [mem]`,
          }
        : {}),
    },
  });
}

const DISCHARGE_COEFFICIENT_SOURCES: Readonly<Record<string, string>> = {
  orifice: 'ISO 5167-2:2003 §5.3.3.1',
  venturi: 'ISO 5167-4:2003 §5.5 (as-cast 0.7 %, machined 1 %, rough-welded 1.5 %) [mem]',
  nozzle: 'ISO 5167-3:2003 §5.1.6.3 (ISA 1932) / §5.2.6.3 (long radius) [mem]',
  cone: 'ISO 5167-5:2016 uncalibrated cone, 5 % (TRADE.md §2) [mem]',
};
const EXPANSIBILITY_SOURCES: Readonly<Record<string, string>> = {
  orifice: 'ISO 5167-2:2003 §5.3.3.2, 3.5 Δp/(κ p1) %',
  venturi: 'ISO 5167-4:2003 §5.7, (4 + 100β⁸) Δp/p1 % [mem]',
  nozzle: 'ISO 5167-3:2003 §5.3.3, (4 + 100β⁸) Δp/p1 % [mem]',
  cone: 'ISO 5167-5:2016 §5.5, 4 Δp/(κ p1) % [mem]',
};
const DENSITY_SOURCES: Readonly<Record<FluidSpec['kind'], string>> = {
  'natural-gas': 'AGA Report No. 8 Part 1 DETAIL, 0.1 % in its normal range [mem]',
  water: 'IAPWS-IF97 against IAPWS-95, 0.05 % [mem]',
  steam: 'IAPWS-IF97 against IAPWS-95, 0.05 % [mem]',
  'ideal-gas': 'stated Z, allowance 1 % chosen here (no standard)',
  liquid: 'density line, allowance 0.5 % chosen here (no standard)',
};
