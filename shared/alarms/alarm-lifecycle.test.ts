import { type AlarmTransitionError, nextAlarmStatus } from './alarm-lifecycle';

// The transitions of the ISA-18.2 / IEC 62682 state diagram (TRADE.md §7).
const code = (fn: () => unknown) => {
  try {
    fn();
  } catch (err) {
    return (err as AlarmTransitionError).code;
  }
  return null;
};

describe('nextAlarmStatus', () => {
  it('goes active-unacknowledged → active-acknowledged → normal on acknowledge then clear', () => {
    const a = nextAlarmStatus({ state: 'normal', conditionActive: false }, 'raise');
    expect(a).toEqual({ state: 'active-unacknowledged', conditionActive: true });
    const b = nextAlarmStatus(a, 'acknowledge');
    expect(b.state).toBe('active-acknowledged');
    expect(nextAlarmStatus(b, 'clear')).toEqual({ state: 'normal', conditionActive: false });
  });

  it('goes active-unacknowledged → returned-unacknowledged → normal on clear then acknowledge', () => {
    const a = nextAlarmStatus({ state: 'active-unacknowledged', conditionActive: true }, 'clear');
    expect(a.state).toBe('returned-unacknowledged');
    expect(nextAlarmStatus(a, 'acknowledge').state).toBe('normal');
  });

  it('returns to alarm from returned-unacknowledged when the condition comes back', () => {
    expect(nextAlarmStatus({ state: 'returned-unacknowledged', conditionActive: false }, 'raise').state).toBe(
      'active-unacknowledged',
    );
  });

  it('refuses a second acknowledge and an acknowledge of a normal alarm with distinct codes', () => {
    expect(code(() => nextAlarmStatus({ state: 'active-acknowledged', conditionActive: true }, 'acknowledge'))).toBe(
      'already_acknowledged',
    );
    expect(code(() => nextAlarmStatus({ state: 'normal', conditionActive: false }, 'acknowledge'))).toBe(
      'already_normal',
    );
  });

  it('keeps tracking the condition while shelved and unshelves to what the condition is', () => {
    const shelved = nextAlarmStatus({ state: 'active-unacknowledged', conditionActive: true }, 'shelve');
    expect(shelved.state).toBe('shelved');
    const cleared = nextAlarmStatus(shelved, 'clear');
    expect(cleared).toEqual({ state: 'shelved', conditionActive: false });
    expect(nextAlarmStatus(cleared, 'unshelve').state).toBe('normal');
    expect(nextAlarmStatus(shelved, 'unshelve').state).toBe('active-unacknowledged');
  });

  it('refuses to shelve an alarm that is out of service or already shelved', () => {
    expect(code(() => nextAlarmStatus({ state: 'out-of-service', conditionActive: true }, 'shelve'))).toBe(
      'out_of_service',
    );
    expect(code(() => nextAlarmStatus({ state: 'shelved', conditionActive: true }, 'shelve'))).toBe('already_shelved');
  });

  it('returns from out of service to active-unacknowledged when the condition holds', () => {
    const oos = nextAlarmStatus({ state: 'active-acknowledged', conditionActive: true }, 'remove-from-service');
    expect(oos.state).toBe('out-of-service');
    expect(nextAlarmStatus(oos, 'return-to-service').state).toBe('active-unacknowledged');
  });
});
