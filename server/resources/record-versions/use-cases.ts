import { notFound } from '../../errors';
import type { PeriodSelector, RecordVersionsRepository, StoredVersion } from './repository';
import type { VersionedInterval } from './schema';

/** Every version of one record, the first and the one in force, and how far the current moved from the first. */
export interface RecordHistory {
  current: StoredVersion;
  /** Oldest first; the last is the current one. */
  versions: StoredVersion[];
  first: StoredVersion;
  /** current − first, per quantity (energy null when either version has none). */
  difference: { massKg: number; volumeM3: number; standardVolumeM3: number; energyJ: number | null };
}

function recordHistory(versions: StoredVersion[]): RecordHistory {
  const first = versions[0];
  const current = versions[versions.length - 1];
  return {
    current,
    versions,
    first,
    difference: {
      massKg: current.massKg - first.massKg,
      volumeM3: current.volumeM3 - first.volumeM3,
      standardVolumeM3: current.standardVolumeM3 - first.standardVolumeM3,
      energyJ: current.energyJ === null || first.energyJ === null ? null : current.energyJ - first.energyJ,
    },
  };
}

/**
 * Every version of the hourly record of the hour starting at `startMs`.
 * @throws not found when the meter run does not exist, or has no record of that hour
 */
export async function hourlyRecordVersions(
  repository: RecordVersionsRepository,
  request: { meterRunId: string; startMs: number },
): Promise<RecordHistory> {
  if (!(await repository.meterRunExists(request.meterRunId))) throw notFound('Meter run');
  const versions = await repository.hourlyVersions(request.meterRunId, request.startMs);
  if (!versions.length) throw notFound('Hourly record');
  return recordHistory(versions);
}

/**
 * Every version of one contract-day or contract-month total.
 * @throws not found when the meter run does not exist, or has no total of that period
 */
export async function periodTotalVersions(
  repository: RecordVersionsRepository,
  request: { meterRunId: string; interval: VersionedInterval; period: PeriodSelector },
): Promise<RecordHistory> {
  if (!(await repository.meterRunExists(request.meterRunId))) throw notFound('Meter run');
  const versions = await repository.periodVersions(request.meterRunId, request.interval, request.period);
  if (!versions.length) throw notFound(request.interval === 'day' ? 'Contract day total' : 'Contract month total');
  return recordHistory(versions);
}
