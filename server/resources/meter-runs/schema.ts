import { z } from 'zod';
import { idField } from '../../http/params';
import { configVersionSchema, meterRunSchema } from '../../../shared/schemas/setup';

/** `GET /api/meter-runs[?siteId]` */
export const meterRunListQuery = z.object({ siteId: idField('site').optional() });

/** `POST /api/meter-runs`: a meter run with its first configuration (the form's own schema). */
export const createMeterRunBody = meterRunSchema;
export type CreateMeterRunInput = z.infer<typeof createMeterRunBody>;

/**
 * `PATCH /api/meter-runs/:id`: what may change in place. The element and fluid change only
 * through a new configuration version, so history before it keeps the old ones.
 */
export const updateMeterRunBody = z
  .object({
    name: z.string().trim().min(1).max(200).optional(),
    holdLimitS: z.number().positive().optional(),
    maxGapS: z.number().positive().optional(),
    line: meterRunSchema.shape.line.optional(),
  })
  .strict();
export type MeterRunChanges = z.infer<typeof updateMeterRunBody>;

/** `POST /api/meter-runs/:id/config-versions` */
export const createConfigVersionBody = configVersionSchema;
export type CreateConfigVersionInput = z.infer<typeof createConfigVersionBody>;
