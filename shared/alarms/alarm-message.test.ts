import { alarmMessage } from './alarm-message';

// 2026-11-12T15:14:00Z is 09:14 in Chicago: US Central Standard Time (UTC−6) from 1 Nov 2026
// (US daylight saving time ends on the first Sunday of November, 15 U.S.C. §260a).
const lastReadingMs = Date.parse('2026-11-12T15:14:00Z');

describe('alarmMessage', () => {
  it("says the time of a silent transmitter's last reading in the site's local time with its zone", () => {
    expect(alarmMessage('stale', 'DP-101', { lastReadingMs, maxAgeS: 300 }, 'America/Chicago')).toBe(
      'DP-101 has sent no reading since 12 Nov 2026, 09:14 CST (limit 5 min).',
    );
  });

  it('keeps the UTC ISO 8601 instant when no time zone is given, as messages stored before read', () => {
    expect(alarmMessage('stale', 'DP-101', { lastReadingMs, maxAgeS: 300 })).toBe(
      'DP-101 has sent no reading since 2026-11-12T15:14:00Z (limit 5 min).',
    );
  });

  it('says the calibration due date as a date in words when the zone is given', () => {
    expect(alarmMessage('calibration-overdue', 'DP-101', { calibrationDue: '2026-11-30' }, 'America/Chicago')).toBe(
      'DP-101 is overdue for calibration (due 30 Nov 2026).',
    );
  });
});
