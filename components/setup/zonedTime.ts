/**
 * Effective times are typed on the site's own clock (a date and a time of day) and sent as ISO
 * 8601 with that zone's offset, so "14:00 on the 20th" means 14:00 at the site whatever the
 * viewer's zone, daylight saving included (IANA rules, through luxon).
 */
import { DateTime } from 'luxon';

/**
 * @param date YYYY-MM-DD
 * @param time HH:MM (empty: 00:00)
 * @param zone the site's IANA zone
 * @returns ISO 8601 with the offset in force then (a time skipped by a spring-forward change moves on by the gap), or the text as typed when it is not a date, for the schema to refuse
 */
export function zonedIso(date: string, time: string, zone: string): string {
  const typed = `${date.trim()}T${time.trim() || '00:00'}`;
  const moment = DateTime.fromISO(typed, { zone });
  return moment.isValid ? (moment.toISO({ suppressMilliseconds: true }) ?? typed) : typed;
}

/**
 * @param iso an instant
 * @param zone the site's IANA zone
 * @returns the instant on the site's clock, e.g. "20 Nov 2026, 14:00 MST"
 */
export function formatOnSiteClock(iso: string, zone: string): string {
  const moment = DateTime.fromISO(iso, { zone });
  return moment.isValid ? moment.toFormat('d LLL yyyy, HH:mm ZZZZ') : iso;
}

/**
 * @param zone the site's IANA zone
 * @param nowMs the current time
 * @returns today's date and the current minute on the site's clock, to start a form from
 */
export function siteClockNow(zone: string, nowMs: number): { date: string; time: string } {
  const moment = DateTime.fromMillis(nowMs, { zone });
  return moment.isValid
    ? { date: moment.toFormat('yyyy-LL-dd'), time: moment.toFormat('HH:mm') }
    : { date: '', time: '' };
}
