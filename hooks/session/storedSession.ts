/** The shape of a signed-in session as kept between page loads, and its parser. */
import { z } from 'zod';

import { roles } from '@/constants/roles';

export const sessionUserSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const storedSessionSchema = z.object({
  token: z.string().min(1),
  user: sessionUserSchema,
});
export type StoredSession = z.infer<typeof storedSessionSchema>;

/**
 * @param raw the stored JSON text, or null when nothing is stored
 * @returns the session, or null when the text is missing, unreadable or of an old shape
 */
export function parseStoredSession(raw: string | null): StoredSession | null {
  if (!raw) return null;
  try {
    const parsed = storedSessionSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
