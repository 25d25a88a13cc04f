import { judgeDueDate, todayIn } from './due-date';

describe('judgeDueDate (due soon up to and including the due date, overdue from the day after)', () => {
  it('is due soon exactly dueSoonDays before the date and ok the day before that', () => {
    // 2026-11-01 minus 14 days is 2026-10-18 (October has 31 days: 31 − 18 + 1 = 14).
    expect(judgeDueDate('2026-11-01', '2026-10-18', 14)).toEqual({ state: 'due-soon', daysLeft: 14 });
    expect(judgeDueDate('2026-11-01', '2026-10-17', 14)).toEqual({ state: 'ok', daysLeft: 15 });
  });

  it('is due soon on the due date itself and overdue the day after', () => {
    expect(judgeDueDate('2026-11-01', '2026-11-01', 14)).toEqual({ state: 'due-soon', daysLeft: 0 });
    expect(judgeDueDate('2026-11-01', '2026-11-02', 14)).toEqual({ state: 'overdue', daysLeft: -1 });
  });

  it('counts whole days across a leap day (2028 is a leap year: 28 Feb to 1 Mar is 2 days)', () => {
    expect(judgeDueDate('2028-03-01', '2028-02-28', 0).daysLeft).toBe(2);
  });

  it('refuses a date that is not YYYY-MM-DD, naming it', () => {
    expect(() => judgeDueDate('1/11/2026', '2026-11-01', 14)).toThrow(/dueOn/);
  });
});

describe('todayIn (the date in the site’s zone)', () => {
  it('turns the day at the site’s midnight, not at UTC midnight', () => {
    // 2026-11-01T23:30Z is 02:30 on 2 November in Riyadh (UTC+3, no daylight saving, IANA tz database).
    const ms = Date.parse('2026-11-01T23:30:00Z');
    expect(todayIn(ms, 'UTC')).toBe('2026-11-01');
    expect(todayIn(ms, 'Asia/Riyadh')).toBe('2026-11-02');
  });
});
