import { z } from 'zod';
import { idField } from '../../http/params';

/** A contract month as the accountant names it: YYYY-MM. */
export const contractMonth = z
  .string({ error: 'must be a month YYYY-MM' })
  .regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');

/** `GET /api/monthly-volumes?siteId&month` */
export const monthlyVolumesQuery = z.object({
  siteId: idField('site'),
  month: contractMonth,
});
