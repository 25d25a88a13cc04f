import { alarmMail, digestMail, floodMail, type MailAlarm, type MailSite } from './alarm-mail-text';

const site: MailSite = { code: 'KFG', name: 'Test field', timeZone: 'America/Chicago' };
const alarm: MailAlarm = {
  id: '42',
  condition: 'dp-low-in-range',
  priority: 'high',
  state: 'active-unacknowledged',
  message: 'DP-101 reads 5.0 % of its span.',
  // 15:11 UTC is 09:11 CST (America/Chicago is UTC−6 in December).
  raisedAt: new Date('2026-12-03T15:11:00Z'),
  clearedAt: null,
  meterRunTag: 'KFG-101',
  transmitterTag: 'DP-101',
};

describe('alarm mail text', () => {
  it('says the condition, priority and state in words and the time in the site’s zone', () => {
    const mail = alarmMail(alarm, site);
    expect(mail.subject).toBe('[Tallyrun] High-priority alarm at KFG: KFG-101 DP low in range');
    expect(mail.text).toContain('Condition: DP low in range; high priority; active, unacknowledged');
    expect(mail.text).toContain('Raised: 3 Dec 2026, 09:11 CST');
    expect(mail.text).not.toMatch(/dp-low-in-range|active-unacknowledged|\d{4}-\d{2}-\d{2}T/);
  });

  it('lists a flood by condition in words, each alarm with its local time and state', () => {
    const mail = floodMail([alarm, { ...alarm, id: '43', condition: 'stale' }], site, 10, 12);
    expect(mail.text).toContain('- DP low in range: 1');
    expect(mail.text).toContain('- Transmitter silent: 1');
    expect(mail.text).toContain(
      '- High priority, KFG-101 / DP-101: DP low in range, raised 3 Dec 2026, 09:11 CST, active, unacknowledged',
    );
  });

  it('labels the digest’s contract day with its start and end', () => {
    // 06:00 CST on 2 Dec is 12:00 UTC.
    const bounds = { startMs: Date.parse('2026-12-02T12:00:00Z'), endMs: Date.parse('2026-12-03T12:00:00Z') };
    const mail = digestMail(site, '2026-12-02', [alarm], [], bounds);
    expect(mail.subject).toBe('[Tallyrun] Alarm digest KFG for contract day 2 Dec 2026: 1 raised, 0 open');
    expect(mail.text).toContain('Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST.');
  });
});
