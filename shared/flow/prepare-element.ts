/**
 * Prepares a primary element at a flowing temperature for repeated evaluation: diameters
 * corrected for thermal expansion, β, the C function and the limits, computed once.
 */
import {
  prepareCalibration,
  UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT,
  type PreparedCalibration,
} from './cone-discharge-coefficient';
import { elementLimits, formatNumber, geometryWarnings, type ElementLimits } from './element-limits';
import type { ElementKind, ElementSpec, FlowWarning } from './flow-types';
import { prepareNozzleDischargeCoefficient } from './nozzle-discharge-coefficient';
import { prepareApiOrificeDischargeCoefficient } from './api-14-3-orifice';
import { prepareOrificeDischargeCoefficient } from './orifice-discharge-coefficient';
import { DEFAULT_REFERENCE_TEMPERATURE_K, diameterAtTemperatureM, expansionPerK } from './thermal-expansion';
import { venturiDischargeCoefficient } from './venturi-discharge-coefficient';

/** Which expansibility equation an element uses. */
export type ExpansibilityModel = 'orifice' | 'isentropic' | 'cone' | 'api-14.3-upstream' | 'api-14.3-downstream';

/** A temperature difference from the reference above which uncorrected diameters get a warning. */
const UNCORRECTED_TEMPERATURE_SPAN_K = 10;

export interface PreparedElement {
  kind: ElementKind;
  /** Flowing temperature the diameters are corrected to, K. */
  temperatureK: number;
  beta: number;
  pipeDiameterM: number;
  /** d, or βD for a cone meter, at flowing temperature, m. */
  boreDiameterM: number;
  /** C when it does not depend on Re_D, else null. */
  fixedDischargeCoefficient: number | null;
  /** C(Re_D) when it does, else null. */
  dischargeCoefficientAt: ((reynoldsNumber: number) => number) | null;
  /** First guess of C for the Re_D iteration. */
  startDischargeCoefficient: number;
  calibration: PreparedCalibration | null;
  expansibilityModel: ExpansibilityModel;
  limits: ElementLimits;
  /** (π/4) d² / sqrt(1 − β⁴), m²: the geometric factor of ISO 5167-1 eq. (1). */
  flowAreaM2: number;
  /** Warnings that depend only on the geometry (β, D, d, thermal correction, uncalibrated cone). */
  warnings: FlowWarning[];
}

/**
 * @param element element specification, diameters at its reference temperature
 * @param temperatureK flowing temperature, K
 * @returns the prepared element
 */
export function prepareElement(element: ElementSpec, temperatureK: number): PreparedElement {
  if (!(temperatureK > 0)) throw new Error(`prepareElement: conditions.temperatureK must be > 0 (got ${temperatureK})`);
  if (!(element.pipeDiameterM > 0))
    throw new Error(`prepareElement: element.pipeDiameterM must be > 0 (got ${element.pipeDiameterM})`);
  const warnings: FlowWarning[] = [];
  const referenceK = element.referenceTemperatureK ?? DEFAULT_REFERENCE_TEMPERATURE_K;
  const pipeAlpha = expansionPerK(element.pipeExpansionPerK, element.pipeMaterial, 'element.pipeExpansionPerK');
  const elementAlpha = expansionPerK(
    element.elementExpansionPerK,
    element.elementMaterial,
    'element.elementExpansionPerK',
  );
  if (
    (pipeAlpha === null || elementAlpha === null) &&
    Math.abs(temperatureK - referenceK) > UNCORRECTED_TEMPERATURE_SPAN_K
  ) {
    warnings.push({
      code: 'flow.thermalExpansionNotCorrected',
      message: `no expansion coefficient or material for the ${pipeAlpha === null ? 'pipe' : 'element'}: diameters are taken as measured at ${formatNumber(referenceK)} K although the fluid is at ${formatNumber(temperatureK)} K`,
    });
  }
  const pipeDiameterM = diameterAtTemperatureM(element.pipeDiameterM, pipeAlpha ?? 0, temperatureK, referenceK);

  let beta: number;
  let boreDiameterM: number;
  if (element.kind === 'cone') {
    if (!(
      element.coneDiameterM !== undefined &&
      element.coneDiameterM > 0 &&
      element.coneDiameterM < element.pipeDiameterM
    )) {
      throw new Error(
        `prepareElement: element.coneDiameterM must be > 0 and below element.pipeDiameterM (got ${element.coneDiameterM})`,
      );
    }
    const coneDiameterM = diameterAtTemperatureM(element.coneDiameterM, elementAlpha ?? 0, temperatureK, referenceK);
    // ISO 5167-5:2016 §3.3.1: β = sqrt(1 − dc²/D²); the equivalent bore d = βD goes into eq. (1).
    beta = Math.sqrt(1 - (coneDiameterM * coneDiameterM) / (pipeDiameterM * pipeDiameterM));
    boreDiameterM = beta * pipeDiameterM;
  } else {
    if (!(
      element.boreDiameterM !== undefined &&
      element.boreDiameterM > 0 &&
      element.boreDiameterM < element.pipeDiameterM
    )) {
      throw new Error(
        `prepareElement: element.boreDiameterM must be > 0 and below element.pipeDiameterM (got ${element.boreDiameterM})`,
      );
    }
    boreDiameterM = diameterAtTemperatureM(element.boreDiameterM, elementAlpha ?? 0, temperatureK, referenceK);
    beta = boreDiameterM / pipeDiameterM;
  }
  const limits = elementLimits(element);
  warnings.push(...geometryWarnings(limits, beta, pipeDiameterM, boreDiameterM));

  let fixedDischargeCoefficient: number | null = null;
  let dischargeCoefficientAt: ((re: number) => number) | null = null;
  let startDischargeCoefficient = 0.606; // ISO 5167-1 Annex C's first guess for an orifice
  let calibration: PreparedCalibration | null = null;
  if (element.dischargeCoefficient !== undefined) {
    if (!(element.dischargeCoefficient > 0 && element.dischargeCoefficient <= 1.2)) {
      throw new Error(
        `prepareElement: element.dischargeCoefficient must be in (0, 1.2] (got ${element.dischargeCoefficient})`,
      );
    }
    fixedDischargeCoefficient = element.dischargeCoefficient;
  } else if (element.calibration !== undefined) {
    calibration = prepareCalibration(element.calibration);
    dischargeCoefficientAt = calibration.dischargeCoefficientAt;
    startDischargeCoefficient = calibration.typicalDischargeCoefficient;
  } else if (element.kind === 'orifice' && element.method === 'api-14.3') {
    // API MPMS 14.3 Part 1 gives its equation for flange taps only.
    if (element.taps !== 'flange') {
      throw new Error(`prepareElement: element.taps must be flange for method api-14.3 (got ${String(element.taps)})`);
    }
    dischargeCoefficientAt = prepareApiOrificeDischargeCoefficient(beta, pipeDiameterM);
  } else if (element.kind === 'orifice') {
    dischargeCoefficientAt = prepareOrificeDischargeCoefficient(beta, pipeDiameterM, element.taps ?? missing('taps'));
  } else if (element.kind === 'nozzle') {
    dischargeCoefficientAt = prepareNozzleDischargeCoefficient(element.nozzleType ?? missing('nozzleType'), beta);
    startDischargeCoefficient = 0.98;
  } else if (element.kind === 'venturi') {
    fixedDischargeCoefficient = venturiDischargeCoefficient(element.venturiType ?? missing('venturiType'));
  } else {
    fixedDischargeCoefficient = UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT;
    warnings.push({
      code: 'flow.coneUncalibrated',
      message: `cone meter without a calibration: C = ${UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT}, uncertainty about 5 % (ISO 5167-5:2016 expects each cone meter to be calibrated)`,
    });
  }

  const beta4 = beta * beta * beta * beta;
  return {
    kind: element.kind,
    temperatureK,
    beta,
    pipeDiameterM,
    boreDiameterM,
    fixedDischargeCoefficient,
    dischargeCoefficientAt,
    startDischargeCoefficient,
    calibration,
    expansibilityModel: expansibilityModelOf(element),
    limits,
    flowAreaM2: ((Math.PI / 4) * boreDiameterM * boreDiameterM) / Math.sqrt(1 - beta4),
    warnings,
  };
}

function expansibilityModelOf(element: ElementSpec): ExpansibilityModel {
  if (element.kind === 'orifice' && element.method === 'api-14.3') {
    return element.expansionReference === 'downstream' ? 'api-14.3-downstream' : 'api-14.3-upstream';
  }
  return element.kind === 'orifice' ? 'orifice' : element.kind === 'cone' ? 'cone' : 'isentropic';
}

function missing(field: string): never {
  throw new Error(`prepareElement: element.${field} is required for this element kind`);
}
