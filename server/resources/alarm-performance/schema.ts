import { z } from 'zod';
import { idField } from '../../http/params';

/** `GET /api/alarm-performance?siteId&month`: one site, one calendar month (YYYY-MM) in the site's zone. */
export const alarmPerformanceQuery = z.object({
  siteId: idField('site'),
  month: z.string({ error: 'must be a month YYYY-MM' }).regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM'),
});
