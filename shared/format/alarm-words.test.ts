import { ALARM_CONDITIONS, ALARM_STATES } from '../alarms/alarm-codes';
import { alarmConditionWords, alarmStateName, alarmStateWords } from './alarm-words';

describe('alarm words', () => {
  it('names every condition in words, with the product-wide names for a silent transmitter and reverse flow', () => {
    for (const condition of ALARM_CONDITIONS) expect(alarmConditionWords(condition)).not.toBe(condition);
    expect(alarmConditionWords('stale')).toBe('Transmitter silent');
    expect(alarmConditionWords('dp-low-in-range')).toBe('DP low in range');
    expect(alarmConditionWords('reverse-flow')).toBe('Reverse flow on a one-way meter run');
  });

  it('names every state by its ISA-18.2 name, and in lower case inside a sentence', () => {
    for (const state of ALARM_STATES) expect(alarmStateName(state)).not.toBe(state);
    expect(alarmStateName('active-unacknowledged')).toBe('Active, unacknowledged');
    expect(alarmStateWords('returned-unacknowledged')).toBe('returned to normal, unacknowledged');
  });

  it('shows a code it does not know as it came, never dropped', () => {
    expect(alarmConditionWords('orifice-plate-upside-down')).toBe('orifice-plate-upside-down');
    expect(alarmStateWords('suppressed-by-design')).toBe('suppressed-by-design');
  });
});
