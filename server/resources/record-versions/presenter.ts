import type { StoredVersion } from './repository';
import type { RecordHistory } from './use-cases';

const iso = (ms: number) => new Date(ms).toISOString();

/** One version: what made it, its figures (SI), when it was computed and when it was replaced (null: in force). */
const presentVersion = (v: StoredVersion, kind: 'hour' | 'total') => ({
  version: v.version,
  cause: v.cause,
  causeReference: v.causeReference,
  start: iso(v.startMs),
  end: iso(v.endMs),
  hours: v.hours,
  flowTimeS: v.flowTimeS,
  massKg: v.massKg,
  volumeM3: v.volumeM3,
  standardVolumeM3: v.standardVolumeM3,
  energyJ: v.energyJ,
  coverage: v.coverage,
  flags: v.flags,
  uncertaintyPercent: v.uncertaintyPercent,
  ...(kind === 'hour' ? { configVersionId: v.configVersionId } : { status: v.status }),
  computedAt: iso(v.computedAtMs),
  supersededAt: v.supersededAtMs === null ? null : iso(v.supersededAtMs),
});

/** The answer of the versions routes: the version in force, every version oldest first, the first, and current − first. */
export const presentRecordHistory = (h: RecordHistory, kind: 'hour' | 'total') => ({
  current: presentVersion(h.current, kind),
  versions: h.versions.map((v) => presentVersion(v, kind)),
  first: presentVersion(h.first, kind),
  difference: h.difference,
});
