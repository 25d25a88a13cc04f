/** The API shape of an alarm (DESIGN.md "Interfaces"), plus what the alarm list and history screens use. */
const isoOrNull = (d: unknown) => (d instanceof Date ? d.toISOString() : null);

export function presentAlarm(r: Record<string, unknown>) {
  return {
    id: String(r.id),
    meterRunId: String(r.meter_run_id),
    meterRunTag: r.meter_run_tag as string,
    siteId: String(r.site_id),
    transmitterId: (r.transmitter_id as string | null) ?? null,
    transmitterTag: (r.transmitter_tag as string | null) ?? null,
    condition: r.condition as string,
    priority: r.priority as string,
    state: r.state as string,
    conditionActive: r.condition_active as boolean,
    onsetAt: isoOrNull(r.onset_at),
    raisedAt: isoOrNull(r.raised_at),
    clearedAt: isoOrNull(r.cleared_at),
    acknowledgedAt: isoOrNull(r.acknowledged_at),
    acknowledgedBy: (r.acknowledged_by as string | null) ?? null,
    shelvedUntil: isoOrNull(r.shelved_until),
    shelveReason: (r.shelve_reason as string | null) ?? null,
    activations: r.activations as number,
    message: r.message as string,
    detail: r.detail as Record<string, unknown>,
    notification: { status: r.notify_status as string, sentAt: isoOrNull(r.notified_at) },
  };
}

export function presentAlarmEvent(r: Record<string, unknown>) {
  return {
    id: String(r.id),
    alarmId: String(r.alarm_id),
    occurredAt: isoOrNull(r.occurred_at),
    recordedAt: isoOrNull(r.recorded_at),
    action: r.action as string,
    fromState: (r.from_state as string | null) ?? null,
    toState: r.to_state as string,
    userId: r.user_id ? String(r.user_id) : null,
    userEmail: (r.user_email as string | null) ?? null,
    note: (r.note as string | null) ?? null,
  };
}
