/**
 * The words an alarm is shown in: its condition, its ISA-18.2 state (TRADE.md §7) and the
 * actions in its log. The codes are DESIGN.md's (shared/alarms/alarm-codes.ts); a code this
 * client does not know is shown as it came, never dropped.
 */
import type { AlarmPriority } from '@/shared/alarms/alarm-codes';
import { alarmConditionWords, alarmStateName } from '@/shared/format/alarm-words';

/**
 * @param condition a condition code
 * @returns it in words, e.g. "DP low in range" (shared/format/alarm-words.ts, the words mails use too)
 */
export function conditionInWords(condition: string): string {
  return alarmConditionWords(condition);
}

/**
 * @param state a state code
 * @returns its ISA-18.2 name, e.g. "Active, unacknowledged" (shared/format/alarm-words.ts)
 */
export function stateInWords(state: string): string {
  return alarmStateName(state);
}

export const priorityWords: Record<AlarmPriority, string> = { high: 'High', medium: 'Medium', low: 'Low' };

const actionWords: Record<string, string> = {
  raised: 'Raised',
  cleared: 'Condition cleared',
  acknowledged: 'Acknowledged',
  shelved: 'Shelved',
  unshelved: 'Unshelved',
  'removed-from-service': 'Taken out of service',
  'returned-to-service': 'Returned to service',
  'returned-to-alarm': 'Returned to alarm',
};

/**
 * @param action an alarm log action, e.g. "acknowledged" or "raised-while-shelved"
 * @returns it in words
 */
export function actionInWords(action: string): string {
  if (action.startsWith('raised-while-'))
    return `Condition again while ${stateInWords(action.slice('raised-while-'.length)).toLowerCase()}`;
  return actionWords[action] ?? action;
}

/** States in which the alarm still wants someone's acknowledgement. */
export function isUnacknowledged(state: string): boolean {
  return state === 'active-unacknowledged' || state === 'returned-unacknowledged';
}

/** States annunciated as abnormal (drawn in the priority's colour): in alarm, or waiting for acknowledgement. */
export function isAnnunciated(state: string): boolean {
  return state === 'active-unacknowledged' || state === 'active-acknowledged' || state === 'returned-unacknowledged';
}
