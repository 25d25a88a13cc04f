import { Router } from 'express';
import type { Pool } from 'pg';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId, parseTimeWindow } from '../../http/params';
import { RECONCILIATIONS_MAX_DAYS, reconciliationsQuery, toleranceBody } from './schema';
import { reconciliationRepository } from './repository';
import {
  reconciliationMeterRun,
  reconciliationsForWindow,
  reconciliationSummary,
  listToleranceVersions,
  setReconciliationTolerance,
} from './use-cases';
import { presentReconciliation, presentReconciliationSum, presentToleranceVersion } from './presenter';

/**
 * Reconciliation against field totals (issue 10 §2). Everyone who sees totals reads it; the
 * tolerance is part of a meter run's configuration (engineer, admin).
 * - `GET /api/reconciliations?meterRunId&from&to`: one row per contract day and quantity with a field total;
 * - `GET /api/reconciliations/summary?meterRunId&from&to`: their sums per quantity and unit (a month's sum);
 * - `GET /api/reconciliations/tolerances/:id`: the meter run's dated tolerance versions, oldest first;
 * - `PATCH /api/reconciliations/tolerances/:id { tolerancePercent, effectiveFrom?, reason }`: a new
 *   dated version judging the contract days that start from `effectiveFrom` (default now) on (audited).
 * `from` and `to` are instants, or plain dates read in the site's zone.
 */
export function reconciliationsRouter(pool: Pool, sequelize: Sequelize) {
  const router = Router();
  const repository = reconciliationRepository(pool);

  /** The query's meter run and window (a plain date needs the site's zone, so the meter run is read first). */
  const request = async (query: unknown) => {
    const q = validate(reconciliationsQuery, query, 'query');
    const run = await reconciliationMeterRun(repository, q.meterRunId);
    const window = parseTimeWindow(q, { maxDays: RECONCILIATIONS_MAX_DAYS, timeZone: run.timeZone });
    return { run, ...window };
  };

  router.get('/', requireCapability('view'), async (req, res) => {
    const days = await reconciliationsForWindow(repository, await request(req.query));
    res.json(days.map(presentReconciliation));
  });

  router.get('/summary', requireCapability('view'), async (req, res) => {
    const r = await request(req.query);
    const sums = await reconciliationSummary(repository, r);
    res.json(sums.map((s) => presentReconciliationSum(r, s)));
  });

  router.get('/tolerances/:id', requireCapability('view'), async (req, res) => {
    const versions = await listToleranceVersions(repository, parseId(req.params.id, 'Meter run'));
    res.json(versions.map((v) => presentToleranceVersion(parseId(req.params.id, 'Meter run'), v)));
  });

  router.patch('/tolerances/:id', requireCapability('configure'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const body = validate(toleranceBody, req.body);
    const version = await setReconciliationTolerance(
      { repository, sequelize },
      { meterRunId, ...body, actor: req.user! },
    );
    res.json(presentToleranceVersion(meterRunId, version));
  });

  return router;
}
