import type { Alarm } from '@/hooks/api/alarms';
import { alarmsByRun, boardOrderFrom, boardSummary, sortRuns, type OrderableRun } from './boardOrder';

function alarm(
  meterRunId: string,
  priority: Alarm['priority'],
  state: Alarm['state'],
  id = `${meterRunId}-${priority}`,
): Alarm {
  return {
    id,
    meterRunId,
    meterRunTag: meterRunId,
    siteId: '1',
    transmitterId: null,
    transmitterTag: null,
    condition: 'dp-low-in-range',
    priority,
    state,
    conditionActive: state.startsWith('active'),
    onsetAt: null,
    raisedAt: null,
    clearedAt: null,
    acknowledgedAt: null,
    acknowledgedBy: null,
    shelvedUntil: null,
    shelveReason: null,
    activations: 1,
    message: '',
  };
}

const run = (meterRunId: string, dpShareOfSpan: number | null, stateCount = 0): OrderableRun => ({
  meterRunId,
  tag: meterRunId,
  dpShareOfSpan,
  stateCount,
});

describe('the live board order', () => {
  const runs = [run('MR-10', 0.5), run('MR-2', 0.05), run('MR-3', 0.8), run('MR-4', null), run('MR-5', 0.3)];

  it('puts an unacknowledged high alarm first, then acknowledged high, then medium, then the lowest DP share, then the tag', () => {
    const alarms = alarmsByRun([
      alarm('MR-3', 'medium', 'active-unacknowledged'),
      alarm('MR-10', 'high', 'active-acknowledged'),
      alarm('MR-5', 'high', 'active-unacknowledged'),
    ]);
    expect(sortRuns(runs, alarms, 'worst').map((r) => r.tag)).toEqual(['MR-5', 'MR-10', 'MR-3', 'MR-2', 'MR-4']);
  });

  it('does not let a shelved, out-of-service or normal alarm rank a meter run', () => {
    const alarms = alarmsByRun([
      alarm('MR-3', 'high', 'shelved'),
      alarm('MR-10', 'high', 'out-of-service'),
      alarm('MR-5', 'high', 'normal'),
    ]);
    expect(sortRuns(runs, alarms, 'worst').map((r) => r.tag)).toEqual(['MR-2', 'MR-5', 'MR-10', 'MR-3', 'MR-4']);
  });

  it('orders by DP share lowest first with no DP last, and by tag in natural order', () => {
    const none = alarmsByRun([]);
    expect(sortRuns(runs, none, 'dp-share').map((r) => r.tag)).toEqual(['MR-2', 'MR-5', 'MR-10', 'MR-3', 'MR-4']);
    expect(sortRuns(runs, none, 'name').map((r) => r.tag)).toEqual(['MR-2', 'MR-3', 'MR-4', 'MR-5', 'MR-10']);
  });

  it('reads the order from the address and falls back to worst first', () => {
    expect(boardOrderFrom('dp-share')).toBe('dp-share');
    expect(boardOrderFrom('name')).toBe('name');
    expect(boardOrderFrom('bogus')).toBe('worst');
    expect(boardOrderFrom(undefined)).toBe('worst');
  });

  it('counts a meter run’s open and unacknowledged alarms and its worst priority', () => {
    const byRun = alarmsByRun([
      alarm('MR-3', 'low', 'active-unacknowledged', 'a'),
      alarm('MR-3', 'medium', 'active-acknowledged', 'b'),
      alarm('MR-3', 'high', 'shelved', 'c'),
    ]);
    expect(byRun.get('MR-3')).toEqual({ open: 3, unacknowledged: 1, worst: 'medium', worstUnacknowledged: false });
  });
});

describe('the live board summary', () => {
  const runs = [run('MR-1', 0.5), run('MR-2', 0.6), run('MR-3', 0.7)];

  it('says all meter runs are normal only when none has a state or an active alarm', () => {
    expect(boardSummary(runs, alarmsByRun([]))).toBe('All 3 meter runs normal.');
  });

  it('never says all normal while an active unacknowledged alarm exists on one of them', () => {
    expect(boardSummary(runs, alarmsByRun([alarm('MR-2', 'medium', 'active-unacknowledged')]))).toBe(
      '1 of 3 meter runs needs attention.',
    );
  });

  it('counts a returned but unacknowledged alarm and a board state, but not a shelved alarm', () => {
    const alarms = alarmsByRun([alarm('MR-1', 'low', 'returned-unacknowledged'), alarm('MR-2', 'high', 'shelved')]);
    expect(boardSummary([...runs, run('MR-4', 0.05, 1)], alarms)).toBe('2 of 4 meter runs need attention.');
  });
});
