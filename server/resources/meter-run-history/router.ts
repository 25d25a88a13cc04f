import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId, parseTimeWindow } from '../../http/params';
import { hourlyRecordsQuery, TOTALS_MAX_DAYS, totalsQuery, TREND_MAX_DAYS, trendQuery } from './schema';
import { meterRunHistoryRepository } from './repository';
import {
  hourlyRecordsForWindow,
  meterRunCalendar,
  recomputeStatus,
  totalsForWindow,
  trendForWindow,
} from './use-cases';
import { presentHourlyRecord, presentRecomputeStatus, presentTotal, presentTrend } from './presenter';

/**
 * Totals, downsampled trends and hourly records of a meter run (mounted on /meter-runs beside
 * the meter runs' set-up). Every role reads them.
 */
export function meterRunHistoryRouter(pool: Pool) {
  const router = Router();
  const repository = meterRunHistoryRepository(pool);

  router.get('/:id/totals', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(totalsQuery, req.query, 'query');
    // A plain date names the contract day (month) starting on it in the site's zone: the site is read first.
    const calendar = await meterRunCalendar(repository, meterRunId);
    const window = parseTimeWindow(query, {
      maxDays: TOTALS_MAX_DAYS[query.interval],
      timeZone: calendar.timeZone,
      contractHour: calendar.contractHour,
      what: `${query.interval}ly totals`,
    });
    const totals = await totalsForWindow(repository, { meterRunId, interval: query.interval, calendar, ...window });
    res.json(totals.map(presentTotal));
  });

  /** How many hours of the meter run wait for recomputation (late data, a back-dated change). */
  router.get('/:id/recompute-status', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    res.json(presentRecomputeStatus(await recomputeStatus(repository, meterRunId)));
  });

  router.get('/:id/hourly-records', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(hourlyRecordsQuery, req.query, 'query');
    // No window check here: a reversed window simply holds no hour (as it always has).
    const window = { fromMs: Date.parse(query.from), toMs: Date.parse(query.to) };
    const records = await hourlyRecordsForWindow(repository, { meterRunId, ...window });
    res.json(records.map(presentHourlyRecord));
  });

  router.get('/:id/trend', requireCapability('view'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const query = validate(trendQuery, req.query, 'query');
    const window = parseTimeWindow(query, { maxDays: TREND_MAX_DAYS });
    const trend = await trendForWindow(repository, { meterRunId, buckets: query.buckets, ...window });
    res.json(presentTrend(query, trend));
  });

  return router;
}
