import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { notFound } from '../../errors';
import {
  reconcileFigures,
  SI_UNIT_OF,
  sumReconciledDays,
  type ReconciledDay,
} from '../../../shared/reconciliation/reconcile-day';
import type { ReconciliationMeterRun, ReconciliationRepository } from './repository';

/** @throws not found when the meter run does not exist */
export async function reconciliationMeterRun(repository: ReconciliationRepository, meterRunId: string) {
  const run = await repository.meterRun(meterRunId);
  if (!run) throw notFound('Meter run');
  return run;
}

/**
 * Tallyrun's contract-day totals against the field device's, one row per contract day and
 * quantity that has a field total, in the field total's unit, judged against the meter run's
 * tolerance in force now. A field total whose period is not exactly one of Tallyrun's contract
 * days (another contract hour, an hour, a month) is not reconciled here.
 */
export async function reconciliationsForWindow(
  repository: ReconciliationRepository,
  request: { run: ReconciliationMeterRun; fromMs: number; toMs: number },
): Promise<ReconciledDay[]> {
  const { run, fromMs, toMs } = request;
  const days = await repository.fieldTotalDays(run.id, fromMs, toMs);
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
        tolerancePercent: run.tolerancePercent,
      }),
    };
  });
}

/** The sums of the window's reconciled days per quantity and unit (the month's sum for a month's window). */
export async function reconciliationSummary(
  repository: ReconciliationRepository,
  request: { run: ReconciliationMeterRun; fromMs: number; toMs: number },
) {
  const days = await reconciliationsForWindow(repository, request);
  return sumReconciledDays(days, request.run.tolerancePercent);
}

/**
 * Sets a meter run's reconciliation tolerance. The change is audited with the value before and
 * after; it judges later comparisons and the alarm's next days, and changes no figure.
 * @throws not found when the meter run does not exist
 */
export async function setReconciliationTolerance(
  repository: ReconciliationRepository,
  request: { meterRunId: string; tolerancePercent: number; actor: SignedInUser },
) {
  const { meterRunId, tolerancePercent, actor } = request;
  const before = await repository.setTolerance(meterRunId, tolerancePercent);
  if (before === null) throw notFound('Meter run');
  await recordAuditEvent({
    actor,
    action: 'meter-run.reconciliation-tolerance',
    entityType: 'meter-run',
    entityId: meterRunId,
    before: { reconciliationTolerancePercent: before },
    after: { reconciliationTolerancePercent: tolerancePercent },
  });
  return { meterRunId, tolerancePercent };
}
