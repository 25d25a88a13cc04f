import type { Pool } from 'pg';
import { ALARM_SELECT, applyAction, type Actor, type AlarmSelectRow } from '../../alarms/alarm-store';
import type { AlarmAction } from '../../../shared/alarms/alarm-lifecycle';
import type { AlarmCondition, AlarmPriority, AlarmState } from '../../../shared/alarms/alarm-codes';
import type { AlarmStateFilter } from './schema';

/** An alarm with its meter run, site and transmitter, as the API shows it (instants as Date). */
export interface AlarmRecord {
  id: string;
  meterRunId: string;
  meterRunTag: string;
  siteId: string;
  transmitterId: string | null;
  transmitterTag: string | null;
  condition: AlarmCondition;
  priority: AlarmPriority;
  state: AlarmState;
  conditionActive: boolean;
  onsetAt: Date;
  raisedAt: Date;
  clearedAt: Date | null;
  acknowledgedAt: Date | null;
  /** The acknowledging user's email. */
  acknowledgedBy: string | null;
  shelvedUntil: Date | null;
  shelveReason: string | null;
  activations: number;
  message: string;
  detail: Record<string, unknown>;
  notifyStatus: AlarmSelectRow['notify_status'];
  notifiedAt: Date | null;
}

/** One line of an alarm's log. */
export interface AlarmEventRecord {
  id: string;
  alarmId: string;
  occurredAt: Date;
  recordedAt: Date;
  action: string;
  fromState: string | null;
  toState: string;
  userId: string | null;
  userEmail: string | null;
  note: string | null;
}

interface AlarmEventRow {
  id: string;
  alarm_id: string;
  occurred_at: Date;
  recorded_at: Date;
  action: string;
  from_state: string | null;
  to_state: string;
  user_id: string | null;
  user_email: string | null;
  note: string | null;
}

/** Which alarms a list reads; every field narrows it. `from`/`to` are ISO instants. */
export interface AlarmFilter {
  meterRunId?: string;
  siteId?: string;
  transmitterId?: string;
  condition?: AlarmCondition;
  priority?: AlarmPriority;
  from?: string;
  to?: string;
  states?: AlarmStateFilter[];
  limit: number;
}

/** The alarms a count covers: all, a site's or a meter run's. */
export interface AlarmScope {
  siteId?: string;
  meterRunId?: string;
}

/** How many open alarms are in one state at one priority. */
export interface OpenAlarmCount {
  state: AlarmState;
  priority: AlarmPriority;
  count: number;
}

export type PersonAction = Exclude<AlarmAction, 'raise' | 'clear'>;

export interface AlarmsRepository {
  list(filter: AlarmFilter): Promise<AlarmRecord[]>;
  find(alarmId: string): Promise<AlarmRecord | null>;
  /** The logs of the alarms, oldest line first. */
  events(alarmIds: string[]): Promise<AlarmEventRecord[]>;
  openCounts(scope: AlarmScope): Promise<OpenAlarmCount[]>;
  /** Alarms raised in the last `minutes` by the database's clock. */
  raisedWithin(scope: AlarmScope, minutes: number): Promise<number>;
  /**
   * A person's action, in its own transaction (server/alarms/alarm-store.ts applyAction).
   * @throws AlarmTransitionError when the alarm's state does not allow it
   */
  act(
    alarmId: string,
    action: PersonAction,
    actor: Actor,
    options: { minutes?: number; reason?: string },
  ): Promise<AlarmRecord | null>;
}

const toAlarm = (r: AlarmSelectRow): AlarmRecord => ({
  id: r.id,
  meterRunId: r.meter_run_id,
  meterRunTag: r.meter_run_tag,
  siteId: r.site_id,
  transmitterId: r.transmitter_id,
  transmitterTag: r.transmitter_tag,
  condition: r.condition,
  priority: r.priority,
  state: r.state,
  conditionActive: r.condition_active,
  onsetAt: r.onset_at,
  raisedAt: r.raised_at,
  clearedAt: r.cleared_at,
  acknowledgedAt: r.acknowledged_at,
  acknowledgedBy: r.acknowledged_by,
  shelvedUntil: r.shelved_until,
  shelveReason: r.shelve_reason,
  activations: r.activations,
  message: r.message,
  detail: r.detail,
  notifyStatus: r.notify_status,
  notifiedAt: r.notified_at,
});

const toEvent = (r: AlarmEventRow): AlarmEventRecord => ({
  id: r.id,
  alarmId: r.alarm_id,
  occurredAt: r.occurred_at,
  recordedAt: r.recorded_at,
  action: r.action,
  fromState: r.from_state,
  toState: r.to_state,
  userId: r.user_id,
  userEmail: r.user_email,
  note: r.note,
});

/** Numbered placeholders for a WHERE clause built from optional filters. */
function conditions() {
  const where: string[] = [];
  const params: unknown[] = [];
  return {
    where,
    params,
    /** Adds a parameter and returns its placeholder. */
    param(value: unknown) {
      params.push(value);
      return `$${params.length}`;
    },
  };
}

function scopeConditions(scope: AlarmScope) {
  const c = conditions();
  if (scope.siteId) c.where.push(`m.site_id = ${c.param(scope.siteId)}`);
  if (scope.meterRunId) c.where.push(`a.meter_run_id = ${c.param(scope.meterRunId)}`);
  return c;
}

const andAll = (where: string[]) => where.map((w) => ` AND ${w}`).join('');

export function alarmsRepository(pool: Pool): AlarmsRepository {
  return {
    async list(filter) {
      const c = conditions();
      if (filter.meterRunId) c.where.push(`a.meter_run_id = ${c.param(filter.meterRunId)}`);
      if (filter.siteId) c.where.push(`m.site_id = ${c.param(filter.siteId)}`);
      if (filter.transmitterId) c.where.push(`a.transmitter_id = ${c.param(filter.transmitterId)}`);
      if (filter.condition) c.where.push(`a.condition = ${c.param(filter.condition)}`);
      if (filter.priority) c.where.push(`a.priority = ${c.param(filter.priority)}`);
      // An alarm overlaps the window if it was raised before its end and cleared (or not yet) after its start.
      if (filter.from) c.where.push(`coalesce(a.cleared_at, 'infinity') >= ${c.param(filter.from)}`);
      if (filter.to) c.where.push(`a.raised_at < ${c.param(filter.to)}`);
      if (filter.states) {
        const states = filter.states.filter((s) => s !== 'open');
        const open = filter.states.includes('open') ? " OR a.state <> 'normal'" : '';
        c.where.push(`(a.state = ANY(${c.param(states)}::text[])${open})`);
      }
      const { rows } = await pool.query<AlarmSelectRow>(
        `${ALARM_SELECT} ${c.where.length ? `WHERE ${c.where.join(' AND ')}` : ''}
          ORDER BY a.raised_at DESC, a.id DESC LIMIT ${c.param(filter.limit)}`,
        c.params,
      );
      return rows.map(toAlarm);
    },

    async find(alarmId) {
      const { rows } = await pool.query<AlarmSelectRow>(`${ALARM_SELECT} WHERE a.id = $1`, [alarmId]);
      return rows[0] ? toAlarm(rows[0]) : null;
    },

    async events(alarmIds) {
      if (!alarmIds.length) return [];
      const { rows } = await pool.query<AlarmEventRow>(
        `SELECT id::text, alarm_id::text, occurred_at, recorded_at, action, from_state, to_state, user_id::text, user_email, note
           FROM alarm_events WHERE alarm_id = ANY($1::bigint[]) ORDER BY alarm_events.id`,
        [alarmIds],
      );
      return rows.map(toEvent);
    },

    async openCounts(scope) {
      const c = scopeConditions(scope);
      const { rows } = await pool.query<OpenAlarmCount>(
        `SELECT a.state, a.priority, count(*)::int AS count FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
          WHERE a.state <> 'normal'${andAll(c.where)} GROUP BY a.state, a.priority`,
        c.params,
      );
      return rows;
    },

    async raisedWithin(scope, minutes) {
      const c = scopeConditions(scope);
      const since = `now() - ${c.param(minutes)}::int * interval '1 minute'`;
      const { rows } = await pool.query<{ count: number }>(
        `SELECT count(*)::int AS count FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
          WHERE a.raised_at > ${since}${andAll(c.where)}`,
        c.params,
      );
      return rows[0].count;
    },

    async act(alarmId, action, actor, options) {
      const row = await applyAction(pool, alarmId, action, actor, options);
      return row ? toAlarm(row) : null;
    },
  };
}
