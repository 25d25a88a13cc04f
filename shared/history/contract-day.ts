/**
 * Contract days, contract months and hour boundaries in a site's local time (API MPMS Ch. 21.1:
 * a contract day starts at the contract hour, local time, so it has 23 or 25 hours on the days
 * daylight saving time starts or ends; TRADE.md §5).
 *
 * Definitions (every function here agrees with them):
 * - Contract day D starts at the FIRST instant whose local wall time is D at the contract hour
 *   (H:00). Where H:00 does not exist (clocks jump over it), the day starts at the jump, the
 *   first instant at or after H:00 wall time; where H:00 occurs twice (clocks go back over it),
 *   at the earlier of the two. The day is named by the local date on which it starts and ends
 *   when day D + 1 starts.
 * - A contract month YYYY-MM runs from the start of contract day YYYY-MM-01 to the start of the
 *   contract day on the 1st of the next month.
 * - Hour starts are the instants at which the local wall clock shows a whole hour (minute 0).
 *   In a zone whose UTC offset is a whole number of hours (almost all), these are exactly the
 *   UTC hour boundaries. In a zone offset by :30 or :45 (Asia/Kolkata, Asia/Kathmandu,
 *   Australia/Adelaide, ...) they are the local hours, e.g. 00:30 UTC for 06:00 in Kolkata, so a
 *   record never straddles the contract hour. Assumption: offsets are multiples of 15 minutes
 *   (true of every zone in use today); a zone with a 30-minute DST shift (Australia/Lord_Howe)
 *   gets one 30- or 90-minute "hour" on its change days, which API 21.1's at-most-an-hour record
 *   does not allow; such a site should be configured with hourly splitting on the server.
 */
import { DateTime, IANAZone } from 'luxon';
import type { PeriodBounds } from './types';

const MS_PER_HOUR = 3_600_000;
const MS_PER_MINUTE = 60_000;
/** Every UTC offset in use is a multiple of 15 minutes (IANA tz database): the grid for local hour starts. */
const OFFSET_GRID_MS = 15 * MS_PER_MINUTE;

function zoneOf(functionName: string, timeZone: string): IANAZone {
  if (typeof timeZone !== 'string' || !IANAZone.isValidZone(timeZone)) {
    throw new Error(
      `${functionName}: timeZone must be an IANA time zone name such as America/Denver (got ${String(timeZone)})`,
    );
  }
  return IANAZone.create(timeZone);
}

function checkContractHour(functionName: string, contractHour: number): void {
  if (!Number.isInteger(contractHour) || contractHour < 0 || contractHour > 23) {
    throw new Error(`${functionName}: contractHour must be an integer 0–23 (got ${contractHour})`);
  }
}

function checkTimeMs(functionName: string, field: string, timeMs: number): void {
  if (!Number.isFinite(timeMs))
    throw new Error(`${functionName}: ${field} must be a finite epoch time in ms (got ${timeMs})`);
}

/** Local wall time of an instant in ms since 1970-01-01T00:00 "local". */
function wallMs(zone: IANAZone, timeMs: number): number {
  return timeMs + zone.offset(timeMs) * MS_PER_MINUTE;
}

/** 'YYYY-MM-DD' → midnight UTC of that calendar date (used only for calendar arithmetic). */
function parseDay(functionName: string, day: string): DateTime {
  const parsed =
    typeof day === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(day) ? DateTime.fromISO(day, { zone: 'utc' }) : null;
  if (!parsed || !parsed.isValid)
    throw new Error(`${functionName}: day must be a date YYYY-MM-DD (got ${String(day)})`);
  return parsed;
}

/** Start instant of the contract day on a calendar date (see the definitions above). */
function contractDayStartMs(zone: IANAZone, date: DateTime, contractHour: number): number {
  const wanted = Date.UTC(date.year, date.month - 1, date.day, contractHour);
  // Luxon resolves a skipped wall time forward (to the jump) and an ambiguous one to the LATER
  // occurrence; look back across a possible fold for an earlier instant with the same wall time.
  const resolved = DateTime.fromObject(
    { year: date.year, month: date.month, day: date.day, hour: contractHour },
    { zone },
  ).toMillis();
  for (const backMinutes of [60, 30]) {
    const earlier = resolved - backMinutes * MS_PER_MINUTE;
    if (wallMs(zone, earlier) === wanted) return earlier;
  }
  return resolved;
}

/**
 * The contract day an instant belongs to.
 * @param timeMs instant, epoch ms
 * @param timeZone IANA time zone of the site
 * @param contractHour local hour (0–23) at which a contract day starts
 * @returns the day's name 'YYYY-MM-DD', the local date on which it starts
 * @example contractDayOf(Date.parse('2026-11-01T14:00:00Z'), 'America/Denver', 9) // '2026-10-31' (07:00 MST is before 09:00)
 */
export function contractDayOf(timeMs: number, timeZone: string, contractHour: number): string {
  const zone = zoneOf('contractDayOf', timeZone);
  checkContractHour('contractDayOf', contractHour);
  checkTimeMs('contractDayOf', 'timeMs', timeMs);
  const w = new Date(wallMs(zone, timeMs));
  let date = DateTime.fromObject(
    { year: w.getUTCFullYear(), month: w.getUTCMonth() + 1, day: w.getUTCDate() },
    { zone: 'utc' },
  );
  if (w.getUTCHours() < contractHour) date = date.minus({ days: 1 });
  // The wall-clock guess is right except next to a fold or a jump: settle it on the real bounds.
  if (timeMs < contractDayStartMs(zone, date, contractHour)) date = date.minus({ days: 1 });
  else if (timeMs >= contractDayStartMs(zone, date.plus({ days: 1 }), contractHour)) date = date.plus({ days: 1 });
  return date.toISODate() as string;
}

/**
 * Bounds of a contract day.
 * @param day 'YYYY-MM-DD', the local date on which the day starts
 * @param timeZone IANA time zone of the site
 * @param contractHour local hour (0–23) at which a contract day starts
 * @returns { startMs, endMs, hours }: 24, or 23 / 25 on a daylight-saving change day
 */
export function contractDayBounds(day: string, timeZone: string, contractHour: number): PeriodBounds {
  const zone = zoneOf('contractDayBounds', timeZone);
  checkContractHour('contractDayBounds', contractHour);
  const date = parseDay('contractDayBounds', day);
  const startMs = contractDayStartMs(zone, date, contractHour);
  const endMs = contractDayStartMs(zone, date.plus({ days: 1 }), contractHour);
  return { startMs, endMs, hours: (endMs - startMs) / MS_PER_HOUR };
}

/**
 * Bounds of a contract month: from the contract hour of the 1st to the contract hour of the 1st
 * of the next month, local time.
 * @param month 'YYYY-MM'
 * @param timeZone IANA time zone of the site
 * @param contractHour local hour (0–23) at which a contract day starts
 * @returns { startMs, endMs, hours }
 */
export function contractMonthBounds(month: string, timeZone: string, contractHour: number): PeriodBounds {
  const zone = zoneOf('contractMonthBounds', timeZone);
  checkContractHour('contractMonthBounds', contractHour);
  const first =
    typeof month === 'string' && /^\d{4}-\d{2}$/.test(month) ? DateTime.fromISO(`${month}-01`, { zone: 'utc' }) : null;
  if (!first || !first.isValid) throw new Error(`contractMonthBounds: month must be YYYY-MM (got ${String(month)})`);
  const startMs = contractDayStartMs(zone, first, contractHour);
  const endMs = contractDayStartMs(zone, first.plus({ months: 1 }), contractHour);
  return { startMs, endMs, hours: (endMs - startMs) / MS_PER_HOUR };
}

function isLocalHourStart(zone: IANAZone, timeMs: number): boolean {
  return wallMs(zone, timeMs) % MS_PER_HOUR === 0;
}

/**
 * The hour starts in [startMs, endMs): instants where the local clock shows minute 0 (UTC hour
 * boundaries in whole-hour zones, local hours in :30/:45 zones).
 * @param startMs period start, epoch ms (included if it is an hour start)
 * @param endMs period end, epoch ms (excluded)
 * @param timeZone IANA time zone of the site
 * @returns ascending epoch ms of each hour start
 */
export function hourStartsBetween(startMs: number, endMs: number, timeZone: string): number[] {
  const zone = zoneOf('hourStartsBetween', timeZone);
  checkTimeMs('hourStartsBetween', 'startMs', startMs);
  checkTimeMs('hourStartsBetween', 'endMs', endMs);
  const starts: number[] = [];
  let t = Math.ceil(startMs / OFFSET_GRID_MS) * OFFSET_GRID_MS;
  // Step to the first local hour start, then by whole hours, re-aligning if an offset change
  // moves the local minute (only a :30 DST shift does).
  while (t < endMs && !isLocalHourStart(zone, t)) t += OFFSET_GRID_MS;
  while (t < endMs) {
    starts.push(t);
    t += MS_PER_HOUR;
    while (t < endMs && !isLocalHourStart(zone, t)) t += OFFSET_GRID_MS;
  }
  return starts;
}

/**
 * The start of the hour (local whole hour) that contains an instant.
 * @param timeMs instant, epoch ms
 * @param timeZone IANA time zone of the site
 * @returns the latest hour start ≤ timeMs
 */
export function hourStartOf(timeMs: number, timeZone: string): number {
  const zone = zoneOf('hourStartOf', timeZone);
  checkTimeMs('hourStartOf', 'timeMs', timeMs);
  let t = Math.floor(timeMs / OFFSET_GRID_MS) * OFFSET_GRID_MS;
  while (!isLocalHourStart(zone, t)) t -= OFFSET_GRID_MS;
  return t;
}
