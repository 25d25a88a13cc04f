import { z } from 'zod';

export const loginSchema = z.object({
  email: z.string().trim().min(1, 'is required').max(320),
  password: z.string().min(1, 'is required').max(200),
});
