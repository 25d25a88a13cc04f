import type { Pool } from 'pg';
import { computeHour } from '../../shared/history/compute-hour';
import {
  contractDayBounds,
  contractDayOf,
  contractMonthBounds,
  hourStartsBetween,
} from '../../shared/history/contract-day';
import { rollUpRecords } from '../../shared/history/roll-up';
import type { HourlyRecord, RollUpRecord } from '../../shared/history/types';
import { loadMeterRunContext, loadReadings, type MeterRunContext } from './load-context';

const hourMs = 3_600_000;
/** Hours computed per round for one meter run (a week): bounds the readings held in memory. */
const hoursPerRound = 168;

/**
 * Drains the stale-hours queue: recomputes the hourly records of the claimed hours from the
 * stored readings, then the contract days and months that contain them. Runs in the server
 * process; several processes may run it at once (claims skip each other's rows).
 */
export class HistoryWorker {
  private running = false;
  private timer: ReturnType<typeof setInterval> | null = null;
  private idleResolvers: (() => void)[] = [];
  private onChange: ((meterRunIds: string[]) => void) | undefined;

  constructor(
    private readonly pool: Pool,
    private readonly now: () => number = Date.now,
    private readonly timing: { quietMs: number; maxWaitMs: number } = { quietMs: 1000, maxWaitMs: 10_000 },
  ) {}

  start(onChange?: (meterRunIds: string[]) => void) {
    this.onChange = onChange;
    // A claim left by a process that died is released.
    void this.pool
      .query('UPDATE stale_hours SET claimed_at = NULL WHERE claimed_at IS NOT NULL')
      .catch(() => undefined);
    const timer = setInterval(() => void this.drain(), 1000);
    this.timer = timer;
    (timer as unknown as { unref?: () => void }).unref?.();
  }

  /** Stops the timer and waits for a round in progress, so the pool can close under it safely. */
  async stop() {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    if (this.running) await new Promise<void>((resolve) => this.idleResolvers.push(resolve));
  }

  /** Resolves when the queue is empty (benchmarks wait on it); the debounce still applies. */
  async settle(timeoutMs = 60_000) {
    const until = Date.now() + timeoutMs;
    for (;;) {
      await this.drain();
      const { rows } = await this.pool.query('SELECT count(*)::int AS n FROM stale_hours');
      if (rows[0].n === 0) return;
      if (Date.now() > until) throw new Error(`history did not settle: ${rows[0].n} hours still queued`);
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  /** Works until the queue is empty; a second call while one runs waits for it. */
  async drain(): Promise<void> {
    if (this.running) return new Promise((resolve) => this.idleResolvers.push(resolve));
    this.running = true;
    const touched = new Set<string>();
    try {
      for (;;) {
        const claimed = await this.claim();
        if (!claimed) break;
        touched.add(claimed.meterRunId);
        try {
          await this.recompute(claimed.meterRunId, claimed.hours);
          await this.pool.query(
            `DELETE FROM stale_hours WHERE meter_run_id = $1 AND start = ANY($2::timestamptz[]) AND queued_at <= claimed_at`,
            [claimed.meterRunId, claimed.hours.map((h) => new Date(h).toISOString())],
          );
        } catch (err) {
          console.error(`[history] meter run ${claimed.meterRunId}:`, err);
          // Leave the rows queued, but not in a tight loop: push them back a little.
          await this.pool.query(
            `UPDATE stale_hours SET claimed_at = NULL, queued_at = clock_timestamp() + interval '30 seconds', first_queued_at = clock_timestamp() + interval '30 seconds' WHERE meter_run_id = $1 AND start = ANY($2::timestamptz[])`,
            [claimed.meterRunId, claimed.hours.map((h) => new Date(h).toISOString())],
          );
          break;
        }
        // Hours that got new readings while being computed wait for another round (a live hour: ten seconds).
        await this.pool.query(
          'UPDATE stale_hours SET claimed_at = NULL, first_queued_at = clock_timestamp() WHERE meter_run_id = $1 AND claimed_at IS NOT NULL',
          [claimed.meterRunId],
        );
      }
    } finally {
      this.running = false;
      const waiting = this.idleResolvers;
      this.idleResolvers = [];
      waiting.forEach((r) => r());
      if (touched.size) this.onChange?.([...touched]);
    }
  }

  /** An hour is ready once quiet for `quietMs`, or once it has waited `maxWaitMs` (a live hour). */
  private readyCondition = `claimed_at IS NULL AND (queued_at <= clock_timestamp() - interval '1 millisecond' * $1 OR first_queued_at <= clock_timestamp() - interval '1 millisecond' * $2)`;

  private async claim(): Promise<{ meterRunId: string; hours: number[] } | null> {
    const { rows } = await this.pool.query(
      `UPDATE stale_hours SET claimed_at = clock_timestamp()
        WHERE (meter_run_id, start) IN (
          SELECT meter_run_id, start FROM stale_hours
           WHERE ${this.readyCondition}
             AND meter_run_id = (SELECT meter_run_id FROM stale_hours WHERE ${this.readyCondition} ORDER BY first_queued_at LIMIT 1)
           ORDER BY start LIMIT ${hoursPerRound} FOR UPDATE SKIP LOCKED)
        RETURNING meter_run_id::text, start`,
      [this.timing.quietMs, this.timing.maxWaitMs],
    );
    if (!rows.length) return null;
    return {
      meterRunId: rows[0].meter_run_id,
      hours: rows.map((r) => (r.start as Date).getTime()).sort((a, b) => a - b),
    };
  }

  /** Recomputes the given hours of one meter run and the periods above them. */
  async recompute(meterRunId: string, hours: number[]) {
    const ctx = await loadMeterRunContext(this.pool, meterRunId);
    if (!ctx) return;
    const nowMs = this.now();
    const lookBackMs = Math.max(ctx.holdLimitS, ctx.maxGapS) * 1000;
    // Load readings once for the whole span of claimed hours.
    const spanStart = hours[0];
    const spanEnd = hours[hours.length - 1] + hourMs;
    const readings = await loadReadings(this.pool, ctx, spanStart - lookBackMs, spanEnd);
    let previousChoice = await this.previousStackChoice(meterRunId, spanStart);
    const records: HourlyRecord[] = [];
    for (const startMs of hours) {
      const endMs = nextHourStart(startMs, ctx.timeZone);
      if (startMs > nowMs) continue;
      const record = computeHour({
        startMs,
        endMs,
        asOfMs: Math.min(endMs, nowMs),
        dp: readings.dp.map((s) => ({ ...s, samples: window(s.samples, startMs, endMs) })),
        staticPressure: window(readings.staticPressure, startMs, endMs),
        temperature: window(readings.temperature, startMs, endMs),
        configVersions: ctx.configVersions,
        base: ctx.base,
        holdLimitS: ctx.holdLimitS,
        maxGapS: ctx.maxGapS,
        stackSwitchUpShare: ctx.stackSwitchUpShare,
        stackSwitchDownShare: ctx.stackSwitchDownShare,
        initialStackChoice: previousChoice ?? undefined,
      });
      previousChoice = record.finalStackChoice ?? previousChoice;
      records.push(record);
    }
    await this.saveHourlyRecords(meterRunId, records);
    await this.rollUp(
      ctx,
      records.map((r) => r.startMs),
      nowMs,
    );
  }

  private async previousStackChoice(meterRunId: string, beforeMs: number): Promise<'low' | 'high' | null> {
    const { rows } = await this.pool.query(
      'SELECT final_stack_choice FROM hourly_records WHERE meter_run_id = $1 AND start < to_timestamp($2 / 1000.0) ORDER BY start DESC LIMIT 1',
      [meterRunId, beforeMs],
    );
    return rows[0]?.final_stack_choice ?? null;
  }

  private async saveHourlyRecords(meterRunId: string, records: HourlyRecord[]) {
    if (!records.length) return;
    await this.pool.query(
      `INSERT INTO hourly_records (meter_run_id, start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j,
         average_dp_pa, average_pressure_pa, average_temperature_k, integral_value, coverage, flags, uncertainty_percent,
         config_version_id, dp_bands, active_transmitter_time, final_stack_choice, computed_at)
       SELECT $1, to_timestamp((r->>'startMs')::float8 / 1000), to_timestamp((r->>'endMs')::float8 / 1000),
              (r->>'flowTimeS')::float8, (r->>'massKg')::float8, (r->>'volumeM3')::float8, (r->>'standardVolumeM3')::float8,
              (r->>'energyJ')::float8, (r->>'averageDpPa')::float8, (r->>'averagePressurePa')::float8, (r->>'averageTemperatureK')::float8,
              (r->>'integralValue')::float8, (r->>'coverage')::float8,
              ARRAY(SELECT jsonb_array_elements_text(r->'flags')), (r->>'uncertaintyPercent')::float8,
              (r->>'configVersionId')::bigint, r->'dpBands', r->'activeTransmitterTimeS', r->>'finalStackChoice', now()
         FROM jsonb_array_elements($2::jsonb) AS r
       ON CONFLICT (meter_run_id, start) DO UPDATE SET
         "end" = EXCLUDED."end", flow_time_s = EXCLUDED.flow_time_s, mass_kg = EXCLUDED.mass_kg, volume_m3 = EXCLUDED.volume_m3,
         standard_volume_m3 = EXCLUDED.standard_volume_m3, energy_j = EXCLUDED.energy_j, average_dp_pa = EXCLUDED.average_dp_pa,
         average_pressure_pa = EXCLUDED.average_pressure_pa, average_temperature_k = EXCLUDED.average_temperature_k,
         integral_value = EXCLUDED.integral_value, coverage = EXCLUDED.coverage, flags = EXCLUDED.flags,
         uncertainty_percent = EXCLUDED.uncertainty_percent, config_version_id = EXCLUDED.config_version_id,
         dp_bands = EXCLUDED.dp_bands, active_transmitter_time = EXCLUDED.active_transmitter_time,
         final_stack_choice = EXCLUDED.final_stack_choice, computed_at = now()`,
      [meterRunId, JSON.stringify(records)],
    );
  }

  /** Recomputes the contract days and months that contain the given hours. */
  private async rollUp(ctx: MeterRunContext, hourStarts: number[], nowMs: number) {
    const days = new Set(hourStarts.map((h) => contractDayOf(h, ctx.timeZone, ctx.contractHour)));
    const months = new Set([...days].map((d) => d.slice(0, 7)));
    for (const day of days) {
      await this.savePeriodTotal(
        'daily_totals',
        'contract_day',
        day,
        ctx,
        contractDayBounds(day, ctx.timeZone, ctx.contractHour),
        nowMs,
      );
    }
    for (const month of months) {
      await this.savePeriodTotal(
        'monthly_totals',
        'month',
        `${month}-01`,
        ctx,
        contractMonthBounds(month, ctx.timeZone, ctx.contractHour),
        nowMs,
      );
    }
  }

  /** Rolls the hourly records of one contract day or month up and stores the total. */
  private async savePeriodTotal(
    table: 'daily_totals' | 'monthly_totals',
    keyColumn: 'contract_day' | 'month',
    key: string,
    ctx: MeterRunContext,
    bounds: { startMs: number; endMs: number; hours: number },
    nowMs: number,
  ) {
    const total = rollUpRecords(await this.recordsIn(ctx.meterRunId, bounds.startMs, bounds.endMs), bounds, { nowMs });
    await this.pool.query(
      `INSERT INTO ${table} (meter_run_id, ${keyColumn}, start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3,
         energy_j, coverage, flags, uncertainty_percent, status, computed_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, now())
       ON CONFLICT (meter_run_id, ${keyColumn}) DO UPDATE SET start = EXCLUDED.start, "end" = EXCLUDED."end", hours = EXCLUDED.hours,
         flow_time_s = EXCLUDED.flow_time_s, mass_kg = EXCLUDED.mass_kg, volume_m3 = EXCLUDED.volume_m3,
         standard_volume_m3 = EXCLUDED.standard_volume_m3, energy_j = EXCLUDED.energy_j, coverage = EXCLUDED.coverage,
         flags = EXCLUDED.flags, uncertainty_percent = EXCLUDED.uncertainty_percent, status = EXCLUDED.status, computed_at = now()`,
      [
        ctx.meterRunId,
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
      ],
    );
  }

  private async recordsIn(meterRunId: string, startMs: number, endMs: number): Promise<RollUpRecord[]> {
    const { rows } = await this.pool.query(
      `SELECT start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage, flags, uncertainty_percent
         FROM hourly_records WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0) ORDER BY start`,
      [meterRunId, startMs, endMs],
    );
    return rows.map((r) => ({
      startMs: (r.start as Date).getTime(),
      endMs: (r.end as Date).getTime(),
      flowTimeS: r.flow_time_s,
      massKg: r.mass_kg,
      volumeM3: r.volume_m3,
      standardVolumeM3: r.standard_volume_m3,
      energyJ: r.energy_j,
      coverage: r.coverage,
      flags: r.flags,
      uncertaintyPercent: r.uncertainty_percent,
    }));
  }

  /** Queues every hour of every meter run in [fromMs, toMs) (the hourly sweep, a back-dated change). */
  async queueHours(meterRunIds: string[] | 'all', fromMs: number, toMs: number) {
    const runs =
      meterRunIds === 'all'
        ? (await this.pool.query('SELECT m.id::text, s.time_zone FROM meter_runs m JOIN sites s ON s.id = m.site_id'))
            .rows
        : (
            await this.pool.query(
              'SELECT m.id::text, s.time_zone FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = ANY($1::bigint[])',
              [meterRunIds],
            )
          ).rows;
    for (const run of runs) {
      // Nothing before the meter run's first reading can change: start there.
      const first = await this.pool.query(
        'SELECT min(r.time) AS t FROM readings r JOIN transmitters t ON t.id = r.transmitter_id WHERE t.meter_run_id = $1',
        [run.id],
      );
      if (!first.rows[0].t) continue;
      const startMs = Math.max(fromMs, (first.rows[0].t as Date).getTime() - 3_600_000);
      const starts = hourStartsBetween(startMs, Math.min(toMs, this.now()), run.time_zone);
      if (!starts.length) continue;
      await this.pool.query(
        `INSERT INTO stale_hours (meter_run_id, start) SELECT $1, to_timestamp(h / 1000.0) FROM unnest($2::float8[]) AS h
         ON CONFLICT (meter_run_id, start) DO UPDATE SET queued_at = clock_timestamp()`,
        [run.id, starts],
      );
    }
  }
}

/** Samples of [startMs, endMs) plus the last one before startMs (it covers the start of the hour). */
function window<T extends { timeMs: number }>(samples: T[], startMs: number, endMs: number): T[] {
  let lo = 0;
  let hi = samples.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (samples[mid].timeMs < startMs) lo = mid + 1;
    else hi = mid;
  }
  let end = lo;
  while (end < samples.length && samples[end].timeMs < endMs) end++;
  return samples.slice(Math.max(0, lo - 1), end);
}

function nextHourStart(startMs: number, timeZone: string): number {
  const next = hourStartsBetween(startMs + 1, startMs + 2 * hourMs, timeZone)[0];
  return next ?? startMs + hourMs;
}
