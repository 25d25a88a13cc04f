import type { Alarm } from '@/hooks/api/alarms';
import { withKeptAlarms, type KeptAlarm } from './keptAlarms';

const alarm = (id: string, state: Alarm['state']) => ({ id, state }) as Alarm;

describe('alarms kept in the list after an action', () => {
  it('puts an acknowledged alarm that left the filtered list back at its old place, under its new state', () => {
    const kept = new Map<string, KeptAlarm>([['b', { alarm: alarm('b', 'active-acknowledged'), index: 1 }]]);
    const list = withKeptAlarms([alarm('a', 'active-unacknowledged'), alarm('c', 'active-unacknowledged')], kept);
    expect(list.map((a) => `${a.id}:${a.state}`)).toEqual([
      'a:active-unacknowledged',
      'b:active-acknowledged',
      'c:active-unacknowledged',
    ]);
  });

  it('prefers the server’s copy of an alarm that is still listed', () => {
    const kept = new Map<string, KeptAlarm>([['a', { alarm: alarm('a', 'active-acknowledged'), index: 0 }]]);
    expect(withKeptAlarms([alarm('a', 'normal')], kept).map((a) => a.state)).toEqual(['normal']);
  });

  it('appends a kept alarm whose old place is past the end of a shorter list', () => {
    const kept = new Map<string, KeptAlarm>([['z', { alarm: alarm('z', 'normal'), index: 9 }]]);
    expect(withKeptAlarms([alarm('a', 'shelved')], kept).map((a) => a.id)).toEqual(['a', 'z']);
  });
});
