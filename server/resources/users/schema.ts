import { z } from 'zod';
import { roles } from '../../../shared/auth/roles';
import { normaliseEmail } from '../../auth/email';
import { passwordMaxLength } from '../../auth/password-policy';

// Stored as sign-in looks it up (server/auth/email.ts): trimmed and lower-cased.
const email = z.string().transform(normaliseEmail).pipe(z.email('must be an email address'));
// Length and strength are the password policy's (server/auth/password-policy.ts), checked by the use case
// with the account's email; the bound here only keeps an absurd body from reaching it.
const password = z
  .string()
  .min(1, 'is required')
  .max(4 * passwordMaxLength, `must be at most ${passwordMaxLength} characters`);

export const createUserSchema = z.object({
  email,
  name: z.string().trim().min(1, 'is required').max(200),
  role: z.enum(roles, { error: `must be one of ${roles.join(', ')}` }),
  password,
});

export const updateUserSchema = z
  .object({
    name: z.string().trim().min(1, 'is required').max(200).optional(),
    role: z.enum(roles, { error: `must be one of ${roles.join(', ')}` }).optional(),
    disabled: z.boolean({ error: 'must be true or false' }).optional(),
    password: password.optional(),
  })
  .strict();
