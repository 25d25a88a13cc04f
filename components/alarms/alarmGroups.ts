/**
 * One row per consequential-alarm group (ISA-18.2 first-out): the server marks each listed alarm
 * with its group; a first-out carries the alarms raised under it. An alarm whose first-out is not
 * in the list (filtered out, or older than the list reaches) stands alone.
 */
import type { Alarm } from '@/hooks/api/alarms';

export interface AlarmGroupRow {
  firstOut: Alarm;
  consequential: Alarm[];
}

/** @returns the groups in the list's order (the first-out's place), each consequential list oldest first */
export function alarmGroupRows(list: readonly Alarm[]): AlarmGroupRow[] {
  const present = new Set(list.map((a) => a.id));
  const under = new Map<string, Alarm[]>();
  for (const a of list)
    if (a.firstOutId && present.has(a.firstOutId)) under.set(a.firstOutId, [...(under.get(a.firstOutId) ?? []), a]);
  return list
    .filter((a) => !a.firstOutId || !present.has(a.firstOutId))
    .map((firstOut) => ({ firstOut, consequential: [...(under.get(firstOut.id) ?? [])].reverse() }));
}
