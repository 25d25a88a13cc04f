import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { hourlyVersionsQuery, totalVersionsQuery } from './schema';
import { recordVersionsRepository } from './repository';
import { hourlyRecordVersions, periodTotalVersions } from './use-cases';
import { presentRecordHistory } from './presenter';

/**
 * Every version of a meter run's hourly record or contract-day / contract-month total, with the
 * first and the current figures and their difference (mounted on /meter-runs). Every role reads them.
 */
export function recordVersionsRouter(pool: Pool) {
  const router = Router();
  const repository = recordVersionsRepository(pool);

  router.get('/:id/hourly-records/versions', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(hourlyVersionsQuery, req.query, 'query');
    const history = await hourlyRecordVersions(repository, { meterRunId, startMs: Date.parse(query.start) });
    res.json(presentRecordHistory(history, 'hour'));
  });

  router.get('/:id/totals/versions', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(totalVersionsQuery, req.query, 'query');
    // A plain date names the contract day (or a day of the month); an instant is the period's start.
    const period = query.start.length === 10 ? { date: query.start } : { startMs: Date.parse(query.start) };
    const history = await periodTotalVersions(repository, { meterRunId, interval: query.interval, period });
    res.json(presentRecordHistory(history, 'total'));
  });

  return router;
}
