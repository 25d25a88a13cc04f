/**
 * The range check form's values (text as typed, in the chosen display units), their defaults,
 * switching between SI and US units, and prefilling from a meter run and its transmitters.
 */
import {
  convertFlowRate,
  defaultFlowRateUnit,
  flowRateForDisplay,
  flowRateUnit,
  readingForDisplay,
  staticPressureForDisplay,
  staticPressureFromDisplay,
  temperatureForDisplay,
  temperatureFromDisplay,
  unitsFor,
  type DisplayUnits,
} from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import type { Transmitter } from '@/hooks/api/transmitters';
import type { FluidSpec } from '@/shared/fluids';
import type {
  ElementSpec,
  ExpansionReference,
  NozzleType,
  OrificeMethod,
  OrificeTaps,
  VenturiType,
} from '@/shared/flow';
import { fromSI, toSI } from '@/shared/units';
import type { PointTransmitter } from '@/shared/history/sample-uncertainty';
import type { RecordedOperatingPoint } from './recordedOperatingPoint';
import { densityForDisplay, densityFromDisplay, expansionForDisplay, expansionFromDisplay } from './rangeCheckUnits';

export interface TransmitterValues {
  /** Upper range value (span from zero) in the display DP unit. */
  span: string;
  accuracy: string;
}

export interface RangeCheckValues {
  displayUnits: DisplayUnits;
  /** The meter run the values came from, if any. */
  meterRunId: string | null;
  /** Site conditions in SI (from the meter run's site, or the defaults below). */
  atmosphericPressurePa: number;
  basePressurePa: number;
  baseTemperatureK: number;
  elementKind: ElementSpec['kind'];
  taps: OrificeTaps;
  /** Orifice only: the method the meter run uses (or a what-if's choice). */
  orificeMethod: OrificeMethod;
  /** API 14.3 only: the static tap the expansion factor is referred to. */
  expansionReference: ExpansionReference;
  venturiType: VenturiType;
  nozzleType: NozzleType;
  /** In the display length unit (mm or in). */
  pipeDiameter: string;
  boreDiameter: string;
  coneDiameter: string;
  /** A fixed C; blank takes the standard's C (or the calibration curve). */
  dischargeCoefficient: string;
  /** Element fields the form does not edit, kept from a prefilled meter run. */
  elementExtras: Partial<ElementSpec>;
  fluidKind: FluidSpec['kind'];
  /** One component per line: "methane 0.965222". */
  composition: string;
  /** g/mol. */
  molarMass: string;
  compressibility: string;
  isentropicExponent: string;
  /** mPa·s (= cP); blank for the fluid's own. */
  viscosity: string;
  /** At the reference temperature, in the display density unit (kg/m³ or lb/ft³). */
  liquidDensity: string;
  /** In the display temperature unit. */
  liquidReferenceTemperature: string;
  /** Volumetric expansion per K (SI) or per °F (US). */
  liquidExpansion: string;
  /** Static pressure (gauge or absolute as the display units say) and temperature. */
  staticPressure: string;
  temperature: string;
  flowUnitKey: string;
  minimumFlow: string;
  normalFlow: string;
  maximumFlow: string;
  transmitters: TransmitterValues[];
  /** Expanded (k = 2) flow uncertainty the meter run must meet, %. */
  uncertaintyLimit: string;
  /**
   * The prefilled meter run's static pressure and temperature transmitters (spans in Pa and K), which
   * the hourly records' budget takes in through the density; the form does not edit them.
   */
  budgetTransmitters?: { staticPressure?: PointTransmitter; temperature?: PointTransmitter };
}

/**
 * AGA Report No. 8 Part 1 "Gulf Coast" example gas, mole fractions (TRADE.md §4): a published
 * pipeline-quality gas, used as the default until a meter run's own composition is picked.
 */
export const gulfCoastGasText = [
  'methane 0.965222',
  'nitrogen 0.002595',
  'carbon-dioxide 0.005956',
  'ethane 0.018186',
  'propane 0.004596',
  'isobutane 0.000977',
  'n-butane 0.001007',
  'isopentane 0.000473',
  'n-pentane 0.000324',
  'n-hexane 0.000664',
].join('\n');

/**
 * Site conditions when no meter run is picked: the standard atmosphere (101.325 kPa, exact by
 * definition) and common base conditions, 15 °C / 101.325 kPa (ISO 13443) for SI and
 * 60 °F / 14.73 psia for US gas contracts (common practice).
 */
const defaultSite: Record<
  DisplayUnits,
  { atmosphericPressurePa: number; basePressurePa: number; baseTemperatureK: number }
> = {
  si: { atmosphericPressurePa: 101_325, basePressurePa: 101_325, baseTemperatureK: toSI(15, 'degC') },
  us: { atmosphericPressurePa: 101_325, basePressurePa: toSI(14.73, 'psi'), baseTemperatureK: toSI(60, 'degF') },
};

/**
 * A gas case a newcomer can run at once: a 6 in schedule 40 line (inside diameter 6.065 in,
 * ASME B36.10 [mem]) with a β 0.5 orifice, one 0–50 kPa (0–200 inH2O) transmitter, and a flow
 * range wide enough that one transmitter is not enough.
 */
export function defaultValues(displayUnits: DisplayUnits = 'si'): RangeCheckValues {
  const us = displayUnits === 'us';
  return {
    displayUnits,
    meterRunId: null,
    ...defaultSite[displayUnits],
    elementKind: 'orifice',
    taps: 'flange',
    orificeMethod: 'iso-5167-2',
    expansionReference: 'upstream',
    venturiType: 'machined',
    nozzleType: 'isa-1932',
    pipeDiameter: us ? '6.065' : '154.05',
    boreDiameter: us ? '3.0325' : '77.03',
    coneDiameter: '',
    dischargeCoefficient: '',
    elementExtras: {},
    fluidKind: 'natural-gas',
    composition: gulfCoastGasText,
    molarMass: '28.97',
    compressibility: '1',
    isentropicExponent: '',
    viscosity: '',
    // Water at 20 °C, 998.2 kg/m³ (IAPWS-95 [mem]), in the site's density unit.
    liquidDensity: shown(densityForDisplay(998.2, displayUnits)),
    liquidReferenceTemperature: us ? '68' : '20',
    liquidExpansion: shown(expansionForDisplay(0.00021, displayUnits)),
    staticPressure: us ? '565' : '4000',
    temperature: us ? '60' : '15',
    flowUnitKey: defaultFlowRateUnit(displayUnits, 'natural-gas').key,
    minimumFlow: us ? '1500' : '2000',
    normalFlow: us ? '8000' : '10000',
    maximumFlow: us ? '16000' : '20000',
    transmitters: [{ span: us ? '200' : '50', accuracy: '0.075' }],
    uncertaintyLimit: '1',
  };
}

/** Reformats a converted number without a tail of float noise. */
function shown(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/** Converts a typed number with a function, leaving text that is not a number as it is. */
function convert(text: string, f: (value: number) => number): string {
  const value = Number(text);
  return text.trim() === '' || !Number.isFinite(value) ? text : shown(f(value));
}

/**
 * The same case in the other unit system: every typed length, pressure, temperature and span
 * converted; flows into the other system's usual unit of the same kind (mass or volume).
 * @param values the form as it is
 * @param to the unit system to show
 * @returns the converted values
 */
export function switchUnits(values: RangeCheckValues, to: DisplayUnits): RangeCheckValues {
  if (values.displayUnits === to) return values;
  const from = unitsFor(values.displayUnits);
  const next = unitsFor(to);
  const atm = values.atmosphericPressurePa;
  const length = (t: string) => convert(t, (v) => (v * from.length.metresPerUnit) / next.length.metresPerUnit);
  const temperature = (t: string) => convert(t, (v) => temperatureForDisplay(temperatureFromDisplay(v, from), next));
  const oldUnit = flowRateUnit(values.flowUnitKey);
  const newUnit = defaultFlowRateUnit(to, values.fluidKind);
  const flow = (t: string) =>
    oldUnit.basis === newUnit.basis ? convert(t, (v) => convertFlowRate(v, oldUnit, newUnit, null) ?? v) : t;
  const site = values.meterRunId ? {} : defaultSite[to];
  return {
    ...values,
    ...site,
    displayUnits: to,
    pipeDiameter: length(values.pipeDiameter),
    boreDiameter: length(values.boreDiameter),
    coneDiameter: length(values.coneDiameter),
    liquidDensity: convert(values.liquidDensity, (v) =>
      densityForDisplay(densityFromDisplay(v, values.displayUnits), to),
    ),
    liquidReferenceTemperature: temperature(values.liquidReferenceTemperature),
    liquidExpansion: convert(values.liquidExpansion, (v) =>
      expansionForDisplay(expansionFromDisplay(v, values.displayUnits), to),
    ),
    staticPressure: convert(values.staticPressure, (v) =>
      staticPressureForDisplay(staticPressureFromDisplay(v, from, atm), next, atm),
    ),
    temperature: temperature(values.temperature),
    flowUnitKey: oldUnit.basis === newUnit.basis ? newUnit.key : values.flowUnitKey,
    minimumFlow: flow(values.minimumFlow),
    normalFlow: flow(values.normalFlow),
    maximumFlow: flow(values.maximumFlow),
    transmitters: values.transmitters.map((t) => ({
      ...t,
      span: convert(t.span, (v) => fromSI(toSI(v, from.differentialPressure.unit), next.differentialPressure.unit)),
    })),
  };
}

/**
 * Takes a meter run's element, fluid, site conditions and DP transmitters into the form,
 * keeping the operating conditions and flows already typed.
 * @param values the form as it is
 * @param run the meter run
 * @param site its site
 * @param transmitters its transmitters (the DP ones are used, high range first)
 * @returns the prefilled values
 */
export function prefillFromMeterRun(
  values: RangeCheckValues,
  run: MeterRun,
  site: Site,
  transmitters: readonly Transmitter[],
): RangeCheckValues {
  const inSiteUnits = switchUnits(values, site.displayUnits);
  const set = unitsFor(site.displayUnits);
  const next: RangeCheckValues = {
    ...inSiteUnits,
    meterRunId: run.id,
    atmosphericPressurePa: site.atmosphericPressurePa,
    basePressurePa: site.basePressurePa,
    baseTemperatureK: site.baseTemperatureK,
  };
  const element = run.element;
  if (element) {
    const length = (m: number | undefined) => (m === undefined ? '' : shown(m / set.length.metresPerUnit));
    const {
      kind,
      taps,
      method,
      expansionReference,
      venturiType,
      nozzleType,
      pipeDiameterM,
      boreDiameterM,
      coneDiameterM,
      dischargeCoefficient,
      ...extras
    } = element;
    Object.assign(next, {
      elementKind: kind,
      taps: taps ?? next.taps,
      orificeMethod: method ?? 'iso-5167-2',
      expansionReference: expansionReference ?? 'upstream',
      venturiType: venturiType ?? next.venturiType,
      nozzleType: nozzleType ?? next.nozzleType,
      pipeDiameter: length(pipeDiameterM),
      boreDiameter: length(boreDiameterM),
      coneDiameter: length(coneDiameterM),
      dischargeCoefficient: dischargeCoefficient === undefined ? '' : String(dischargeCoefficient),
      elementExtras: extras,
    });
  }
  const fluid = run.fluid;
  if (fluid) {
    next.fluidKind = fluid.kind;
    next.isentropicExponent = fluid.isentropicExponent === undefined ? '' : String(fluid.isentropicExponent);
    next.viscosity = fluid.viscosityPaS === undefined ? '' : shown(fluid.viscosityPaS * 1000);
    if (fluid.kind === 'natural-gas')
      next.composition = Object.entries(fluid.composition)
        .map(([name, x]) => `${name} ${x}`)
        .join('\n');
    if (fluid.kind === 'ideal-gas') {
      next.molarMass = shown(fluid.molarMassKgPerMol * 1000);
      next.compressibility = String(fluid.compressibility ?? 1);
    }
    if (fluid.kind === 'liquid') {
      next.liquidDensity = shown(densityForDisplay(fluid.densityKgPerM3, site.displayUnits));
      next.liquidReferenceTemperature = shown(temperatureForDisplay(fluid.referenceTemperatureK, set));
      next.liquidExpansion = shown(expansionForDisplay(fluid.expansionPerK, site.displayUnits));
    }
    const flowUnit = defaultFlowRateUnit(site.displayUnits, fluid.kind);
    if (flowRateUnit(next.flowUnitKey).basis !== flowUnit.basis) next.flowUnitKey = flowUnit.key;
  }
  next.budgetTransmitters = {
    staticPressure: budgetTransmitter(transmitters, 'static-pressure'),
    temperature: budgetTransmitter(transmitters, 'temperature'),
  };
  const dp = transmitters
    .filter((t) => t.measures === 'differential-pressure')
    .sort((a, b) => (a.stackRole === 'high' ? -1 : b.stackRole === 'high' ? 1 : 0))
    .slice(0, 2);
  if (dp.length > 0) {
    next.transmitters = dp.map((t) => ({
      // The range check takes spans from zero; a DP transmitter's lower range value is 0 in practice.
      span: shown(readingForDisplay(t.upperRange, t, set, site.atmosphericPressurePa)),
      accuracy: String(t.accuracyPercentOfSpan),
    }));
  }
  return next;
}

/**
 * A meter run's P or T transmitter as the hourly budget takes it: span in SI (a difference of two
 * converted range values, so in K for °F too). The transmitter list does not carry the kind of the
 * datasheet figure, so it is taken as a k = 2 uncertainty, the set-up's default.
 */
function budgetTransmitter(
  transmitters: readonly Transmitter[],
  measures: 'static-pressure' | 'temperature',
): PointTransmitter | undefined {
  const t = transmitters.find((x) => x.measures === measures);
  if (!t) return undefined;
  const span = toSI(t.upperRange, t.unit) - toSI(t.lowerRange, t.unit);
  return span > 0 ? { accuracyPercentOfSpan: t.accuracyPercentOfSpan, span, accuracyKind: 'expanded-k2' } : undefined;
}

/**
 * Takes a meter run's recorded operating point into the form: its static pressure and
 * temperature, and its lowest, median and highest flowing rate as the minimum, normal and
 * maximum flow, in the form's flow unit.
 * @param values the form (already in the meter run's site units)
 * @param point the operating point from its hourly records
 * @returns the values with conditions and flows filled in
 */
export function prefillOperatingPoint(values: RangeCheckValues, point: RecordedOperatingPoint): RangeCheckValues {
  const set = unitsFor(values.displayUnits);
  const unit = flowRateUnit(values.flowUnitKey);
  const flow = (massKgPerS: number, current: string) => {
    const shownValue = flowRateForDisplay(
      { massKgPerS, standardVolumeM3PerS: point.baseDensityKgPerM3 ? massKgPerS / point.baseDensityKgPerM3 : null },
      unit,
    );
    return shownValue === null ? current : String(Number(shownValue.toPrecision(4)));
  };
  return {
    ...values,
    staticPressure:
      point.pressurePa === null
        ? values.staticPressure
        : shown(staticPressureForDisplay(point.pressurePa, set, values.atmosphericPressurePa)),
    temperature:
      point.temperatureK === null
        ? values.temperature
        : String(Number(temperatureForDisplay(point.temperatureK, set).toFixed(1))),
    minimumFlow: flow(point.minimumKgPerS, values.minimumFlow),
    normalFlow: flow(point.normalKgPerS, values.normalFlow),
    maximumFlow: flow(point.maximumKgPerS, values.maximumFlow),
  };
}
