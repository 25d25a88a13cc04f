import { demoHistoryStartMs, demoMonthAt, localTimeMs } from './demo-month';
import { scenarioTimeline } from './scenario-timeline';

describe('the demo month', () => {
  it('is the calendar month before the current one in the site zone', () => {
    expect(demoMonthAt(Date.parse('2026-12-02T00:17:00Z'), 'America/Denver')).toBe('2026-11');
    // 2026-12-01T03:00Z is still 30 November, 20:00 in Denver (UTC−7), but 1 December, 04:00 in Berlin (UTC+1).
    expect(demoMonthAt(Date.parse('2026-12-01T03:00:00Z'), 'America/Denver')).toBe('2026-10');
    expect(demoMonthAt(Date.parse('2026-12-01T03:00:00Z'), 'Europe/Berlin')).toBe('2026-11');
  });

  it('crosses a year boundary: in January the demo month is the December before', () => {
    expect(demoMonthAt(Date.parse('2027-01-15T12:00:00Z'), 'America/Denver')).toBe('2026-12');
  });

  it('puts 14:00 on 20 November 2026 in Denver at 21:00 UTC (MST, UTC−7: US daylight time ends on the first Sunday of November, 1 November 2026 [mem])', () => {
    expect(localTimeMs('2026-11', 20, 14, 0, 'America/Denver')).toBe(Date.parse('2026-11-20T21:00:00Z'));
  });

  it("starts each site's history at its first contract day of the month: KFG 09:00 MST = 16:00 UTC, BPM 06:00 CET = 05:00 UTC", () => {
    expect(demoHistoryStartMs('2026-11', 'America/Denver', 9)).toBe(Date.parse('2026-11-01T16:00:00Z'));
    expect(demoHistoryStartMs('2026-11', 'Europe/Berlin', 6)).toBe(Date.parse('2026-11-01T05:00:00Z'));
  });

  it('places the frozen hour on day 3 and the 40-minute dropout on day 12 of the demo month, local time', () => {
    const timeline = scenarioTimeline('2026-11');
    expect(timeline.frozen).toEqual({
      tag: 'KFG-102-DP',
      fromMs: Date.parse('2026-11-03T17:00:00Z'),
      toMs: Date.parse('2026-11-03T18:00:00Z'),
    });
    expect(timeline.dropout.toMs - timeline.dropout.fromMs).toBe(40 * 60_000);
    expect(new Date(timeline.dropout.fromMs).toISOString()).toBe('2026-11-12T09:15:00.000Z'); // 02:15 MST
    expect(timeline.elementChangeMs['KFG-101']).toBe(Date.parse('2026-11-20T21:00:00Z'));
  });

  it('refuses a month that is not YYYY-MM, naming the function', () => {
    expect(() => localTimeMs('2026-13', 1, 0, 0, 'UTC')).toThrow(/localTimeMs/);
    expect(() => localTimeMs('Nov', 1, 0, 0, 'UTC')).toThrow(/localTimeMs: month/);
  });
});
