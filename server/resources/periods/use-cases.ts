import type { Sequelize } from 'sequelize';
import { contractCalendar } from '../../../shared/history/contract-calendar';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict } from '../../errors';
import type {
  HeldHourRecord,
  OpenAlarmRecord,
  PendingImportRecord,
  PeriodActionRecord,
  PeriodsRepository,
  ProposedCorrectionRecord,
  SiteCalendarRecord,
} from './repository';
import type { CloseInput, ReopenInput } from './schema';

/** Alarm conditions that keep a month from being final while they are not back to normal (issue 10 §2, §3). */
export const MONTH_END_ALARM_CONDITIONS = ['reconciliation-out-of-tolerance', 'balance-out-of-tolerance'] as const;

export interface PeriodDeps {
  sequelize: Sequelize;
  repository: PeriodsRepository;
  /** Called after a reopen is committed: the history worker recomputes the meter runs' hours of [fromMs, toMs). */
  reopened: (meterRunIds: string[], fromMs: number, toMs: number, reference: string) => Promise<void>;
}

/** Hours of one meter run that are not final in the month. */
export interface HourGaps {
  meterRunId: string;
  tag: string;
  /** Hours of the month (up to now) with no record. */
  missingHours: number;
  /** Records computed before their hour ended. */
  provisionalRecords: number;
  /** Hours waiting in the recompute queue. */
  queuedHours: number;
}

/** What is not final in a month: empty lists when it is. */
export interface Incomplete {
  hours: HourGaps[];
  corrections: ProposedCorrectionRecord[];
  alarms: OpenAlarmRecord[];
}

/** A site's contract month: its status, what is held as pending and what is not final. */
export interface PeriodView {
  site: SiteCalendarRecord;
  month: string;
  startMs: number;
  endMs: number;
  status: 'open' | 'closed';
  /** The close in force (null while open). */
  closed: PeriodActionRecord | null;
  pending: { hours: (HeldHourRecord & { tag: string })[]; imports: PendingImportRecord[] };
  incomplete: Incomplete;
}

const hourS = 3600;

/** @throws bad request naming siteId when there is no such site */
async function siteOf(repository: PeriodsRepository, siteId: string): Promise<SiteCalendarRecord> {
  const site = await repository.site(siteId);
  if (!site) throw badRequest('siteId: no such site', 'siteId', 'invalid_field');
  return site;
}

/** The month's bounds on the site's contract calendar (its contract hour as dated). */
function monthBounds(site: SiteCalendarRecord, month: string) {
  return contractCalendar(site.timeZone, site.contractHours, site.contractHour).monthBounds(month);
}

/** What is not final in [startMs, endMs) of the site's meter runs (hours counted up to now). */
async function incompleteOf(
  repository: PeriodsRepository,
  site: SiteCalendarRecord,
  bounds: { startMs: number; endMs: number },
  nowMs: number,
): Promise<Incomplete> {
  const [runs, coverage, corrections, alarms] = await Promise.all([
    repository.meterRuns(site.id),
    repository.hourCoverage(site.id, bounds),
    repository.proposedCorrections(site.id, bounds),
    repository.openAlarms(site.id, MONTH_END_ALARM_CONDITIONS),
  ]);
  const expectedS = Math.max(0, (Math.min(bounds.endMs, nowMs) - bounds.startMs) / 1000);
  const hours = runs
    .map((run): HourGaps => {
      const c = coverage.find((x) => x.meterRunId === run.id);
      const missingHours = Math.max(0, Math.round(((expectedS - (c?.coveredS ?? 0)) / hourS) * 100) / 100);
      return {
        meterRunId: run.id,
        tag: run.tag,
        missingHours,
        provisionalRecords: c?.provisionalRecords ?? 0,
        queuedHours: c?.queuedHours ?? 0,
      };
    })
    .filter((h) => h.missingHours > 0 || h.provisionalRecords > 0 || h.queuedHours > 0);
  return { hours, corrections, alarms };
}

const isFinal = (i: Incomplete) => !i.hours.length && !i.corrections.length && !i.alarms.length;

/** "12 hours missing (FT-101), 1 correction awaiting approval, …" */
function describeIncomplete(i: Incomplete): string {
  const parts: string[] = [];
  for (const h of i.hours) {
    const what = [
      h.missingHours > 0 ? `${h.missingHours} hours missing` : null,
      h.provisionalRecords > 0 ? `${h.provisionalRecords} provisional records` : null,
      h.queuedHours > 0 ? `${h.queuedHours} hours waiting to be recomputed` : null,
    ].filter(Boolean);
    parts.push(`${h.tag}: ${what.join(', ')}`);
  }
  if (i.corrections.length)
    parts.push(
      `${i.corrections.length} correction${i.corrections.length === 1 ? '' : 's'} awaiting approval (${i.corrections.map((c) => c.id).join(', ')})`,
    );
  if (i.alarms.length)
    parts.push(
      `${i.alarms.length} alarm${i.alarms.length === 1 ? '' : 's'} still open (${i.alarms.map((a) => `${a.condition} ${a.id}`).join(', ')})`,
    );
  return parts.join('; ');
}

/**
 * A site's contract month as the month-end screen shows it.
 * @throws bad request naming siteId for an unknown site
 */
export async function getPeriod(
  repository: PeriodsRepository,
  request: { siteId: string; month: string; nowMs?: number },
): Promise<PeriodView> {
  const site = await siteOf(repository, request.siteId);
  const bounds = monthBounds(site, request.month);
  const latest = await repository.latestAction(site.id, request.month);
  const closed = latest?.action === 'close' ? latest : null;
  const [held, imports, runs, incomplete] = await Promise.all([
    repository.heldHours(site.id, bounds),
    closed ? repository.importsSince(site.id, bounds, closed.actedAt.getTime()) : Promise.resolve([]),
    repository.meterRuns(site.id),
    incompleteOf(repository, site, bounds, request.nowMs ?? Date.now()),
  ]);
  const tagOf = new Map(runs.map((r) => [r.id, r.tag]));
  return {
    site,
    month: request.month,
    startMs: bounds.startMs,
    endMs: bounds.endMs,
    status: closed ? 'closed' : 'open',
    closed,
    pending: { hours: held.map((h) => ({ ...h, tag: tagOf.get(h.meterRunId) ?? '' })), imports },
    incomplete,
  };
}

/**
 * Closes a site's contract month (accountant, admin): from now on its hourly records and totals
 * do not change; its totals read 'closed'. A month that is not final (hours missing or
 * provisional, corrections awaiting approval, reconciliation or balance alarms open) closes only
 * with `confirm: true`, and the close keeps the list of what was not final. Audited.
 * @throws bad request naming siteId; conflict naming month when it has not ended or is already
 *   closed; conflict naming confirm when it is not final and confirm is not true
 */
export async function closePeriod(
  deps: PeriodDeps,
  request: { month: string; input: CloseInput; actor: SignedInUser; nowMs?: number },
): Promise<PeriodView> {
  const { month, input, actor } = request;
  const nowMs = request.nowMs ?? Date.now();
  const site = await siteOf(deps.repository, input.siteId);
  const bounds = monthBounds(site, month);
  if (bounds.endMs > nowMs)
    throw conflict(
      `The contract month ${month} of site ${site.code} has not ended yet (it ends ${new Date(bounds.endMs).toISOString()}).`,
      'month',
      'period_running',
    );
  await deps.sequelize.transaction(async (transaction) => {
    await deps.repository.lockMonth(site.id, month, transaction);
    const latest = await deps.repository.latestAction(site.id, month, transaction);
    if (latest?.action === 'close')
      throw conflict(
        `The contract month ${month} of site ${site.code} is already closed (since ${latest.actedAt.toISOString()}).`,
        'month',
        'period_closed',
      );
    const incomplete = await incompleteOf(deps.repository, site, bounds, nowMs);
    const final = isFinal(incomplete);
    if (!final && !input.confirm)
      throw conflict(
        `The contract month ${month} of site ${site.code} is not final: ${describeIncomplete(incomplete)}. Close it with confirm: true to close it as it is.`,
        'confirm',
        'period_incomplete',
      );
    const id = await deps.repository.insertAction(
      {
        siteId: site.id,
        month,
        action: 'close',
        startMs: bounds.startMs,
        endMs: bounds.endMs,
        incomplete: final ? null : incomplete,
        reason: input.reason ?? null,
        actedBy: actor.id,
      },
      transaction,
    );
    await deps.repository.markTotalsClosed(site.id, month, bounds, transaction);
    await recordAuditEvent(
      {
        actor,
        action: 'period.close',
        entityType: 'period',
        entityId: `${site.id}:${month}`,
        after: {
          id,
          siteId: site.id,
          month,
          start: new Date(bounds.startMs).toISOString(),
          end: new Date(bounds.endMs).toISOString(),
          confirmedIncomplete: final ? null : describeIncomplete(incomplete),
        },
        reason: input.reason ?? null,
      },
      transaction,
    );
  });
  return getPeriod(deps.repository, { siteId: site.id, month, nowMs });
}

/**
 * Reopens a closed month (admin), with a reason, audited: the totals take back their status and
 * every hour of the month is recomputed (cause 'reopen'), including what was held as pending.
 * @throws bad request naming siteId; conflict naming month when it is not closed
 */
export async function reopenPeriod(
  deps: PeriodDeps,
  request: { month: string; input: ReopenInput; actor: SignedInUser; nowMs?: number },
): Promise<PeriodView> {
  const { month, input, actor } = request;
  const site = await siteOf(deps.repository, input.siteId);
  const { id, bounds } = await deps.sequelize.transaction(async (transaction) => {
    await deps.repository.lockMonth(site.id, month, transaction);
    const latest = await deps.repository.latestAction(site.id, month, transaction);
    if (latest?.action !== 'close')
      throw conflict(`The contract month ${month} of site ${site.code} is not closed.`, 'month', 'period_not_closed');
    // The bounds it was closed with: everything it held is inside them.
    const closedBounds = { startMs: latest.startMs, endMs: latest.endMs };
    const reopenId = await deps.repository.insertAction(
      {
        siteId: site.id,
        month,
        action: 'reopen',
        ...closedBounds,
        incomplete: null,
        reason: input.reason,
        actedBy: actor.id,
      },
      transaction,
    );
    await deps.repository.restoreTotals(site.id, month, closedBounds, transaction);
    await deps.repository.releaseHeldHours(site.id, closedBounds, transaction);
    await recordAuditEvent(
      {
        actor,
        action: 'period.reopen',
        entityType: 'period',
        entityId: `${site.id}:${month}`,
        before: {
          status: 'closed',
          closedAt: latest.actedAt.toISOString(),
          closedBy: latest.actedBy.email ?? latest.actedBy.id,
        },
        after: { id: reopenId, siteId: site.id, month, status: 'open' },
        reason: input.reason,
      },
      transaction,
    );
    return { id: reopenId, bounds: closedBounds };
  });
  const runs = await deps.repository.meterRuns(site.id);
  await deps.reopened(
    runs.map((r) => r.id),
    bounds.startMs,
    bounds.endMs,
    `period-reopen:${id}`,
  );
  return getPeriod(deps.repository, { siteId: site.id, month, nowMs: request.nowMs });
}
