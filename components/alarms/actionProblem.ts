/**
 * What to say when an action on an alarm is refused. A 409 is not a failure of the person: the
 * alarm moved on (someone else acknowledged it, it returned to normal) and the list has been
 * refreshed, so it is said politely, as information. A 400 names its field for the form.
 */
import { isApiError } from '@/hooks/api/client';

export interface ActionProblem {
  /** `info` for a 409 (the alarm moved on), `alarm` for anything that really failed. */
  tone: 'info' | 'error';
  message: string;
  /** The form field a 400 names. */
  field?: string;
}

const conflictWords: Record<string, string> = {
  already_acknowledged: 'Someone has already acknowledged this alarm.',
  already_normal: 'This alarm has already returned to normal and been acknowledged: there is nothing left to do.',
  already_shelved: 'Someone has already shelved this alarm.',
  not_shelved: 'This alarm is no longer shelved.',
  shelved: 'This alarm is shelved: unshelve it first.',
  out_of_service: 'This alarm is out of service.',
  already_out_of_service: 'Someone has already taken this alarm out of service.',
  not_out_of_service: 'This alarm is no longer out of service.',
};

/**
 * @param error what the action threw
 * @returns the words to show, the tone and the field at fault
 */
export function actionProblem(error: unknown): ActionProblem {
  if (isApiError(error, 409)) {
    return {
      tone: 'info',
      message: `${conflictWords[error.code] ?? error.message} The list now shows where it stands.`,
    };
  }
  if (isApiError(error, 403)) return { tone: 'error', message: 'Your role does not allow this action on alarms.' };
  if (isApiError(error, 400)) return { tone: 'error', message: error.message, field: error.field };
  return { tone: 'error', message: error instanceof Error ? error.message : String(error) };
}
