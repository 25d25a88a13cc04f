import { contractDayBounds, contractDayOf, contractMonthBounds, hourStartOf, hourStartsBetween } from './contract-day';

/*
 * Daylight-saving dates worked by hand from the published rules, not from the code:
 * - United States (Energy Policy Act of 2005, common knowledge): DST starts the second Sunday of
 *   March at 02:00 local standard time and ends the first Sunday of November at 02:00 local
 *   daylight time. 2026-01-01 is a Thursday, so 2026-03-01 (day 60) is a Sunday and the second
 *   Sunday is 2026-03-08; 2026-11-01 (day 305) is a Sunday, the first of November.
 *   America/Denver: MST = UTC−7, MDT = UTC−6.
 * - European Union (Directive 2000/84/EC, common knowledge): summer time starts the last Sunday
 *   of March and ends the last Sunday of October at 01:00 UTC: 2026-03-29 and 2026-10-25.
 *   Europe/Berlin: CET = UTC+1, CEST = UTC+2.
 * A contract day is named by the local date on which it starts (API MPMS 21.1 practice; the gas
 * day convention), so with a 09:00 contract hour the day that contains the 02:00 change on
 * 2026-11-01 is the day that STARTS on 2026-10-31.
 * The UTC bounds below were also cross-checked with Python's zoneinfo (Debian /usr/bin/python3).
 */
const iso = (s: string) => Date.parse(s);

describe('contractDayBounds', () => {
  it('gives 25 hours to the America/Denver contract day (09:00) that contains the autumn change of 2026-11-01: 2026-10-31 15:00Z to 2026-11-01 16:00Z', () => {
    // Starts 09:00 MDT (UTC−6) on 10-31, ends 09:00 MST (UTC−7) on 11-01.
    expect(contractDayBounds('2026-10-31', 'America/Denver', 9)).toEqual({
      startMs: iso('2026-10-31T15:00:00Z'),
      endMs: iso('2026-11-01T16:00:00Z'),
      hours: 25,
    });
  });

  it('gives 24 hours to the America/Denver contract day (09:00) named 2026-11-01, which starts after the change', () => {
    expect(contractDayBounds('2026-11-01', 'America/Denver', 9)).toEqual({
      startMs: iso('2026-11-01T16:00:00Z'),
      endMs: iso('2026-11-02T16:00:00Z'),
      hours: 24,
    });
  });

  it('gives 25 hours to the calendar day 2026-11-01 itself in America/Denver when the contract hour is midnight', () => {
    // 00:00 MDT = 06:00Z to 00:00 MST next day = 07:00Z.
    expect(contractDayBounds('2026-11-01', 'America/Denver', 0)).toEqual({
      startMs: iso('2026-11-01T06:00:00Z'),
      endMs: iso('2026-11-02T07:00:00Z'),
      hours: 25,
    });
  });

  it('gives 23 hours to the America/Denver contract day (09:00) that contains the spring change of 2026-03-08: 2026-03-07 16:00Z to 2026-03-08 15:00Z', () => {
    expect(contractDayBounds('2026-03-07', 'America/Denver', 9)).toEqual({
      startMs: iso('2026-03-07T16:00:00Z'),
      endMs: iso('2026-03-08T15:00:00Z'),
      hours: 23,
    });
    expect(contractDayBounds('2026-03-08', 'America/Denver', 9).hours).toBe(24);
  });

  it('gives 23 hours to the calendar day 2026-03-08 in America/Denver with a midnight contract hour', () => {
    // 00:00 MST = 07:00Z to 00:00 MDT on 03-09 = 06:00Z.
    expect(contractDayBounds('2026-03-08', 'America/Denver', 0)).toEqual({
      startMs: iso('2026-03-08T07:00:00Z'),
      endMs: iso('2026-03-09T06:00:00Z'),
      hours: 23,
    });
  });

  it('gives 25 hours to the Europe/Berlin contract day (06:00) that contains the change of 2026-10-25: 2026-10-24 04:00Z to 2026-10-25 05:00Z', () => {
    expect(contractDayBounds('2026-10-24', 'Europe/Berlin', 6)).toEqual({
      startMs: iso('2026-10-24T04:00:00Z'),
      endMs: iso('2026-10-25T05:00:00Z'),
      hours: 25,
    });
    expect(contractDayBounds('2026-10-25', 'Europe/Berlin', 6).hours).toBe(24);
  });

  it('gives 23 hours to the Europe/Berlin contract day (06:00) starting 2026-03-28 (summer time from 2026-03-29)', () => {
    expect(contractDayBounds('2026-03-28', 'Europe/Berlin', 6)).toEqual({
      startMs: iso('2026-03-28T05:00:00Z'),
      endMs: iso('2026-03-29T04:00:00Z'),
      hours: 23,
    });
  });

  it('starts a day whose contract hour occurs twice (01:00 on 2026-11-01 in Denver) at the earlier one, 01:00 MDT = 07:00Z', () => {
    expect(contractDayBounds('2026-11-01', 'America/Denver', 1)).toEqual({
      startMs: iso('2026-11-01T07:00:00Z'),
      endMs: iso('2026-11-02T08:00:00Z'),
      hours: 25,
    });
  });

  it('starts a day whose contract hour is skipped (02:00 on 2026-03-08 in Denver) at the jump, 02:00 MST = 09:00Z', () => {
    expect(contractDayBounds('2026-03-08', 'America/Denver', 2)).toEqual({
      startMs: iso('2026-03-08T09:00:00Z'),
      endMs: iso('2026-03-09T08:00:00Z'),
      hours: 23,
    });
    expect(contractDayBounds('2026-03-07', 'America/Denver', 2).hours).toBe(24);
  });

  it('rejects an unknown time zone, a contract hour of 24 and a malformed day, naming the field', () => {
    expect(() => contractDayBounds('2026-01-01', 'Mars/Olympus', 9)).toThrow(/contractDayBounds: timeZone/);
    expect(() => contractDayBounds('2026-01-01', 'UTC', 24)).toThrow(/contractDayBounds: contractHour/);
    expect(() => contractDayBounds('2026-1-1', 'UTC', 9)).toThrow(/contractDayBounds: day/);
  });
});

describe('contractDayOf', () => {
  it('names an instant before the contract hour by the previous local date: 2026-11-01T15:59:59.999Z (08:59 MST) is in 2026-10-31', () => {
    expect(contractDayOf(iso('2026-11-01T15:59:59.999Z'), 'America/Denver', 9)).toBe('2026-10-31');
    expect(contractDayOf(iso('2026-11-01T16:00:00Z'), 'America/Denver', 9)).toBe('2026-11-01');
  });

  it('puts both occurrences of 01:30 on 2026-11-01 in Denver (07:30Z MDT, 08:30Z MST) in the day that started at the first 01:00 when the contract hour is 1', () => {
    expect(contractDayOf(iso('2026-11-01T07:30:00Z'), 'America/Denver', 1)).toBe('2026-11-01');
    expect(contractDayOf(iso('2026-11-01T08:30:00Z'), 'America/Denver', 1)).toBe('2026-11-01');
    expect(contractDayOf(iso('2026-11-01T06:59:59Z'), 'America/Denver', 1)).toBe('2026-10-31');
  });

  it('names the instant right after a skipped contract hour (03:00 MDT on 2026-03-08 = 09:00Z) by that date', () => {
    expect(contractDayOf(iso('2026-03-08T09:00:00Z'), 'America/Denver', 2)).toBe('2026-03-08');
    expect(contractDayOf(iso('2026-03-08T08:59:59Z'), 'America/Denver', 2)).toBe('2026-03-07');
  });

  it('agrees with contractDayBounds for every hour across the Berlin autumn change', () => {
    const { startMs, endMs } = contractDayBounds('2026-10-24', 'Europe/Berlin', 6);
    for (let t = startMs; t < endMs; t += 3_600_000) expect(contractDayOf(t, 'Europe/Berlin', 6)).toBe('2026-10-24');
    expect(contractDayOf(endMs, 'Europe/Berlin', 6)).toBe('2026-10-25');
  });
});

describe('contractMonthBounds', () => {
  it('gives October 2026 in Denver (09:00) 31 × 24 + 1 = 745 hours, from 10-01 15:00Z to 11-01 16:00Z', () => {
    expect(contractMonthBounds('2026-10', 'America/Denver', 9)).toEqual({
      startMs: iso('2026-10-01T15:00:00Z'),
      endMs: iso('2026-11-01T16:00:00Z'),
      hours: 745,
    });
  });

  it('gives November 2026 in Denver (09:00) 30 × 24 = 720 hours, the long day falling in October', () => {
    expect(contractMonthBounds('2026-11', 'America/Denver', 9).hours).toBe(720);
  });

  it('gives March 2026 in Denver (09:00) 31 × 24 − 1 = 743 hours, from 03-01 16:00Z to 04-01 15:00Z', () => {
    expect(contractMonthBounds('2026-03', 'America/Denver', 9)).toEqual({
      startMs: iso('2026-03-01T16:00:00Z'),
      endMs: iso('2026-04-01T15:00:00Z'),
      hours: 743,
    });
  });

  it('crosses the year: December 2026 in Berlin (06:00) ends 2027-01-01 05:00Z', () => {
    expect(contractMonthBounds('2026-12', 'Europe/Berlin', 6)).toEqual({
      startMs: iso('2026-12-01T05:00:00Z'),
      endMs: iso('2027-01-01T05:00:00Z'),
      hours: 744,
    });
  });

  it('rejects a month that is not YYYY-MM', () => {
    expect(() => contractMonthBounds('2026-13', 'UTC', 0)).toThrow(/contractMonthBounds: month/);
  });
});

describe('hourStartsBetween and hourStartOf', () => {
  it('gives the 25 UTC hour boundaries of the long Denver contract day', () => {
    const { startMs, endMs } = contractDayBounds('2026-10-31', 'America/Denver', 9);
    const starts = hourStartsBetween(startMs, endMs, 'America/Denver');
    expect(starts).toHaveLength(25);
    expect(starts[0]).toBe(iso('2026-10-31T15:00:00Z'));
    expect(starts[24]).toBe(iso('2026-11-01T15:00:00Z'));
  });

  it('aligns to local hours in Asia/Kolkata (UTC+05:30, no DST since 1945 [mem]): 00:30Z, 01:30Z, 02:30Z', () => {
    expect(hourStartsBetween(iso('2026-06-01T00:00:00Z'), iso('2026-06-01T03:00:00Z'), 'Asia/Kolkata')).toEqual([
      iso('2026-06-01T00:30:00Z'),
      iso('2026-06-01T01:30:00Z'),
      iso('2026-06-01T02:30:00Z'),
    ]);
  });

  it('aligns to local hours in Asia/Kathmandu (UTC+05:45 [mem]): the hour containing 01:00Z starts at 00:15Z', () => {
    expect(hourStartOf(iso('2026-06-01T01:00:00Z'), 'Asia/Kathmandu')).toBe(iso('2026-06-01T00:15:00Z'));
  });

  it('floors to the UTC hour in a whole-hour zone: 10:17:42Z in Denver → 10:00Z; an hour start is its own', () => {
    expect(hourStartOf(iso('2026-07-01T10:17:42Z'), 'America/Denver')).toBe(iso('2026-07-01T10:00:00Z'));
    expect(hourStartOf(iso('2026-07-01T10:00:00Z'), 'America/Denver')).toBe(iso('2026-07-01T10:00:00Z'));
  });

  it('gives a Kolkata contract day (06:00 = 00:30Z) exactly 24 local hour starts, the first at its start', () => {
    const { startMs, endMs, hours } = contractDayBounds('2026-06-01', 'Asia/Kolkata', 6);
    expect(startMs).toBe(iso('2026-06-01T00:30:00Z'));
    const starts = hourStartsBetween(startMs, endMs, 'Asia/Kolkata');
    expect(hours).toBe(24);
    expect(starts).toHaveLength(24);
    expect(starts[0]).toBe(startMs);
  });
});
