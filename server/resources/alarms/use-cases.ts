import { AppError, notFound } from '../../errors';
import { AlarmTransitionError } from '../../../shared/alarms/alarm-lifecycle';
import type { AlarmPriority, AlarmState } from '../../../shared/alarms/alarm-codes';
import type { Actor } from '../../alarms/alarm-store';
import { groupConsequential, type AlarmGrouping } from '../../../shared/alarms/alarm-performance';
import type {
  AlarmEventRecord,
  AlarmFilter,
  AlarmRecord,
  AlarmScope,
  AlarmsRepository,
  PersonAction,
} from './repository';

/** TRADE.md §7: a flood is more than 10 alarms in 10 minutes. */
const FLOOD_WINDOW_MINUTES = 10;
const FLOOD_MORE_THAN = 10;

const UNACKNOWLEDGED: readonly AlarmState[] = ['active-unacknowledged', 'returned-unacknowledged'];

export type AlarmWithEvents = AlarmRecord & { events: AlarmEventRecord[] };
export type GroupedAlarm = AlarmRecord & AlarmGrouping;
export type GroupedAlarmWithEvents = AlarmWithEvents & AlarmGrouping;

/**
 * The alarms matching a filter, newest first, each with its consequential-alarm group
 * (shared/alarms/alarm-performance.ts groupConsequential: same site, same condition family, raised
 * within 2 minutes of the first-out). Grouping is worked out at read time over the alarms listed.
 * @param withEvents also read each alarm's log (the history screen shows them together)
 */
export async function listAlarms(
  repository: AlarmsRepository,
  filter: AlarmFilter,
  withEvents: boolean,
): Promise<GroupedAlarm[] | GroupedAlarmWithEvents[]> {
  const alarms = await repository.list(filter);
  const groups = groupConsequential(alarms);
  const grouped = alarms.map((a) => ({ ...a, ...groups.get(a.id)! }));
  if (!withEvents || !alarms.length) return grouped;
  const byAlarm = new Map<string, AlarmEventRecord[]>();
  for (const e of await repository.events(alarms.map((a) => a.id)))
    byAlarm.set(e.alarmId, [...(byAlarm.get(e.alarmId) ?? []), e]);
  return grouped.map((a) => ({ ...a, events: byAlarm.get(a.id) ?? [] }));
}

/** For the banner on every screen: open alarms, how many wait for acknowledgement, by priority, and a flood. */
export async function alarmCounts(repository: AlarmsRepository, scope: AlarmScope) {
  const byState: Partial<Record<AlarmState, number>> = {};
  const unacknowledgedByPriority: Record<AlarmPriority, number> = { high: 0, medium: 0, low: 0 };
  let open = 0;
  for (const c of await repository.openCounts(scope)) {
    open += c.count;
    byState[c.state] = (byState[c.state] ?? 0) + c.count;
    if (UNACKNOWLEDGED.includes(c.state)) unacknowledgedByPriority[c.priority] += c.count;
  }
  const raisedLast10Minutes = await repository.raisedWithin(scope, FLOOD_WINDOW_MINUTES);
  return {
    open,
    unacknowledged: (byState['active-unacknowledged'] ?? 0) + (byState['returned-unacknowledged'] ?? 0),
    unacknowledgedByPriority,
    byState,
    raisedLast10Minutes,
    flood: raisedLast10Minutes > FLOOD_MORE_THAN,
  };
}

export type AlarmCounts = Awaited<ReturnType<typeof alarmCounts>>;

/** One alarm with its log. @throws not found */
export async function alarmWithEvents(repository: AlarmsRepository, alarmId: string): Promise<AlarmWithEvents> {
  const alarm = await existingAlarm(repository, alarmId);
  return { ...alarm, events: await repository.events([alarm.id]) };
}

/** One alarm's log, oldest first. @throws not found */
export async function alarmEvents(repository: AlarmsRepository, alarmId: string): Promise<AlarmEventRecord[]> {
  const alarm = await existingAlarm(repository, alarmId);
  return repository.events([alarm.id]);
}

/**
 * A person acknowledges, shelves, unshelves, takes out of service or returns an alarm.
 * @returns the alarm after the action
 * @throws not found; 409 with the lifecycle's code when the alarm's state does not allow the action
 */
export async function respondToAlarm(
  repository: AlarmsRepository,
  request: {
    alarmId: string;
    action: PersonAction;
    actor: Actor;
    minutes?: number;
    reason?: string;
    changed?: (alarmIds: string[]) => void;
  },
): Promise<AlarmRecord> {
  const { alarmId, action, actor, minutes, reason } = request;
  await existingAlarm(repository, alarmId);
  try {
    const alarm = await repository.act(alarmId, action, { id: actor.id, email: actor.email }, { minutes, reason });
    if (!alarm) throw notFound('Alarm');
    request.changed?.([alarmId]);
    return alarm;
  } catch (err) {
    // Not allowed in its state (a second acknowledge, one already normal, ...): 409 with a stable code.
    if (err instanceof AlarmTransitionError) throw new AppError(409, err.code, err.message, 'state');
    throw err;
  }
}

async function existingAlarm(repository: AlarmsRepository, alarmId: string) {
  const alarm = await repository.find(alarmId);
  if (!alarm) throw notFound('Alarm');
  return alarm;
}
