/**
 * Types of the flow calculation case and result (DESIGN.md, "Interfaces that checks rely on").
 * The zod schema in shared/schemas/flow-case.ts validates JSON into these shapes.
 */
import type { FluidSpec } from '../fluids';

/** A warning: a limit of the standard that a case breaks, with a stable code and the numbers. */
export interface FlowWarning {
  code: string;
  message: string;
}

export type ElementKind = 'orifice' | 'venturi' | 'nozzle' | 'cone';
export type OrificeTaps = 'flange' | 'corner' | 'D-D/2';
export type VenturiType = 'as-cast' | 'machined' | 'rough-welded';
export type NozzleType = 'isa-1932' | 'long-radius';

/** One point of a cone meter's laboratory calibration: C measured at a pipe Reynolds number. */
export interface CalibrationPoint {
  reynoldsNumber: number;
  dischargeCoefficient: number;
}

/** Names accepted instead of a thermal expansion coefficient (see thermal-expansion.ts). */
export type MaterialName = 'stainless-304' | 'stainless-316' | 'carbon-steel' | 'uns-n04400' | 'uns-n10276';

/** The primary element of a meter run, diameters at the reference temperature. */
export interface ElementSpec {
  kind: ElementKind;
  taps?: OrificeTaps;
  venturiType?: VenturiType;
  nozzleType?: NozzleType;
  pipeDiameterM: number;
  boreDiameterM?: number;
  coneDiameterM?: number;
  referenceTemperatureK?: number;
  pipeExpansionPerK?: number;
  elementExpansionPerK?: number;
  pipeMaterial?: MaterialName;
  elementMaterial?: MaterialName;
  dischargeCoefficient?: number;
  calibration?: CalibrationPoint[];
  /**
   * The laboratory's stated expanded uncertainty of C (k = 2), percent, from the calibration
   * certificate of `calibration`; without it a typical laboratory figure is assumed.
   */
  calibrationUncertaintyPercent?: number;
  /** true when the fixed `dischargeCoefficient` comes from a calibration (U(C) = calibrationUncertaintyPercent). */
  dischargeCoefficientCalibrated?: boolean;
  /** The calibrating laboratory and certificate (reference text). */
  calibrationLaboratory?: string;
}

export interface FlowConditions {
  differentialPressurePa: number;
  /** Absolute, at the upstream tap. */
  staticPressurePa: number;
  temperatureK: number;
}

export interface BaseConditions {
  pressurePa: number;
  temperatureK: number;
}

export interface FlowCase {
  element: ElementSpec;
  fluid: FluidSpec;
  conditions: FlowConditions;
  base?: BaseConditions;
}

export interface FlowResult {
  beta: number;
  dischargeCoefficient: number;
  expansibility: number;
  reynoldsNumber: number;
  densityKgPerM3: number;
  compressibility: number | null;
  baseDensityKgPerM3: number | null;
  massFlowKgPerS: number;
  volumeFlowM3PerS: number;
  standardVolumeFlowM3PerS: number | null;
  /** Bonus output: permanent pressure loss (ISO 5167-2 §5.4, ISO 5167-5), Pa; null where the standard gives none. */
  pressureLossPa: number | null;
  warnings: FlowWarning[];
}
