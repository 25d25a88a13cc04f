import type { ReconciledDay, ReconciliationSum } from '../../../shared/reconciliation/reconcile-day';
import type { TimeWindow } from '../../http/params';
import type { ToleranceVersion } from './repository';

/** One contract day and quantity: instants as ISO 8601, figures in the field total's unit. */
export function presentReconciliation(day: ReconciledDay) {
  return {
    start: new Date(day.startMs).toISOString(),
    end: new Date(day.endMs).toISOString(),
    quantity: day.quantity,
    unit: day.unit,
    tallyrunValue: day.tallyrunValue,
    fieldValue: day.fieldValue,
    difference: day.difference,
    differencePercent: day.differencePercent,
    tolerancePercent: day.tolerancePercent,
    withinTolerance: day.withinTolerance,
  };
}

/** The sums of a window per quantity and unit, with the window they cover. */
export function presentReconciliationSum(window: TimeWindow, sum: ReconciliationSum) {
  return {
    from: new Date(window.fromMs).toISOString(),
    to: new Date(window.toMs).toISOString(),
    quantity: sum.quantity,
    unit: sum.unit,
    days: sum.days,
    daysOutsideTolerance: sum.daysOutsideTolerance,
    daysWithoutTallyrunFigure: sum.daysWithoutTallyrunFigure,
    tallyrunValue: sum.tallyrunValue,
    fieldValue: sum.fieldValue,
    difference: sum.difference,
    differencePercent: sum.differencePercent,
    tolerancePercent: sum.tolerancePercent,
    withinTolerance: sum.withinTolerance,
  };
}

/** One dated tolerance version, as `GET/PATCH /api/reconciliations/tolerances/:id` return it. */
export function presentToleranceVersion(meterRunId: string, v: ToleranceVersion) {
  return {
    meterRunId,
    versionId: v.id,
    tolerancePercent: v.tolerancePercent,
    effectiveFrom: new Date(v.effectiveFromMs).toISOString(),
    reason: v.reason,
    createdBy: v.createdBy,
    createdAt: new Date(v.createdAtMs).toISOString(),
  };
}
