/**
 * The one way Tallyrun shows time, on screens, in mails and in exports' headers: an instant in
 * the site's local time with its zone named, a calendar date, a duration, and a contract day
 * with its start and end (so "yesterday" never needs guessing). Pure: client and server alike.
 *
 * Month names are spelled here, not taken from the runtime's locale data, so every machine writes
 * the same text ("Sep", never "Sept").
 */
import { DateTime, IANAZone } from 'luxon';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const MS_PER_HOUR = 3_600_000;

/** An instant as epoch ms, an ISO 8601 string or a Date. */
export type Instant = number | string | Date;

function toMs(at: Instant): number {
  if (typeof at === 'number') return at;
  if (at instanceof Date) return at.getTime();
  return Date.parse(at);
}

/** The viewer's own zone, for screens that show an instant with no site (e.g. a user added). */
export function viewerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

function zoneOrViewer(timeZone: string | undefined): string {
  return timeZone && IANAZone.isValidZone(timeZone) ? timeZone : viewerTimeZone();
}

function local(ms: number, timeZone: string): DateTime {
  return DateTime.fromMillis(ms, { zone: timeZone }).setLocale('en-US');
}

/** The zone's short name at that instant: "CST", "CDT", or "GMT+13" where the zone has no letters. */
function zoneName(dt: DateTime): string {
  return dt.toFormat('ZZZZ');
}

const dayText = (dt: DateTime) => `${dt.day} ${MONTHS[dt.month - 1]} ${dt.year}`;
const clockText = (dt: DateTime, seconds: boolean) => dt.toFormat(seconds ? 'HH:mm:ss' : 'HH:mm');

/**
 * @param at the instant
 * @param timeZone the site's IANA zone; the viewer's zone when absent or not a zone
 * @param options seconds: also show seconds (audit and rejection logs)
 * @returns e.g. "3 Dec 2026, 09:11 CST"; the input as text when it is not a time
 */
export function formatInstant(at: Instant, timeZone?: string, options: { seconds?: boolean } = {}): string {
  const ms = toMs(at);
  if (!Number.isFinite(ms)) return String(at);
  const dt = local(ms, zoneOrViewer(timeZone));
  return `${dayText(dt)}, ${clockText(dt, options.seconds ?? false)} ${zoneName(dt)}`;
}

/**
 * The time of day alone, for a line whose day goes without saying (the board's "as of", today's start).
 * @param at the instant
 * @param timeZone the site's IANA zone; the viewer's zone when absent or not a zone
 * @returns e.g. "09:11 CST", or "09:11:27 CST" with seconds; the input as text when it is not a time
 */
export function formatClock(at: Instant, timeZone?: string, options: { seconds?: boolean } = {}): string {
  const ms = toMs(at);
  if (!Number.isFinite(ms)) return String(at);
  const dt = local(ms, zoneOrViewer(timeZone));
  return `${clockText(dt, options.seconds ?? false)} ${zoneName(dt)}`;
}

/**
 * @param day a calendar date "YYYY-MM-DD", or an instant (shown as its date in timeZone)
 * @param timeZone for an instant: the site's zone (the viewer's when absent)
 * @returns e.g. "2 Dec 2026"; the input as text when it is not a date
 */
export function formatDate(day: Instant, timeZone?: string): string {
  if (typeof day === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(day)) {
    const dt = DateTime.fromISO(day, { zone: 'utc' });
    return dt.isValid ? dayText(dt) : day;
  }
  const ms = toMs(day);
  if (!Number.isFinite(ms)) return String(day);
  return dayText(local(ms, zoneOrViewer(timeZone)));
}

/**
 * @param seconds a duration in seconds (rounded to whole seconds; negative shown with "−")
 * @returns "45 s" under a minute, "12 min" or "12 min 30 s" under an hour, "1 h 05 min" from an hour,
 *   "2 d 3 h" from two days
 */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '—';
  const sign = seconds < 0 ? '−' : '';
  const total = Math.round(Math.abs(seconds));
  if (total < 60) return `${sign}${total} s`;
  if (total < 3600) {
    const s = total % 60;
    return `${sign}${Math.floor(total / 60)} min${s ? ` ${s} s` : ''}`;
  }
  const totalMinutes = Math.round(total / 60);
  if (totalMinutes < 48 * 60) {
    return `${sign}${Math.floor(totalMinutes / 60)} h ${String(totalMinutes % 60).padStart(2, '0')} min`;
  }
  const totalHours = Math.round(total / 3600);
  const h = totalHours % 24;
  return `${sign}${Math.floor(totalHours / 24)} d${h ? ` ${h} h` : ''}`;
}

/**
 * @param day the contract day's name, "YYYY-MM-DD" (the local date on which it starts)
 * @param bounds its start and end instants (shared/history/contract-day.ts contractDayBounds)
 * @param timeZone the site's zone
 * @returns e.g. "Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST"; both zone names when
 *   daylight saving time changes within it, and its length when it is not 24 hours
 *   ("Contract day 1 Nov 2026, 00:00 1 Nov CDT – 00:00 2 Nov CST (25 h)")
 */
export function formatContractDay(day: string, bounds: { startMs: number; endMs: number }, timeZone: string): string {
  const zone = zoneOrViewer(timeZone);
  const start = local(bounds.startMs, zone);
  const end = local(bounds.endMs, zone);
  const edge = (dt: DateTime) => `${clockText(dt, false)} ${dt.day} ${MONTHS[dt.month - 1]}`;
  const startZone = zoneName(start);
  const endZone = zoneName(end);
  const span =
    startZone === endZone
      ? `${edge(start)} – ${edge(end)} ${endZone}`
      : `${edge(start)} ${startZone} – ${edge(end)} ${endZone}`;
  const hours = (bounds.endMs - bounds.startMs) / MS_PER_HOUR;
  const length = hours === 24 ? '' : ` (${Number.isInteger(hours) ? hours : hours.toFixed(1)} h)`;
  return `Contract day ${formatDate(day)}, ${span}${length}`;
}
