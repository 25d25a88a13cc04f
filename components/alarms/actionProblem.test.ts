import { ApiError } from '@/hooks/api/client';
import { actionProblem } from './actionProblem';

describe('actionProblem', () => {
  it('says a 409 politely, as information, and that the list now shows where the alarm stands', () => {
    expect(actionProblem(new ApiError(409, 'already_acknowledged', 'Alarm 4 is already acknowledged.'))).toEqual({
      tone: 'info',
      message: 'Someone has already acknowledged this alarm. The list now shows where it stands.',
    });
  });

  it('uses the server’s message for a conflict it has no words for', () => {
    expect(actionProblem(new ApiError(409, 'moved_on', 'The alarm moved on.'))).toEqual({
      tone: 'info',
      message: 'The alarm moved on. The list now shows where it stands.',
    });
  });

  it('says a 403 is the role’s limit', () => {
    expect(actionProblem(new ApiError(403, 'forbidden', 'Forbidden.'))).toEqual({
      tone: 'error',
      message: 'Your role does not allow this action on alarms.',
    });
  });

  it('passes a 400’s field on to the form', () => {
    expect(actionProblem(new ApiError(400, 'invalid_body', 'reason: is required', 'reason'))).toEqual({
      tone: 'error',
      message: 'reason: is required',
      field: 'reason',
    });
  });

  it('shows any other failure’s own message', () => {
    expect(actionProblem(new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server.'))).toEqual({
      tone: 'error',
      message: 'Cannot reach the Tallyrun server.',
    });
    expect(actionProblem('timeout')).toEqual({ tone: 'error', message: 'timeout' });
  });
});
