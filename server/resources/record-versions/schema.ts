import { z } from 'zod';
import { isoInstant, isoInstantOrDate } from '../../http/params';

/** `GET /api/meter-runs/:id/hourly-records/versions?start` — the hour starting at `start`. */
export const hourlyVersionsQuery = z.object({ start: isoInstant });

/**
 * `GET /api/meter-runs/:id/totals/versions?interval&start` — the contract day or month starting
 * at the instant `start`, or named by the plain date `start` (a contract day's date; for a
 * month, any date in it).
 */
export const totalVersionsQuery = z.object({
  interval: z.enum(['day', 'month'], { error: 'must be day or month' }),
  start: isoInstantOrDate,
});

export type VersionedInterval = z.infer<typeof totalVersionsQuery>['interval'];
