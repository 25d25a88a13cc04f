/**
 * "The demo month": the calendar month before the current one, in a site's zone, and the
 * instants of the scenario's events in it. Pure: the caller passes the clock.
 */
import { DateTime } from 'luxon';
import { contractMonthBounds } from '../../shared/history/contract-day';

/**
 * The calendar month before the one containing an instant, in a zone.
 * @param nowMs the present, epoch ms
 * @param timeZone IANA zone of the site
 * @returns 'YYYY-MM'
 * @example demoMonthAt(Date.parse('2026-12-02T00:17:00Z'), 'America/Denver') // '2026-11'
 */
export function demoMonthAt(nowMs: number, timeZone: string): string {
  const local = DateTime.fromMillis(nowMs, { zone: timeZone });
  if (!local.isValid)
    throw new Error(`demoMonthAt: timeZone must be an IANA zone and nowMs a finite time (got ${timeZone}, ${nowMs})`);
  return local.startOf('month').minus({ months: 1 }).toFormat('yyyy-MM');
}

/**
 * The calendar month containing an instant, in a zone.
 * @param timeMs instant, epoch ms
 * @param timeZone IANA zone
 * @returns 'YYYY-MM'
 */
export function monthOf(timeMs: number, timeZone: string): string {
  const local = DateTime.fromMillis(timeMs, { zone: timeZone });
  if (!local.isValid)
    throw new Error(`monthOf: timeZone must be an IANA zone and timeMs a finite time (got ${timeZone}, ${timeMs})`);
  return local.toFormat('yyyy-MM');
}

/**
 * An instant given as a local wall time on a day of a month (an hour skipped by DST resolves
 * forward, as the clock on the wall would).
 * @param month 'YYYY-MM'
 * @param day day of the month
 * @param hour local hour
 * @param minute local minute
 * @param timeZone IANA zone
 * @returns epoch ms
 */
export function localTimeMs(month: string, day: number, hour: number, minute: number, timeZone: string): number {
  const m = /^(\d{4})-(\d{2})$/.exec(month);
  if (!m) throw new Error(`localTimeMs: month must be YYYY-MM (got ${month})`);
  const t = DateTime.fromObject({ year: Number(m[1]), month: Number(m[2]), day, hour, minute }, { zone: timeZone });
  if (!t.isValid)
    throw new Error(
      `localTimeMs: ${month}-${day} ${hour}:${minute} is not a time in ${timeZone} (${t.invalidExplanation})`,
    );
  return t.toMillis();
}

/**
 * Where a site's demo history starts: the first contract day of the demo month (contract hour of
 * the 1st, local time), so the month's contract days are all complete.
 * @param month 'YYYY-MM'
 * @param timeZone IANA zone of the site
 * @param contractHour the site's contract hour
 * @returns epoch ms
 */
export function demoHistoryStartMs(month: string, timeZone: string, contractHour: number): number {
  return contractMonthBounds(month, timeZone, contractHour).startMs;
}
