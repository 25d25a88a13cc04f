import type { LiveBoardRow } from '@/hooks/api/live';
import { DEFAULT_ALARM_LIMITS } from '@/shared/alarms/alarm-limits';
import { isLowInRange, lowInRangePriority, runStates } from './runStates';

function row(change: Partial<LiveBoardRow> = {}): LiveBoardRow {
  return {
    meterRunId: '1',
    tag: 'MR-1',
    name: 'Meter run 1',
    siteCode: 'S1',
    timeZone: 'UTC',
    massFlowKgPerS: 1,
    standardVolumeFlowM3PerS: 1.4,
    todayMassKg: 100,
    todayStandardVolumeM3: 140,
    todayEnergyJ: null,
    todayStart: '2026-01-01T00:00:00Z',
    activeTransmitterId: '1',
    activeStackRole: 'single',
    dpShareOfSpan: 0.5,
    freshnessS: 2,
    transmitters: [],
    warnings: [],
    ...change,
  };
}

describe('isLowInRange', () => {
  it('puts a DP in the bottom tenth of the span, and nothing else, low in range', () => {
    expect(isLowInRange(0.099)).toBe(true);
    expect(isLowInRange(0)).toBe(true);
    expect(isLowInRange(0.1)).toBe(false);
    expect(isLowInRange(null)).toBe(false);
  });
});

describe('runStates', () => {
  it('finds nothing abnormal in a fresh row in mid span', () => {
    expect(runStates(row(), 5, 120)).toEqual([]);
  });

  it('says a DP above span is over range, at high priority, with its share', () => {
    expect(runStates(row({ dpShareOfSpan: 1.12 }), 5, 120)).toEqual([
      { key: 'dp-over-range', priority: 'high', label: 'DP over range (112 % of span)' },
    ]);
  });

  it('says a DP in the bottom tenth is low in range, drawn like the DP-low-in-range alarm', () => {
    expect(lowInRangePriority).toBe(DEFAULT_ALARM_LIMITS['dp-low-in-range'].priority);
    expect(runStates(row({ dpShareOfSpan: 0.054 }), 5, 120)).toEqual([
      { key: 'dp-low-in-range', priority: lowInRangePriority, label: 'DP low in range (5.4 % of span)' },
    ]);
  });

  it('says a row with no readings has none, and leaves out the server warnings that only repeat it', () => {
    const states = runStates(row({ dpShareOfSpan: null, warnings: ['no fresh DP reading'] }), null, 120);
    expect(states).toEqual([{ key: 'no-readings', priority: 'medium', label: 'No readings yet' }]);
  });

  it('says a row is stale past its hold limit, keeping warnings other than "no fresh ..."', () => {
    const states = runStates(row({ warnings: ['no fresh temperature reading', 'stacked pair disagree'] }), 300, 120);
    expect(states).toEqual([
      { key: 'stale', priority: 'medium', label: 'Transmitter silent: newest reading 5 min old' },
      { key: 'warning', priority: 'medium', label: 'stacked pair disagree' },
    ]);
  });

  it('keeps a "no fresh ..." warning while the row itself is not stale', () => {
    expect(runStates(row({ warnings: ['no fresh temperature reading'] }), 10, 120)).toEqual([
      { key: 'warning', priority: 'medium', label: 'no fresh temperature reading' },
    ]);
  });

  it('is not stale at exactly the hold limit', () => {
    expect(runStates(row(), 120, 120)).toEqual([]);
  });
});
