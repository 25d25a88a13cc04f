import { z } from 'zod';
import { isoInstant, isoInstantOrDate } from '../../http/params';

/**
 * `GET /api/meter-runs/:id/totals?interval&from&to`: from/to are instants, or plain dates meaning
 * the start of that date in the site's zone (a person asks for "1 to 4 November", not for UTC).
 */
export const totalsQuery = z.object({
  interval: z.enum(['hour', 'day', 'month'], { error: 'must be hour, day or month' }),
  from: isoInstantOrDate,
  to: isoInstantOrDate,
});

export type TotalsInterval = z.infer<typeof totalsQuery>['interval'];

/** Longest window per request: two months of hourly totals, ten years of days or months. */
export const TOTALS_MAX_DAYS: Record<TotalsInterval, number> = { hour: 62, day: 3700, month: 3700 };

/** `GET /api/meter-runs/:id/hourly-records?from&to` (hours starting in [from, to)). */
export const hourlyRecordsQuery = z.object({ from: isoInstant, to: isoInstant });

/** `GET /api/meter-runs/:id/trend?from&to[&buckets]` */
export const trendQuery = z.object({
  from: isoInstant,
  to: isoInstant,
  buckets: z.coerce.number().int().min(10).max(5000).default(600),
});

/**
 * A trend has no longest window: its answer is bounded by `buckets`, and the database reduces
 * the readings of the whole window to them.
 */
export const TREND_MAX_DAYS = Number.POSITIVE_INFINITY;
