import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { readingsQuery } from './schema';
import { readingRepository } from './repository';
import { readingsForWindow } from './use-cases';
import { presentReading, presentReadingWithProvenance } from './presenter';

/**
 * `GET /api/readings?transmitterId=&from=&to=[&provenance=true]`: raw readings in the transmitter's
 * unit, oldest first; with provenance, each also names its device or import and its arrival time.
 */
export function readingsRouter(pool: Pool) {
  const router = Router();
  const repository = readingRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(readingsQuery, req.query, 'query');
    const readings = await readingsForWindow(repository, query);
    res.json(readings.map(query.provenance ? presentReadingWithProvenance : presentReading));
  });

  return router;
}
