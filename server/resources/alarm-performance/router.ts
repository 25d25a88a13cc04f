import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { alarmPerformanceQuery } from './schema';
import { alarmPerformanceRepository } from './repository';
import { alarmPerformanceReport } from './use-cases';
import { presentAlarmPerformance } from './presenter';

/**
 * `GET /api/alarm-performance?siteId&month`: a site's monthly alarm performance against the
 * ISA-18.2 benchmarks. Every role reads it.
 */
export function alarmPerformanceRouter(pool: Pool, clock: () => number = Date.now) {
  const router = Router();
  const repository = alarmPerformanceRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(alarmPerformanceQuery, req.query, 'query');
    const report = await alarmPerformanceReport(repository, { ...query, nowMs: clock() });
    res.json(presentAlarmPerformance(report));
  });

  return router;
}
