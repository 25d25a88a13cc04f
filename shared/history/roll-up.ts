/**
 * Totals of a period (an hour, a contract day, a contract month) from its hourly records, as
 * GET /api/meter-runs/:id/totals returns them (DESIGN.md, "Interfaces").
 */
import { widenForUnmeasuredTime } from '../uncertainty/total-uncertainty';
import type { PeriodBounds, PeriodReverse, PeriodTotal, RollUpRecord, TotalStatus } from './types';

const MS_PER_HOUR = 3_600_000;

export interface RollUpOptions {
  /** The caller's "now", epoch ms: hours starting at or after it are not yet due. */
  nowMs: number;
  /** The period lies in a closed month (locked against change). */
  closed?: boolean;
  /**
   * When the meter run's history starts, epoch ms: time before it is no part of the period (its
   * first contract day may start before the meter run existed), so it is neither missing nor covered.
   */
  historyStartMs?: number;
}

/**
 * Sums hourly records into a period total.
 * - Quantities and flow time are sums; energy is null only when no record has one (flag
 *   'energy-incomplete' when a record with flow lacks it while others have it).
 * - Coverage is weighted by elapsed time over the elapsed part of the period, [start, min(now,
 *   end)): an hour without a record counts as coverage 0; hours not yet begun do not count, so
 *   today's running total shows the coverage of what has happened so far. Each hour's weight
 *   is its elapsed part, min(now, hour end) − hour start (the hour's own coverage is already
 *   relative to its elapsed part).
 * - Flags: the union in order of first appearance, plus 'missing-data' when coverage < 1.
 * - Uncertainty: the mass-weighted mean of the hourly expanded uncertainties. Assumption: the
 *   hourly uncertainties are dominated by systematic effects (C, ε, diameters, transmitter
 *   calibration) that are fully correlated from hour to hour, so they add linearly rather than
 *   in quadrature (the conservative choice; random noise averages out well within an hour).
 *   Then widened for time without a measurement (coverage < 1) and for the mass of records
 *   flagged 'substituted', by the rectangular rule of widenForUnmeasuredTime (GUM §4.3.7).
 *   Null when there is no mass.
 * - Status: 'closed' when options.closed; else, once now ≥ end, 'missing' when nothing at all was
 *   recorded (coverage 0: a period without data is not complete), 'complete' when every hour of
 *   the period has a record; else 'provisional'.
 * - Reverse flow (a bi-directional meter run): the records' figures above are forward flow; their
 *   reverse parts are summed apart into `reverse` (energy null only when no reverse part has one),
 *   and `net` = forward − reverse (energy null when either is null). Both are present only when
 *   some record of the period has a reverse part (not null), so one-way totals keep their shape.
 * - Time before options.historyStartMs (the meter run did not exist yet) counts neither as elapsed
 *   nor as needing a record.
 * Hours are the period's start + k h for k < hours (a contract day starts at a local hour, and
 * every hour of a whole-hour or :30/:45 zone is 3600 s long). An hour may be stored as several
 * records, split where a dated setting took effect (API MPMS 21.1: a new record when a constant
 * changes): each record is weighted by its own elapsed part, min(now, record end) − record start,
 * and an hour counts as recorded when its records together cover it. Records starting outside
 * the period are ignored, and of two records with one start the later in the array wins.
 * @param records hourly records (or the summed fields of them)
 * @param bounds the period's bounds and its length in hours
 * @param options nowMs, and closed for a closed month
 * @returns the period total with start and end as ISO 8601 UTC strings
 */
export function rollUpRecords(
  records: readonly RollUpRecord[],
  bounds: PeriodBounds,
  options: RollUpOptions,
): PeriodTotal {
  const { startMs, endMs, hours } = bounds;
  if (!Number.isFinite(startMs) || !Number.isFinite(endMs) || !(endMs > startMs)) {
    throw new Error(
      `rollUpRecords: bounds.startMs and bounds.endMs must be finite with endMs > startMs (got ${startMs}, ${endMs})`,
    );
  }
  if (!(hours > 0)) throw new Error(`rollUpRecords: bounds.hours must be > 0 (got ${hours})`);
  if (!Number.isFinite(options?.nowMs))
    throw new Error(`rollUpRecords: options.nowMs must be a finite epoch time in ms (got ${options?.nowMs})`);
  const nowMs = options.nowMs;

  const byStart = new Map<number, RollUpRecord>();
  for (const r of records) {
    if (r.startMs >= startMs && r.startMs < endMs) byStart.set(r.startMs, r);
  }

  let flowTimeS = 0;
  let massKg = 0;
  let volumeM3 = 0;
  let standardVolumeM3 = 0;
  let energyJ = 0;
  let energyCount = 0;
  let flowingWithoutEnergy = false;
  let massTimesUncertainty = 0;
  let massWithUncertainty = 0;
  let uncertaintyMissing = false;
  // Mass of records resting on substituted readings (the whole record counts: it does not say how much).
  let substitutedMassKg = 0;
  const flags: string[] = [];
  let reverse: PeriodReverse | null = null;
  let reverseEnergyCount = 0;
  for (const r of byStart.values()) {
    if (r.reverse) {
      reverse ??= { flowTimeS: 0, massKg: 0, volumeM3: 0, standardVolumeM3: 0, energyJ: 0 };
      reverse.flowTimeS += r.reverse.flowTimeS;
      reverse.massKg += r.reverse.massKg;
      reverse.volumeM3 += r.reverse.volumeM3;
      reverse.standardVolumeM3 += r.reverse.standardVolumeM3;
      if (r.reverse.energyJ !== null) {
        reverse.energyJ = (reverse.energyJ as number) + r.reverse.energyJ;
        reverseEnergyCount++;
      }
    }
    flowTimeS += r.flowTimeS;
    massKg += r.massKg;
    volumeM3 += r.volumeM3;
    standardVolumeM3 += r.standardVolumeM3;
    if (r.energyJ !== null) {
      energyJ += r.energyJ;
      energyCount++;
    } else if (r.massKg > 0) {
      flowingWithoutEnergy = true;
    }
    if (r.massKg > 0) {
      if (r.flags.includes('substituted')) substitutedMassKg += r.massKg;
      if (r.uncertaintyPercent === null) uncertaintyMissing = true;
      else {
        massTimesUncertainty += r.massKg * r.uncertaintyPercent;
        massWithUncertainty += r.massKg;
      }
    }
    for (const f of r.flags) if (!flags.includes(f)) flags.push(f);
  }

  // Coverage over the elapsed part of the period: each record (a whole hour or a part of one)
  // weighs its elapsed part; the elapsed part of the period is counted hour by hour.
  const elapsedEndMs = Math.min(nowMs, endMs);
  const historyStartMs = options.historyStartMs ?? -Infinity;
  const hourCount = Math.ceil(hours - 1e-9);
  let coveredMs = 0;
  const recordedMs = new Float64Array(hourCount);
  for (const r of byStart.values()) {
    const recordEndMs = Math.min(r.endMs, endMs);
    coveredMs += Math.max(0, Math.min(elapsedEndMs, recordEndMs) - r.startMs) * Math.min(Math.max(r.coverage, 0), 1);
    const k = Math.floor((r.startMs - startMs) / MS_PER_HOUR);
    if (k < hourCount) recordedMs[k] += Math.max(0, recordEndMs - r.startMs);
  }
  let elapsedMs = 0;
  let everyHourHasRecord = true;
  for (let k = 0; k < hourCount; k++) {
    const hourEnd = Math.min(startMs + (k + 1) * MS_PER_HOUR, endMs);
    const hourStart = Math.max(startMs + k * MS_PER_HOUR, historyStartMs);
    if (hourStart >= hourEnd) continue;
    if (recordedMs[k] < hourEnd - hourStart) everyHourHasRecord = false;
    if (hourStart >= elapsedEndMs) continue;
    elapsedMs += Math.min(elapsedEndMs, hourEnd) - hourStart;
  }
  const coverage = elapsedMs > 0 ? coveredMs / elapsedMs : 0;
  if (coverage < 1 && !flags.includes('missing-data')) flags.push('missing-data');
  if (flowingWithoutEnergy && energyCount > 0) flags.push('energy-incomplete');
  if (uncertaintyMissing && !flags.includes('uncertainty-incomplete')) flags.push('uncertainty-incomplete');

  let status: TotalStatus = 'provisional';
  if (options.closed) status = 'closed';
  else if (nowMs >= endMs && coverage === 0) status = 'missing';
  else if (nowMs >= endMs && everyHourHasRecord) status = 'complete';

  const total: PeriodTotal = {
    start: new Date(startMs).toISOString(),
    end: new Date(endMs).toISOString(),
    hours,
    flowTimeS,
    massKg,
    volumeM3,
    standardVolumeM3,
    energyJ: energyCount > 0 ? energyJ : null,
    coverage,
    flags,
    uncertaintyPercent:
      massWithUncertainty > 0
        ? widenForUnmeasuredTime(massTimesUncertainty / massWithUncertainty, coverage, substitutedMassKg / massKg)
        : null,
    status,
  };
  if (reverse !== null) {
    if (reverseEnergyCount === 0) reverse.energyJ = null;
    total.reverse = reverse;
    total.net = {
      massKg: massKg - reverse.massKg,
      volumeM3: volumeM3 - reverse.volumeM3,
      standardVolumeM3: standardVolumeM3 - reverse.standardVolumeM3,
      energyJ: total.energyJ !== null && reverse.energyJ !== null ? total.energyJ - reverse.energyJ : null,
    };
  }
  return total;
}
