import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { notFound } from '../../errors';
import {
  reconcileFigures,
  SI_UNIT_OF,
  sumReconciledDays,
  type ReconciledDay,
} from '../../../shared/reconciliation/reconcile-day';
import type { Sequelize } from 'sequelize';
import { refuseDatedChangeInClosedMonth } from '../../history/closed-periods';
import { checkEffectiveFrom } from '../meter-runs/use-cases';
import type { ReconciliationMeterRun, ReconciliationRepository, ToleranceVersion } from './repository';

/** @throws not found when the meter run does not exist */
export async function reconciliationMeterRun(repository: ReconciliationRepository, meterRunId: string) {
  const run = await repository.meterRun(meterRunId);
  if (!run) throw notFound('Meter run');
  return run;
}

/**
 * Tallyrun's contract-day totals against the field device's, one row per contract day and
 * quantity that has a field total, in the field total's unit, each day judged against the
 * tolerance version in force at its start (the meter run's current figure when it has no
 * versions). A field total whose period is not exactly one of Tallyrun's contract
 * days (another contract hour, an hour, a month) is not reconciled here.
 */
export async function reconciliationsForWindow(
  repository: ReconciliationRepository,
  request: { run: ReconciliationMeterRun; fromMs: number; toMs: number },
): Promise<ReconciledDay[]> {
  const { run, fromMs, toMs } = request;
  const [days, versions] = await Promise.all([
    repository.fieldTotalDays(run.id, fromMs, toMs),
    repository.toleranceVersions(run.id),
  ]);
  return days.map((d) => {
    const unit = d.unit ?? SI_UNIT_OF[d.quantity];
    return {
      startMs: d.startMs,
      endMs: d.endMs,
      quantity: d.quantity,
      unit,
      ...reconcileFigures({
        tallyrunSI: d.tallyrunSI,
        fieldSI: d.fieldSI,
        unit,
        tolerancePercent: toleranceInForce(versions, d.startMs) ?? run.tolerancePercent,
      }),
    };
  });
}

/** The tolerance of the version in force at `atMs` (versions oldest first; the later of a tie wins), or null. */
export function toleranceInForce(versions: readonly ToleranceVersion[], atMs: number): number | null {
  let found: number | null = null;
  for (const v of versions) if (v.effectiveFromMs <= atMs) found = v.tolerancePercent;
  return found;
}

/** The sums of the window's reconciled days per quantity and unit (the month's sum for a month's window). */
export async function reconciliationSummary(
  repository: ReconciliationRepository,
  request: { run: ReconciliationMeterRun; fromMs: number; toMs: number },
) {
  const days = await reconciliationsForWindow(repository, request);
  // A window's sum is judged by the tolerance of its last day (a month's closing tolerance).
  const last = days.at(-1);
  return sumReconciledDays(days, last ? last.tolerancePercent : request.run.tolerancePercent);
}

/** A meter run's tolerance versions, oldest first. @throws not found when the meter run does not exist */
export async function listToleranceVersions(repository: ReconciliationRepository, meterRunId: string) {
  await reconciliationMeterRun(repository, meterRunId);
  return repository.toleranceVersions(meterRunId);
}

/**
 * Sets a meter run's reconciliation tolerance as a dated version: it judges the contract days
 * that start at or after `effectiveFrom` (default now, so today's day keeps the tolerance it
 * started with) and no earlier one. The rule of every dated setting applies (not before the
 * meter run's history, at most a day ahead, never inside a closed month), and the change is
 * audited with the tolerance in force before at that instant, the new one and the reason. It
 * changes no figure, only verdicts.
 * @throws not found when the meter run does not exist; bad request or conflict naming effectiveFrom
 */
export async function setReconciliationTolerance(
  deps: { repository: ReconciliationRepository; sequelize: Sequelize },
  request: {
    meterRunId: string;
    tolerancePercent: number;
    effectiveFrom?: string;
    reason: string;
    actor: SignedInUser;
    nowMs?: number;
  },
) {
  const { meterRunId, tolerancePercent, actor } = request;
  await reconciliationMeterRun(deps.repository, meterRunId);
  const nowMs = request.nowMs ?? Date.now();
  const effectiveFrom = request.effectiveFrom !== undefined ? new Date(request.effectiveFrom) : new Date(nowMs);
  checkEffectiveFrom(effectiveFrom, await deps.repository.historyStart(meterRunId), nowMs);
  await refuseDatedChangeInClosedMonth(deps.sequelize, { meterRunId }, effectiveFrom);
  const added = await deps.repository.addToleranceVersion(meterRunId, {
    effectiveFromMs: effectiveFrom.getTime(),
    tolerancePercent,
    reason: request.reason,
    createdBy: actor.id,
  });
  if (!added) throw notFound('Meter run');
  await recordAuditEvent({
    actor,
    action: 'meter-run.reconciliation-tolerance',
    entityType: 'meter-run',
    entityId: meterRunId,
    before: { reconciliationTolerancePercent: added.before },
    after: {
      reconciliationTolerancePercent: tolerancePercent,
      effectiveFrom: effectiveFrom.toISOString(),
      versionId: added.version.id,
    },
    reason: request.reason,
  });
  return added.version;
}
