import { mailRuleWords, unmailedAlarmsWords } from './mailRuleWords';

describe('mail outbox words', () => {
  it('says who gets mail and for which priorities', () => {
    expect(mailRuleWords(2)).toMatch(/^Mail goes to the 2 engineers for each new high- or medium-priority alarm/);
    expect(mailRuleWords(0)).toContain('the engineers (there are none yet)');
  });

  it('says why nine low-priority unacknowledged alarms sent no mail', () => {
    expect(unmailedAlarmsWords({ high: 0, medium: 0, low: 9 }, 3)).toBe(
      'None of the 9 unacknowledged alarms is high or medium priority: they are not mailed one by one, only listed in the daily digest.',
    );
  });

  it('says no mail can go out when there is no engineer', () => {
    expect(unmailedAlarmsWords({ high: 1, medium: 0, low: 0 }, 0)).toBe(
      'No mail can go out: there is no enabled engineer to send the one unacknowledged alarm to.',
    );
  });

  it('says nothing when no alarm waits', () => {
    expect(unmailedAlarmsWords({ high: 0, medium: 0, low: 0 }, 3)).toBeNull();
  });
});
