import type { Pool } from 'pg';
import type { Sequelize } from 'sequelize';
import { DateTime } from 'luxon';
import {
  contractDayOf,
  contractMonthBounds,
  hourStartOf,
  hourStartsBetween,
} from '../../../shared/history/contract-day';
import {
  estimateFromPreviousDays,
  estimateFromSalesMeter,
  type MemberQuantity,
} from '../../../shared/history/corrections';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, forbidden, notFound } from '../../errors';
import { periodIsClosed } from '../../history/closed-periods';
import type {
  CorrectionRecord,
  CorrectionStatus,
  CorrectionsRepository,
  EstimateRecord,
  PeriodQuantities,
} from './repository';
import { CORRECTION_MAX_DAYS, type ProposeCorrectionInput } from './schema';
import { presentCorrection } from './presenter';

const hourMs = 3_600_000;
const dayMs = 86_400_000;
/** An estimate looks at the same hours of this many previous days. */
export const ESTIMATE_PREVIOUS_DAYS = 7;
/** A previous hour counts towards an estimate only with (nearly) full coverage. */
const ESTIMATE_MIN_COVERAGE = 0.99;

export interface CorrectionDeps {
  sequelize: Sequelize;
  pool: Pool;
  repository: CorrectionsRepository;
  /** Called after an approval is committed: the history worker recomputes [fromMs, toMs) with the correction. */
  approved: (meterRunId: string, fromMs: number, toMs: number, correctionId: string) => Promise<void>;
}

type Clock = { timeZone: string; contractHour: number };

/** A correction's period: whole hours of the site, end after start, not beyond the current hour, at most a quarter. */
function checkPeriod(startMs: number, endMs: number, clock: Clock, nowMs: number) {
  if (endMs <= startMs) throw badRequest('end: must be after start', 'end', 'invalid_field');
  if (hourStartOf(startMs, clock.timeZone) !== startMs)
    throw badRequest('start: must be the start of an hour on the site’s clock', 'start', 'invalid_field');
  if (hourStartOf(endMs, clock.timeZone) !== endMs)
    throw badRequest('end: must be the start of an hour on the site’s clock', 'end', 'invalid_field');
  if (endMs - startMs > CORRECTION_MAX_DAYS * dayMs)
    throw badRequest(`end: a correction covers at most ${CORRECTION_MAX_DAYS} days`, 'end', 'invalid_field');
  if (endMs > hourStartOf(nowMs, clock.timeZone) + hourMs)
    throw badRequest('end: must not be later than the end of the current hour', 'end', 'invalid_field');
}

/** @throws conflict naming the first closed contract month the period touches */
async function refuseClosedMonths(pool: Pool, meterRunId: string, startMs: number, endMs: number, clock: Clock) {
  let month = contractDayOf(startMs, clock.timeZone, clock.contractHour).slice(0, 7);
  const lastMonth = contractDayOf(endMs - 1, clock.timeZone, clock.contractHour).slice(0, 7);
  for (;;) {
    const bounds = contractMonthBounds(month, clock.timeZone, clock.contractHour);
    const from = Math.max(startMs, bounds.startMs);
    const to = Math.min(endMs, bounds.endMs);
    if (to > from && (await periodIsClosed(pool, meterRunId, from, to)))
      throw conflict(`The contract month ${month} is closed: a correction cannot change it.`, 'start', 'period_closed');
    if (month >= lastMonth) return;
    month = DateTime.fromISO(`${month}-01`, { zone: 'utc' }).plus({ months: 1 }).toFormat('yyyy-MM');
  }
}

/** The estimate for missing time (sales minus the other wells, or the previous days' mean), with its uncertainty. */
export interface CorrectionEstimate extends EstimateRecord {
  meterRunId: string;
  startMs: number;
  endMs: number;
}

/**
 * "Sales minus the other wells" (issue 9 §8) for a well: the first balance group in which the
 * meter run is an inlet, with exactly one outlet, whose sales meter and other inlets have
 * complete, not estimated records over the whole period (shared/history/corrections.ts
 * estimateFromSalesMeter). A fixed daily allowance counts pro rata by time (hours / 24).
 * @returns the estimate, or why none was made (problem null when the meter run is in no such group)
 */
async function salesMeterEstimate(
  repository: CorrectionsRepository,
  meterRunId: string,
  startMs: number,
  endMs: number,
  timeZone: string,
): Promise<{ ok: true; estimate: EstimateRecord } | { ok: false; problem: string | null }> {
  const groups = await repository.wellGroups(meterRunId);
  const problems: string[] = [];
  for (const group of groups) {
    const sales = group.members.find((m) => m.side === 'outlet');
    if (!sales) continue;
    const others = group.members.filter((m) => m.side === 'inlet' && m.meterRunId !== meterRunId);
    const records = await repository.memberRecords(
      [sales.meterRunId, ...others.map((m) => m.meterRunId)],
      startMs,
      endMs,
    );
    const member = (m: { meterRunId: string; tag: string }) => ({ ...m, records: records.get(m.meterRunId) ?? [] });
    const allowance =
      group.allowancePercent !== null
        ? { percent: group.allowancePercent }
        : { standardVolumeM3: ((group.allowanceDailyM3 ?? 0) * (endMs - startMs)) / dayMs };
    const made = estimateFromSalesMeter({
      startMs,
      endMs,
      sales: member(sales),
      otherWells: others.map(member),
      allowance,
    });
    if (!made.ok) {
      problems.push(`${group.name}: ${made.problem}`);
      continue;
    }
    const quantity = (q: MemberQuantity) => ({
      meterRunId: q.meterRunId,
      tag: q.tag,
      massKg: q.massKg,
      standardVolumeM3: q.standardVolumeM3,
      expandedUncertaintyKg: q.expandedUncertaintyKg,
    });
    return {
      ok: true,
      estimate: {
        massKg: made.massKg,
        uncertaintyPercent: made.uncertaintyPercent,
        method: 'sales-minus-other-wells',
        basis: {
          description:
            'the sales meter (over 1 − the allowance when it is a percent of the inlet) minus the other wells and a fixed allowance, over the same hours; uncertainty the root-sum-square of the members’ expanded uncertainties (JCGM 100:2008 §5.1.2, uncorrelated)',
          balanceGroup: { id: group.id, name: group.name },
          salesMeter: quantity(made.sales),
          otherWells: made.otherWells.map(quantity),
          allowance: {
            percent: group.allowancePercent,
            dailyM3: group.allowanceDailyM3,
            massKg: made.allowance.massKg,
            standardVolumeM3: made.allowance.standardVolumeM3,
          },
          standardVolumeM3: made.standardVolumeM3,
          expandedUncertaintyKg: made.expandedUncertaintyKg,
          start: new Date(startMs).toISOString(),
          end: new Date(endMs).toISOString(),
          hours: hourStartsBetween(startMs, endMs, timeZone).map((h) => new Date(h).toISOString()),
        },
      },
    };
  }
  return { ok: false, problem: problems.length ? problems.join('; ') : null };
}

/**
 * An estimate for [startMs, endMs) of a meter run from the same hours of the previous seven days
 * (local time, so a DST day keeps its hours), each hour the mean of the days with a complete,
 * not estimated record. Uncertainty: a 95 % prediction interval per hour, added over the hours
 * (shared/history/corrections.ts). A well (an inlet of a balance group with one outlet) is
 * estimated from its sales meter instead when the group's records allow it (salesMeterEstimate).
 * @throws not found (meter run); bad request naming start when neither method can make an estimate
 */
export async function estimateCorrection(
  repository: CorrectionsRepository,
  request: { meterRunId: string; startMs: number; endMs: number; nowMs?: number },
): Promise<CorrectionEstimate> {
  const { meterRunId, startMs, endMs } = request;
  const clock = await repository.meterRunClock(meterRunId);
  if (!clock) throw notFound('Meter run');
  checkPeriod(startMs, endMs, clock, request.nowMs ?? Date.now());
  const fromSales = await salesMeterEstimate(repository, meterRunId, startMs, endMs, clock.timeZone);
  if (fromSales.ok) return { meterRunId, startMs, endMs, ...fromSales.estimate };
  const hours = hourStartsBetween(startMs, endMs, clock.timeZone);
  const earliest = DateTime.fromMillis(startMs, { zone: clock.timeZone })
    .minus({ days: ESTIMATE_PREVIOUS_DAYS })
    .toMillis();
  const records = await repository.hourlyRecords(meterRunId, earliest - hourMs, endMs);
  const usable = new Map(
    records
      .filter((r) => r.coverage >= ESTIMATE_MIN_COVERAGE && !r.flags.includes('estimated'))
      .map((r) => [r.startMs, r.massKg]),
  );
  const inputs = hours.map((h) => {
    const previousMassesKg: number[] = [];
    for (let k = 1; k <= ESTIMATE_PREVIOUS_DAYS; k++) {
      const before = DateTime.fromMillis(h, { zone: clock.timeZone }).minus({ days: k }).toMillis();
      const mass = usable.get(before);
      if (mass !== undefined) previousMassesKg.push(mass);
    }
    return { startMs: h, previousMassesKg };
  });
  const estimate = estimateFromPreviousDays(inputs);
  if (!estimate.ok) {
    const why = fromSales.problem
      ? `${estimate.problem}; sales minus the other wells: ${fromSales.problem}`
      : estimate.problem;
    throw badRequest(`start: no estimate can be made: ${why}`, 'start', 'no_estimate');
  }
  return {
    meterRunId,
    startMs,
    endMs,
    massKg: estimate.massKg,
    uncertaintyPercent: estimate.uncertaintyPercent,
    method: 'previous-days',
    basis: {
      description: `mean of the same hours over the previous ${ESTIMATE_PREVIOUS_DAYS} days with complete records; uncertainty a 95 % prediction interval per hour (Student's t), added over the hours`,
      hours: estimate.hours.map((h) => ({
        start: new Date(h.startMs).toISOString(),
        days: h.days,
        meanKg: h.meanKg,
        standardDeviationKg: h.standardDeviationKg,
      })),
    },
  };
}

/** Checks what the schema cannot: one of massKg / substitute for a substitution, a factor for an adjustment. */
async function checkWhat(repository: CorrectionsRepository, input: ProposeCorrectionInput, startMs: number) {
  if (input.kind === 'adjust') {
    if (input.factor === undefined)
      throw badRequest('factor: is required for an adjustment', 'factor', 'invalid_field');
    if (input.massKg !== undefined || input.substitute !== undefined)
      throw badRequest('massKg: an adjustment gives only a factor', 'massKg', 'invalid_field');
    if (input.origin === 'estimate')
      throw badRequest('origin: an estimate is a substitution', 'origin', 'invalid_field');
    return;
  }
  if (input.factor !== undefined) throw badRequest('factor: a substitution gives no factor', 'factor', 'invalid_field');
  if (input.massKg !== undefined && input.substitute !== undefined)
    throw badRequest('massKg: give a quantity or substituted readings, not both', 'massKg', 'invalid_field');
  if (input.origin === 'estimate') {
    if (input.substitute !== undefined)
      throw badRequest('substitute: an estimate substitutes a quantity', 'substitute', 'invalid_field');
    return;
  }
  if (input.massKg === undefined && input.substitute === undefined)
    throw badRequest('massKg: a substitution needs massKg or substitute', 'massKg', 'invalid_field');
  if (input.substitute) {
    const owner = await repository.transmitterMeterRun(input.substitute.transmitterId);
    if (owner !== input.meterRunId)
      throw badRequest(
        'substitute.transmitterId: must be a transmitter of the meter run',
        'substitute.transmitterId',
        'invalid_field',
      );
    if (
      'hold' in input.substitute &&
      !(await repository.hasUsableReadingBefore(input.substitute.transmitterId, startMs))
    )
      throw badRequest(
        'substitute.hold: the transmitter has no usable reading before start to hold',
        'substitute.hold',
        'invalid_field',
      );
  }
}

/**
 * An engineer's or admin's proposal, audited with its reason. An estimate is made here again, so
 * what is stored is the server's estimate, not a figure the client sent.
 * @throws bad request naming the field; not found (meter run: 400 naming meterRunId); conflict for a closed month
 */
export async function proposeCorrection(
  deps: CorrectionDeps,
  request: { input: ProposeCorrectionInput; actor: SignedInUser; nowMs?: number },
): Promise<CorrectionRecord> {
  const { input, actor } = request;
  const nowMs = request.nowMs ?? Date.now();
  const clock = await deps.repository.meterRunClock(input.meterRunId);
  if (!clock) throw badRequest('meterRunId: no such meter run', 'meterRunId', 'invalid_field');
  const startMs = Date.parse(input.start);
  const endMs = Date.parse(input.end);
  checkPeriod(startMs, endMs, clock, nowMs);
  await checkWhat(deps.repository, input, startMs);
  // A quantity names no direction: on a bi-directional run it could be forward, reverse or net (issue 13 §11).
  if (
    input.kind === 'substitute' &&
    input.substitute === undefined &&
    (await deps.repository.bidirectionalDuring(input.meterRunId, startMs, endMs))
  )
    throw badRequest(
      'massKg: a quantity substitution names no flow direction, and the meter run is bi-directional in this period; substitute readings or adjust by a factor instead',
      'massKg',
      'invalid_field',
    );
  let estimate: EstimateRecord | null = null;
  let massKg = input.massKg ?? null;
  if (input.origin === 'estimate') {
    const made = await estimateCorrection(deps.repository, { meterRunId: input.meterRunId, startMs, endMs, nowMs });
    if (massKg !== null && Math.abs(massKg - made.massKg) > 1e-6 * Math.max(1, made.massKg))
      throw badRequest(
        `massKg: differs from the estimate (${made.massKg} kg); propose a manual substitution instead`,
        'massKg',
        'invalid_field',
      );
    massKg = made.massKg;
    estimate = {
      massKg: made.massKg,
      uncertaintyPercent: made.uncertaintyPercent,
      method: made.method,
      basis: made.basis,
    };
  }
  await refuseClosedMonths(deps.pool, input.meterRunId, startMs, endMs, clock);
  return deps.sequelize.transaction(async (transaction) => {
    const created = await deps.repository.insert(
      {
        meterRunId: input.meterRunId,
        startMs,
        endMs,
        kind: input.kind,
        massKg: input.kind === 'substitute' ? massKg : null,
        factor: input.factor ?? null,
        substitute: input.substitute ?? null,
        origin: input.origin,
        estimate,
        reason: input.reason,
        proposedBy: actor.id,
      },
      transaction,
    );
    await recordAuditEvent(
      {
        actor,
        action: 'correction.propose',
        entityType: 'correction',
        entityId: created.id,
        after: presentCorrection(created),
        reason: input.reason,
      },
      transaction,
    );
    return created;
  });
}

/**
 * Approves or rejects a proposed correction, audited with the reason; an approval sends the
 * correction's hours to the history worker (cause 'correction').
 * @throws not found; forbidden for one's own; conflict when already decided or in a closed month
 */
export async function decideCorrection(
  deps: CorrectionDeps,
  request: { id: string; decision: 'approved' | 'rejected'; reason: string; actor: SignedInUser },
): Promise<CorrectionRecord> {
  const { id, decision, reason, actor } = request;
  const decided = await deps.sequelize.transaction(async (transaction) => {
    const before = await deps.repository.findById(id, transaction);
    if (!before) throw notFound('Correction');
    if (before.proposedBy.id === actor.id)
      throw forbidden(
        `Nobody ${decision === 'approved' ? 'approves' : 'rejects'} their own correction: another engineer or an administrator decides it.`,
        'own_correction',
      );
    if (before.status !== 'proposed')
      throw conflict(`This correction is already ${before.status}.`, undefined, 'decided');
    if (decision === 'approved') {
      const clock = await deps.repository.meterRunClock(before.meterRunId);
      if (clock) await refuseClosedMonths(deps.pool, before.meterRunId, before.startMs, before.endMs, clock);
    }
    const after = await deps.repository.decide(id, { status: decision, decidedBy: actor.id, reason }, transaction);
    await recordAuditEvent(
      {
        actor,
        action: decision === 'approved' ? 'correction.approve' : 'correction.reject',
        entityType: 'correction',
        entityId: id,
        before: presentCorrection(before),
        after: presentCorrection(after),
        reason,
      },
      transaction,
    );
    return after;
  });
  if (decided.status === 'approved')
    await deps.approved(decided.meterRunId, decided.startMs, decided.endMs, decided.id);
  return decided;
}

/** A correction with the quantities of its period: as first recorded, as in force now, and now − first. */
export interface CorrectionWithFigures {
  correction: CorrectionRecord;
  figures: {
    hours: number;
    original: PeriodQuantities;
    current: PeriodQuantities;
    difference: PeriodQuantities;
  };
}

const minus = (a: PeriodQuantities, b: PeriodQuantities): PeriodQuantities => ({
  massKg: a.massKg - b.massKg,
  volumeM3: a.volumeM3 - b.volumeM3,
  standardVolumeM3: a.standardVolumeM3 - b.standardVolumeM3,
  energyJ: a.energyJ === null || b.energyJ === null ? null : a.energyJ - b.energyJ,
});

async function withFigures(repository: CorrectionsRepository, c: CorrectionRecord): Promise<CorrectionWithFigures> {
  const q = await repository.periodQuantities(c.meterRunId, c.startMs, c.endMs);
  return { correction: c, figures: { ...q, difference: minus(q.current, q.original) } };
}

/** Corrections newest first, each with the original and current figures of its period. */
export async function listCorrections(
  repository: CorrectionsRepository,
  filter: { meterRunId?: string; status?: CorrectionStatus },
): Promise<CorrectionWithFigures[]> {
  const list = await repository.list({ ...filter, limit: 200 });
  return Promise.all(list.map((c) => withFigures(repository, c)));
}

/** @throws not found */
export async function getCorrection(repository: CorrectionsRepository, id: string): Promise<CorrectionWithFigures> {
  const c = await repository.findById(id);
  if (!c) throw notFound('Correction');
  return withFigures(repository, c);
}
