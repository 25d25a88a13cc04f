import { Router } from 'express';
import type { Pool } from 'pg';
import { z } from 'zod';
import { requireCapability } from '../../auth/passport';
import { notFound } from '../../errors';
import { validate } from '../../http/validate';

const qualityName = ['good', 'uncertain', 'bad', 'substituted'];
const sourceName = ['mqtt', 'csv', 'backfill'];
const isoTime = z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' });

/** `GET /api/readings?transmitterId=&from=&to=`: raw readings in the transmitter's unit, oldest first. */
export function readingsRouter(pool: Pool) {
  const router = Router();
  router.get('/', requireCapability('view'), async (req, res) => {
    const q = validate(
      z.object({
        transmitterId: z.string().regex(/^\d+$/, 'must be a transmitter id'),
        from: isoTime.optional(),
        to: isoTime.optional(),
        limit: z.coerce.number().int().min(1).max(100_000).default(10_000),
      }),
      req.query,
      'query',
    );
    const t = await pool.query('SELECT 1 FROM transmitters WHERE id = $1', [q.transmitterId]);
    if (!t.rowCount) throw notFound('Transmitter');
    const { rows } = await pool.query(
      `SELECT time, value, quality, source FROM readings WHERE transmitter_id = $1 AND time >= $2 AND time < $3 ORDER BY time LIMIT $4`,
      [q.transmitterId, q.from ?? '-infinity', q.to ?? 'infinity', q.limit],
    );
    res.json(
      rows.map((r) => ({
        time: (r.time as Date).toISOString(),
        value: r.value,
        quality: qualityName[r.quality],
        source: sourceName[r.source],
      })),
    );
  });
  return router;
}
