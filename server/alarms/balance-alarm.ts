/**
 * The alarm `balance-out-of-tolerance` (issue 10 §3), one alarm point per balance group, kept on
 * the group's first outlet meter run (the sales meter; alarms belong to a meter run), with the
 * group in its detail: raised at the end of a contract day whose |imbalance| exceeds the group's
 * tolerance, returned at the end of the next day within it.
 *
 * Days are judged once, in time order, after the group's watermark, like the reconciliation
 * alarm: a total recomputed later shows in the balance but does not rewrite the alarm log. A day
 * is judged once every member has its daily total.
 */
import type { Pool } from 'pg';
import { alarmMessage } from '../../shared/alarms/alarm-message';
import { balanceAlarmRepository } from '../resources/balance-groups/repository';
import { balanceForWindow } from '../resources/balance-groups/use-cases';
import { applySignal } from './alarm-store';
import { limitsResolver, loadStoredLimits } from './limits-store';

const condition = 'balance-out-of-tolerance';

/**
 * Judges every group's contract days after its watermark that ended by `nowMs`; one transaction
 * per group under a transaction-scoped advisory lock, so two judges never announce a day twice.
 * @returns the alarms touched and those newly raised (for the alarm events and mail)
 */
export async function judgeBalanceAlarms(pool: Pool, nowMs: number) {
  const touched: string[] = [];
  const raised: string[] = [];
  for (const groupId of await balanceAlarmRepository(pool).groupIds()) {
    const client = await pool.connect();
    try {
      await client.query('BEGIN');
      await client.query("SELECT pg_advisory_xact_lock(hashtext('balance-alarm:' || $1::text))", [groupId]);
      const repository = balanceAlarmRepository(client);
      const group = await repository.group(groupId);
      const point = group?.members.find((m) => m.side === 'outlet');
      if (!group || !point) {
        await client.query('COMMIT');
        continue;
      }
      const periods = await balanceForWindow(repository, {
        group,
        interval: 'day',
        fromMs: group.alarmWatermarkMs ?? 0,
        toMs: nowMs,
      });
      const limits = limitsResolver(await loadStoredLimits(client, point.meterRunId))(condition, null);
      let judgedToMs: number | null = null;
      for (const day of periods) {
        if (day.endMs > nowMs || day.missingMeterRunIds.length) break;
        judgedToMs = day.endMs;
        if (!limits.enabled) continue;
        const detail = {
          balanceGroupId: group.id,
          balanceGroupName: group.name,
          dayStartMs: day.startMs,
          imbalanceM3: day.imbalanceM3,
          imbalancePercent: day.imbalancePercent,
          tolerancePercent: group.tolerancePercent,
          uncertaintyM3: day.uncertaintyM3,
          exceedsUncertainty: day.exceedsUncertainty === null ? null : String(day.exceedsUncertainty),
        };
        const applied = await applySignal(
          client,
          point.meterRunId,
          {
            kind: day.withinTolerance ? 'clear' : 'raise',
            condition,
            transmitterId: null,
            timeMs: day.endMs,
            onsetMs: day.startMs,
            message: alarmMessage(condition, group.name, detail, group.timeZone),
            detail,
          },
          limits.priority,
          nowMs,
        );
        if (applied) touched.push(applied.alarmId);
        if (applied?.raised) raised.push(applied.alarmId);
      }
      if (judgedToMs !== null) await repository.setAlarmWatermark(group.id, judgedToMs);
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
