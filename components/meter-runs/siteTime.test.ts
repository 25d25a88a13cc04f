/**
 * Site clocks follow the IANA zone rules. US daylight saving time (Energy Policy Act of 2005)
 * runs from the second Sunday of March to the first Sunday of November: America/Denver is UTC−7
 * (MST) outside it and UTC−6 (MDT) inside it.
 */
import { Settings } from 'luxon';

import { formatSiteTime, parseSiteTime, zoneAbbreviation } from './siteTime';

// Month names and zone abbreviations are the locale's; the expected texts are en-US.
beforeAll(() => {
  Settings.defaultLocale = 'en-US';
});

describe('formatSiteTime', () => {
  it('shows an instant on the site’s clock: 16:05 UTC on 3 March 2025 is 09:05 in Denver (MST)', () => {
    expect(formatSiteTime('2025-03-03T16:05:00Z', 'America/Denver')).toBe('3 Mar 09:05');
  });

  it('follows daylight saving time: 16:05 UTC on 1 July 2025 is 10:05 in Denver (MDT)', () => {
    expect(formatSiteTime(Date.UTC(2025, 6, 1, 16, 5), 'America/Denver')).toBe('1 Jul 10:05');
  });

  it('takes a format, and shows text it cannot read as it came', () => {
    expect(formatSiteTime('2025-03-03T16:05:00Z', 'UTC', 'yyyy-MM-dd HH:mm')).toBe('2025-03-03 16:05');
    expect(formatSiteTime('yesterday', 'UTC')).toBe('yesterday');
  });
});

describe('parseSiteTime', () => {
  it('reads a time typed on the site’s clock', () => {
    expect(parseSiteTime('2025-07-01 09:00', 'America/Denver')).toBe(Date.UTC(2025, 6, 1, 15, 0));
    expect(parseSiteTime('2025-01-15 9:30', 'America/Denver')).toBe(Date.UTC(2025, 0, 15, 16, 30));
    expect(parseSiteTime(' 2025-01-15T09:30 ', 'America/Denver')).toBe(Date.UTC(2025, 0, 15, 16, 30));
  });

  it('reads a date alone as the site’s midnight', () => {
    expect(parseSiteTime('2025-01-15', 'America/Denver')).toBe(Date.UTC(2025, 0, 15, 7, 0));
  });

  it('gives null for text that is not such a time', () => {
    expect(parseSiteTime('15/01/2025', 'America/Denver')).toBeNull();
    expect(parseSiteTime('2025-13-01', 'America/Denver')).toBeNull();
    expect(parseSiteTime('', 'America/Denver')).toBeNull();
  });
});

describe('zoneAbbreviation', () => {
  it('names UTC as UTC and an unknown zone by what was given', () => {
    expect(zoneAbbreviation('UTC')).toBe('UTC');
    expect(zoneAbbreviation('Mars/Olympus_Mons')).toBe('Mars/Olympus_Mons');
  });
});
