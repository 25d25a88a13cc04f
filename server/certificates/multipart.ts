import { badRequest } from '../errors';

/**
 * The record of a request that may come with a certificate: a JSON body as it is, or the JSON
 * text of the multipart form field `field` (a form cannot carry nested objects otherwise).
 * @param what how the error names the record ("the calibration"); the field's name by default
 * @throws bad request naming `field` when the form has no such text or it is not JSON
 */
export function jsonFieldPayload(body: unknown, multipart: boolean, field: string, what = `the ${field}`): unknown {
  if (!multipart) return body;
  const raw = (body as Record<string, unknown> | undefined)?.[field];
  if (typeof raw !== 'string')
    throw badRequest(`${field}: send ${what} as JSON text in the form field "${field}"`, field);
  try {
    return JSON.parse(raw) as unknown;
  } catch {
    throw badRequest(`${field}: is not valid JSON`, field);
  }
}
