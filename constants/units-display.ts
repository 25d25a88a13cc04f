/**
 * Units on screen. A site chooses US customary ('us': inH2O at 60 °F, psig, °F, Mscf/d) or SI
 * ('si': kPa, °C, t/h, m³/h) display; everything the API sends is SI (Pa absolute, K, kg, m³,
 * J, s) or in a transmitter's own unit. Every conversion goes through shared/units (toSI,
 * fromSI, absolutePressurePa) so no factor is written twice; only the clock's own exact
 * definitions (3600 s in an hour, 86 400 s in a day) live here.
 */
import type { FluidSpec } from '@/shared/fluids';
import { INCH_M, absolutePressurePa, fromSI, toSI, type PressureUnit } from '@/shared/units';

export type DisplayUnits = 'si' | 'us';

/** Exact by the definition of the hour and the day. */
const SECONDS_PER_HOUR = 3600;
const SECONDS_PER_DAY = 86_400;

/** The unit of a quantity on screen: the shared/units code and how it is written. */
export interface ShownUnit<U extends string = string> {
  unit: U;
  label: string;
}

export interface DisplayUnitSet {
  differentialPressure: ShownUnit<PressureUnit>;
  /** Static pressure: gauge ("psig") in US units, absolute in SI, and said so in the label. */
  staticPressure: ShownUnit<PressureUnit> & { gauge: boolean };
  temperature: ShownUnit<'degC' | 'degF'>;
  /** Pipe and bore diameters: metres per shown unit (mm or in). */
  length: { metresPerUnit: number; label: string };
  mass: ShownUnit;
  standardVolume: ShownUnit;
  energy: ShownUnit;
}

const sets: Record<DisplayUnits, DisplayUnitSet> = {
  si: {
    differentialPressure: { unit: 'kPa', label: 'kPa' },
    staticPressure: { unit: 'kPa', label: 'kPa abs', gauge: false },
    temperature: { unit: 'degC', label: '°C' },
    length: { metresPerUnit: 1e-3, label: 'mm' },
    mass: { unit: 't', label: 't' },
    standardVolume: { unit: 'm3', label: 'm³' },
    energy: { unit: 'GJ', label: 'GJ' },
  },
  us: {
    // Inches of water carry their reference temperature (TRADE.md §4); 60 °F is the gas trade's.
    differentialPressure: { unit: 'inH2O-60F', label: 'inH2O (60 °F)' },
    staticPressure: { unit: 'psi', label: 'psig', gauge: true },
    temperature: { unit: 'degF', label: '°F' },
    length: { metresPerUnit: INCH_M, label: 'in' },
    mass: { unit: 'lb', label: 'lb' },
    standardVolume: { unit: 'Mscf', label: 'Mscf' },
    energy: { unit: 'MMBtu', label: 'MMBtu' },
  },
};

/**
 * @param displayUnits a site's choice
 * @returns the units its screens show
 */
export function unitsFor(displayUnits: DisplayUnits): DisplayUnitSet {
  return sets[displayUnits];
}

/** How each transmitter unit code is written on screen. */
const unitLabels: Record<string, string> = {
  'inH2O-4C': 'inH2O (4 °C)',
  'inH2O-60F': 'inH2O (60 °F)',
  'inH2O-68F': 'inH2O (68 °F)',
  degC: '°C',
  degF: '°F',
  m3: 'm³',
};

/**
 * @param unit a shared/units code such as 'inH2O-60F' or 'degC'
 * @returns the way it is written, e.g. "inH2O (60 °F)" or "°C"
 */
export function unitLabel(unit: string): string {
  return unitLabels[unit] ?? unit;
}

/**
 * @param pa a differential pressure, Pa
 * @param set the display units
 * @returns it in the display unit
 */
export function differentialPressureForDisplay(pa: number, set: DisplayUnitSet): number {
  return fromSI(pa, set.differentialPressure.unit);
}

/**
 * @param value a differential pressure in the display unit
 * @param set the display units
 * @returns it in Pa
 */
export function differentialPressureFromDisplay(value: number, set: DisplayUnitSet): number {
  return toSI(value, set.differentialPressure.unit);
}

/**
 * @param absolutePa an absolute static pressure, Pa
 * @param set the display units
 * @param atmosphericPressurePa the site's atmospheric pressure (for gauge display)
 * @returns it in the display unit, gauge or absolute as the set says
 */
export function staticPressureForDisplay(
  absolutePa: number,
  set: DisplayUnitSet,
  atmosphericPressurePa: number,
): number {
  return fromSI(set.staticPressure.gauge ? absolutePa - atmosphericPressurePa : absolutePa, set.staticPressure.unit);
}

/**
 * @param value a static pressure as shown (gauge or absolute as the set says)
 * @param set the display units
 * @param atmosphericPressurePa the site's atmospheric pressure (for gauge input)
 * @returns the absolute pressure, Pa
 */
export function staticPressureFromDisplay(value: number, set: DisplayUnitSet, atmosphericPressurePa: number): number {
  return absolutePressurePa(
    value,
    set.staticPressure.unit,
    set.staticPressure.gauge ? 'gauge' : 'absolute',
    atmosphericPressurePa,
  );
}

/**
 * @param kelvin a temperature, K
 * @param set the display units
 * @returns it in °C or °F
 */
export function temperatureForDisplay(kelvin: number, set: DisplayUnitSet): number {
  return fromSI(kelvin, set.temperature.unit);
}

/**
 * @param value a temperature in °C or °F
 * @param set the display units
 * @returns it in K
 */
export function temperatureFromDisplay(value: number, set: DisplayUnitSet): number {
  return toSI(value, set.temperature.unit);
}

/** A reading's transmitter: what it measures and how it reports. */
export interface ReadingSource {
  /** 'flow-direction': a bi-directional meter run's direction input, read as a plain sign (> 0 forward). */
  measures: 'differential-pressure' | 'static-pressure' | 'temperature' | 'flow-direction';
  unit: string;
  pressureReference?: 'absolute' | 'gauge';
}

/**
 * A transmitter's reading (in its own unit) in the display unit of what it measures.
 * @param value the reading, in the transmitter's unit
 * @param source the transmitter
 * @param set the display units
 * @param atmosphericPressurePa the site's atmospheric pressure (gauge readings, gauge display)
 * @returns the value on screen
 */
export function readingForDisplay(
  value: number,
  source: ReadingSource,
  set: DisplayUnitSet,
  atmosphericPressurePa: number,
): number {
  if (source.measures === 'flow-direction') return value;
  if (source.measures === 'temperature') return temperatureForDisplay(toSI(value, source.unit), set);
  if (source.measures === 'differential-pressure') return differentialPressureForDisplay(toSI(value, source.unit), set);
  const absolutePa = absolutePressurePa(
    value,
    source.unit as PressureUnit,
    source.pressureReference ?? 'absolute',
    atmosphericPressurePa,
  );
  return staticPressureForDisplay(absolutePa, set, atmosphericPressurePa);
}

/**
 * @param source the transmitter
 * @param set the display units
 * @returns the unit its readings are shown in
 */
export function displayUnitFor(source: Pick<ReadingSource, 'measures'>, set: DisplayUnitSet): string {
  if (source.measures === 'flow-direction') return 'sign';
  if (source.measures === 'temperature') return set.temperature.label;
  if (source.measures === 'differential-pressure') return set.differentialPressure.label;
  return set.staticPressure.label;
}

/** A flow rate unit: a mass or a volume at base conditions per hour or per day. */
export interface FlowRateUnit {
  key: string;
  label: string;
  basis: 'mass' | 'standard-volume';
  /** shared/units code of the quantity (kg, t, lb, m3, Mscf, bbl). */
  unit: string;
  secondsPerPeriod: number;
}

export const flowRateUnits: readonly FlowRateUnit[] = [
  { key: 'kg/h', label: 'kg/h', basis: 'mass', unit: 'kg', secondsPerPeriod: SECONDS_PER_HOUR },
  { key: 't/h', label: 't/h', basis: 'mass', unit: 't', secondsPerPeriod: SECONDS_PER_HOUR },
  { key: 'lb/h', label: 'lb/h', basis: 'mass', unit: 'lb', secondsPerPeriod: SECONDS_PER_HOUR },
  { key: 'm3/h', label: 'm³/h (base)', basis: 'standard-volume', unit: 'm3', secondsPerPeriod: SECONDS_PER_HOUR },
  { key: 'Mscf/d', label: 'Mscf/d', basis: 'standard-volume', unit: 'Mscf', secondsPerPeriod: SECONDS_PER_DAY },
  { key: 'bbl/d', label: 'bbl/d (base)', basis: 'standard-volume', unit: 'bbl', secondsPerPeriod: SECONDS_PER_DAY },
];

/**
 * @param key a flow rate unit key such as 't/h'
 * @returns the unit
 */
export function flowRateUnit(key: string): FlowRateUnit {
  const found = flowRateUnits.find((unit) => unit.key === key);
  if (!found) throw new Error(`flowRateUnit: unknown flow rate unit "${key}"`);
  return found;
}

/**
 * The flow a site's people think in: volume at base conditions for gas and liquids (Mscf/d,
 * bbl/d or m³/h), mass for steam (lb/h or t/h): common practice in each trade.
 * @param displayUnits the site's choice
 * @param fluidKind the meter run's fluid
 * @returns the flow rate unit
 */
export function defaultFlowRateUnit(
  displayUnits: DisplayUnits,
  fluidKind: FluidSpec['kind'] | undefined,
): FlowRateUnit {
  if (fluidKind === 'steam') return flowRateUnit(displayUnits === 'us' ? 'lb/h' : 't/h');
  if (fluidKind === 'water' || fluidKind === 'liquid') return flowRateUnit(displayUnits === 'us' ? 'bbl/d' : 'm3/h');
  return flowRateUnit(displayUnits === 'us' ? 'Mscf/d' : 'm3/h');
}

/** A flow in SI: mass, and volume at base conditions where the fluid has a base density. */
export interface FlowInSI {
  massKgPerS: number;
  standardVolumeM3PerS: number | null;
}

/**
 * @param flow the flow in SI
 * @param unit the flow rate unit to show
 * @returns the value in that unit, or null when a volume is asked for and not known
 */
export function flowRateForDisplay(flow: FlowInSI, unit: FlowRateUnit): number | null {
  const perSecond = unit.basis === 'mass' ? flow.massKgPerS : flow.standardVolumeM3PerS;
  return perSecond === null ? null : fromSI(perSecond * unit.secondsPerPeriod, unit.unit);
}

/**
 * @param value a flow in the unit
 * @param unit its flow rate unit
 * @param baseDensityKgPerM3 the fluid's density at base conditions (needed for a volume)
 * @returns the mass flow, kg/s
 */
export function massFlowFromDisplay(value: number, unit: FlowRateUnit, baseDensityKgPerM3: number | null): number {
  const perSecond = toSI(value, unit.unit) / unit.secondsPerPeriod;
  if (unit.basis === 'mass') return perSecond;
  if (baseDensityKgPerM3 === null || !(baseDensityKgPerM3 > 0)) {
    throw new Error(`massFlowFromDisplay: a flow in ${unit.label} needs the fluid's density at base conditions`);
  }
  return perSecond * baseDensityKgPerM3;
}

/**
 * @param value a flow in one unit
 * @param from its unit
 * @param to the unit wanted
 * @param baseDensityKgPerM3 the fluid's density at base conditions (needed between mass and volume)
 * @returns the flow in `to`, or null when mass and volume meet and the base density is unknown
 */
export function convertFlowRate(
  value: number,
  from: FlowRateUnit,
  to: FlowRateUnit,
  baseDensityKgPerM3: number | null,
): number | null {
  if (from.basis === to.basis)
    return fromSI((toSI(value, from.unit) / from.secondsPerPeriod) * to.secondsPerPeriod, to.unit);
  if (baseDensityKgPerM3 === null || !(baseDensityKgPerM3 > 0)) return null;
  const massKgPerS = massFlowFromDisplay(value, from, baseDensityKgPerM3);
  return flowRateForDisplay({ massKgPerS, standardVolumeM3PerS: massKgPerS / baseDensityKgPerM3 }, to);
}

/**
 * A number for a table or a label: four significant figures (finer than any DP meter's
 * uncertainty), grouped thousands, no exponent for the values a meter run sees.
 * @param value the number (null or not finite shows as a dash)
 * @param significant significant figures (default 4)
 * @returns the text
 */
export function formatNumber(value: number | null | undefined, significant = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, Math.min(8, significant - 1 - magnitude));
  return value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

/**
 * A set value (a range, a span) as it was meant: up to six significant figures, no trailing
 * zeros, grouped thousands ("200", "0.075", "1,000").
 * @param value the number (null or not finite shows as a dash)
 * @returns the text
 */
export function formatPlain(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return Number(value.toPrecision(6)).toLocaleString('en-US', { maximumFractionDigits: 8 });
}

/**
 * @param value a number in the unit
 * @param label the unit as written
 * @param significant significant figures
 * @returns e.g. "12.35 inH2O (60 °F)"
 */
export function formatQuantity(value: number | null | undefined, label: string, significant = 4): string {
  const text = formatNumber(value, significant);
  return text === '—' ? text : `${text} ${label}`;
}
