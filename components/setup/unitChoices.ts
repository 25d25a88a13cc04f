/**
 * The units a set-up form may be typed in, with the words shown for each. Conversions go
 * through shared/units (toSI, fromSI) and its defining constants; none is written here but the
 * SI prefix milli.
 */
import { INCH_M, fromSI, toSI } from '@/shared/units';
import { parseNumberText } from './formFields';

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

/**
 * Decimals shown when a value is converted for the person (not when it is typed): a thousandth
 * of a kPa or psi, a hundred-thousandth of a bar, a hundredth of a degree, which is finer than
 * any base condition or barometer is stated to.
 */
const shownDecimals: Record<AbsolutePressureUnit | TemperatureUnit, number> = {
  kPa: 3,
  psi: 3,
  bar: 5,
  degC: 2,
  degF: 2,
  K: 2,
};

/**
 * @param value a converted value in unit
 * @param unit the unit it is shown in
 * @returns its text rounded for reading (14.6959487755 psia → "14.696"), with no trailing zeros
 */
export function roundedText(value: number, unit: AbsolutePressureUnit | TemperatureUnit): string {
  if (!Number.isFinite(value)) return '';
  return String(Number(value.toFixed(shownDecimals[unit])));
}

/**
 * A value the form converted for showing, with the SI value it stands for: while the text is
 * left as shown, the SI value is sent, so rounding for reading never changes what is stored.
 */
export interface ShownValue {
  text: string;
  si: number;
}

/**
 * A field's value in a new unit, rounded for reading.
 * @param text the field's text
 * @param from the unit it is in
 * @param to the unit to show it in
 * @param shown what the form last showed in this field, if it converted it
 * @returns the new text and the SI value it stands for (no SI value when the text is not a number)
 */
export function convertShown(
  text: string,
  from: AbsolutePressureUnit | TemperatureUnit,
  to: AbsolutePressureUnit | TemperatureUnit,
  shown?: ShownValue,
): { text: string; shown?: ShownValue } {
  const si = siFromShown(text, from, shown);
  if (si === undefined || !Number.isFinite(si)) return { text };
  const converted = roundedText(fromSI(si, to), to);
  return { text: converted, shown: { text: converted, si } };
}

/**
 * @param text the field's text
 * @param unit the unit it is in
 * @param shown what the form last showed in this field, if it converted it
 * @returns the SI value: the one shown stands for while the text is unchanged, else the text's (undefined when blank, NaN when not a number)
 */
export function siFromShown(text: string, unit: string, shown?: ShownValue): number | undefined {
  if (shown && shown.text === text) return shown.si;
  return optionalToSI(parseNumberText(text), unit);
}
