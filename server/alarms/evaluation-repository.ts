/**
 * What the alarm evaluator reads and writes in PostgreSQL besides the alarms (alarm-store.ts)
 * and the limits (limits-store.ts): the readings and hourly records it walks, and each meter
 * run's watermark and walk state in alarm_evaluations, locked for the length of a transaction.
 */
import type { Pool, PoolClient } from 'pg';
import { initialAlarmWalkState, type AlarmWalkState, type WalkHour } from '../../shared/alarms/meter-run-alarm-walk';

type Db = Pool | PoolClient;

/** A stored reading: value in the transmitter's unit, quality as its code (0 good … 3 substituted). */
export interface StoredReading {
  timeMs: number;
  value: number;
  quality: number;
}

/** A transmitter whose calibration date is judged, with the date in its site's calendar. */
export interface CalibrationTransmitter {
  id: string;
  tag: string;
  meterRunId: string;
  /** YYYY-MM-DD, or null when the date was removed while an alarm about it is still open. */
  due: string | null;
  timeZone: string;
}

interface ReadingRow {
  time: Date;
  value: number;
  quality: number;
}

interface ReadingSpanRow {
  first: Date | null;
  last: Date | null;
}

interface HourRow {
  start: Date;
  end: Date;
  flow_time_s: number;
  flags: string[];
}

interface CalibrationRow {
  id: string;
  tag: string;
  meter_run_id: string;
  due: string | null;
  time_zone: string;
}

/** @returns every meter run's id, in id order */
export async function meterRunIds(db: Db): Promise<string[]> {
  const { rows } = await db.query<{ id: string }>('SELECT id::text FROM meter_runs ORDER BY meter_runs.id');
  return rows.map((r) => r.id);
}

/** @returns the meter run's tag, or null when there is no such meter run */
export async function meterRunTag(db: Db, meterRunId: string): Promise<string | null> {
  const { rows } = await db.query<{ tag: string }>('SELECT tag FROM meter_runs WHERE id = $1', [meterRunId]);
  return rows[0]?.tag ?? null;
}

/** @returns the tags of the meter run's transmitters, by transmitter id */
export async function transmitterTags(db: Db, meterRunId: string): Promise<Map<string, string>> {
  const { rows } = await db.query<{ id: string; tag: string }>(
    'SELECT id::text, tag FROM transmitters WHERE meter_run_id = $1',
    [meterRunId],
  );
  return new Map(rows.map((r) => [r.id, r.tag]));
}

/** @returns the times of a transmitter's first and latest readings (null when it has none) */
export async function readingSpan(
  db: Db,
  transmitterId: string,
): Promise<{ firstMs: number | null; lastMs: number | null }> {
  const { rows } = await db.query<ReadingSpanRow>(
    'SELECT min(time) AS first, max(time) AS last FROM readings WHERE transmitter_id = $1',
    [transmitterId],
  );
  return { firstMs: rows[0].first?.getTime() ?? null, lastMs: rows[0].last?.getTime() ?? null };
}

/** @returns the time of a transmitter's first reading after `afterMs`, or null */
export async function nextReadingMs(db: Db, transmitterId: string, afterMs: number): Promise<number | null> {
  const { rows } = await db.query<{ time: Date }>(
    'SELECT time FROM readings WHERE transmitter_id = $1 AND time > to_timestamp($2 / 1000.0) ORDER BY time LIMIT 1',
    [transmitterId, afterMs],
  );
  return rows[0] ? rows[0].time.getTime() : null;
}

/**
 * A transmitter's readings of [fromMs, toMs] plus its latest one before fromMs, as stored.
 * @returns the readings in time order
 */
export async function readingsAround(
  db: Db,
  transmitterId: string,
  fromMs: number,
  toMs: number,
): Promise<StoredReading[]> {
  const { rows } = await db.query<ReadingRow>(
    `(SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time < to_timestamp($2 / 1000.0) ORDER BY time DESC LIMIT 1)
     UNION ALL
     (SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time <= to_timestamp($3 / 1000.0) ORDER BY time)`,
    [transmitterId, fromMs, toMs],
  );
  return rows.map((r) => ({ timeMs: r.time.getTime(), value: r.value, quality: r.quality }));
}

/**
 * Locks the meter run's evaluation row (created on first use) until the transaction ends.
 * @param client a client inside the caller's transaction
 * @returns the stored walk state, with the defaults of fields it lacks
 */
export async function lockWalkState(client: PoolClient, meterRunId: string): Promise<AlarmWalkState> {
  await client.query(
    'INSERT INTO alarm_evaluations (meter_run_id, state) VALUES ($1, $2) ON CONFLICT (meter_run_id) DO NOTHING',
    [meterRunId, JSON.stringify(initialAlarmWalkState())],
  );
  const { rows } = await client.query<{ state: Partial<AlarmWalkState> }>(
    'SELECT state FROM alarm_evaluations WHERE meter_run_id = $1 FOR UPDATE',
    [meterRunId],
  );
  return { ...initialAlarmWalkState(), ...rows[0].state };
}

/** Stores the walk state and its watermark (in the transaction that holds the lock). */
export async function saveWalkState(client: PoolClient, meterRunId: string, state: AlarmWalkState): Promise<void> {
  await client.query(
    'UPDATE alarm_evaluations SET state = $2, watermark = to_timestamp($3 / 1000.0), updated_at = now() WHERE meter_run_id = $1',
    [meterRunId, JSON.stringify(state), state.watermarkMs],
  );
}

/**
 * Hourly records starting at or after fromMs and ending by toMs, but only those that end
 * before the meter run's first hour still waiting to be recomputed.
 * @returns the hours in time order
 */
export async function settledHours(
  db: Db,
  meterRunId: string,
  fromMs: number | null,
  toMs: number,
): Promise<WalkHour[]> {
  const { rows } = await db.query<HourRow>(
    `SELECT start, "end", flow_time_s, flags FROM hourly_records h
      WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND "end" <= to_timestamp($3 / 1000.0)
        AND "end" <= coalesce((SELECT min(start) FROM stale_hours s WHERE s.meter_run_id = $1), 'infinity'::timestamptz)
      ORDER BY start`,
    [meterRunId, fromMs ?? 0, toMs],
  );
  return rows.map((r) => ({
    startMs: r.start.getTime(),
    endMs: r.end.getTime(),
    flowTimeS: r.flow_time_s,
    flags: r.flags,
  }));
}

/**
 * The due date of each transmitter's calibration: the next due date of its latest calibration in
 * force (by calibration date, then the later record; one corrected by a later record is not in
 * force), or the transmitter's own calibration_due when it has no recorded calibration (issue 11).
 * @returns the transmitters with a calibration date, or with a calibration alarm still open
 */
export async function calibrationTransmitters(db: Db): Promise<CalibrationTransmitter[]> {
  const { rows } = await db.query<CalibrationRow>(
    `SELECT t.id::text, t.tag, t.meter_run_id::text, to_char(coalesce(c.next_due, t.calibration_due), 'YYYY-MM-DD') AS due,
            s.time_zone
       FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id JOIN sites s ON s.id = m.site_id
       LEFT JOIN LATERAL (
         SELECT k.next_due FROM transmitter_calibrations k
          WHERE k.transmitter_id = t.id
            AND NOT EXISTS (SELECT 1 FROM transmitter_calibrations x WHERE x.corrects_id = k.id)
          ORDER BY k.calibrated_on DESC, k.id DESC LIMIT 1
       ) c ON true
      WHERE coalesce(c.next_due, t.calibration_due) IS NOT NULL
         OR EXISTS (SELECT 1 FROM alarms a WHERE a.transmitter_id = t.id AND a.condition IN ('calibration-due', 'calibration-overdue') AND a.state <> 'normal')`,
  );
  return rows.map((r) => ({ id: r.id, tag: r.tag, meterRunId: r.meter_run_id, due: r.due, timeZone: r.time_zone }));
}
