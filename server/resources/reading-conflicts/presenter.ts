import type { ReadingConflict, ReadingOrigin } from './repository';

/** A reading's origin as one word: `device:<id>`, `import:<id>`, or its path when neither is known. */
export const presentOrigin = (o: ReadingOrigin) =>
  o.deviceId ? `device:${o.deviceId}` : o.importId ? `import:${o.importId}` : o.path;

const iso = (ms: number | null) => (ms === null ? null : new Date(ms).toISOString());

/** A conflict as the API gives it: ids as strings, instants as ISO 8601, values in `unit`. */
export const presentReadingConflict = (c: ReadingConflict) => ({
  id: c.id,
  meterRunId: c.meterRunId,
  transmitterId: c.transmitterId,
  transmitterTag: c.transmitterTag,
  time: iso(c.timeMs),
  storedValue: c.storedValue,
  storedQuality: c.storedQuality,
  offeredValue: c.offeredValue,
  offeredQuality: c.offeredQuality,
  unit: c.unit,
  storedSource: presentOrigin(c.storedOrigin),
  storedArrivedAt: iso(c.storedArrivedAtMs),
  offeredSource: presentOrigin(c.offeredOrigin),
  offeredArrivedAt: iso(c.offeredArrivedAtMs),
  status: c.status,
  resolvedBy: c.resolution?.resolvedBy ?? null,
  resolvedAt: c.resolution ? iso(c.resolution.resolvedAtMs) : null,
  resolution: c.resolution?.note ?? null,
  correctionId: c.resolution?.correctionId ?? null,
});
