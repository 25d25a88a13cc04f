/**
 * Expected values come from the rules of the zones, not from the code:
 * - America/Chicago is UTC−6 (CST) in winter and UTC−5 (CDT) in summer; US daylight saving time
 *   ends on the first Sunday of November at 02:00 local (Energy Policy Act of 2005, 15 U.S.C. 260a),
 *   and 1 Nov 2026 is a Sunday (Python's datetime.date(2026, 11, 1).strftime('%A')), so that local day has 25 hours.
 * - Pacific/Auckland is UTC+13 (NZDT) from the last Sunday of September to the first Sunday of
 *   April (New Zealand Time Act 1974 and the Daylight Time Order 2007), so in December its date is
 *   a day ahead of UTC's in the morning.
 */
import { contractDayBounds } from '../history/contract-day';
import { formatClock, formatContractDay, formatDate, formatDuration, formatInstant } from './time';

const chicago = 'America/Chicago';
const auckland = 'Pacific/Auckland';

describe('formatInstant', () => {
  it('shows an instant in the site’s local time with its zone named', () => {
    expect(formatInstant('2026-12-03T15:11:27Z', chicago)).toBe('3 Dec 2026, 09:11 CST');
    expect(formatInstant(Date.UTC(2026, 6, 3, 15, 11), chicago)).toBe('3 Jul 2026, 10:11 CDT');
  });

  it('shows seconds only when asked', () => {
    expect(formatInstant(new Date('2026-12-03T15:11:27Z'), chicago, { seconds: true })).toBe(
      '3 Dec 2026, 09:11:27 CST',
    );
  });

  it('names both 01:30s of the night Chicago’s clocks go back by their zones', () => {
    expect(formatInstant('2026-11-01T06:30:00Z', chicago)).toBe('1 Nov 2026, 01:30 CDT');
    expect(formatInstant('2026-11-01T07:30:00Z', chicago)).toBe('1 Nov 2026, 01:30 CST');
  });

  it('puts an Auckland morning on the next day across the date line', () => {
    expect(formatInstant('2026-12-02T20:30:00Z', auckland)).toBe('3 Dec 2026, 09:30 GMT+13');
  });

  it('shows text that is not a time unchanged', () => {
    expect(formatInstant('not a date', chicago)).toBe('not a date');
  });
});

describe('formatDate', () => {
  it('shows a calendar date with the month in letters, never split by hyphens', () => {
    expect(formatDate('2026-12-02')).toBe('2 Dec 2026');
    expect(formatDate('2026-09-30')).toBe('30 Sep 2026');
  });

  it('shows an instant’s date in the site’s zone, a day ahead of UTC in Auckland', () => {
    expect(formatDate('2026-12-02T20:30:00Z', auckland)).toBe('3 Dec 2026');
    expect(formatDate('2026-12-02T20:30:00Z', chicago)).toBe('2 Dec 2026');
  });
});

describe('formatDuration', () => {
  it('shows seconds under a minute, minutes under an hour and hours with two-digit minutes', () => {
    expect(formatDuration(45)).toBe('45 s');
    expect(formatDuration(600)).toBe('10 min');
    expect(formatDuration(750)).toBe('12 min 30 s');
    expect(formatDuration(3900)).toBe('1 h 05 min');
    expect(formatDuration(25 * 3600)).toBe('25 h 00 min');
    expect(formatDuration(3 * 86400 + 7200)).toBe('3 d 2 h');
  });
});

describe('formatContractDay', () => {
  it('says the day with its start and end so that yesterday is unambiguous', () => {
    // 06:00 CST is 12:00 UTC.
    const bounds = { startMs: Date.parse('2026-12-02T12:00:00Z'), endMs: Date.parse('2026-12-03T12:00:00Z') };
    expect(formatContractDay('2026-12-02', bounds, chicago)).toBe(
      'Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST',
    );
  });

  it('names both zones and the 25 hours of the day Chicago’s clocks go back', () => {
    // 00:00 CDT on 1 Nov is 05:00 UTC; 00:00 CST on 2 Nov is 06:00 UTC.
    const bounds = { startMs: Date.parse('2026-11-01T05:00:00Z'), endMs: Date.parse('2026-11-02T06:00:00Z') };
    expect(contractDayBounds('2026-11-01', chicago, 0)).toEqual(expect.objectContaining(bounds));
    expect(formatContractDay('2026-11-01', bounds, chicago)).toBe(
      'Contract day 1 Nov 2026, 00:00 1 Nov CDT – 00:00 2 Nov CST (25 h)',
    );
  });

  it('labels an Auckland contract day by its local date although it starts the UTC day before', () => {
    // 06:00 NZDT on 3 Dec is 17:00 UTC on 2 Dec.
    const bounds = { startMs: Date.parse('2026-12-02T17:00:00Z'), endMs: Date.parse('2026-12-03T17:00:00Z') };
    expect(formatContractDay('2026-12-03', bounds, auckland)).toBe(
      'Contract day 3 Dec 2026, 06:00 3 Dec – 06:00 4 Dec GMT+13',
    );
  });
});

describe('formatClock', () => {
  it("says the time of day alone in the site's zone with the zone named", () => {
    // 15:11:27 UTC on 3 Dec 2026 is 09:11:27 US Central Standard Time (UTC−6).
    expect(formatClock(Date.parse('2026-12-03T15:11:27Z'), 'America/Chicago')).toBe('09:11 CST');
    expect(formatClock('2026-12-03T15:11:27Z', 'America/Chicago', { seconds: true })).toBe('09:11:27 CST');
  });
});
