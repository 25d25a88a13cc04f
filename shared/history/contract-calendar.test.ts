import { contractCalendar } from './contract-calendar';
import { contractDayBounds, contractMonthBounds } from './contract-day';

const at = (iso: string) => Date.parse(iso);

/**
 * Worked by hand in UTC (no daylight saving, so every ordinary day is 24 h): contract hour 9
 * until a version dated 2026-11-10T12:00Z sets 6. The version falls inside day 10 November
 * (09:00 on the 10th to 09:00 on the 11th), which keeps the old hour; the change takes effect at
 * the next day start, 09:00 on the 11th; day 11 November runs to 06:00 on the 12th (21 h).
 */
describe('contractCalendar', () => {
  const calendar = contractCalendar(
    'UTC',
    [
      { effectiveFromMs: at('2020-01-01T00:00:00Z'), contractHour: 9 },
      { effectiveFromMs: at('2026-11-10T12:00:00Z'), contractHour: 6 },
    ],
    0,
  );

  it('keeps the old contract hour for the day the version falls in and every day before it', () => {
    expect(calendar.dayBounds('2026-11-10')).toEqual({
      startMs: at('2026-11-10T09:00:00Z'),
      endMs: at('2026-11-11T09:00:00Z'),
      hours: 24,
    });
    expect(calendar.dayBounds('2026-11-09')).toEqual(contractDayBounds('2026-11-09', 'UTC', 9));
    expect(calendar.dayOf(at('2026-11-11T08:59:59Z'))).toBe('2026-11-10');
  });

  it('makes the day that spans the change run from the old hour to the new hour of the next date: 21 h', () => {
    expect(calendar.dayBounds('2026-11-11')).toEqual({
      startMs: at('2026-11-11T09:00:00Z'),
      endMs: at('2026-11-12T06:00:00Z'),
      hours: 21,
    });
    expect(calendar.dayOf(at('2026-11-11T09:00:00Z'))).toBe('2026-11-11');
    expect(calendar.dayOf(at('2026-11-12T05:59:59Z'))).toBe('2026-11-11');
  });

  it('starts every later day at the new hour', () => {
    expect(calendar.dayOf(at('2026-11-12T06:00:00Z'))).toBe('2026-11-12');
    expect(calendar.dayBounds('2026-11-12')).toEqual(contractDayBounds('2026-11-12', 'UTC', 6));
    expect(calendar.dayBounds('2026-12-01')).toEqual(contractDayBounds('2026-12-01', 'UTC', 6));
  });

  it('gives November 30 × 24 − 3 = 717 hours, the sum of its contract days, with no hour in two days', () => {
    const month = calendar.monthBounds('2026-11');
    expect(month).toEqual({ startMs: at('2026-11-01T09:00:00Z'), endMs: at('2026-12-01T06:00:00Z'), hours: 717 });
    let hours = 0;
    let endMs = month.startMs;
    for (let d = 1; d <= 30; d++) {
      const day = calendar.dayBounds(`2026-11-${String(d).padStart(2, '0')}`);
      expect(day.startMs).toBe(endMs);
      endMs = day.endMs;
      hours += day.hours;
    }
    expect(endMs).toBe(month.endMs);
    expect(hours).toBe(717);
  });

  it('makes the day longer when the new hour is later: 0 → 6 dated exactly at a day start gives a 30-hour day', () => {
    const later = contractCalendar(
      'UTC',
      [
        { effectiveFromMs: at('2020-01-01T00:00:00Z'), contractHour: 0 },
        { effectiveFromMs: at('2026-11-10T00:00:00Z'), contractHour: 6 },
      ],
      0,
    );
    expect(later.dayBounds('2026-11-10')).toEqual({
      startMs: at('2026-11-10T00:00:00Z'),
      endMs: at('2026-11-11T06:00:00Z'),
      hours: 30,
    });
    expect(later.dayBounds('2026-11-09').endMs).toBe(at('2026-11-10T00:00:00Z'));
  });

  it('agrees with the fixed-hour functions when the hour never changes, across a DST change (America/Denver)', () => {
    const fixed = contractCalendar('America/Denver', [{ effectiveFromMs: 0, contractHour: 9 }], 9);
    expect(fixed.dayBounds('2026-10-31')).toEqual(contractDayBounds('2026-10-31', 'America/Denver', 9));
    expect(fixed.monthBounds('2026-11')).toEqual(contractMonthBounds('2026-11', 'America/Denver', 9));
    expect(fixed.dayOf(at('2026-11-01T14:00:00Z'))).toBe('2026-10-31');
  });
});
