/**
 * The fixed transmitter unit codes (shared/schemas/setup.ts) with the words shown for each.
 * Inches of water name their water temperature: the column's density differs by 0.2 % between
 * 4 °C and 20 °C (TRADE.md §4).
 */
import { directionUnits, pressureUnits, temperatureUnits, type transmitterMeasures } from '@/shared/schemas/setup';

export type Measures = (typeof transmitterMeasures)[number];
export type TransmitterUnitCode =
  (typeof pressureUnits)[number] | (typeof temperatureUnits)[number] | (typeof directionUnits)[number];

export const unitLabel: Record<TransmitterUnitCode, string> = {
  Pa: 'Pa',
  kPa: 'kPa',
  MPa: 'MPa',
  mbar: 'mbar',
  bar: 'bar',
  psi: 'psi',
  'inH2O-4C': 'inH₂O (4 °C)',
  'inH2O-60F': 'inH₂O (60 °F)',
  'inH2O-68F': 'inH₂O (68 °F)',
  K: 'K',
  degC: '°C',
  degF: '°F',
  sign: 'sign (+ forward, − reverse)',
};

/**
 * @param what what the transmitter measures
 * @returns the unit codes it may be ranged in
 */
export function unitsFor(what: Measures): readonly TransmitterUnitCode[] {
  if (what === 'flow-direction') return directionUnits;
  return what === 'temperature' ? temperatureUnits : pressureUnits;
}

export const measuresLabel: Record<Measures, string> = {
  'differential-pressure': 'Differential pressure (DP)',
  'static-pressure': 'Static pressure',
  temperature: 'Temperature',
  'flow-direction': 'Flow direction input',
};

/** @returns e.g. "0 – 250 inH₂O (60 °F)" */
export function rangeLabel(lower: number, upper: number, unit: string): string {
  return `${lower} – ${upper} ${unitLabel[unit as TransmitterUnitCode] ?? unit}`;
}
