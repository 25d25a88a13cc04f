/**
 * Default uncertainties of C and ε from the parts of ISO 5167, as relative EXPANDED
 * uncertainties in percent (about 95 %, k = 2, as ISO 5167-1:2003 §8 states them [mem]).
 */
import type { ElementKind, NozzleType, VenturiType } from '../flow/flow-types';

export interface DischargeCoefficientUncertaintyInput {
  kind: ElementKind;
  beta: number;
  pipeDiameterM: number;
  reynoldsNumber: number;
  venturiType?: VenturiType;
  nozzleType?: NozzleType;
  /** true when C comes from a laboratory calibration (cone meters). */
  calibrated?: boolean;
  /**
   * The calibration certificate's stated U(C)/C, percent (k = 2): when C comes from a laboratory
   * curve, this is its uncertainty whatever the element kind, rather than the standard's default.
   */
  certificateUncertaintyPercent?: number;
}

/**
 * U(C)/C in percent.
 * - Orifice, ISO 5167-2:2003 §5.3.3.1 [std]: (0.7 − β) % for 0.1 ≤ β < 0.2; 0.5 % for
 *   0.2 ≤ β ≤ 0.6; (1.667β − 0.5) % for 0.6 < β ≤ 0.75; plus 0.9(0.75 − β)(2.8 − D/25.4) % when
 *   D < 71.12 mm, plus 0.5 % when β > 0.5 and Re_D < 10 000 (added arithmetically).
 * - Venturi, ISO 5167-4:2003 §5.5 [mem]: as-cast 0.7 %, machined 1 %, rough-welded 1.5 %.
 * - ISA 1932 nozzle, ISO 5167-3:2003 §5.1.6.3 [mem]: 0.8 % for β ≤ 0.6, (2β − 0.4) % above;
 *   long-radius nozzle §5.2.6.3 [mem]: 2 %.
 * - Cone, ISO 5167-5:2016: uncalibrated 5 % (TRADE.md §2 [mem]); calibrated 0.5 % [mem], a
 *   typical laboratory figure: use the calibration certificate's value when there is one.
 * - Any element with a laboratory curve and a certificate: the certificate's stated U(C)/C
 *   (the curve replaces the standard's equation, so the standard's figure no longer applies;
 *   ISO 5167-1:2003 §8 combines whatever U(C) the source of C states [mem]).
 * @param input element kind, β, D, Re_D and subtype
 * @returns U(C)/C in percent
 */
export function dischargeCoefficientUncertaintyPercent(input: DischargeCoefficientUncertaintyInput): number {
  const { kind, beta } = input;
  if (input.calibrated && input.certificateUncertaintyPercent !== undefined) {
    if (!(input.certificateUncertaintyPercent > 0))
      throw new Error(
        `dischargeCoefficientUncertaintyPercent: element.calibrationUncertaintyPercent must be > 0 (got ${input.certificateUncertaintyPercent})`,
      );
    return input.certificateUncertaintyPercent;
  }
  switch (kind) {
    case 'orifice': {
      let u = beta < 0.2 ? 0.7 - beta : beta <= 0.6 ? 0.5 : 1.667 * beta - 0.5;
      const dInches = input.pipeDiameterM / 0.0254;
      if (dInches < 2.8) u += 0.9 * (0.75 - beta) * (2.8 - dInches);
      if (beta > 0.5 && input.reynoldsNumber < 10000) u += 0.5;
      return u;
    }
    case 'venturi':
      return input.venturiType === 'machined' ? 1.0 : input.venturiType === 'rough-welded' ? 1.5 : 0.7;
    case 'nozzle':
      if (input.nozzleType === 'long-radius') return 2.0;
      return beta <= 0.6 ? 0.8 : 2 * beta - 0.4;
    case 'cone':
      return input.calibrated ? 0.5 : 5.0;
    default:
      throw new Error(
        `dischargeCoefficientUncertaintyPercent: element.kind must be orifice, venturi, nozzle or cone (got ${String(kind)})`,
      );
  }
}

/**
 * U(ε)/ε in percent (0 for an incompressible fluid, where ε = 1 exactly).
 * - Orifice, ISO 5167-2:2003 §5.3.3.2 [std]: 3.5 Δp/(κ p1) %.
 * - Venturi and nozzles, ISO 5167-4 §5.7 / ISO 5167-3 [mem]: (4 + 100β⁸) Δp/p1 %.
 * - Cone, ISO 5167-5:2016 [mem]: 4 Δp/(κ p1) %.
 * @param kind element kind
 * @param beta β
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa p1 absolute, Pa
 * @param isentropicExponent κ
 * @param compressible false for a liquid
 * @returns U(ε)/ε in percent
 */
export function expansibilityUncertaintyPercent(
  kind: ElementKind,
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
  compressible = true,
): number {
  if (!compressible) return 0;
  if (!(staticPressurePa > 0))
    throw new Error(`expansibilityUncertaintyPercent: staticPressurePa must be > 0 (got ${staticPressurePa})`);
  const ratio = differentialPressurePa / staticPressurePa;
  if (kind === 'orifice') return (3.5 * ratio) / isentropicExponent;
  if (kind === 'cone') return (4 * ratio) / isentropicExponent;
  return (4 + 100 * Math.pow(beta, 8)) * ratio;
}
