import { z } from 'zod';
import { idField } from '../../http/params';

/** A contract month in the path: `YYYY-MM`. */
export const monthParam = z
  .string()
  .regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM')
  .refine((m) => Number(m.slice(0, 4)) >= 2000, 'must be a month YYYY-MM from 2000 on');

/** `GET /api/periods/:month?siteId` */
export const periodQuery = z.object({ siteId: z.string({ error: 'is required' }).and(idField('site')) });

/** `POST /api/periods/:month/close`: `confirm: true` closes a month that is not final yet. */
export const closeBody = z
  .object({
    siteId: idField('site'),
    confirm: z.boolean({ error: 'must be true or false' }).default(false),
    reason: z.string({ error: 'must be text' }).trim().max(2000, 'must be at most 2000 characters').optional(),
  })
  .strict();
export type CloseInput = z.infer<typeof closeBody>;

/** `POST /api/periods/:month/reopen`: always with a reason. */
export const reopenBody = z
  .object({
    siteId: idField('site'),
    reason: z
      .string({ error: 'is required' })
      .trim()
      .min(1, 'is required')
      .max(2000, 'must be at most 2000 characters'),
  })
  .strict();
export type ReopenInput = z.infer<typeof reopenBody>;
