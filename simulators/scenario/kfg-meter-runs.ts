/**
 * The meter runs of Kestrel Flats Gathering (SCENARIO.md, invented): three wellheads and the
 * sales meter. Geometry from SCENARIO.md's β and line sizes; line conditions and flows are
 * invented and sized so each DP sits where the scenario wants it (see operating-point.ts and
 * the model tests): KFG-101 at the bottom of its high-range span, the others mid-span.
 */
import { toSI } from '../../shared/units';
import type { CalibrationPoint, ElementSpec } from '../../shared/flow/flow-types';
import type { FluidSpec } from '../../shared/fluids';
import { coneDiameterForBetaM, boreDiameterForBetaM } from './element-geometry';
import { PIPE_INSIDE_DIAMETER_M } from './pipe-inside-diameters';
import type { LoadProfile, ScenarioMeterRun, ScenarioTransmitter } from './scenario-types';

/** SCENARIO.md's gas, mole fractions (they add up to 1.0000). */
export const KFG_GAS: FluidSpec = {
  kind: 'natural-gas',
  composition: {
    methane: 0.9137,
    ethane: 0.0421,
    propane: 0.0112,
    isobutane: 0.0021,
    'n-butane': 0.0028,
    isopentane: 0.0008,
    'n-pentane': 0.0007,
    'n-hexane': 0.0006,
    nitrogen: 0.0148,
    'carbon-dioxide': 0.0112,
  },
};

/** Invented laboratory calibration of the first KFG-101 cone (β 0.55): C against Re_D. */
export const KFG_101_CALIBRATION_BETA_055: CalibrationPoint[] = [
  { reynoldsNumber: 1e5, dischargeCoefficient: 0.8012 },
  { reynoldsNumber: 2.5e5, dischargeCoefficient: 0.8047 },
  { reynoldsNumber: 5e5, dischargeCoefficient: 0.8068 },
  { reynoldsNumber: 1e6, dischargeCoefficient: 0.8081 },
  { reynoldsNumber: 2.5e6, dischargeCoefficient: 0.809 },
];

/** Invented certificate of the replacement cone (β 0.45) fitted on day 20. */
export const KFG_101_CALIBRATION_BETA_045: CalibrationPoint[] = [
  { reynoldsNumber: 1e5, dischargeCoefficient: 0.7968 },
  { reynoldsNumber: 2.5e5, dischargeCoefficient: 0.8003 },
  { reynoldsNumber: 5e5, dischargeCoefficient: 0.8021 },
  { reynoldsNumber: 1e6, dischargeCoefficient: 0.8032 },
  { reynoldsNumber: 2.5e6, dischargeCoefficient: 0.804 },
];

/** Pipes are carbon steel, elements stainless 316, diameters measured at 20 °C. */
const MATERIALS = {
  referenceTemperatureK: 293.15,
  pipeMaterial: 'carbon-steel',
  elementMaterial: 'stainless-316',
} as const;

const D_101 = PIPE_INSIDE_DIAMETER_M['NPS 2 sch 80'];
const D_102 = PIPE_INSIDE_DIAMETER_M['NPS 3 sch 80'];
const D_103 = PIPE_INSIDE_DIAMETER_M['NPS 4 sch 40'];
const D_201 = PIPE_INSIDE_DIAMETER_M['NPS 8 sch 40'];

export const KFG_101_CONE_BETA_055: ElementSpec = {
  kind: 'cone',
  pipeDiameterM: D_101,
  coneDiameterM: coneDiameterForBetaM(D_101, 0.55),
  ...MATERIALS,
  calibration: KFG_101_CALIBRATION_BETA_055,
};
export const KFG_101_CONE_BETA_045: ElementSpec = {
  kind: 'cone',
  pipeDiameterM: D_101,
  coneDiameterM: coneDiameterForBetaM(D_101, 0.45),
  ...MATERIALS,
  calibration: KFG_101_CALIBRATION_BETA_045,
};

/** The wells decline about 3 % a month (SCENARIO.md); gas demand downstream peaks in the evening. */
const WELL_LOAD: LoadProfile = { diurnalAmplitude: 0.07, peakHourLocal: 18, declinePerMonth: 0.03, noiseShare: 0.002 };

const psig = (value: number) => toSI(value, 'psi');
const degF = (value: number) => toSI(value, 'degF');
/** Mscf per day (at the site's base conditions) → m³/s. */
const mscfPerDay = (value: number) => toSI(value, 'Mscf') / 86_400;

const pressureTransmitter = (tag: string, upperPsig: number): ScenarioTransmitter => ({
  tag,
  measures: 'static-pressure',
  unit: 'psi',
  pressureReference: 'gauge',
  lowerRange: 0,
  upperRange: upperPsig,
  stackRole: 'single',
  accuracyPercentOfSpan: 0.075,
});
const temperatureTransmitter = (tag: string): ScenarioTransmitter => ({
  tag,
  measures: 'temperature',
  unit: 'degF',
  pressureReference: 'absolute',
  lowerRange: -20,
  upperRange: 150,
  stackRole: 'single',
  accuracyPercentOfSpan: 0.1,
});
const dpTransmitter = (
  tag: string,
  upperInH2O: number,
  stackRole: ScenarioTransmitter['stackRole'] = 'single',
): ScenarioTransmitter => ({
  tag,
  measures: 'differential-pressure',
  unit: 'inH2O-60F',
  pressureReference: 'absolute',
  lowerRange: 0,
  upperRange: upperInH2O,
  stackRole,
  accuracyPercentOfSpan: 0.075,
});

/** Sample timing of the gathering system: samples older than 3 min are not used, gaps over 5 min are missing time. */
const TIMING = { holdLimitS: 180, maxGapS: 300, stackSwitchUpShare: 0.9, stackSwitchDownShare: 0.8 };

export const KFG_METER_RUNS: ScenarioMeterRun[] = [
  {
    siteCode: 'KFG',
    tag: 'KFG-101',
    name: 'Pad 1 wellhead',
    ...TIMING,
    element: KFG_101_CONE_BETA_055,
    fluid: KFG_GAS,
    line: {
      insideDiameterM: D_101,
      nominalSize: 'NPS 2',
      schedule: '80',
      flangeClass: 'ASME Class 600',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 3,
      downstreamStraightLengthD: 3,
      installDate: '2024-05-14',
    },
    transmitters: [
      dpTransmitter('KFG-101-DPH', 250, 'high'),
      dpTransmitter('KFG-101-DPL', 25, 'low'),
      pressureTransmitter('KFG-101-PT', 1000),
      temperatureTransmitter('KFG-101-TT'),
    ],
    operating: {
      flow: { kind: 'standard-volume', m3PerS: mscfPerDay(1050) },
      load: WELL_LOAD,
      staticPressureGaugePa: psig(430),
      staticPressureSwingPa: psig(6),
      temperatureK: degF(64),
      temperatureSwingK: 2,
    },
    elementChange: {
      day: 20,
      hour: 14,
      minute: 0,
      element: KFG_101_CONE_BETA_045,
      reason:
        'Cone changed for a β 0.45 cone (calibration certificate uploaded): the well has declined and the DP sat low in the high-range span.',
    },
  },
  {
    siteCode: 'KFG',
    tag: 'KFG-102',
    name: 'Pad 2 wellhead',
    ...TIMING,
    // SCENARIO.md: C 0.82 uncalibrated; the engine uses ISO 5167-5's 0.82 and says the cone is uncalibrated.
    element: { kind: 'cone', pipeDiameterM: D_102, coneDiameterM: coneDiameterForBetaM(D_102, 0.65), ...MATERIALS },
    fluid: KFG_GAS,
    line: {
      insideDiameterM: D_102,
      nominalSize: 'NPS 3',
      schedule: '80',
      flangeClass: 'ASME Class 600',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 3,
      downstreamStraightLengthD: 3,
      installDate: '2023-09-02',
    },
    transmitters: [
      dpTransmitter('KFG-102-DP', 100),
      pressureTransmitter('KFG-102-PT', 1000),
      temperatureTransmitter('KFG-102-TT'),
    ],
    operating: {
      flow: { kind: 'standard-volume', m3PerS: mscfPerDay(5000) },
      load: WELL_LOAD,
      staticPressureGaugePa: psig(425),
      staticPressureSwingPa: psig(6),
      temperatureK: degF(66),
      temperatureSwingK: 2,
    },
  },
  {
    siteCode: 'KFG',
    tag: 'KFG-103',
    name: 'Pad 3 wellhead',
    ...TIMING,
    element: {
      kind: 'orifice',
      taps: 'flange',
      pipeDiameterM: D_103,
      boreDiameterM: boreDiameterForBetaM(D_103, 0.5),
      ...MATERIALS,
    },
    fluid: KFG_GAS,
    line: {
      insideDiameterM: D_103,
      nominalSize: 'NPS 4',
      schedule: '40',
      flangeClass: 'ASME Class 600',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 30,
      downstreamStraightLengthD: 7,
      installDate: '2022-11-21',
    },
    transmitters: [
      dpTransmitter('KFG-103-DP', 200),
      pressureTransmitter('KFG-103-PT', 1000),
      temperatureTransmitter('KFG-103-TT'),
    ],
    operating: {
      flow: { kind: 'standard-volume', m3PerS: mscfPerDay(6000) },
      load: WELL_LOAD,
      staticPressureGaugePa: psig(420),
      staticPressureSwingPa: psig(6),
      temperatureK: degF(60),
      temperatureSwingK: 2.5,
    },
  },
  {
    siteCode: 'KFG',
    tag: 'KFG-201',
    name: 'Sales meter',
    ...TIMING,
    element: {
      kind: 'orifice',
      taps: 'flange',
      pipeDiameterM: D_201,
      boreDiameterM: boreDiameterForBetaM(D_201, 0.6),
      ...MATERIALS,
    },
    fluid: KFG_GAS,
    line: {
      insideDiameterM: D_201,
      nominalSize: 'NPS 8',
      schedule: '40',
      flangeClass: 'ASME Class 600',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 44,
      downstreamStraightLengthD: 8,
      installDate: '2021-06-30',
    },
    transmitters: [
      dpTransmitter('KFG-201-DP', 50),
      pressureTransmitter('KFG-201-PT', 1000),
      temperatureTransmitter('KFG-201-TT'),
    ],
    // SCENARIO.md's balance: inlets 101 + 102 + 103, outlet 201, 1.5 % fuel and losses.
    operating: {
      flow: { kind: 'balance-outlet', inletTags: ['KFG-101', 'KFG-102', 'KFG-103'], lossShare: 0.015 },
      load: WELL_LOAD,
      staticPressureGaugePa: psig(385),
      staticPressureSwingPa: psig(10),
      temperatureK: degF(58),
      temperatureSwingK: 4,
    },
  },
];
