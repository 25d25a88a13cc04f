import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { notFound } from '../../errors';
import { validate } from '../../http/validate';
import { parseId, parseTimeWindow } from '../../http/params';
import { RANGE_HEALTH_MAX_DAYS, rangeHealthQuery } from './schema';
import { rangeHealthRepository } from './repository';
import { rangeHealthReport } from './use-cases';
import { presentRangeHealth } from './presenter';

/**
 * `GET /api/meter-runs/:id/range-health?from&to`. Every role may read it (it is a view of the
 * totals); the engineer acts on it.
 */
export function rangeHealthRouter(pool: Pool) {
  const router = Router();
  const repository = rangeHealthRepository(pool);

  router.get('/:id/range-health', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(rangeHealthQuery, req.query, 'query');
    const window = parseTimeWindow(query, { maxDays: RANGE_HEALTH_MAX_DAYS });
    const report = await rangeHealthReport(repository, {
      meterRunId,
      ...window,
      uncertaintyLimitPercent: query.uncertaintyLimitPercent,
    });
    if (!report) throw notFound('Meter run');
    res.json(presentRangeHealth(report));
  });

  return router;
}
