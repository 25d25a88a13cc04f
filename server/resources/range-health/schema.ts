import { z } from 'zod';
import { isoInstant } from '../../http/params';

/** `GET /api/meter-runs/:id/range-health?from&to[&uncertaintyLimitPercent]` */
export const rangeHealthQuery = z.object({
  from: isoInstant,
  to: isoInstant,
  uncertaintyLimitPercent: z.coerce.number().positive('must be above 0').max(10, 'must be at most 10').default(1),
});

/** A report reads hourly records; 400 days covers a year with its neighbouring months. */
export const RANGE_HEALTH_MAX_DAYS = 400;
