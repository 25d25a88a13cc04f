import type { AlarmEventRecord, AlarmRecord } from './repository';
import type { AlarmWithEvents, GroupedAlarm, GroupedAlarmWithEvents } from './use-cases';

/** The API shape of an alarm (DESIGN.md "Interfaces"), plus what the alarm list and history screens use. */
const isoOrNull = (d: Date | null) => (d ? d.toISOString() : null);

export function presentAlarm(a: AlarmRecord) {
  return {
    id: a.id,
    meterRunId: a.meterRunId,
    meterRunTag: a.meterRunTag,
    siteId: a.siteId,
    transmitterId: a.transmitterId,
    transmitterTag: a.transmitterTag,
    condition: a.condition,
    priority: a.priority,
    state: a.state,
    conditionActive: a.conditionActive,
    onsetAt: isoOrNull(a.onsetAt),
    raisedAt: isoOrNull(a.raisedAt),
    clearedAt: isoOrNull(a.clearedAt),
    acknowledgedAt: isoOrNull(a.acknowledgedAt),
    acknowledgedBy: a.acknowledgedBy,
    shelvedUntil: isoOrNull(a.shelvedUntil),
    shelveReason: a.shelveReason,
    activations: a.activations,
    message: a.message,
    detail: a.detail,
    notification: { status: a.notifyStatus, sentAt: isoOrNull(a.notifiedAt) },
  };
}

export function presentAlarmEvent(e: AlarmEventRecord) {
  return {
    id: e.id,
    alarmId: e.alarmId,
    occurredAt: isoOrNull(e.occurredAt),
    recordedAt: isoOrNull(e.recordedAt),
    action: e.action,
    fromState: e.fromState,
    toState: e.toState,
    userId: e.userId,
    userEmail: e.userEmail,
    note: e.note,
  };
}

export function presentAlarmWithEvents(a: AlarmWithEvents) {
  return { ...presentAlarm(a), events: a.events.map(presentAlarmEvent) };
}

/** Where an alarm stands in its consequential-alarm group (ISA-18.2 first-out). */
const presentGrouping = (a: GroupedAlarm) => ({
  groupId: a.groupId,
  firstOutId: a.firstOutId,
  consequentialCount: a.consequentialCount,
});

/** A list, each alarm with its log when the list was read with its events, and its group. */
export function presentAlarmList(list: GroupedAlarm[] | GroupedAlarmWithEvents[]) {
  return list.map((a) =>
    'events' in a
      ? { ...presentAlarm(a), ...presentGrouping(a), events: a.events.map(presentAlarmEvent) }
      : { ...presentAlarm(a), ...presentGrouping(a) },
  );
}
