/**
 * The rates at one operating point (one DP sample with its P and T): the flow engine's fast
 * path (prepared element, fluid state, C iterated on Re_D per ISO 5167-1 Annex C), plus what an
 * hourly record needs beside the mass rate: volumes, energy, the flow extension for the
 * integral value, the expanded uncertainty, and whether a limit of ISO 5167 is broken.
 */
import { apiDownstreamCompressibilityRatio } from '../flow/api-14-3-compressibility-ratio';
import { operatingPointWarnings } from '../flow/element-limits';
import { evaluateFlow } from '../flow/evaluate-flow';
import { waterStatePT } from '../fluids';
import type { PreparedConfigVersion } from './prepared-config-version';
import type { AccuracyKind, UncertaintyContribution } from '../uncertainty';
import { sampleUncertaintyBreakdown, type PointTransmitter } from './sample-uncertainty';

export interface OperatingPoint {
  massFlowKgPerS: number;
  volumeFlowM3PerS: number;
  standardVolumeFlowM3PerS: number;
  /** Energy rate, W; null when the fluid has no energy basis. */
  energyFlowW: number | null;
  /** √(Δp ρ₁), the flow extension whose time mean over flow time is the integral value. */
  flowExtension: number;
  /** Expanded (k = 2) uncertainty of the mass rate, percent. */
  uncertaintyPercent: number;
  /** Its budget: each term's share (sensitivity × input, percent) and where the input comes from. */
  uncertaintyContributions: UncertaintyContribution[];
  /** A warning whose code starts with 'iso5167.' (geometry, Re_D, p2/p1) applies. */
  outsideStandardLimits: boolean;
  /**
   * Re_D lies outside the laboratory curve's points (C is held at the end value there): the
   * calibration does not vouch for this point. false without a curve.
   */
  outsideCalibrationRange: boolean;
}

/** The DP transmitter that supplied the reading. */
export interface ActiveTransmitter {
  accuracyPercentOfSpan: number;
  spanPa: number;
  accuracyKind?: AccuracyKind;
  /** The P and T transmitters, when the hour's inputs carry them. */
  staticPressureTransmitter?: PointTransmitter;
  temperatureTransmitter?: PointTransmitter;
}

const ISO_5167_CODE = 'iso5167.';

/**
 * @param version prepared configuration version
 * @param differentialPressurePa Δp of the active transmitter, Pa (> 0: the caller applies the no-flow cutoff)
 * @param staticPressurePa upstream absolute pressure, Pa
 * @param temperatureK flowing temperature, K
 * @param transmitter accuracy and span of the active DP transmitter
 * @returns the rates and flags of the operating point
 * @throws Error from the engine when the fluid state cannot be computed (caller: missing time)
 */
export function evaluateOperatingPoint(
  version: PreparedConfigVersion,
  differentialPressurePa: number,
  staticPressurePa: number,
  temperatureK: number,
  transmitter: ActiveTransmitter,
): OperatingPoint {
  if (!(staticPressurePa > differentialPressurePa)) {
    throw new Error(
      `evaluateOperatingPoint: staticPressurePa (${staticPressurePa} Pa absolute) must exceed differentialPressurePa (${differentialPressurePa} Pa)`,
    );
  }
  const element = version.elementAt(temperatureK);
  const state = version.fluidAt(staticPressurePa, temperatureK);
  const fluid =
    element.expansibilityModel === 'api-14.3-downstream' && state.compressible
      ? {
          ...state,
          downstreamCompressibilityRatio: apiDownstreamCompressibilityRatio(
            version.fluid,
            staticPressurePa,
            differentialPressurePa,
            temperatureK,
          ),
        }
      : state;
  const flow = evaluateFlow(element, differentialPressurePa, staticPressurePa, fluid);
  const massFlowKgPerS = flow.massFlowKgPerS;
  const baseDensity = version.baseDensityKgPerM3;

  let outsideStandardLimits =
    element.warnings.some((w) => w.code.startsWith(ISO_5167_CODE)) ||
    fluid.warnings.some((w) => w.code.startsWith(ISO_5167_CODE));
  if (!outsideStandardLimits) {
    const pressureRatio = fluid.compressible ? (staticPressurePa - differentialPressurePa) / staticPressurePa : null;
    const pointWarnings = operatingPointWarnings(
      element.limits,
      element.beta,
      element.pipeDiameterM,
      flow.reynoldsNumber,
      pressureRatio,
    );
    outsideStandardLimits = pointWarnings.some((w) => w.code.startsWith(ISO_5167_CODE));
  }

  const calibration = element.calibration;
  const outsideCalibrationRange =
    calibration !== null &&
    (flow.reynoldsNumber < calibration.minimumReynoldsNumber ||
      flow.reynoldsNumber > calibration.maximumReynoldsNumber);

  const standardVolumeFlowM3PerS = baseDensity !== null && baseDensity > 0 ? massFlowKgPerS / baseDensity : 0;
  let energyFlowW: number | null = null;
  if (version.energy.kind === 'standard-volume') {
    energyFlowW = standardVolumeFlowM3PerS * version.energy.superiorJPerM3;
  } else if (version.energy.kind === 'steam-enthalpy') {
    const enthalpy = waterStatePT(staticPressurePa, temperatureK).specificEnthalpyJPerKg;
    energyFlowW = massFlowKgPerS * (enthalpy - version.energy.referenceEnthalpyJPerKg);
  }

  return {
    massFlowKgPerS,
    volumeFlowM3PerS: massFlowKgPerS / fluid.densityKgPerM3,
    standardVolumeFlowM3PerS,
    energyFlowW,
    flowExtension: Math.sqrt(differentialPressurePa * fluid.densityKgPerM3),
    ...budgetFields(
      sampleUncertaintyBreakdown({
        element,
        spec: version.element,
        fluidKind: version.fluid.kind,
        reynoldsNumber: flow.reynoldsNumber,
        differentialPressurePa,
        staticPressurePa,
        isentropicExponent: fluid.isentropicExponent,
        compressible: fluid.compressible,
        accuracyPercentOfSpan: transmitter.accuracyPercentOfSpan,
        spanPa: transmitter.spanPa,
        accuracyKind: transmitter.accuracyKind,
        staticPressureTransmitter: transmitter.staticPressureTransmitter,
        temperatureTransmitter: transmitter.temperatureTransmitter,
        temperatureK,
      }),
    ),
    outsideStandardLimits,
    outsideCalibrationRange,
  };
}

function budgetFields(budget: ReturnType<typeof sampleUncertaintyBreakdown>) {
  return { uncertaintyPercent: budget.expandedPercent, uncertaintyContributions: budget.contributions };
}
