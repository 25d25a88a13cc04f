import { z } from 'zod';
import { idField, isoInstant } from '../../http/params';

/**
 * `GET /api/readings?transmitterId[&from][&to][&limit][&provenance]`: an open window when from or to
 * is left out.
 */
export const readingsQuery = z.object({
  transmitterId: idField('transmitter'),
  from: isoInstant.optional(),
  to: isoInstant.optional(),
  limit: z.coerce.number().int().min(1).max(100_000).default(10_000),
  /** `true`: each reading also says its device, its import and its arrival time. */
  provenance: z
    .enum(['true', 'false'], { error: 'must be true or false' })
    .default('false')
    .transform((v) => v === 'true'),
});
export type ReadingsQuery = z.infer<typeof readingsQuery>;
