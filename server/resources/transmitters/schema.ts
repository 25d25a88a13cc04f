import { z } from 'zod';
import { idField } from '../../http/params';
import { accuracyKindField, transmitterSchema } from '../../../shared/schemas/setup';
import { datedChangeFields } from '../meter-runs/schema';

/** `GET /api/transmitters[?meterRunId]` */
export const transmitterListQuery = z.object({ meterRunId: idField('meter run').optional() });

/** `POST /api/transmitters` (the form's own schema); also re-checks a whole transmitter after a change. */
export const transmitterBody = transmitterSchema;
export type TransmitterInput = z.infer<typeof transmitterBody>;

/**
 * `PATCH /api/transmitters/:id`: a re-range, a new accuracy (or kind of accuracy figure) or calibration
 * date. The range and accuracy with its kind are dated: a change is a version in force from `effectiveFrom` (default now), with a
 * `reason`, and recomputes from then only.
 */
export const updateTransmitterBody = z
  .object({
    lowerRange: z.number().optional(),
    upperRange: z.number().optional(),
    accuracyPercentOfSpan: z.number().positive().max(10).optional(),
    accuracyKind: accuracyKindField.optional(),
    calibrationDue: z.iso.date('must be a date YYYY-MM-DD').nullable().optional(),
    ...datedChangeFields,
  })
  .strict();
export type TransmitterChanges = z.infer<typeof updateTransmitterBody>;
