import type { z } from 'zod';
import { badRequest } from '../errors';

/** Parses a request part with a zod schema; the first issue becomes a 400 naming its field. */
export function validate<S extends z.ZodType>(schema: S, value: unknown, where = 'body'): z.infer<S> {
  const parsed = schema.safeParse(value ?? {});
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const field = issue.path.length ? issue.path.join('.') : where;
  throw badRequest(`${field}: ${issue.message}`, field, 'invalid_field');
}
