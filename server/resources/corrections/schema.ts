import { z } from 'zod';
import { idField, isoInstant } from '../../http/params';

const num = z.number({ error: 'must be a number' }).finite('must be a finite number');
const reason = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(2000, 'must be at most 2000 characters');

/** Readings of one transmitter replaced over the period: a fixed value in its unit, or the value held from before. */
const substitute = z.union(
  [
    z.object({ transmitterId: idField('transmitter'), value: num }).strict(),
    z.object({ transmitterId: idField('transmitter'), hold: z.literal(true) }).strict(),
  ],
  { error: 'must be { transmitterId, value } or { transmitterId, hold: true }' },
);

/**
 * `POST /api/corrections`: a substitution (a quantity `massKg` for the period, or substituted
 * readings `substitute`) or an adjustment (`factor`), always with a reason. `origin: 'estimate'`
 * proposes the server's estimate for the period (massKg may be left out; if given, it must be the estimate).
 */
export const proposeCorrectionBody = z
  .object({
    meterRunId: idField('meter run'),
    start: isoInstant,
    end: isoInstant,
    kind: z.enum(['substitute', 'adjust'], { error: 'must be substitute or adjust' }),
    massKg: num.nonnegative('must be 0 or more').optional(),
    factor: num.positive('must be above 0').optional(),
    substitute: substitute.optional(),
    origin: z.enum(['manual', 'estimate'], { error: 'must be manual or estimate' }).default('manual'),
    reason,
  })
  .strict();
export type ProposeCorrectionInput = z.infer<typeof proposeCorrectionBody>;

/** `POST /api/corrections/:id/approve` and `/reject`. */
export const decisionBody = z.object({ reason }).strict();

/** `GET /api/corrections?meterRunId&status` */
export const correctionsQuery = z.object({
  meterRunId: idField('meter run').optional(),
  status: z.enum(['proposed', 'approved', 'rejected'], { error: 'must be proposed, approved or rejected' }).optional(),
});

/** `GET /api/corrections/estimate?meterRunId&start&end` */
export const estimateQuery = z.object({
  meterRunId: z.string({ error: 'is required' }).and(idField('meter run')),
  start: isoInstant,
  end: isoInstant,
});

/** A correction covers at most this long (a quarter); longer spans are a configuration matter. */
export const CORRECTION_MAX_DAYS = 92;
