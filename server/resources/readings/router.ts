import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { readingsQuery } from './schema';
import { readingRepository } from './repository';
import { readingsForWindow } from './use-cases';
import { presentReading } from './presenter';

/** `GET /api/readings?transmitterId=&from=&to=`: raw readings in the transmitter's unit, oldest first. */
export function readingsRouter(pool: Pool) {
  const router = Router();
  const repository = readingRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(readingsQuery, req.query, 'query');
    res.json((await readingsForWindow(repository, query)).map(presentReading));
  });

  return router;
}
