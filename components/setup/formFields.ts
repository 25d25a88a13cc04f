/**
 * Helpers of the set-up forms: text to numbers, and the problems of a draft keyed by the
 * schema's field path ("element.boreDiameterM"), whether found by the shared zod schema before
 * sending or named by the server's 400 or 409 afterwards.
 */
import type { z } from 'zod';

import { ApiError } from '@/hooks/api/client';

/** Problems by field path, e.g. { "element.boreDiameterM": "must be below pipeDiameterM" }. */
export type FieldErrors = Record<string, string>;

/**
 * @param text what was typed
 * @returns undefined for an empty field, the number, or NaN for anything else (the schema then names the field)
 */
export function parseNumberText(text: string): number | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}

/** @returns the text, or undefined when it is blank (optional fields are then left out) */
export function optionalText(text: string): string | undefined {
  const trimmed = text.trim();
  return trimmed === '' ? undefined : trimmed;
}

/**
 * @param value a number to put back into a field
 * @returns its text with no more digits than a float needs to round-trip (12 significant)
 */
export function numberText(value: number | undefined | null): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(12)));
}

/**
 * @param error the ZodError of a schema's safeParse
 * @param prefix a path the schema sits under in the request body (e.g. "element")
 * @returns the first problem of each field
 */
export function fieldErrorsFromZod(error: z.ZodError, prefix?: string): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of error.issues) {
    const path = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || 'body';
    errors[path] ??= issue.message;
  }
  return errors;
}

/**
 * The server prefixes a field's message with its path ("element.boreDiameterM: must be ..."):
 * the form already shows the field, so the prefix is dropped.
 * @param error what a mutation failed with
 * @returns the problem keyed by its field, or null when the server named no field
 */
export function fieldErrorFromServer(error: unknown): FieldErrors | null {
  if (!(error instanceof ApiError) || !error.field) return null;
  const prefix = `${error.field}: `;
  return { [error.field]: error.message.startsWith(prefix) ? error.message.slice(prefix.length) : error.message };
}

/**
 * @param errors problems by field path
 * @param key a field path
 * @returns the problem of that field, or of any field under it (for a group such as "fluid.composition")
 */
export function errorFor(errors: FieldErrors, key: string): string | undefined {
  if (errors[key]) return errors[key];
  const nested = Object.keys(errors).find((path) => path.startsWith(`${key}.`));
  return nested ? errors[nested] : undefined;
}

/** @returns a test id for a field: the form's prefix and the path with dots as dashes */
export function fieldTestID(prefix: string, key: string): string {
  return `${prefix}-${key.replace(/\./g, '-')}`;
}

/**
 * When the unit a field is typed in changes, the number follows, so the quantity stays what
 * it was (14.73 psia becomes 101.56 kPa, not 14.73 kPa).
 * @param text the field's text
 * @param convert the value in the old unit to the new one
 * @returns the converted text, or the text unchanged when it is not a number
 */
export function convertNumberText(text: string, convert: (value: number) => number): string {
  const value = parseNumberText(text);
  return value === undefined || !Number.isFinite(value) ? text : numberText(convert(value));
}
