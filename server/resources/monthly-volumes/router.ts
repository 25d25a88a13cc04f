import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { monthlyVolumesQuery } from './schema';
import { monthlyVolumesRepository } from './repository';
import { monthlyVolumes } from './use-cases';
import { presentMonthlyVolumes } from './presenter';

/**
 * `GET /api/monthly-volumes?siteId&month=YYYY-MM`: the accountant's month of a site. Every role
 * may read it (it is a view of the totals).
 */
export function monthlyVolumesRouter(pool: Pool) {
  const router = Router();
  const repository = monthlyVolumesRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(monthlyVolumesQuery, req.query, 'query');
    res.json(presentMonthlyVolumes(await monthlyVolumes(repository, query)));
  });

  return router;
}
