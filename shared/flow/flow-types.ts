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
/** The orifice method: ISO 5167-2:2003, or API MPMS 14.3 / AGA Report No. 3 Part 1 (flange taps only). */
export type OrificeMethod = 'iso-5167-2' | 'api-14.3';
/** The static tap an API 14.3 expansion factor is referred to, as installed (Y1 upstream, Y2 downstream). */
export type ExpansionReference = 'upstream' | 'downstream';

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
  /** Orifice only; default iso-5167-2. */
  method?: OrificeMethod;
  /**
   * API 14.3 only; default upstream. With downstream, conditions.staticPressurePa is the absolute pressure
   * at the downstream tap (as installed), the fluid state is taken there and Y2 is used.
   */
  expansionReference?: ExpansionReference;
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
  /** Absolute, at the upstream tap (at the downstream tap for an API 14.3 orifice referred downstream). */
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
