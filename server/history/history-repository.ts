/**
 * What the history worker reads and writes in PostgreSQL: the stale-hours queue (claims skip
 * each other's rows, so several processes may drain it at once), the hourly records and the
 * contract-day and contract-month totals. The meter run's context and readings come from
 * load-context.ts.
 */
import type { Pool } from 'pg';
import type { DirectionPart, HourlyRecord, PeriodTotal, RollUpRecord } from '../../shared/history/types';
import type { RecomputeReason, RecordCause } from './record-causes';

/** How long an hour must be quiet, or may wait at most, before it is claimed. */
export interface ClaimTiming {
  quietMs: number;
  maxWaitMs: number;
}

/** Hours of one meter run claimed for a round, as epoch ms, in time order, with why each waited. */
export interface ClaimedHours {
  meterRunId: string;
  hours: number[];
  reasons: Map<number, RecomputeReason>;
}

interface ClaimedRow {
  meter_run_id: string;
  start: Date;
  cause: RecomputeReason['cause'];
  cause_reference: string | null;
}

/**
 * The records computed for one hour [startMs, endMs): one, or one per part where a dated setting
 * took effect inside the hour (each part's record keyed by its own start).
 */
export interface ComputedHour {
  startMs: number;
  endMs: number;
  records: HourlyRecord[];
}

/** What saving a record did to its version: `changed` when it replaced a final record's different figures. */
export interface SavedHour {
  /** The record's start (the hour's, or a part's). */
  startMs: number;
  /** The start of the hour the record belongs to. */
  hourStartMs: number;
  version: number;
  changed: boolean;
  cause: RecordCause;
  causeReference: string | null;
}

interface SavedHourRow {
  start: Date;
  version: number;
  changed: boolean;
  cause: RecordCause;
  cause_reference: string | null;
}

interface HourlyRecordRow {
  start: Date;
  end: Date;
  flow_time_s: number;
  mass_kg: number;
  volume_m3: number;
  standard_volume_m3: number;
  energy_j: number | null;
  coverage: number;
  flags: string[];
  uncertainty_percent: number | null;
  /** The reverse-flow part (migration 0024), NULL on a one-way meter run. */
  reverse: DirectionPart | null;
}

/** The table of contract-day totals or of contract-month totals, with its key column. */
export type PeriodTable =
  { table: 'daily_totals'; keyColumn: 'contract_day' } | { table: 'monthly_totals'; keyColumn: 'month' };

interface MeterRunZoneRow {
  id: string;
  time_zone: string;
}

const isoInstants = (hours: number[]) => hours.map((h) => new Date(h).toISOString());

/** A claim left by a process that died is released (at start-up). */
export async function releaseAllClaims(pool: Pool): Promise<void> {
  await pool.query('UPDATE stale_hours SET claimed_at = NULL WHERE claimed_at IS NOT NULL');
}

/** @returns how many hours wait in the queue (claimed or not) */
export async function queuedHourCount(pool: Pool): Promise<number> {
  const { rows } = await pool.query<{ n: number }>('SELECT count(*)::int AS n FROM stale_hours');
  return rows[0].n;
}

/** An hour is ready once quiet for `quietMs` ($1), or once it has waited `maxWaitMs` ($2) (a live hour). */
const readyCondition = `claimed_at IS NULL AND (queued_at <= clock_timestamp() - interval '1 millisecond' * $1 OR first_queued_at <= clock_timestamp() - interval '1 millisecond' * $2)`;

/**
 * Claims up to `maxHours` ready hours of the meter run that has waited longest.
 * @returns the claimed hours, or null when none is ready
 */
export async function claimHours(pool: Pool, timing: ClaimTiming, maxHours: number): Promise<ClaimedHours | null> {
  const { rows } = await pool.query<ClaimedRow>(
    `UPDATE stale_hours SET claimed_at = clock_timestamp()
      WHERE (meter_run_id, start) IN (
        SELECT meter_run_id, start FROM stale_hours
         WHERE ${readyCondition}
           AND meter_run_id = (SELECT meter_run_id FROM stale_hours WHERE ${readyCondition} ORDER BY first_queued_at LIMIT 1)
         ORDER BY start LIMIT ${maxHours} FOR UPDATE SKIP LOCKED)
      RETURNING meter_run_id::text, start, cause, cause_reference`,
    [timing.quietMs, timing.maxWaitMs],
  );
  if (!rows.length) return null;
  return {
    meterRunId: rows[0].meter_run_id,
    hours: rows.map((r) => r.start.getTime()).sort((a, b) => a - b),
    reasons: new Map(rows.map((r) => [r.start.getTime(), { cause: r.cause, reference: r.cause_reference }])),
  };
}

/** Drops the computed hours from the queue, unless a reading queued them again meanwhile. */
export async function dropComputedHours(pool: Pool, meterRunId: string, hours: number[]): Promise<void> {
  await pool.query(
    `DELETE FROM stale_hours WHERE meter_run_id = $1 AND start = ANY($2::timestamptz[]) AND queued_at <= claimed_at`,
    [meterRunId, isoInstants(hours)],
  );
}

/** Leaves hours that failed queued, but pushed back 30 s so a failure does not spin. */
export async function postponeHours(pool: Pool, meterRunId: string, hours: number[]): Promise<void> {
  await pool.query(
    `UPDATE stale_hours SET claimed_at = NULL, queued_at = clock_timestamp() + interval '30 seconds', first_queued_at = clock_timestamp() + interval '30 seconds' WHERE meter_run_id = $1 AND start = ANY($2::timestamptz[])`,
    [meterRunId, isoInstants(hours)],
  );
}

/** Releases the meter run's hours still claimed (they got new readings while computed) for another round. */
export async function releaseClaims(pool: Pool, meterRunId: string): Promise<void> {
  await pool.query(
    'UPDATE stale_hours SET claimed_at = NULL, first_queued_at = clock_timestamp() WHERE meter_run_id = $1 AND claimed_at IS NOT NULL',
    [meterRunId],
  );
}

/** @returns the stacked-pair choice at the end of the last hourly record before `beforeMs` */
export async function previousStackChoice(
  pool: Pool,
  meterRunId: string,
  beforeMs: number,
): Promise<'low' | 'high' | null> {
  const { rows } = await pool.query<{ final_stack_choice: 'low' | 'high' | null }>(
    'SELECT final_stack_choice FROM hourly_records WHERE meter_run_id = $1 AND start < to_timestamp($2 / 1000.0) ORDER BY start DESC LIMIT 1',
    [meterRunId, beforeMs],
  );
  return rows[0]?.final_stack_choice ?? null;
}

/**
 * Stores the records of the given hours in one statement, replacing those of the same hours. The
 * table's trigger (migrations 0006, 0022) keeps the figures a record replaces, its uncertainty
 * budget among them, as a version when they
 * differ and the record was final; a record of a recomputed hour whose start is no longer a
 * part's start (a version instant moved or went) is deleted, and the delete trigger (0007) keeps
 * it as a version first, so no part survives as an orphan and none vanishes without a trace. An
 * hour stored whole before and split now keeps its start: its record gets a new version with the
 * shorter end. `reasons` (by hour start) says why each hour was recomputed, `asOfMs` how far the
 * data reached (an hour computed before its end is a running figure, replaced without a version).
 * @returns per record, the version in force after the save and whether this save made it
 */
export async function saveHourlyRecords(
  pool: Pool,
  meterRunId: string,
  hours: ComputedHour[],
  options: { asOfMs: number; reasons: Map<number, RecomputeReason> },
): Promise<SavedHour[]> {
  const filled = hours.filter((h) => h.records.length);
  if (!filled.length) return [];
  const hourOfRecord = new Map<number, number>();
  const rows = filled.flatMap((h) => {
    const reason = options.reasons.get(h.startMs);
    return h.records.map((r) => {
      hourOfRecord.set(r.startMs, h.startMs);
      return { ...r, recomputeCause: reason?.cause ?? 'scheduled', recomputeReference: reason?.reference ?? null };
    });
  });
  const spans = filled.map((h) => ({ startMs: h.startMs, endMs: h.endMs }));
  const { rows: saved } = await pool.query<SavedHourRow>(
    `WITH input AS (
       SELECT r, to_timestamp((r->>'startMs')::float8 / 1000) AS start FROM jsonb_array_elements($2::jsonb) AS r),
     prior AS (
       SELECT start, version FROM hourly_records WHERE meter_run_id = $1 AND start = ANY(SELECT start FROM input)),
     removed AS (
       DELETE FROM hourly_records h USING jsonb_array_elements($4::jsonb) AS span
        WHERE h.meter_run_id = $1
          AND h.start >= to_timestamp((span->>'startMs')::float8 / 1000)
          AND h.start < to_timestamp((span->>'endMs')::float8 / 1000)
          AND h.start <> ALL(SELECT start FROM input)),
     saved AS (
     INSERT INTO hourly_records (meter_run_id, start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j,
       average_dp_pa, average_pressure_pa, average_temperature_k, integral_value, integral_multiplier_value, coverage, flags,
       uncertainty_percent, uncertainty_budget, reverse, config_version_id, dp_bands, active_transmitter_time,
       final_stack_choice, computed_at, recompute_cause, recompute_reference, as_of)
     SELECT $1, i.start, to_timestamp((r->>'endMs')::float8 / 1000),
            (r->>'flowTimeS')::float8, (r->>'massKg')::float8, (r->>'volumeM3')::float8, (r->>'standardVolumeM3')::float8,
            (r->>'energyJ')::float8, (r->>'averageDpPa')::float8, (r->>'averagePressurePa')::float8, (r->>'averageTemperatureK')::float8,
            (r->>'integralValue')::float8, (r->>'integralMultiplierValue')::float8, (r->>'coverage')::float8,
            ARRAY(SELECT jsonb_array_elements_text(r->'flags')), (r->>'uncertaintyPercent')::float8, r->'uncertaintyBudget',
            nullif(r->'reverse', 'null'::jsonb), (r->>'configVersionId')::bigint, r->'dpBands', r->'activeTransmitterTimeS', r->>'finalStackChoice', now(),
            r->>'recomputeCause', r->>'recomputeReference',
            least(to_timestamp((r->>'endMs')::float8 / 1000), to_timestamp($3::float8 / 1000))
       FROM input i
     ON CONFLICT (meter_run_id, start) DO UPDATE SET
       "end" = EXCLUDED."end", flow_time_s = EXCLUDED.flow_time_s, mass_kg = EXCLUDED.mass_kg, volume_m3 = EXCLUDED.volume_m3,
       standard_volume_m3 = EXCLUDED.standard_volume_m3, energy_j = EXCLUDED.energy_j, average_dp_pa = EXCLUDED.average_dp_pa,
       average_pressure_pa = EXCLUDED.average_pressure_pa, average_temperature_k = EXCLUDED.average_temperature_k,
       integral_value = EXCLUDED.integral_value, integral_multiplier_value = EXCLUDED.integral_multiplier_value,
       coverage = EXCLUDED.coverage, flags = EXCLUDED.flags,
       uncertainty_percent = EXCLUDED.uncertainty_percent, uncertainty_budget = EXCLUDED.uncertainty_budget,
       reverse = EXCLUDED.reverse, config_version_id = EXCLUDED.config_version_id, dp_bands = EXCLUDED.dp_bands, active_transmitter_time = EXCLUDED.active_transmitter_time,
       final_stack_choice = EXCLUDED.final_stack_choice, computed_at = now(), recompute_cause = EXCLUDED.recompute_cause,
       recompute_reference = EXCLUDED.recompute_reference, as_of = EXCLUDED.as_of
     RETURNING start, version, cause, cause_reference)
     SELECT s.start, s.version, coalesce(s.version > p.version, false) AS changed, s.cause, s.cause_reference
       FROM saved s LEFT JOIN prior p ON p.start = s.start`,
    [meterRunId, JSON.stringify(rows), options.asOfMs, JSON.stringify(spans)],
  );
  return saved.map((r) => ({
    startMs: r.start.getTime(),
    hourStartMs: hourOfRecord.get(r.start.getTime()) ?? r.start.getTime(),
    version: r.version,
    changed: r.changed,
    cause: r.cause,
    causeReference: r.cause_reference,
  }));
}

/** @returns the meter run's hourly records starting in [startMs, endMs), in time order, as a roll-up sums them */
export async function hourlyRecordsIn(
  pool: Pool,
  meterRunId: string,
  startMs: number,
  endMs: number,
): Promise<RollUpRecord[]> {
  const { rows } = await pool.query<HourlyRecordRow>(
    `SELECT start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage, flags, uncertainty_percent,
            reverse
       FROM hourly_records WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0) ORDER BY start`,
    [meterRunId, startMs, endMs],
  );
  return rows.map((r) => ({
    startMs: r.start.getTime(),
    endMs: r.end.getTime(),
    flowTimeS: r.flow_time_s,
    massKg: r.mass_kg,
    volumeM3: r.volume_m3,
    standardVolumeM3: r.standard_volume_m3,
    energyJ: r.energy_j,
    coverage: r.coverage,
    flags: r.flags,
    uncertaintyPercent: r.uncertainty_percent,
    reverse: r.reverse,
  }));
}

/**
 * Stores the total of one contract day (`daily_totals`, keyed by `contract_day`) or contract
 * month (`monthly_totals`, keyed by `month`), replacing the previous one; the table's trigger
 * keeps a complete total's different figures as a version, with `reason` as the new version's cause.
 */
export async function savePeriodTotal(
  pool: Pool,
  period: PeriodTable,
  meterRunId: string,
  key: string,
  total: PeriodTotal,
  reason: RecomputeReason,
): Promise<void> {
  const { table, keyColumn } = period;
  await pool.query(
    `INSERT INTO ${table} (meter_run_id, ${keyColumn}, start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3,
       energy_j, coverage, flags, uncertainty_percent, reverse, status, computed_at, recompute_cause, recompute_reference)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $17::jsonb, $14, now(), $15, $16)
     ON CONFLICT (meter_run_id, ${keyColumn}) DO UPDATE SET start = EXCLUDED.start, "end" = EXCLUDED."end", hours = EXCLUDED.hours,
       flow_time_s = EXCLUDED.flow_time_s, mass_kg = EXCLUDED.mass_kg, volume_m3 = EXCLUDED.volume_m3,
       standard_volume_m3 = EXCLUDED.standard_volume_m3, energy_j = EXCLUDED.energy_j, coverage = EXCLUDED.coverage,
       flags = EXCLUDED.flags, uncertainty_percent = EXCLUDED.uncertainty_percent, reverse = EXCLUDED.reverse,
       status = EXCLUDED.status, computed_at = now(),
       recompute_cause = EXCLUDED.recompute_cause, recompute_reference = EXCLUDED.recompute_reference`,
    [
      meterRunId,
      key,
      total.start,
      total.end,
      total.hours,
      total.flowTimeS,
      total.massKg,
      total.volumeM3,
      total.standardVolumeM3,
      total.energyJ,
      total.coverage,
      total.flags,
      total.uncertaintyPercent,
      total.status,
      reason.cause,
      reason.reference,
      // The period's reverse flow (0024), only on a period with some reverse part; net is derived, never stored.
      total.reverse ? JSON.stringify(total.reverse) : null,
    ],
  );
}

/** @returns the given meter runs (or all) with their site's time zone */
export async function meterRunZones(
  pool: Pool,
  meterRunIds: string[] | 'all',
): Promise<{ id: string; timeZone: string }[]> {
  const { rows } =
    meterRunIds === 'all'
      ? await pool.query<MeterRunZoneRow>(
          'SELECT m.id::text, s.time_zone FROM meter_runs m JOIN sites s ON s.id = m.site_id',
        )
      : await pool.query<MeterRunZoneRow>(
          'SELECT m.id::text, s.time_zone FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = ANY($1::bigint[])',
          [meterRunIds],
        );
  return rows.map((r) => ({ id: r.id, timeZone: r.time_zone }));
}

/** @returns the time of the meter run's first reading (any transmitter), or null before any */
export async function firstReadingMs(pool: Pool, meterRunId: string): Promise<number | null> {
  const { rows } = await pool.query<{ t: Date | null }>(
    'SELECT min(r.time) AS t FROM readings r JOIN transmitters t ON t.id = r.transmitter_id WHERE t.meter_run_id = $1',
    [meterRunId],
  );
  return rows[0].t ? rows[0].t.getTime() : null;
}

/**
 * Queues hours of a meter run for recomputation (an hour already queued counts as queued again).
 * An hour already waiting keeps its reason against the hourly sweep's ('scheduled'); any other
 * reason replaces it (a configuration change says more than late readings).
 */
export async function queueHourStarts(
  pool: Pool,
  meterRunId: string,
  hourStartsMs: number[],
  reason: RecomputeReason,
): Promise<void> {
  await pool.query(
    `INSERT INTO stale_hours (meter_run_id, start, cause, cause_reference)
     SELECT $1, to_timestamp(h / 1000.0), $3, $4 FROM unnest($2::float8[]) AS h
     ON CONFLICT (meter_run_id, start) DO UPDATE SET queued_at = clock_timestamp(),
       cause = CASE WHEN EXCLUDED.cause = 'scheduled' THEN stale_hours.cause ELSE EXCLUDED.cause END,
       cause_reference = CASE WHEN EXCLUDED.cause = 'scheduled' THEN stale_hours.cause_reference ELSE EXCLUDED.cause_reference END`,
    [meterRunId, hourStartsMs, reason.cause, reason.reference],
  );
}
