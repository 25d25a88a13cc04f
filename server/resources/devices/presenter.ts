import type { DeviceRecord } from './repository';

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
