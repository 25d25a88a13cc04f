/**
 * What to say in place after an action on an alarm succeeded: what happened, when, and where the
 * alarm now stands, so a row that changes state (or would leave a filtered list) is explained.
 * The server keeps no way to take an acknowledgement back (an acknowledgement is a record in the
 * alarm's log), so no undo is offered.
 */
import type { AlarmAction } from '@/hooks/api/alarms';
import { stateInWords } from './alarmWords';

const doneWords: Record<AlarmAction['kind'], string> = {
  acknowledge: 'Acknowledged',
  shelve: 'Shelved',
  unshelve: 'Unshelved',
  'out-of-service': 'Taken out of service',
  'return-to-service': 'Returned to service',
};

/**
 * @param kind the action that succeeded
 * @param state the alarm's state as the server now has it
 * @param at when, on the site's clock (shared/format/time.ts formatInstant: "3 Dec 2026, 09:14 MST")
 * @returns the notice's words, e.g. "Acknowledged at 3 Dec 2026, 09:14 MST. Now: Active, acknowledged."
 */
export function actionOutcome(kind: AlarmAction['kind'], state: string, at: string): string {
  const now =
    state === 'normal'
      ? 'Its condition had already cleared, so it is now closed (normal).'
      : `Now: ${stateInWords(state)}.`;
  return `${doneWords[kind]} at ${at}. ${now}`;
}
