/**
 * Keeps the alarms someone has just acted on in the list they acted in: after an acknowledgement
 * the refreshed list may no longer hold the alarm (an "unacknowledged" filter, or an alarm whose
 * condition had cleared and is now closed), and a row that vanishes under a finger reads as a
 * failure. Such an alarm stays at its old place, under the state the server answered with, until
 * the filter changes.
 */
import type { Alarm } from '@/hooks/api/alarms';

export interface KeptAlarm {
  alarm: Alarm;
  /** Its place in the list when it was acted on. */
  index: number;
}

/**
 * @param list the list as the server now returns it
 * @param kept the alarms acted on since the filter last changed, by id
 * @returns the list with each kept alarm that left it put back at its old place; the server's
 *   copy wins for alarms still listed
 */
export function withKeptAlarms(list: readonly Alarm[], kept: ReadonlyMap<string, KeptAlarm>): Alarm[] {
  const present = new Set(list.map((alarm) => alarm.id));
  const missing = [...kept.values()].filter((k) => !present.has(k.alarm.id)).sort((a, b) => a.index - b.index);
  const out = [...list];
  for (const { alarm, index } of missing) out.splice(Math.min(index, out.length), 0, alarm);
  return out;
}
