import type { Catalog } from './catalog';
import type { DeviceCounters } from './device-counters';
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
 * conflict by the writer, and the first one stays stored.
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
    const reject = (reason: string, count = 1): IngestOutcome => {
      if (device) deps.counters.count(device.id, 0, count, `${topic}: ${reason}`);
      return { accepted: 0, rejected: count, reasons: [reason] };
    };
    const where = parseTopic(topic);
    if (!where) return reject(`topic must be tallyrun/<site code>/<transmitter tag>`);
    if (device && device.siteCode !== where.siteCode)
      return reject(`this device may publish only under tallyrun/${device.siteCode}/`);
    const transmitter = await deps.catalog.bySiteAndTag(where.siteCode, where.tag);
    if (!transmitter) return reject(`unknown transmitter ${where.tag} at site ${where.siteCode}`);
    const raw = parsePayload(payload);
    if (typeof raw === 'string') return reject(raw);
    const good: ValidReading[] = [];
    const reasons: string[] = [];
    const nowMs = now();
    for (const r of raw) {
      const checked = validateReading(r, transmitter, nowMs);
      if (typeof checked === 'string') reasons.push(checked);
      else {
        if (device) checked.deviceId = device.id;
        good.push(checked);
      }
    }
    if (good.length) await deps.committer.submit(good);
    if (device)
      deps.counters.count(device.id, good.length, reasons.length, reasons[0] ? `${topic}: ${reasons[0]}` : undefined);
    if (good.length) deps.onStored?.(good);
    return { accepted: good.length, rejected: reasons.length, reasons };
  };
}
