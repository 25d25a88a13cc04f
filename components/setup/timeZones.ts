/**
 * The IANA time zones a site may be in, and the ones a typed text can mean ("chicago" offers
 * America/Chicago). The list comes from the platform's Intl (the same database the server's
 * schema checks names against), with UTC, which some platforms leave out of it.
 */

/** @returns every IANA zone name this platform knows, sorted, with UTC */
export function allTimeZones(): string[] {
  const intl = Intl as typeof Intl & { supportedValuesOf?: (key: 'timeZone') => string[] };
  let zones: string[];
  try {
    zones = intl.supportedValuesOf?.('timeZone') ?? [];
  } catch {
    zones = [];
  }
  return [...new Set([...zones, 'UTC'])].sort();
}

/** Case, spaces and underscores do not matter: "new york" finds America/New_York. */
function normalise(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, '_');
}

/**
 * @param query what was typed
 * @param zones the zones to choose from
 * @param limit how many to offer at most
 * @returns the matching zones: an exact name first, then those whose place starts with the text, then the rest
 */
export function timeZoneMatches(query: string, zones: readonly string[], limit = 8): string[] {
  const wanted = normalise(query);
  if (wanted === '') return [];
  const rank = (zone: string): number => {
    const name = normalise(zone);
    if (name === wanted) return 0;
    const place = name.slice(name.lastIndexOf('/') + 1);
    if (place.startsWith(wanted)) return 1;
    if (name.split('/').some((part) => part.startsWith(wanted))) return 2;
    return name.includes(wanted) ? 3 : -1;
  };
  return zones
    .map((zone) => ({ zone, rank: rank(zone) }))
    .filter((match) => match.rank >= 0)
    .sort((a, b) => a.rank - b.rank || a.zone.localeCompare(b.zone))
    .slice(0, limit)
    .map((match) => match.zone);
}
