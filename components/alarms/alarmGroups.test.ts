import type { Alarm } from '@/hooks/api/alarms';
import { alarmGroupRows } from './alarmGroups';

const alarm = (id: string, firstOutId: string | null): Alarm =>
  ({ id, firstOutId, groupId: firstOutId ?? id }) as unknown as Alarm;

describe('alarmGroupRows', () => {
  it('shows one row per group with the consequential alarms under the first-out, oldest first', () => {
    // newest first, as the list comes: 4 and 3 fall under 1; 2 is alone
    const rows = alarmGroupRows([alarm('4', '1'), alarm('3', '1'), alarm('2', null), alarm('1', null)]);
    expect(rows.map((r) => [r.firstOut.id, r.consequential.map((a) => a.id)])).toEqual([
      ['2', []],
      ['1', ['3', '4']],
    ]);
  });

  it('lets an alarm stand alone when its first-out is not in the list', () => {
    const rows = alarmGroupRows([alarm('5', '1'), alarm('6', null)]);
    expect(rows.map((r) => r.firstOut.id)).toEqual(['5', '6']);
  });
});
