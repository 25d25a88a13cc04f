/**
 * When a live reading is sent: at once, or late (the scenario's store-and-forward block, see
 * LATE_DATA). Pure.
 */
import { LATE_DATA, transmitterByTag } from '../scenario';

const MS_PER_MINUTE = 60_000;
const MS_PER_HOUR = 3_600_000;

/**
 * @param tag transmitter tag
 * @param timeMs the reading's time, epoch ms
 * @returns the instant at which the live publisher sends it, or null to send it at once
 * @example lateReleaseMs('KFG-103-DP', Date.parse('2026-12-02T10:41:30Z')) // Date.parse('2026-12-02T10:48:00Z')
 */
export function lateReleaseMs(tag: string, timeMs: number): number | null {
  if (transmitterByTag(tag).meterRun.tag !== LATE_DATA.meterRunTag) return null;
  // Hour starts are UTC hour boundaries in both demo zones (whole-hour offsets), so UTC minutes are local minutes.
  const hourStartMs = Math.floor(timeMs / MS_PER_HOUR) * MS_PER_HOUR;
  const blockStartMs = hourStartMs + LATE_DATA.minute * MS_PER_MINUTE;
  if (timeMs < blockStartMs || timeMs >= blockStartMs + LATE_DATA.blockMinutes * MS_PER_MINUTE) return null;
  return blockStartMs + LATE_DATA.releaseAfterMinutes * MS_PER_MINUTE;
}
