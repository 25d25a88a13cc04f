import type { StoredReading } from './repository';

export const presentReading = (r: StoredReading) => ({
  time: new Date(r.timeMs).toISOString(),
  value: r.value,
  quality: r.quality,
  source: r.source,
});
