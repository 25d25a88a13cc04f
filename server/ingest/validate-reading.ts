import { toSI, fromSI } from '../../shared/units';
import type { CatalogTransmitter } from './catalog';

export const qualities = ['good', 'uncertain', 'bad', 'substituted'] as const;
export type QualityName = (typeof qualities)[number];
export const qualityCode: Record<QualityName, number> = { good: 0, uncertain: 1, bad: 2, substituted: 3 };

export interface ValidReading {
  transmitterId: string;
  meterRunId: string;
  /** The site's zone: hours are aligned to its local hours. */
  timeZone: string;
  timeMs: number;
  value: number;
  quality: number;
  /** The device that published it over MQTT (its provenance); left out for imports and unknown publishers. */
  deviceId?: string;
  /** How long the reading may stand for (the meter run's longest hold or gap limit), s: the hours it feeds are queued. */
  reachS?: number;
}

/** How far ahead of the server's clock a timestamp may be (device clocks drift a little). */
export const futureToleranceMs = 5 * 60 * 1000;

const isoWithOffset = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:?\d{2})$/i;

/**
 * Checks one reading against its transmitter. Returns the reading, or the reason it is refused
 * (a sentence naming the field): timestamps without an offset, far-future times, values that are
 * not finite numbers, unknown qualities, units other than the transmitter's, and physically
 * impossible values (negative absolute pressure, temperature below absolute zero), and times before
 * the meter run's history starts (its first configuration version), naming that start.
 */
export function validateReading(
  raw: { time: unknown; value: unknown; quality?: unknown; unit?: unknown; problem?: string },
  transmitter: CatalogTransmitter,
  nowMs: number,
): ValidReading | string {
  if (raw.problem) return raw.problem;
  let timeMs: number;
  if (typeof raw.time === 'number') {
    if (!Number.isFinite(raw.time) || !Number.isInteger(raw.time))
      return 'time: epoch milliseconds must be a whole number';
    timeMs = raw.time;
  } else if (typeof raw.time === 'string') {
    if (!isoWithOffset.test(raw.time.trim()))
      return `time: "${raw.time}" must be ISO 8601 with an offset or Z (e.g. 2026-11-01T09:00:00-07:00)`;
    timeMs = Date.parse(raw.time.trim());
    if (Number.isNaN(timeMs)) return `time: "${raw.time}" is not a valid date`;
  } else {
    return 'time: is missing';
  }
  // Beyond ±8.64e15 ms a Date cannot hold the instant (toISOString would throw): refuse it with a reason.
  if (Number.isNaN(new Date(timeMs).getTime())) return `time: ${String(raw.time)} is beyond the dates a clock can hold`;
  if (timeMs > nowMs + futureToleranceMs) return `time: ${new Date(timeMs).toISOString()} is in the future`;
  if (timeMs < Date.UTC(1990, 0, 1)) return `time: ${new Date(timeMs).toISOString()} is before 1990`;
  // Before the meter run's first configuration there is no record for the reading to go into.
  if (transmitter.historyStartMs !== undefined && timeMs < transmitter.historyStartMs)
    return `time: ${new Date(timeMs).toISOString()} is before the history of the meter run of ${transmitter.tag} starts (${new Date(transmitter.historyStartMs).toISOString()})`;

  let value: number;
  if (typeof raw.value === 'number') value = raw.value;
  else if (
    typeof raw.value === 'string' &&
    raw.value.trim() !== '' &&
    /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(raw.value.trim())
  )
    value = Number(raw.value);
  else
    return raw.value === undefined || raw.value === ''
      ? 'value: is missing'
      : `value: ${JSON.stringify(raw.value)} is not a number`;
  if (!Number.isFinite(value)) return 'value: must be a finite number';

  let quality = 0;
  if (raw.quality !== undefined && raw.quality !== null && raw.quality !== '') {
    const q = String(raw.quality).trim().toLowerCase() as QualityName;
    if (!(q in qualityCode)) return `quality: "${raw.quality}" must be one of ${qualities.join(', ')}`;
    quality = qualityCode[q];
  }

  if (raw.unit !== undefined && raw.unit !== null && raw.unit !== '' && String(raw.unit).trim() !== transmitter.unit)
    return `unit: "${raw.unit}" does not match transmitter ${transmitter.tag}, which reads in ${transmitter.unit}`;

  if (transmitter.measures === 'temperature') {
    if (toSI(value, transmitter.unit) <= 0) return `value: ${value} ${transmitter.unit} is at or below absolute zero`;
  } else if (transmitter.measures === 'static-pressure') {
    const absolutePa =
      toSI(value, transmitter.unit) +
      (transmitter.pressureReference === 'gauge' ? transmitter.atmosphericPressurePa : 0);
    if (absolutePa <= 0) {
      const floor =
        transmitter.pressureReference === 'gauge' ? fromSI(-transmitter.atmosphericPressurePa, transmitter.unit) : 0;
      return `value: ${value} ${transmitter.unit} ${transmitter.pressureReference} is a negative absolute pressure (must be above ${floor.toPrecision(4)})`;
    }
  }
  return {
    transmitterId: transmitter.id,
    meterRunId: transmitter.meterRunId,
    timeZone: transmitter.timeZone,
    timeMs,
    value,
    quality,
    ...(transmitter.reachS !== undefined ? { reachS: transmitter.reachS } : {}),
  };
}
