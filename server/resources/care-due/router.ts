import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { careDueQuery } from './schema';
import { listCareDue } from './use-cases';
import { presentCareDue } from './presenter';

/**
 * `GET /api/sites/:id/care-due[?sort=due|-due]`: what is due or overdue in the care of the
 * site's meters (issue 11 §4). Every role reads it; engineers act on it.
 */
export function careDueRouter(pool: Pool, options: { now?: () => number } = {}) {
  const router = Router();
  const now = options.now ?? Date.now;

  router.get('/:id/care-due', requireCapability('view'), async (req, res) => {
    const siteId = parseId(req.params.id, 'Site');
    const { sort } = validate(careDueQuery, req.query, 'query');
    res.json(presentCareDue(await listCareDue(pool, { siteId, sort, nowMs: now() })));
  });

  return router;
}
