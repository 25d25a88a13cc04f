/**
 * Back-fill: writes the demo history (one reading per minute per transmitter, from the first
 * contract day of the demo month up to now) straight into PostgreSQL through the server's
 * ReadingWriter (bulk statements; the touched hours are queued for the history worker).
 *
 * Idempotent: per transmitter it fills only what lies before its earliest stored reading and
 * after its latest, and the (transmitter, time) key makes any overlap a duplicate. Batches are
 * written in time order, one at a time, so an interrupted run resumes from the latest reading.
 */
import type { Pool } from 'pg';
import { ReadingWriter } from '../../server/ingest/reading-writer';
import type { ValidReading } from '../../server/ingest/validate-reading';
import { DEMO_TRANSMITTERS, type ScenarioTimeline } from '../scenario';
import { transmitterValueAt } from '../model/transmitter-value';
import { cachedHourStartOf } from '../../server/ingest/hour-start-cache';

export interface BackfillTarget {
  tag: string;
  transmitterId: string;
  meterRunId: string;
  timeZone: string;
  siteCode: string;
}

export interface BackfillResult {
  transmitters: number;
  /** Transmitters of the scenario missing from the database (not seeded). */
  missingTags: string[];
  generated: number;
  inserted: number;
  batches: number;
  fromMs: number | null;
  toMs: number;
  elapsedMs: number;
}

/** History needs no more than a sample a minute (the live publisher sends one every 5 s). */
export const BACKFILL_STEP_MS = 60_000;

/**
 * The scenario's transmitters as stored, by tag.
 * @param pool database pool
 * @returns the demo transmitters found, with their ids, meter run ids and site zones
 */
export async function loadBackfillTargets(pool: Pool): Promise<BackfillTarget[]> {
  const { rows } = await pool.query(
    `SELECT t.tag, t.id::text AS "transmitterId", t.meter_run_id::text AS "meterRunId", s.time_zone AS "timeZone", s.code AS "siteCode"
       FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id JOIN sites s ON s.id = m.site_id
      WHERE t.tag = ANY($1::text[])`,
    [DEMO_TRANSMITTERS.map((t) => t.transmitter.tag)],
  );
  return rows as BackfillTarget[];
}

/** The time ranges [from, to) a transmitter still needs, given its stored extent. */
function missingRanges(
  startMs: number,
  endMs: number,
  stored: { min: number | null; max: number | null },
): [number, number][] {
  if (stored.min === null || stored.max === null) return [[startMs, endMs]];
  const ranges: [number, number][] = [];
  if (stored.min > startMs) ranges.push([startMs, Math.min(stored.min, endMs)]);
  if (stored.max + 1 < endMs) ranges.push([Math.max(stored.max + 1, startMs), endMs]);
  return ranges.filter(([a, b]) => b > a);
}

/**
 * Writes the missing demo history.
 * @param options pool; timeline of the demo month; nowMs (default Date.now()); batchSize (readings per statement);
 *   log; shouldStop (checked between batches, for a clean stop on a signal)
 * @returns counts and timing
 */
export async function backfillDemoHistory(options: {
  pool: Pool;
  timeline: ScenarioTimeline;
  nowMs?: number;
  batchSize?: number;
  shouldStop?: () => boolean;
}): Promise<BackfillResult> {
  const began = Date.now();
  const { pool, timeline } = options;
  const batchSize = options.batchSize ?? 25_000;
  // Up to the last whole minute: the live publisher carries on from there.
  const endMs = Math.floor((options.nowMs ?? Date.now()) / BACKFILL_STEP_MS) * BACKFILL_STEP_MS + 1;
  const targets = await loadBackfillTargets(pool);
  const found = new Set(targets.map((t) => t.tag));
  const missingTags = DEMO_TRANSMITTERS.map((t) => t.transmitter.tag).filter((tag) => !found.has(tag));

  const plans: { target: BackfillTarget; ranges: [number, number][] }[] = [];
  for (const target of targets) {
    const { rows } = await pool.query(
      'SELECT extract(epoch FROM min(time)) * 1000 AS min, extract(epoch FROM max(time)) * 1000 AS max FROM readings WHERE transmitter_id = $1',
      [target.transmitterId],
    );
    const stored = {
      min: rows[0].min === null ? null : Number(rows[0].min),
      max: rows[0].max === null ? null : Number(rows[0].max),
    };
    const startMs = Math.ceil(timeline.historyStartMs[target.siteCode] / BACKFILL_STEP_MS) * BACKFILL_STEP_MS;
    const ranges = missingRanges(startMs, endMs, stored);
    if (ranges.length) plans.push({ target, ranges });
  }

  const writer = new ReadingWriter(pool, cachedHourStartOf());
  const result: BackfillResult = {
    transmitters: targets.length,
    missingTags,
    generated: 0,
    inserted: 0,
    batches: 0,
    fromMs: null,
    toMs: endMs - 1,
    elapsedMs: 0,
  };
  if (plans.length === 0) return { ...result, elapsedMs: Date.now() - began };
  const fromMs = Math.min(...plans.map((p) => p.ranges[0][0]));
  result.fromMs = fromMs;

  let batch: ValidReading[] = [];
  const flush = async () => {
    if (!batch.length) return;
    const written = await writer.write(batch, 'backfill');
    result.inserted += written.inserted;
    result.batches++;
    batch = [];
  };
  // Time-major order: every transmitter's history advances together, so a stop leaves no holes.
  for (let t = Math.ceil(fromMs / BACKFILL_STEP_MS) * BACKFILL_STEP_MS; t < endMs; t += BACKFILL_STEP_MS) {
    for (const { target, ranges } of plans) {
      if (!ranges.some(([a, b]) => t >= a && t < b)) continue;
      const value = transmitterValueAt(target.tag, t, timeline);
      if (value === null) continue;
      batch.push({
        transmitterId: target.transmitterId,
        meterRunId: target.meterRunId,
        timeZone: target.timeZone,
        timeMs: t,
        value,
        quality: 0,
      });
      result.generated++;
    }
    if (batch.length >= batchSize) {
      await flush();
      if (options.shouldStop?.()) break;
    }
  }
  await flush();
  return { ...result, elapsedMs: Date.now() - began };
}
