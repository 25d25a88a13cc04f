import { actionOutcome } from './actionOutcome';
import { stateInWords } from './alarmWords';

describe('the words shown after an alarm action', () => {
  it('says an acknowledged active alarm was acknowledged, when, and its new state', () => {
    expect(actionOutcome('acknowledge', 'active-acknowledged', '3 Dec 2026, 09:14 UTC')).toBe(
      `Acknowledged at 3 Dec 2026, 09:14 UTC. Now: ${stateInWords('active-acknowledged')}.`,
    );
  });

  it('explains that an alarm whose condition had cleared is now closed', () => {
    expect(actionOutcome('acknowledge', 'normal', '3 Dec 2026, 09:14 UTC')).toMatch(
      /^Acknowledged at 3 Dec 2026, 09:14 UTC\. Its condition had already cleared, so it is now closed/,
    );
  });
});
