/**
 * The meter runs of Brackwater Paper Mill (SCENARIO.md, invented): the boiler steam header,
 * cooling water supply and treated effluent. Line conditions and flows are invented and sized
 * so each DP sits mid-span.
 *
 * CAUTION: the steam header runs at about 10 bar(g) and 200 °C. Work on impulse lines and
 * transmitters of a live steam line follows the site's permit-to-work and isolation rules and
 * local pressure-equipment codes; this demo data describes no real installation.
 */
import { toSI } from '../../shared/units';
import { coneDiameterForBetaM, boreDiameterForBetaM } from './element-geometry';
import { PIPE_INSIDE_DIAMETER_M } from './pipe-inside-diameters';
import type { ScenarioMeterRun, ScenarioTransmitter } from './scenario-types';

const MATERIALS = {
  referenceTemperatureK: 293.15,
  pipeMaterial: 'carbon-steel',
  elementMaterial: 'stainless-316',
} as const;

const D_ST1 = PIPE_INSIDE_DIAMETER_M['DN 150 sch 40'];
const D_CW1 = PIPE_INSIDE_DIAMETER_M['DN 300 sch 40'];
const D_EF1 = PIPE_INSIDE_DIAMETER_M['DN 200 sch 40'];

const transmitter = (
  tag: string,
  measures: ScenarioTransmitter['measures'],
  unit: ScenarioTransmitter['unit'],
  upperRange: number,
  pressureReference: ScenarioTransmitter['pressureReference'] = 'absolute',
): ScenarioTransmitter => ({
  tag,
  measures,
  unit,
  pressureReference,
  lowerRange: 0,
  upperRange,
  stackRole: 'single',
  accuracyPercentOfSpan: measures === 'temperature' ? 0.1 : 0.075,
});

/** A calibration that found C constant over Re_D 2e5 to 3e6. */
const flatCalibration = (dischargeCoefficient: number) => [
  { reynoldsNumber: 2e5, dischargeCoefficient },
  { reynoldsNumber: 3e6, dischargeCoefficient },
];

const TIMING = { holdLimitS: 180, maxGapS: 300, stackSwitchUpShare: 0.9, stackSwitchDownShare: 0.8 };
const cubicMetresPerHour = (value: number) => value / 3600;

export const BPM_METER_RUNS: ScenarioMeterRun[] = [
  {
    siteCode: 'BPM',
    tag: 'BPM-ST1',
    name: 'Boiler steam header',
    ...TIMING,
    element: {
      kind: 'venturi',
      venturiType: 'machined',
      pipeDiameterM: D_ST1,
      boreDiameterM: boreDiameterForBetaM(D_ST1, 0.6),
      ...MATERIALS,
    },
    fluid: { kind: 'steam' },
    line: {
      insideDiameterM: D_ST1,
      nominalSize: 'DN 150',
      schedule: '40',
      flangeClass: 'PN 40',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 20,
      downstreamStraightLengthD: 4,
      installDate: '2019-03-11',
    },
    transmitters: [
      transmitter('BPM-ST1-DP', 'differential-pressure', 'kPa', 10),
      transmitter('BPM-ST1-PT', 'static-pressure', 'bar', 16, 'gauge'),
      transmitter('BPM-ST1-TT', 'temperature', 'degC', 300),
    ],
    // Paper machines draw more steam on the day shift; 6 t/h keeps Re_D inside the machined
    // venturi's range (ISO 5167-4 §5.5.3: 2e5 to 1e6).
    operating: {
      flow: { kind: 'mass', kgPerS: 6_000 / 3600 },
      load: { diurnalAmplitude: 0.06, peakHourLocal: 14, declinePerMonth: 0, noiseShare: 0.006 },
      staticPressureGaugePa: toSI(10, 'bar'),
      staticPressureSwingPa: toSI(0.15, 'bar'),
      temperatureK: toSI(200, 'degC'),
      temperatureSwingK: 1.5,
    },
  },
  {
    siteCode: 'BPM',
    tag: 'BPM-CW1',
    name: 'Cooling water supply',
    ...TIMING,
    // Invented: the maker's water calibration came out flat, C = 0.803 from Re_D 2e5 to 3e6; given
    // as a calibration curve so the flow uncertainty is that of a calibrated cone.
    element: {
      kind: 'cone',
      pipeDiameterM: D_CW1,
      coneDiameterM: coneDiameterForBetaM(D_CW1, 0.65),
      ...MATERIALS,
      calibration: flatCalibration(0.803),
    },
    fluid: { kind: 'water' },
    line: {
      insideDiameterM: D_CW1,
      nominalSize: 'DN 300',
      schedule: '40',
      flangeClass: 'PN 16',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 3,
      downstreamStraightLengthD: 3,
      installDate: '2020-08-25',
    },
    transmitters: [
      transmitter('BPM-CW1-DP', 'differential-pressure', 'kPa', 60),
      transmitter('BPM-CW1-PT', 'static-pressure', 'kPa', 1000, 'gauge'),
      transmitter('BPM-CW1-TT', 'temperature', 'degC', 100),
    ],
    // More cooling in the warm afternoon.
    operating: {
      flow: { kind: 'volume', m3PerS: cubicMetresPerHour(750) },
      load: { diurnalAmplitude: 0.1, peakHourLocal: 15, declinePerMonth: 0, noiseShare: 0.005 },
      staticPressureGaugePa: toSI(350, 'kPa'),
      staticPressureSwingPa: toSI(8, 'kPa'),
      temperatureK: toSI(25, 'degC'),
      temperatureSwingK: 1.5,
    },
  },
  {
    siteCode: 'BPM',
    tag: 'BPM-EF1',
    name: 'Treated effluent',
    ...TIMING,
    // Invented, as for BPM-CW1: flat at C = 0.808.
    element: {
      kind: 'cone',
      pipeDiameterM: D_EF1,
      coneDiameterM: coneDiameterForBetaM(D_EF1, 0.7),
      ...MATERIALS,
      calibration: flatCalibration(0.808),
    },
    fluid: { kind: 'water' },
    line: {
      insideDiameterM: D_EF1,
      nominalSize: 'DN 200',
      schedule: '40',
      flangeClass: 'PN 10',
      pipeMaterial: 'carbon steel',
      elementMaterial: 'stainless steel 316',
      upstreamStraightLengthD: 3,
      downstreamStraightLengthD: 3,
      installDate: '2021-02-08',
    },
    transmitters: [
      transmitter('BPM-EF1-DP', 'differential-pressure', 'mbar', 250),
      transmitter('BPM-EF1-PT', 'static-pressure', 'kPa', 600, 'gauge'),
      transmitter('BPM-EF1-TT', 'temperature', 'degC', 100),
    ],
    operating: {
      flow: { kind: 'volume', m3PerS: cubicMetresPerHour(250) },
      load: { diurnalAmplitude: 0.15, peakHourLocal: 12, declinePerMonth: 0, noiseShare: 0.008 },
      staticPressureGaugePa: toSI(150, 'kPa'),
      staticPressureSwingPa: toSI(5, 'kPa'),
      temperatureK: toSI(30, 'degC'),
      temperatureSwingK: 1,
    },
  },
];
