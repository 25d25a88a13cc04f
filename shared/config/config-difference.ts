/**
 * The field-by-field difference between two configurations (element and fluid as stored, plain
 * JSON), so an auditor sees exactly what a new version changed without comparing two documents.
 */

/** A JSON value as stored in the database (jsonb). */
export type JsonValue = null | boolean | number | string | JsonValue[] | { [key: string]: JsonValue };

/** One changed field: `before` or `after` is null when the field is missing on that side. */
export interface FieldChange {
  /** Dotted path; array items by index (`element.boreDiameterM`, `fluid.composition.2.moleFraction`). */
  path: string;
  before: JsonValue;
  after: JsonValue;
}

type Container = JsonValue[] | { [key: string]: JsonValue };

/** Arrays and plain objects (a Date or a class instance is not JSON and is refused as a leaf). */
const isContainer = (v: unknown): v is Container =>
  Array.isArray(v) || (typeof v === 'object' && v !== null && Object.getPrototypeOf(v) === Object.prototype);
const isEmpty = (v: Container) => (Array.isArray(v) ? v.length === 0 : Object.keys(v).length === 0);

/** The keys (or indexes) to visit, in a fixed order: jsonb does not keep the order keys were written in. */
function keysOf(a: Container | undefined, b: Container | undefined): string[] {
  if (Array.isArray(a) || Array.isArray(b)) {
    const length = Math.max(Array.isArray(a) ? a.length : 0, Array.isArray(b) ? b.length : 0);
    return Array.from({ length }, (_, i) => String(i));
  }
  return [...new Set([...Object.keys(a ?? {}), ...Object.keys(b ?? {})])].sort();
}

function child(v: Container | undefined, key: string): JsonValue | undefined {
  if (v === undefined) return undefined;
  return Array.isArray(v) ? v[Number(key)] : v[key];
}

const isJsonLeaf = (v: unknown) =>
  v === null || typeof v === 'string' || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v));

/** Checks that a value is plain JSON, so every change reported can be stored and shown as it is. */
function assertJson(v: unknown, path: string): asserts v is JsonValue {
  if (isContainer(v)) {
    for (const key of keysOf(v, undefined)) assertJson(child(v, key), path ? `${path}.${key}` : key);
  } else if (!isJsonLeaf(v)) {
    throw new Error(`configDifference: ${path || 'the value'} is ${String(v)}, which JSON cannot hold`);
  }
}

function visit(path: string, a: JsonValue, b: JsonValue, out: FieldChange[]) {
  const left = isContainer(a) ? a : undefined;
  const right = isContainer(b) ? b : undefined;
  // Descend while both sides are containers of the same kind, or one side is missing: a field
  // added or removed inside an object is then reported leaf by leaf, with null on the missing side.
  const sameKind = left && right && Array.isArray(left) === Array.isArray(right);
  const oneMissing = (left && b === null) || (right && a === null);
  if (sameKind || oneMissing) {
    const container = (left ?? right) as Container;
    // An empty object or array added or removed has no leaves: report it whole.
    if (oneMissing && isEmpty(container)) {
      out.push({ path, before: a, after: b });
      return;
    }
    for (const key of keysOf(left, right))
      visit(path ? `${path}.${key}` : key, child(left, key) ?? null, child(right, key) ?? null, out);
    return;
  }
  // A value that changed kind (a number became an object, an array an object) is reported whole;
  // leaves compare exactly: a diameter re-measured to the tenth of a micrometre is still a change.
  if (left || right || a !== b) out.push({ path, before: a, after: b });
}

/**
 * The fields that differ between two configurations.
 * @param before the earlier configuration, plain JSON (e.g. `{ element, fluid }` of the version before)
 * @param after the later configuration
 * @returns one entry per changed leaf, in path order (object keys sorted, array items by index);
 *   empty when the two are equal
 * @throws when a value is not JSON (NaN, Infinity, a Date, a function…), naming its path
 * @example
 * configDifference({ element: { boreDiameterM: 0.05 } }, { element: { boreDiameterM: 0.048 } })
 * // → [{ path: 'element.boreDiameterM', before: 0.05, after: 0.048 }]
 */
export function configDifference(before: unknown, after: unknown): FieldChange[] {
  const a = before ?? null;
  const b = after ?? null;
  assertJson(a, '');
  assertJson(b, '');
  const out: FieldChange[] = [];
  visit('', a, b, out);
  return out;
}
