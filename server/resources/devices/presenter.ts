import { rejectionLogSize } from '../../ingest/device-counters';
import type { DeviceRecord, RejectionCount, RejectionRecord } from './repository';

/** A device as JSON (never its password hash); the site's code when the caller has it. */
export function presentDevice(d: DeviceRecord, siteCode?: string) {
  return {
    id: d.id,
    siteId: d.siteId,
    ...(siteCode ? { siteCode } : {}),
    name: d.name,
    username: d.username,
    disabled: d.disabled,
    acceptedCount: d.acceptedCount,
    rejectedCount: d.rejectedCount,
    lastRejection: d.lastRejection,
    lastSeenAt: d.lastSeenAt ? d.lastSeenAt.toISOString() : null,
    createdAt: d.createdAt.toISOString(),
  };
}

/** A device's refusal log as JSON: counts by kind, then the latest refusals, newest first. */
export function presentRejections(deviceId: string, r: { latest: RejectionRecord[]; counts: RejectionCount[] }) {
  return {
    deviceId,
    logSize: rejectionLogSize,
    countsByReason: r.counts.map((c) => ({ kind: c.kind, count: c.count, since: c.since.toISOString() })),
    latest: r.latest.map((x) => ({
      at: x.at.toISOString(),
      topic: x.topic,
      kind: x.kind,
      reason: x.reason,
      readingIndex: x.readingIndex,
    })),
  };
}
