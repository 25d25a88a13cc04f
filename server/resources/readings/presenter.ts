import type { StoredReading } from './repository';

/**
 * A reading as `GET /api/readings` gives it: `{ time, value, quality, source }`, and with
 * `provenance=true` also the device that published it, the import it came with (ids as strings,
 * null when none) and when the server received it (null for readings stored before arrival
 * times were kept). The provenance is asked for, so the plain shape stays as clients know it.
 */
export const presentReading = (r: StoredReading) => ({
  time: new Date(r.timeMs).toISOString(),
  value: r.value,
  quality: r.quality,
  source: r.source,
});

export const presentReadingWithProvenance = (r: StoredReading) => ({
  ...presentReading(r),
  deviceId: r.deviceId,
  importId: r.importId,
  arrivedAt: r.arrivedAtMs === null ? null : new Date(r.arrivedAtMs).toISOString(),
});
