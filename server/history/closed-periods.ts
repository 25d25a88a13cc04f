import type { Pool } from 'pg';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { conflict } from '../errors';
import type { RecomputeReason } from './record-causes';

/**
 * Closed accounting periods (issue 10 §5): a site's contract month is closed when the latest row
 * of `period_closes` for it is a close (migration 0011). A closed month's hours and totals are
 * not recomputed; what would have recomputed them waits in `held_hours` until a reopen.
 */

/** The months of a site whose latest action is a close, with their bounds, as a SQL subquery ($1: the site id). */
const closedMonthsOfSite = `
  SELECT month, start_at, end_at FROM (
    SELECT DISTINCT ON (month) month, action, start_at, end_at
      FROM period_closes WHERE site_id = $1 ORDER BY month, id DESC
  ) latest WHERE action = 'close'`;
const siteOfMeterRun = '(SELECT site_id FROM meter_runs WHERE id = $1::bigint)';

/**
 * @returns whether [startMs, endMs) of the meter run touches a closed contract month of its site
 */
export async function periodIsClosed(pool: Pool, meterRunId: string, startMs: number, endMs: number): Promise<boolean> {
  const { rows } = await pool.query<{ closed: boolean }>(
    `SELECT EXISTS (
       SELECT 1 FROM (${closedMonthsOfSite.replace('site_id = $1', `site_id = ${siteOfMeterRun}`)}) c
        WHERE c.start_at < to_timestamp($3 / 1000.0) AND c.end_at > to_timestamp($2 / 1000.0)
     ) AS closed`,
    [meterRunId, startMs, endMs],
  );
  return rows[0].closed;
}

/**
 * Keeps hours the worker skipped because their month is closed, so the month lists them as
 * pending and a reopen recomputes them. The hourly sweep's hours ('scheduled') are not kept:
 * nothing new came for them.
 */
export async function holdHours(
  pool: Pool,
  meterRunId: string,
  hours: number[],
  reasons: Map<number, RecomputeReason>,
): Promise<void> {
  const kept = hours.filter((h) => (reasons.get(h)?.cause ?? 'late-readings') !== 'scheduled');
  if (!kept.length) return;
  await pool.query(
    `INSERT INTO held_hours (meter_run_id, start, cause, cause_reference)
     SELECT $1, to_timestamp(h.ms / 1000.0), h.cause, h.reference
       FROM unnest($2::float8[], $3::text[], $4::text[]) AS h (ms, cause, reference)
     ON CONFLICT (meter_run_id, start) DO UPDATE SET held_at = clock_timestamp()`,
    [
      meterRunId,
      kept,
      kept.map((h) => reasons.get(h)?.cause ?? 'late-readings'),
      kept.map((h) => reasons.get(h)?.reference ?? null),
    ],
  );
}

/**
 * The first closed contract month at or after `fromMs` of a site (`siteId`) or of a meter run's
 * site (`meterRunId`): a dated change from `fromMs` on would change it.
 * @returns 'YYYY-MM', or null when none is closed
 */
export async function firstClosedMonthFrom(
  sequelize: Sequelize,
  scope: { siteId: string } | { meterRunId: string },
  fromMs: number,
  transaction?: Transaction,
): Promise<string | null> {
  const site = 'siteId' in scope ? '$1::bigint' : siteOfMeterRun;
  const rows = await sequelize.query<{ month: string }>(
    `SELECT month FROM (${closedMonthsOfSite.replace('site_id = $1', `site_id = ${site}`)}) c
      WHERE c.end_at > to_timestamp($2 / 1000.0) ORDER BY c.start_at LIMIT 1`,
    {
      bind: ['siteId' in scope ? scope.siteId : scope.meterRunId, fromMs],
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows[0]?.month ?? null;
}

/**
 * Refuses a dated change (a configuration version, a dated setting) that would change a closed
 * month: 409 'period_closed' naming the month and `field` (issue 9's rule, as corrections).
 */
export async function refuseDatedChangeInClosedMonth(
  sequelize: Sequelize,
  scope: { siteId: string } | { meterRunId: string },
  effectiveFrom: Date,
  field = 'effectiveFrom',
): Promise<void> {
  const month = await firstClosedMonthFrom(sequelize, scope, effectiveFrom.getTime());
  if (month)
    throw conflict(
      `The contract month ${month} is closed: a change in force from ${effectiveFrom.toISOString()} would change it. Reopen the month first.`,
      field,
      'period_closed',
    );
}
