/**
 * Site clocks follow the IANA zone rules. US daylight saving time (Energy Policy Act of 2005)
 * runs from the second Sunday of March (8 March 2026) to the first Sunday of November
 * (1 November 2026), changing at 02:00 local time: America/Denver is UTC−7 (MST) outside it
 * and UTC−6 (MDT) inside it.
 */
import { Settings } from 'luxon';

import { formatOnSiteClock, siteClockNow, zonedIso } from './zonedTime';

// Month names and zone abbreviations are the locale's; the expected texts are en-US.
beforeAll(() => {
  Settings.defaultLocale = 'en-US';
});

describe('zonedIso', () => {
  it('sends a time typed on the site’s clock with the offset in force then', () => {
    expect(zonedIso('2026-11-20', '14:00', 'America/Denver')).toBe('2026-11-20T14:00:00-07:00');
    expect(zonedIso('2026-07-01', '14:00', 'America/Denver')).toBe('2026-07-01T14:00:00-06:00');
  });

  it('takes an empty time as midnight, and ignores blanks', () => {
    expect(zonedIso(' 2026-07-01 ', ' ', 'America/Denver')).toBe('2026-07-01T00:00:00-06:00');
  });

  it('moves a time skipped by the spring-forward change on by the gap: 02:30 on 8 March 2026 is 03:30 MDT', () => {
    expect(zonedIso('2026-03-08', '02:30', 'America/Denver')).toBe('2026-03-08T03:30:00-06:00');
  });

  it('sends text that is not a date as typed, for the schema to refuse', () => {
    expect(zonedIso('2026-13-01', '', 'America/Denver')).toBe('2026-13-01T00:00');
    expect(zonedIso('tomorrow', '10:00', 'America/Denver')).toBe('tomorrowT10:00');
  });
});

describe('formatOnSiteClock', () => {
  it('shows an instant on the site’s clock with the zone named', () => {
    expect(formatOnSiteClock('2026-11-20T21:00:00Z', 'America/Denver')).toBe('20 Nov 2026, 14:00 MST');
  });

  it('shows text it cannot read as it came', () => {
    expect(formatOnSiteClock('soon', 'America/Denver')).toBe('soon');
  });
});

describe('siteClockNow', () => {
  it('gives the site’s date and minute, which may be the day before UTC’s', () => {
    expect(siteClockNow('America/Denver', Date.UTC(2026, 0, 15, 6, 30))).toEqual({ date: '2026-01-14', time: '23:30' });
  });

  it('gives empty fields for a zone it does not know', () => {
    expect(siteClockNow('Mars/Olympus_Mons', Date.UTC(2026, 0, 15))).toEqual({ date: '', time: '' });
  });
});
