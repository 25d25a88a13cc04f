import { latestContractDays } from './contractDayLabels';

describe('latestContractDays', () => {
  it("labels today's and yesterday's contract day with their date, start and end in the site's zone", () => {
    // 3 Dec 2026 15:00 UTC is 09:00 CST (UTC−6 in winter): the contract day that began at 06:00 on 3 Dec.
    const days = latestContractDays(
      { timeZone: 'America/Chicago', contractHour: 6 },
      Date.parse('2026-12-03T15:00:00Z'),
    );
    expect(days.today).toEqual({ day: '2026-12-03', label: 'Contract day 3 Dec 2026, 06:00 3 Dec – 06:00 4 Dec CST' });
    expect(days.yesterday).toEqual({
      day: '2026-12-02',
      label: 'Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST',
    });
  });

  it('takes the day before a contract hour not yet reached as today', () => {
    // 3 Dec 2026 11:00 UTC is 05:00 CST: before 06:00, so still the contract day of 2 Dec.
    const days = latestContractDays(
      { timeZone: 'America/Chicago', contractHour: 6 },
      Date.parse('2026-12-03T11:00:00Z'),
    );
    expect(days.today.day).toBe('2026-12-02');
    expect(days.yesterday.day).toBe('2026-12-01');
  });

  it('says a 25-hour day when daylight saving time ends within it', () => {
    // US DST ends at 02:00 local on Sunday 1 Nov 2026 (first Sunday of November, 15 U.S.C. §260a):
    // the contract day from 00:00 1 Nov CDT to 00:00 2 Nov CST lasts 25 hours.
    const days = latestContractDays(
      { timeZone: 'America/Chicago', contractHour: 0 },
      Date.parse('2026-11-02T12:00:00Z'),
    );
    expect(days.yesterday.label).toBe('Contract day 1 Nov 2026, 00:00 1 Nov CDT – 00:00 2 Nov CST (25 h)');
  });
});
