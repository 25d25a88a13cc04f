/**
 * Expected values: zone names from the IANA tz database (zone1970.tab lists America/Chicago,
 * America/New_York, America/Indiana/Knox; "UTC" is its link to Etc/UTC), from memory.
 */
import { allTimeZones, timeZoneMatches } from './timeZones';

const zones = ['America/Chicago', 'America/Indiana/Knox', 'America/New_York', 'Europe/London', 'UTC'];

describe('timeZoneMatches', () => {
  it('offers America/Chicago for "Chicago", whatever the case', () => {
    expect(timeZoneMatches('Chicago', zones)).toEqual(['America/Chicago']);
    expect(timeZoneMatches('chic', zones)).toEqual(['America/Chicago']);
  });

  it('finds a place written with a space where the name has an underscore', () => {
    expect(timeZoneMatches('new york', zones)).toEqual(['America/New_York']);
  });

  it('puts an exact name first, then places starting with the text, then other parts', () => {
    expect(timeZoneMatches('America', zones, 2)).toEqual(['America/Chicago', 'America/Indiana/Knox']);
    expect(timeZoneMatches('utc', zones)).toEqual(['UTC']);
    expect(timeZoneMatches('kno', zones)).toEqual(['America/Indiana/Knox']);
  });

  it('offers nothing for blank text or a place that is not there', () => {
    expect(timeZoneMatches('  ', zones)).toEqual([]);
    expect(timeZoneMatches('Atlantis', zones)).toEqual([]);
  });
});

describe('allTimeZones', () => {
  it('lists the platform’s IANA zones with UTC, Chicago among them', () => {
    const all = allTimeZones();
    expect(all).toContain('UTC');
    expect(all).toContain('America/Chicago');
    expect(new Set(all).size).toBe(all.length);
  });
});
