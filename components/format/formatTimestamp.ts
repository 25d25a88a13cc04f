/**
 * Shows an instant from the API (ISO 8601) in the viewer's own time zone, with the zone named
 * so a reader never has to guess which clock a record was written on.
 *
 * @param iso an ISO 8601 timestamp
 * @returns e.g. "3 Mar 2025, 14:05:22 MST", or the input unchanged when it is not a date
 */
export function formatTimestamp(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return date.toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
    hour12: false,
    timeZoneName: 'short',
  });
}
