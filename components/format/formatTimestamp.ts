/**
 * Shows an instant from the API (ISO 8601) the one way Tallyrun shows time (shared/format/time.ts):
 * in the site's zone when the screen knows the site, otherwise in the viewer's own, with the zone
 * named so a reader never has to guess which clock a record was written on.
 */
import { formatInstant } from '@/shared/format/time';

/**
 * @param iso an ISO 8601 timestamp
 * @param timeZone the site's IANA zone, when the screen knows it
 * @returns e.g. "3 Dec 2026, 09:11 CST", or the input unchanged when it is not a date
 */
export function formatTimestamp(iso: string, timeZone?: string): string {
  return formatInstant(iso, timeZone);
}
