import { hourStartOf } from '../../shared/history/contract-day';

const quarterHourMs = 900_000;

/**
 * hourStartOf with a memory: every zone's UTC offset is a whole number of quarter hours, so all
 * instants of one UTC quarter hour share their local hour start. A bulk write of a day of
 * 1 Hz readings then asks the calendar (luxon, ~40 µs a call) 96 times instead of 86 400.
 */
export function cachedHourStartOf(maxEntries = 50_000): (timeMs: number, timeZone: string) => number {
  const cache = new Map<string, number>();
  return (timeMs, timeZone) => {
    const slot = Math.floor(timeMs / quarterHourMs);
    const key = `${timeZone}|${slot}`;
    let start = cache.get(key);
    if (start === undefined) {
      start = hourStartOf(slot * quarterHourMs, timeZone);
      if (cache.size >= maxEntries) cache.clear();
      cache.set(key, start);
    }
    return start;
  };
}
