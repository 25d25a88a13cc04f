/**
 * The alarm lifecycle of ISA-18.2 / IEC 62682 (TRADE.md §7) as a pure transition function.
 * An alarm here is one occurrence at one alarm point (meter run, transmitter, condition):
 * raised → active unacknowledged → (acknowledged and/or returned) → normal, which closes it.
 * A condition that returns while its alarm is still returned-unacknowledged re-activates the
 * same alarm (ISA-18.2's "return to alarm"). Shelving (operator, time-limited) and out of
 * service (maintenance) keep tracking the condition without annunciating it; on unshelving or
 * return to service the alarm is active unacknowledged again if its condition holds, else normal.
 */
import type { AlarmState } from './alarm-codes';

export type AlarmAction =
  'raise' | 'clear' | 'acknowledge' | 'shelve' | 'unshelve' | 'remove-from-service' | 'return-to-service';

export interface AlarmStatus {
  state: AlarmState;
  /** The process condition now (tracked also while shelved or out of service). */
  conditionActive: boolean;
}

/** An action the alarm's state does not allow; `code` is stable (the API answers 409 with it). */
export class AlarmTransitionError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = 'AlarmTransitionError';
  }
}

const refuse = (code: string, message: string): never => {
  throw new AlarmTransitionError(code, message);
};

/**
 * @param current the alarm's state and whether its condition holds
 * @param action what happens to it
 * @returns the new state and condition
 * @throws AlarmTransitionError for an action the state does not allow (a second acknowledge,
 *   acknowledging an alarm already normal, shelving one that is out of service, ...)
 */
export function nextAlarmStatus(current: AlarmStatus, action: AlarmAction): AlarmStatus {
  const { state } = current;
  switch (action) {
    case 'raise':
      if (state === 'normal' || state === 'returned-unacknowledged')
        return { state: 'active-unacknowledged', conditionActive: true };
      return { state, conditionActive: true };
    case 'clear':
      if (state === 'active-unacknowledged') return { state: 'returned-unacknowledged', conditionActive: false };
      if (state === 'active-acknowledged') return { state: 'normal', conditionActive: false };
      return { state, conditionActive: false };
    case 'acknowledge':
      if (state === 'active-unacknowledged')
        return { state: 'active-acknowledged', conditionActive: current.conditionActive };
      if (state === 'returned-unacknowledged') return { state: 'normal', conditionActive: current.conditionActive };
      if (state === 'active-acknowledged') return refuse('already_acknowledged', 'This alarm is already acknowledged.');
      if (state === 'normal')
        return refuse(
          'already_normal',
          'This alarm has returned to normal and was acknowledged; there is nothing to acknowledge.',
        );
      if (state === 'shelved') return refuse('shelved', 'This alarm is shelved; unshelve it first.');
      return refuse('out_of_service', 'This alarm is out of service.');
    case 'shelve':
      if (state === 'active-unacknowledged' || state === 'active-acknowledged' || state === 'returned-unacknowledged')
        return { state: 'shelved', conditionActive: current.conditionActive };
      if (state === 'shelved') return refuse('already_shelved', 'This alarm is already shelved.');
      if (state === 'normal') return refuse('already_normal', 'This alarm is normal; there is nothing to shelve.');
      return refuse('out_of_service', 'This alarm is out of service.');
    case 'unshelve':
      if (state !== 'shelved') return refuse('not_shelved', 'This alarm is not shelved.');
      return {
        state: current.conditionActive ? 'active-unacknowledged' : 'normal',
        conditionActive: current.conditionActive,
      };
    case 'remove-from-service':
      if (state === 'out-of-service') return refuse('already_out_of_service', 'This alarm is already out of service.');
      if (state === 'normal')
        return refuse('already_normal', 'This alarm is normal; there is nothing to take out of service.');
      return { state: 'out-of-service', conditionActive: current.conditionActive };
    case 'return-to-service':
      if (state !== 'out-of-service') return refuse('not_out_of_service', 'This alarm is not out of service.');
      return {
        state: current.conditionActive ? 'active-unacknowledged' : 'normal',
        conditionActive: current.conditionActive,
      };
    default:
      return refuse('unknown_action', `nextAlarmStatus: action must be an alarm action (got ${String(action)})`);
  }
}
