import { z } from 'zod';
import { idField } from '../../http/params';
import { contractMonth } from '../monthly-volumes/schema';

/** `GET /api/exports/monthly-volumes?month&siteId&format=csv|xlsx` */
export const monthlyVolumesExportQuery = z.object({
  month: contractMonth,
  siteId: idField('site'),
  format: z.enum(['csv', 'xlsx'], { error: 'must be csv or xlsx' }),
});

/** `GET /api/exports/monthly-statement?month&siteId&format=html` */
export const monthlyStatementQuery = z.object({
  month: contractMonth,
  siteId: idField('site'),
  format: z.enum(['html'], { error: 'must be html' }).default('html'),
});
