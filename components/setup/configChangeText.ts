/**
 * The words for one field a configuration version changed: its path as the API names it, and the
 * values before and after with the unit the field's name carries (`boreDiameterM` is in metres).
 * Numbers show 12 significant digits, beyond any measurement, so what an auditor reads is what the
 * record holds without the binary noise of a unit conversion (90.2 mm is 0.09019999999999999 m).
 */

/** Unit suffixes of field names (SI, see shared/schemas), longest first so `PaS` wins over `S`. */
const unitSuffixes: [suffix: string, unit: string][] = [
  ['KgPerM3', 'kg/m³'],
  ['KgPerMol', 'kg/mol'],
  ['PerK', '1/K'],
  ['PaS', 'Pa·s'],
  ['Percent', '%'],
  ['M3', 'm³'],
  ['Kg', 'kg'],
  ['Pa', 'Pa'],
  ['M', 'm'],
  ['K', 'K'],
  ['S', 's'],
  ['J', 'J'],
];

/**
 * @param path a dotted field path, e.g. `element.boreDiameterM`
 * @returns the unit its last name carries ("m"), or "" when it carries none (`taps`, `compressibility`)
 */
export function unitOfField(path: string): string {
  const name = path.slice(path.lastIndexOf('.') + 1);
  for (const [suffix, unit] of unitSuffixes) {
    // The suffix must start a camel-case word ("pipeDiameterM"), not end a word ("kind", "taps").
    if (name.length > suffix.length && name.endsWith(suffix) && /[a-z0-9]/.test(name[name.length - suffix.length - 1]))
      return unit;
  }
  return '';
}

/**
 * @param value a value as stored (null: the field is not set on that side)
 * @param unit the field's unit, "" for none
 * @returns the value in words, e.g. "0.048 m", "flange", "not set"
 */
export function formatFieldValue(value: unknown, unit: string): string {
  if (value === null || value === undefined) return 'not set';
  if (typeof value === 'number') {
    const shown = String(Number(value.toPrecision(12)));
    return unit ? `${shown} ${unit}` : shown;
  }
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return JSON.stringify(value);
}

/**
 * @param change one entry of a version's `changes`
 * @returns e.g. { path: "element.boreDiameterM", text: "0.05 m → 0.048 m" }
 */
export function describeFieldChange(change: { path: string; before: unknown; after: unknown }): {
  path: string;
  text: string;
} {
  const unit = unitOfField(change.path);
  return {
    path: change.path,
    text: `${formatFieldValue(change.before, unit)} → ${formatFieldValue(change.after, unit)}`,
  };
}
