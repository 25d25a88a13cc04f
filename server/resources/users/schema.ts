import { z } from 'zod';
import { roles } from '../../../shared/auth/roles';

const email = z.string().trim().toLowerCase().pipe(z.email('must be an email address'));

export const createUserSchema = z.object({
  email,
  name: z.string().trim().min(1, 'is required').max(200),
  role: z.enum(roles, { error: `must be one of ${roles.join(', ')}` }),
  password: z.string().min(8, 'must be at least 8 characters').max(200),
});

export const updateUserSchema = z
  .object({
    name: z.string().trim().min(1, 'is required').max(200).optional(),
    role: z.enum(roles, { error: `must be one of ${roles.join(', ')}` }).optional(),
    disabled: z.boolean({ error: 'must be true or false' }).optional(),
    password: z.string().min(8, 'must be at least 8 characters').max(200).optional(),
  })
  .strict();
