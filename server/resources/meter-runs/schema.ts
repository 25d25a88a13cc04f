import { z } from 'zod';
import { idField } from '../../http/params';
import { configVersionSchema, meterRunSchema } from '../../../shared/schemas/setup';

/** `GET /api/meter-runs[?siteId]` */
export const meterRunListQuery = z.object({ siteId: idField('site').optional() });

/**
 * The no-flow cutoff, percent of the active DP transmitter's span (0.5 % unless set): a DP below
 * it is valid time without flow.
 */
const noFlowCutoffPercentOfSpan = z
  .number({ error: 'noFlowCutoffPercentOfSpan must be a number' })
  .refine((v) => Number.isFinite(v) && v >= 0 && v <= 10, 'must be between 0 and 10 % of span');

/** When a dated setting takes effect (default: now), and why it changed. */
export const datedChangeFields = {
  effectiveFrom: z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' }).optional(),
  reason: z.string().trim().max(1000).optional(),
};

/** `POST /api/meter-runs`: a meter run with its first configuration (the form's own schema) and no-flow cutoff. */
export const createMeterRunBody = z.intersection(
  meterRunSchema,
  z.object({ noFlowCutoffPercentOfSpan: noFlowCutoffPercentOfSpan.default(0.5) }),
);
export type CreateMeterRunInput = z.infer<typeof createMeterRunBody>;

/**
 * `PATCH /api/meter-runs/:id`: what may change in place. The element and fluid change only
 * through a new configuration version, so history before it keeps the old ones. The hold limit,
 * largest gap and no-flow cutoff are dated settings: a change is a version in force from
 * `effectiveFrom` (default now), with a `reason`, and recomputes from then only.
 */
export const updateMeterRunBody = z
  .object({
    name: z.string().trim().min(1).max(200).optional(),
    holdLimitS: z.number().positive().optional(),
    maxGapS: z.number().positive().optional(),
    noFlowCutoffPercentOfSpan: noFlowCutoffPercentOfSpan.optional(),
    // Without its default ({}): a PATCH that leaves the line out must not wipe it.
    line: meterRunSchema.shape.line.unwrap().optional(),
    ...datedChangeFields,
  })
  .strict();
export type MeterRunChanges = z.infer<typeof updateMeterRunBody>;

/** `POST /api/meter-runs/:id/config-versions` */
export const createConfigVersionBody = configVersionSchema;
export type CreateConfigVersionInput = z.infer<typeof createConfigVersionBody>;
