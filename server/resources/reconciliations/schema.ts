import { z } from 'zod';
import { idField, isoInstantOrDate } from '../../http/params';

/** `GET /api/reconciliations?meterRunId&from&to` and `GET /api/reconciliations/summary?meterRunId&from&to` */
export const reconciliationsQuery = z.object({
  meterRunId: idField('meter run'),
  from: isoInstantOrDate,
  to: isoInstantOrDate,
});

/** `PATCH /api/reconciliations/tolerances/:id` (the meter run's id) */
export const toleranceBody = z.object({
  tolerancePercent: z
    .number({ error: 'must be a number of percent' })
    .positive('must be above 0')
    .max(100, 'must be at most 100'),
});

/** A year with its neighbouring months, as for totals. */
export const RECONCILIATIONS_MAX_DAYS = 400;
