/**
 * Times at a site are shown on the site's own clock (its IANA zone), as its contract day is:
 * a record that starts at 09:00 in Denver reads 09:00 wherever the reader is.
 */
import { DateTime } from 'luxon';

/**
 * @param iso an instant
 * @param timeZone the site's IANA zone
 * @param format a luxon format, default "d LLL HH:mm"
 * @returns the instant on the site's clock
 */
export function formatSiteTime(iso: string | number, timeZone: string, format = 'd LLL HH:mm'): string {
  const time =
    typeof iso === 'number' ? DateTime.fromMillis(iso, { zone: timeZone }) : DateTime.fromISO(iso, { zone: timeZone });
  return time.isValid ? time.toFormat(format) : String(iso);
}

/**
 * @param timeZone the site's IANA zone
 * @returns the zone's short name now, e.g. "MST" or "CET" (for column titles)
 */
export function zoneAbbreviation(timeZone: string): string {
  const now = DateTime.now().setZone(timeZone);
  return now.isValid ? now.toFormat('ZZZZ') : timeZone;
}

/**
 * Reads a time typed on the site's clock.
 * @param text "YYYY-MM-DD HH:mm" or "YYYY-MM-DD" (midnight)
 * @param timeZone the site's IANA zone
 * @returns epoch ms, or null when the text is not such a time
 */
export function parseSiteTime(text: string, timeZone: string): number | null {
  const trimmed = text.trim().replace('T', ' ');
  for (const format of ['yyyy-MM-dd HH:mm', 'yyyy-MM-dd H:mm', 'yyyy-MM-dd']) {
    const parsed = DateTime.fromFormat(trimmed, format, { zone: timeZone });
    if (parsed.isValid) return parsed.toMillis();
  }
  return null;
}
