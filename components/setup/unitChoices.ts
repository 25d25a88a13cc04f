/**
 * The units a set-up form may be typed in, with the words shown for each. Conversions go
 * through shared/units (toSI, fromSI) and its defining constants; none is written here but the
 * SI prefix milli.
 */
import { INCH_M, fromSI, toSI } from '@/shared/units';

export const absolutePressureUnits = [
  { value: 'kPa', label: 'kPa abs' },
  { value: 'psi', label: 'psia' },
  { value: 'bar', label: 'bar abs' },
] as const;
export type AbsolutePressureUnit = (typeof absolutePressureUnits)[number]['value'];

export const temperatureUnits = [
  { value: 'degC', label: '°C' },
  { value: 'degF', label: '°F' },
  { value: 'K', label: 'K' },
] as const;
export type TemperatureUnit = (typeof temperatureUnits)[number]['value'];

export const lengthUnits = [
  { value: 'mm', label: 'mm' },
  { value: 'in', label: 'in' },
] as const;
export type LengthUnit = (typeof lengthUnits)[number]['value'];

/** 1 mm = 1e-3 m (the SI prefix milli). */
const metresPerMillimetre = 1e-3;

/**
 * @param value a length as typed
 * @param unit mm or in (1 in = 0.0254 m exactly, shared/units INCH_M)
 * @returns the length in metres (NaN and undefined pass through for the schema to name)
 */
export function lengthToMetres<T extends number | undefined>(value: T, unit: LengthUnit): T {
  if (value === undefined) return value;
  return (value * (unit === 'mm' ? metresPerMillimetre : INCH_M)) as T;
}

/**
 * @param metres a length in metres
 * @param unit mm or in
 * @returns the length in that unit
 */
export function lengthFromMetres(metres: number, unit: LengthUnit): number {
  return metres / (unit === 'mm' ? metresPerMillimetre : INCH_M);
}

/** toSI that lets an empty field (undefined) through for the schema to report. */
export function optionalToSI<T extends number | undefined>(value: T, unit: string): T {
  return (value === undefined ? value : toSI(value, unit)) as T;
}

export { fromSI, toSI };
