/**
 * The alarm `reconciliation-out-of-tolerance`, one alarm point per meter run: raised at the end of
 * a contract day whose total differs from the field device's by more than the meter run's
 * tolerance (any quantity of the day), returned at the end of the next day that is within it.
 *
 * Days are judged once, in time order, after a watermark kept per meter run
 * (reconciliation_alarm_watermarks), like readings: a field total imported later for a day
 * already judged, or a changed tolerance, shows in the reconciliation list but does not rewrite
 * the alarm log (what was announced stays as announced). A day is judged when both figures exist.
 */
import type { Pool } from 'pg';
import { alarmMessage } from '../../shared/alarms/alarm-message';
import type { ReconciledDay } from '../../shared/reconciliation/reconcile-day';
import { reconciliationRepository } from '../resources/reconciliations/repository';
import { reconciliationsForWindow } from '../resources/reconciliations/use-cases';
import { applySignal } from './alarm-store';
import { limitsResolver, loadStoredLimits } from './limits-store';

const condition = 'reconciliation-out-of-tolerance';

/** The verdict of a contract day over its quantities: outside when any is; the worst one named. */
export function dayVerdict(rows: readonly ReconciledDay[]): { outside: boolean; worst: ReconciledDay } | null {
  const judged = rows.filter((r) => r.withinTolerance !== null);
  if (!judged.length) return null;
  const outside = judged.filter((r) => r.withinTolerance === false);
  const worst = (outside.length ? outside : judged).reduce((a, b) =>
    Math.abs(b.differencePercent ?? 0) > Math.abs(a.differencePercent ?? 0) ? b : a,
  );
  return { outside: outside.length > 0, worst };
}

/**
 * Judges the days after each meter run's watermark that ended by `nowMs`; one transaction per
 * meter run, under a transaction-scoped advisory lock, so two judges never announce a day twice.
 * @returns the alarms touched and those newly raised (for the alarm events and mail)
 */
export async function judgeReconciliationAlarms(pool: Pool, nowMs: number) {
  const touched: string[] = [];
  const raised: string[] = [];
  for (const meterRunId of await reconciliationRepository(pool).meterRunsWithFieldTotals()) {
    const client = await pool.connect();
    try {
      await client.query('BEGIN');
      await client.query("SELECT pg_advisory_xact_lock(hashtext('reconciliation-alarm:' || $1::text))", [meterRunId]);
      const repository = reconciliationRepository(client);
      const run = await repository.meterRun(meterRunId);
      const watermarkMs = run ? await repository.alarmWatermark(meterRunId) : null;
      const rows = run
        ? await reconciliationsForWindow(repository, { run, fromMs: watermarkMs ?? 0, toMs: nowMs })
        : [];
      const byDay = new Map<number, ReconciledDay[]>();
      for (const r of rows) if (r.endMs <= nowMs) byDay.set(r.startMs, [...(byDay.get(r.startMs) ?? []), r]);
      const limits = limitsResolver(await loadStoredLimits(client, meterRunId))(condition, null);
      let judgedToMs: number | null = null;
      for (const dayRows of byDay.values()) {
        const verdict = dayVerdict(dayRows);
        if (!verdict) continue;
        judgedToMs = verdict.worst.endMs;
        if (!limits.enabled || !run) continue;
        const detail = {
          dayStartMs: verdict.worst.startMs,
          quantity: verdict.worst.quantity,
          unit: verdict.worst.unit,
          tallyrunValue: verdict.worst.tallyrunValue,
          fieldValue: verdict.worst.fieldValue,
          differencePercent: verdict.worst.differencePercent,
          tolerancePercent: verdict.worst.tolerancePercent,
        };
        const applied = await applySignal(
          client,
          meterRunId,
          {
            kind: verdict.outside ? 'raise' : 'clear',
            condition,
            transmitterId: null,
            timeMs: verdict.worst.endMs,
            onsetMs: verdict.worst.startMs,
            message: alarmMessage(condition, run.tag, detail, run.timeZone),
            detail,
          },
          limits.priority,
          nowMs,
        );
        if (applied) touched.push(applied.alarmId);
        if (applied?.raised) raised.push(applied.alarmId);
      }
      if (judgedToMs !== null) await repository.setAlarmWatermark(meterRunId, judgedToMs);
      await client.query('COMMIT');
    } catch (err) {
      await client.query('ROLLBACK').catch(() => undefined);
      throw err;
    } finally {
      client.release();
    }
  }
  return { touched, raised };
}
