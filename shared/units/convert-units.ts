/**
 * toSI / fromSI for every named unit of an input or output (SI inside: Pa, K, m³, kg, J).
 */
import { CUBIC_METRES_PER_UNIT, JOULES_PER_UNIT, KILOGRAMS_PER_UNIT } from './other-units';
import { PASCALS_PER_UNIT } from './pressure-units';

/** Temperature units: K = (value + offset) × scale. °F: K = (°F + 459.67) × 5/9 (exact by the definitions of °R and °F). */
const TEMPERATURE = Object.freeze({
  K: { scale: 1, offset: 0 },
  degC: { scale: 1, offset: 273.15 },
  degF: { scale: 5 / 9, offset: 459.67 },
});

export type Quantity = 'pressure' | 'temperature' | 'volume' | 'mass' | 'energy';

const LINEAR: Record<string, { quantity: Quantity; factor: number }> = {};
for (const [table, quantity] of [
  [PASCALS_PER_UNIT, 'pressure'],
  [CUBIC_METRES_PER_UNIT, 'volume'],
  [KILOGRAMS_PER_UNIT, 'mass'],
  [JOULES_PER_UNIT, 'energy'],
] as const) {
  for (const [unit, factor] of Object.entries(table)) LINEAR[unit] = { quantity, factor };
}

/** The unit codes a transmitter may be ranged in (DESIGN.md). */
export const TRANSMITTER_UNIT_CODES = [
  'Pa',
  'kPa',
  'MPa',
  'mbar',
  'bar',
  'psi',
  'inH2O-4C',
  'inH2O-60F',
  'inH2O-68F',
  'K',
  'degC',
  'degF',
] as const;
export type TransmitterUnit = (typeof TRANSMITTER_UNIT_CODES)[number];

/** Every unit code toSI knows. */
export const UNIT_CODES: readonly string[] = Object.freeze([...Object.keys(LINEAR), ...Object.keys(TEMPERATURE)]);

function unknown(fn: string, unit: string): never {
  throw new Error(`${fn}: unknown unit '${unit}' (known: ${UNIT_CODES.join(' ')})`);
}

/**
 * @param unit unit code
 * @returns the quantity the unit measures
 */
export function unitQuantity(unit: string): Quantity {
  if (Object.prototype.hasOwnProperty.call(TEMPERATURE, unit)) return 'temperature';
  const linear = Object.prototype.hasOwnProperty.call(LINEAR, unit) ? LINEAR[unit] : undefined;
  return linear ? linear.quantity : unknown('unitQuantity', unit);
}

/**
 * A value in a named unit to SI (Pa, K, m³, kg, J). Pressure stays as given (absolute or gauge: see absolutePressurePa).
 * @param value value in the unit
 * @param unit unit code, e.g. 'inH2O-60F', 'degF', 'Mscf'
 * @returns value in SI
 */
export function toSI(value: number, unit: string): number {
  if (Object.prototype.hasOwnProperty.call(TEMPERATURE, unit)) {
    const t = TEMPERATURE[unit as keyof typeof TEMPERATURE];
    return (value + t.offset) * t.scale;
  }
  if (!Object.prototype.hasOwnProperty.call(LINEAR, unit)) unknown('toSI', unit);
  return value * LINEAR[unit].factor;
}

/**
 * An SI value (Pa, K, m³, kg, J) in a named unit.
 * @param valueSI value in SI
 * @param unit unit code
 * @returns value in the unit
 */
export function fromSI(valueSI: number, unit: string): number {
  if (Object.prototype.hasOwnProperty.call(TEMPERATURE, unit)) {
    const t = TEMPERATURE[unit as keyof typeof TEMPERATURE];
    return valueSI / t.scale - t.offset;
  }
  if (!Object.prototype.hasOwnProperty.call(LINEAR, unit)) unknown('fromSI', unit);
  return valueSI / LINEAR[unit].factor;
}
