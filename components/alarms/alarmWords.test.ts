/**
 * State words and which states are annunciated follow ANSI/ISA-18.2 (IEC 62682), the alarm
 * state transition diagram: an alarm is annunciated while active (acknowledged or not) and while
 * returned to normal but unacknowledged; shelved and out-of-service alarms are not (from memory).
 */
import { ALARM_CONDITIONS, ALARM_STATES } from '@/shared/alarms/alarm-codes';
import {
  actionInWords,
  conditionInWords,
  isAnnunciated,
  isUnacknowledged,
  priorityWords,
  stateInWords,
} from './alarmWords';

describe('conditionInWords', () => {
  it('has words for every condition code of the alarm vocabulary', () => {
    for (const condition of ALARM_CONDITIONS) expect(conditionInWords(condition)).not.toBe(condition);
  });

  it('says a few conditions as the trade does', () => {
    expect(conditionInWords('dp-low-in-range')).toBe('DP low in range');
    expect(conditionInWords('stale')).toBe('Transmitter silent');
  });

  it('shows a condition this client does not know by its code, never dropping it', () => {
    expect(conditionInWords('orifice-plate-upside-down')).toBe('orifice-plate-upside-down');
  });
});

describe('stateInWords', () => {
  it('has words for every state', () => {
    for (const state of ALARM_STATES) expect(stateInWords(state)).not.toBe(state);
  });

  it('names the ISA-18.2 states', () => {
    expect(stateInWords('active-unacknowledged')).toBe('Active, unacknowledged');
    expect(stateInWords('returned-unacknowledged')).toBe('Returned to normal, unacknowledged');
    expect(stateInWords('suppressed-by-design')).toBe('suppressed-by-design');
  });
});

describe('actionInWords', () => {
  it('says each logged action', () => {
    expect(actionInWords('acknowledged')).toBe('Acknowledged');
    expect(actionInWords('cleared')).toBe('Condition cleared');
    expect(actionInWords('removed-from-service')).toBe('Taken out of service');
  });

  it('says a condition that came back while the alarm was shelved or out of service', () => {
    expect(actionInWords('raised-while-shelved')).toBe('Condition again while shelved');
    expect(actionInWords('raised-while-out-of-service')).toBe('Condition again while out of service');
  });

  it('shows an action it does not know as it came', () => {
    expect(actionInWords('escalated')).toBe('escalated');
  });
});

describe('the state tests', () => {
  it('wants acknowledgement in the two unacknowledged states only', () => {
    expect(ALARM_STATES.filter(isUnacknowledged)).toEqual(['active-unacknowledged', 'returned-unacknowledged']);
  });

  it('annunciates active alarms and returned-but-unacknowledged ones, not normal, shelved or out-of-service ones', () => {
    expect(ALARM_STATES.filter(isAnnunciated)).toEqual([
      'active-unacknowledged',
      'active-acknowledged',
      'returned-unacknowledged',
    ]);
  });

  it('has words for every priority', () => {
    expect(priorityWords).toEqual({ high: 'High', medium: 'Medium', low: 'Low' });
  });
});
