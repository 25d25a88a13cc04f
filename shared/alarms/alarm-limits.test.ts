import { type AlarmLimitError, DEFAULT_ALARM_LIMITS, checkAlarmLimits, effectiveAlarmLimits } from './alarm-limits';
import { ALARM_CONDITIONS } from './alarm-codes';

const fieldOf = (fn: () => unknown) => {
  try {
    fn();
  } catch (err) {
    return (err as AlarmLimitError).field;
  }
  return null;
};

describe('checkAlarmLimits', () => {
  it('accepts every default', () => {
    for (const c of ALARM_CONDITIONS) expect(() => checkAlarmLimits(c, DEFAULT_ALARM_LIMITS[c])).not.toThrow();
  });
  it('refuses a negative delay, naming onDelayS or offDelayS', () => {
    expect(
      fieldOf(() => checkAlarmLimits('dp-low-in-range', effectiveAlarmLimits('dp-low-in-range', { onDelayS: -1 }))),
    ).toBe('onDelayS');
    expect(fieldOf(() => checkAlarmLimits('stale', effectiveAlarmLimits('stale', { offDelayS: -5 })))).toBe(
      'offDelayS',
    );
  });
  it('refuses a low-in-range share above 100 %, naming thresholdShareOfSpan', () => {
    expect(
      fieldOf(() =>
        checkAlarmLimits('dp-low-in-range', effectiveAlarmLimits('dp-low-in-range', { thresholdShareOfSpan: 1.2 })),
      ),
    ).toBe('thresholdShareOfSpan');
  });
  it('refuses a deadband wider than the range, naming deadbandShareOfSpan', () => {
    expect(
      fieldOf(() =>
        checkAlarmLimits('dp-low-in-range', effectiveAlarmLimits('dp-low-in-range', { deadbandShareOfSpan: 1.5 })),
      ),
    ).toBe('deadbandShareOfSpan');
    expect(
      fieldOf(() =>
        checkAlarmLimits(
          'dp-low-in-range',
          effectiveAlarmLimits('dp-low-in-range', { thresholdShareOfSpan: 0.9, deadbandShareOfSpan: 0.2 }),
        ),
      ),
    ).toBe('deadbandShareOfSpan');
    expect(
      fieldOf(() =>
        checkAlarmLimits('dp-over-range', effectiveAlarmLimits('dp-over-range', { deadbandShareOfSpan: 1 })),
      ),
    ).toBe('deadbandShareOfSpan');
  });
  it('refuses a field that does not belong to the condition', () => {
    expect(fieldOf(() => checkAlarmLimits('stale', { ...DEFAULT_ALARM_LIMITS.stale, windowS: 600 }))).toBe('windowS');
  });
});

describe('effectiveAlarmLimits', () => {
  it('lays the transmitter over the meter run over the defaults', () => {
    const l = effectiveAlarmLimits('dp-low-in-range', { thresholdShareOfSpan: 0.15, onDelayS: 60 }, { onDelayS: 120 });
    expect(l).toMatchObject({ thresholdShareOfSpan: 0.15, onDelayS: 120, offDelayS: 60, priority: 'medium' });
  });
});
