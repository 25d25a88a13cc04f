/**
 * Alarm rows and their event log in PostgreSQL. Every change of an alarm goes through
 * nextAlarmStatus (shared/alarms/alarm-lifecycle.ts) and writes one alarm_events row with its
 * time, the user (for people's actions) and the states before and after.
 */
import type { Pool, PoolClient } from 'pg';
import { nextAlarmStatus, type AlarmAction } from '../../shared/alarms/alarm-lifecycle';
import type { AlarmCondition, AlarmPriority, AlarmState } from '../../shared/alarms/alarm-codes';
import type { AlarmSignal } from '../../shared/alarms/meter-run-alarm-walk';

type Db = Pool | PoolClient;

/** Only alarms raised this recently (by their own time) are mailed one by one; older ones (imported history) go to the digest. */
export const NOTIFY_MAX_AGE_MS = 3_600_000;

export interface Actor {
  id: string;
  email: string;
}

/** The columns an alarm is presented from (see resources/alarms/presenter.ts). */
export const ALARM_SELECT = `
  SELECT a.id::text AS id, a.meter_run_id::text AS meter_run_id, m.tag AS meter_run_tag, m.site_id::text AS site_id,
         a.transmitter_id::text AS transmitter_id, t.tag AS transmitter_tag, a.condition, a.priority, a.state,
         a.condition_active, a.onset_at, a.raised_at, a.cleared_at, a.acknowledged_at, a.acknowledged_by::text AS acknowledged_by_id,
         u.email AS acknowledged_by, a.shelved_until, a.shelve_reason, a.activations, a.message, a.detail,
         a.notify_status, a.notified_at
    FROM alarms a
    JOIN meter_runs m ON m.id = a.meter_run_id
    LEFT JOIN transmitters t ON t.id = a.transmitter_id
    LEFT JOIN users u ON u.id = a.acknowledged_by`;

export type AlarmRow = Record<string, unknown> & { id: string; state: AlarmState; condition_active: boolean };

/** One row of ALARM_SELECT as pg returns it: bigints cast to text, timestamptz as Date, jsonb parsed. */
export interface AlarmSelectRow {
  id: string;
  meter_run_id: string;
  meter_run_tag: string;
  site_id: string;
  transmitter_id: string | null;
  transmitter_tag: string | null;
  condition: AlarmCondition;
  priority: AlarmPriority;
  state: AlarmState;
  condition_active: boolean;
  onset_at: Date;
  raised_at: Date;
  cleared_at: Date | null;
  acknowledged_at: Date | null;
  acknowledged_by_id: string | null;
  /** The acknowledging user's email. */
  acknowledged_by: string | null;
  shelved_until: Date | null;
  shelve_reason: string | null;
  activations: number;
  message: string;
  detail: Record<string, unknown>;
  notify_status: 'pending' | 'sent' | 'summarised' | 'not-needed';
  notified_at: Date | null;
}

async function logEvent(
  db: Db,
  alarmId: string,
  occurredMs: number,
  action: string,
  fromState: string | null,
  toState: string,
  actor: Actor | null = null,
  note: string | null = null,
) {
  await db.query(
    `INSERT INTO alarm_events (alarm_id, occurred_at, action, from_state, to_state, user_id, user_email, note)
     VALUES ($1, to_timestamp($2 / 1000.0), $3, $4, $5, $6, $7, $8)`,
    [alarmId, occurredMs, action, fromState, toState, actor?.id ?? null, actor?.email ?? null, note],
  );
}

const notifyStatusFor = (priority: AlarmPriority, raisedMs: number, nowMs: number) =>
  priority !== 'low' && raisedMs >= nowMs - NOTIFY_MAX_AGE_MS ? 'pending' : 'not-needed';

/**
 * Applies a raise or clear found by the evaluator to the alarm point's open alarm (creating one
 * for a raise when none is open).
 * @param db a client inside the caller's transaction
 * @param meterRunId the meter run
 * @param signal the raise or clear, at the readings' time
 * @param priority the priority in force for the point
 * @param nowMs the clock (decides whether the raise is fresh enough to mail)
 * @returns the id of the alarm touched and whether a new one was raised, or null if nothing changed
 */
export async function applySignal(
  db: Db,
  meterRunId: string,
  signal: AlarmSignal,
  priority: AlarmPriority,
  nowMs: number,
): Promise<{ alarmId: string; raised: boolean } | null> {
  const open: Pick<AlarmRow, 'id' | 'state' | 'condition_active'> | undefined = (
    await db.query<Pick<AlarmRow, 'id' | 'state' | 'condition_active'>>(
      `SELECT id::text, state, condition_active FROM alarms
        WHERE meter_run_id = $1 AND transmitter_id IS NOT DISTINCT FROM $2::bigint AND condition = $3 AND state <> 'normal' FOR UPDATE`,
      [meterRunId, signal.transmitterId, signal.condition],
    )
  ).rows[0];
  if (signal.kind === 'raise') {
    if (!open) {
      const { rows } = await db.query(
        `INSERT INTO alarms (meter_run_id, transmitter_id, condition, priority, state, condition_active, onset_at, raised_at, message, detail, notify_status)
         VALUES ($1, $2, $3, $4, 'active-unacknowledged', true, to_timestamp($5 / 1000.0), to_timestamp($6 / 1000.0), $7, $8, $9) RETURNING id::text`,
        [
          meterRunId,
          signal.transmitterId,
          signal.condition,
          priority,
          signal.onsetMs,
          signal.timeMs,
          signal.message,
          JSON.stringify(signal.detail),
          notifyStatusFor(priority, signal.timeMs, nowMs),
        ],
      );
      await logEvent(db, rows[0].id, signal.timeMs, 'raised', null, 'active-unacknowledged', null, signal.message);
      return { alarmId: rows[0].id, raised: true };
    }
    const next = nextAlarmStatus({ state: open.state, conditionActive: open.condition_active }, 'raise');
    if (next.state === open.state && next.conditionActive === open.condition_active) return null;
    const reactivated = open.state === 'returned-unacknowledged';
    await db.query(
      `UPDATE alarms SET state = $2, condition_active = true, cleared_at = NULL,
              activations = activations + $3, message = CASE WHEN $3 = 1 THEN $4 ELSE message END,
              notify_status = CASE WHEN $3 = 1 THEN $5 ELSE notify_status END
        WHERE id = $1`,
      [open.id, next.state, reactivated ? 1 : 0, signal.message, notifyStatusFor(priority, signal.timeMs, nowMs)],
    );
    await logEvent(
      db,
      open.id,
      signal.timeMs,
      reactivated ? 'returned-to-alarm' : 'raised-while-' + open.state,
      open.state,
      next.state,
      null,
      signal.message,
    );
    return { alarmId: open.id, raised: reactivated };
  }
  if (!open || !open.condition_active) return null;
  const next = nextAlarmStatus({ state: open.state, conditionActive: true }, 'clear');
  await db.query(
    `UPDATE alarms SET state = $2, condition_active = false, cleared_at = to_timestamp($3 / 1000.0) WHERE id = $1`,
    [open.id, next.state, signal.timeMs],
  );
  await logEvent(db, open.id, signal.timeMs, 'cleared', open.state, next.state);
  return { alarmId: open.id, raised: false };
}

/**
 * A person's action on an alarm (acknowledge, shelve, unshelve, out of service, return).
 * @param pool database pool (the action runs in its own transaction)
 * @param alarmId the alarm
 * @param action the action
 * @param actor who, or null for the system (automatic unshelve)
 * @param options shelving minutes and the reason; the clock
 * @returns the alarm row after the action, or null if there is no such alarm
 * @throws AlarmTransitionError when the state does not allow the action (the API answers 409)
 */
export async function applyAction(
  pool: Pool,
  alarmId: string,
  action: Exclude<AlarmAction, 'raise' | 'clear'>,
  actor: Actor | null,
  options: { minutes?: number; reason?: string; nowMs?: number } = {},
): Promise<AlarmSelectRow | null> {
  const nowMs = options.nowMs ?? Date.now();
  const client = await pool.connect();
  try {
    await client.query('BEGIN');
    type LockedAlarm = Pick<AlarmRow, 'id' | 'state' | 'condition_active' | 'priority' | 'raised_at'>;
    const row: LockedAlarm | undefined = (
      await client.query<LockedAlarm>(
        'SELECT id::text, state, condition_active, priority, raised_at FROM alarms WHERE id = $1 FOR UPDATE',
        [alarmId],
      )
    ).rows[0];
    if (!row) {
      await client.query('ROLLBACK');
      return null;
    }
    const next = nextAlarmStatus({ state: row.state, conditionActive: row.condition_active }, action);
    const sets: string[] = ['state = $2'];
    const params: unknown[] = [alarmId, next.state];
    const param = (v: unknown) => {
      params.push(v);
      return `$${params.length}`;
    };
    if (action === 'acknowledge')
      sets.push(
        `acknowledged_at = to_timestamp(${param(nowMs)} / 1000.0)`,
        `acknowledged_by = ${param(actor?.id ?? null)}`,
      );
    if (action === 'shelve')
      sets.push(
        `shelved_until = to_timestamp(${param(nowMs + (options.minutes ?? 0) * 60_000)} / 1000.0)`,
        `shelve_reason = ${param(options.reason ?? null)}`,
      );
    if (action === 'unshelve' || action === 'return-to-service') {
      sets.push('shelved_until = NULL');
      // Back to active: it must be acknowledged again, and the people who follow it hear of it again.
      if (next.state === 'active-unacknowledged')
        sets.push(
          'acknowledged_at = NULL',
          'acknowledged_by = NULL',
          `notify_status = ${param(row.priority === 'low' ? 'not-needed' : 'pending')}`,
        );
    }
    await client.query(`UPDATE alarms SET ${sets.join(', ')} WHERE id = $1`, params);
    const note = action === 'shelve' ? `${options.minutes} min: ${options.reason}` : (options.reason ?? null);
    await logEvent(client, alarmId, nowMs, actionName[action], row.state, next.state, actor, note);
    await client.query('COMMIT');
    return (await pool.query<AlarmSelectRow>(`${ALARM_SELECT} WHERE a.id = $1`, [alarmId])).rows[0];
  } catch (err) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
}

const actionName: Record<Exclude<AlarmAction, 'raise' | 'clear'>, string> = {
  acknowledge: 'acknowledged',
  shelve: 'shelved',
  unshelve: 'unshelved',
  'remove-from-service': 'removed-from-service',
  'return-to-service': 'returned-to-service',
};

/**
 * Unshelves every alarm whose shelving time is over (ISA-18.2: shelving is time-limited).
 * @returns the ids unshelved
 */
export async function unshelveExpired(pool: Pool, nowMs = Date.now()): Promise<string[]> {
  const { rows } = await pool.query(
    `SELECT id::text FROM alarms WHERE state = 'shelved' AND shelved_until <= to_timestamp($1 / 1000.0)`,
    [nowMs],
  );
  const done: string[] = [];
  for (const r of rows) {
    try {
      await applyAction(pool, r.id, 'unshelve', null, { nowMs, reason: 'shelving time over' });
      done.push(r.id);
    } catch {
      // Unshelved by a person meanwhile.
    }
  }
  return done;
}

/** Raises or clears a point judged by the clock alone (due dates; transmitterId null for the meter run): no walk state. */
export async function setClockCondition(
  db: Db,
  meterRunId: string,
  transmitterId: string | null,
  condition: AlarmCondition,
  holds: boolean,
  priority: AlarmPriority,
  message: string,
  detail: Record<string, string | number | null>,
  nowMs: number,
): Promise<{ alarmId: string; raised: boolean } | null> {
  const open = (
    await db.query(
      `SELECT condition_active FROM alarms
        WHERE meter_run_id = $1 AND transmitter_id IS NOT DISTINCT FROM $2::bigint AND condition = $3 AND state <> 'normal'`,
      [meterRunId, transmitterId, condition],
    )
  ).rows[0];
  const active = open?.condition_active ?? false;
  if (holds === active) return null;
  return applySignal(
    db,
    meterRunId,
    { kind: holds ? 'raise' : 'clear', condition, transmitterId, timeMs: nowMs, onsetMs: nowMs, message, detail },
    priority,
    nowMs,
  );
}
