import type { Catalog } from './catalog';
import type { DeviceCounters, Rejection } from './device-counters';
import type { GroupCommitter } from './reading-writer';
import { parsePayload, parseTopic } from './parse-payload';
import { validateReading, type ValidReading } from './validate-reading';

export interface IngestOutcome {
  accepted: number;
  rejected: number;
  reasons: string[];
}

/**
 * The MQTT path: topic → transmitter, payload → readings, each reading checked, the good ones
 * committed (group commit) before the caller acknowledges the message. A bad reading is
 * counted against the device and never stops the good ones of the same message. Each reading
 * carries the device that published it; a re-sent reading with another value is recorded as a
 * conflict by the writer, and the first one stays stored. Every refused reading is logged for
 * the device with its reason and its place in the message (issue 12 §12), not just the first.
 */
export function createMqttIngest(deps: {
  catalog: Catalog;
  committer: GroupCommitter;
  counters: DeviceCounters;
  onStored?: (readings: ValidReading[]) => void;
  now?: () => number;
}) {
  const now = deps.now ?? Date.now;
  return async function ingest(
    device: { id: string; siteCode: string } | null,
    topic: string,
    payload: Buffer,
  ): Promise<IngestOutcome> {
    const nowMs = now();
    const reject = (kind: string, reason: string): IngestOutcome => {
      if (device) deps.counters.count(device.id, 0, [{ atMs: nowMs, topic, kind, reason, readingIndex: null }]);
      return { accepted: 0, rejected: 1, reasons: [reason] };
    };
    const where = parseTopic(topic);
    if (!where) return reject('topic', `topic must be tallyrun/<site code>/<transmitter tag>`);
    if (device && device.siteCode !== where.siteCode)
      return reject('other-site', `this device may publish only under tallyrun/${device.siteCode}/`);
    const transmitter = await deps.catalog.bySiteAndTag(where.siteCode, where.tag);
    if (!transmitter)
      return reject('unknown-transmitter', `unknown transmitter ${where.tag} at site ${where.siteCode}`);
    const raw = parsePayload(payload);
    if (typeof raw === 'string') return reject('payload', raw);
    const good: ValidReading[] = [];
    const reasons: string[] = [];
    const rejections: Rejection[] = [];
    raw.forEach((r, readingIndex) => {
      const checked = validateReading(r, transmitter, nowMs);
      if (typeof checked === 'string') {
        reasons.push(checked);
        rejections.push({ atMs: nowMs, topic, kind: reasonKind(checked), reason: checked, readingIndex });
      } else {
        if (device) checked.deviceId = device.id;
        good.push(checked);
      }
    });
    if (good.length) await deps.committer.submit(good);
    if (device) deps.counters.count(device.id, good.length, rejections);
    if (good.length) deps.onStored?.(good);
    return { accepted: good.length, rejected: reasons.length, reasons };
  };
}

/** A reading's reason names its field first (`value: must be a finite number`): count by that field. */
function reasonKind(reason: string): string {
  const field = /^([a-z]+):/.exec(reason)?.[1];
  return field ?? 'reading';
}
