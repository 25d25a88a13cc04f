import { z } from 'zod';
import { idField, isoInstant, isoInstantOrDate } from '../../http/params';

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
  /** Contract days starting at or after this instant are judged by the new tolerance (default now). */
  effectiveFrom: isoInstant.optional(),
  reason: z.string({ error: 'must be text' }).trim().min(1, 'must say why the tolerance changes').max(2000),
});

/** A year with its neighbouring months, as for totals. */
export const RECONCILIATIONS_MAX_DAYS = 400;
