import type { Pool } from 'pg';
import { computeHour } from '../../shared/history/compute-hour';
import { hourStartsBetween } from '../../shared/history/contract-day';
import { contractCalendar, type ContractCalendar } from '../../shared/history/contract-calendar';
import { inEffectAt, versionInstantsWithin, type Dated } from '../../shared/history/dated';
import { rollUpRecords } from '../../shared/history/roll-up';
import type { PointTransmitter } from '../../shared/history/sample-uncertainty';
import type { HourlyRecord } from '../../shared/history/types';
import { toSI } from '../../shared/units';
import { componentLogger } from '../log';
import { applyCorrections, loadCorrectionsInForce, overlayReadings } from './corrections-overlay';
import {
  claimHours,
  dropComputedHours,
  firstReadingMs,
  hourlyRecordsIn,
  meterRunZones,
  postponeHours,
  previousStackChoice,
  queueHourStarts,
  queuedHourCount,
  releaseAllClaims,
  releaseClaims,
  saveHourlyRecords,
  savePeriodTotal,
  type ClaimTiming,
  type ComputedHour,
  type PeriodTable,
} from './history-repository';
import { loadMeterRunContext, loadReadings, type MeterRunContext, type ReadingSeries } from './load-context';
import { holdHours, periodIsClosed } from './closed-periods';
import { scheduled, strongestReason, type RecomputeReason } from './record-causes';

const log = componentLogger('history');

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
  /** Claims that could not be handed back (the database went away): handed back first in the next round. */
  private unreleased: { meterRunId: string; hours: number[] }[] = [];
  /** Whether the last timed round failed, so an outage is logged once rather than every second. */
  private failing = false;

  constructor(
    private readonly pool: Pool,
    private readonly now: () => number = Date.now,
    private readonly timing: ClaimTiming = { quietMs: 1000, maxWaitMs: 10_000 },
  ) {}

  /**
   * Starts the timed rounds. Called only in the process that holds the job runner's lock
   * (server/jobs/single-runner.ts), so one process recomputes on the clock; `drain`/`settle` called
   * elsewhere stay safe, as claims skip each other's rows.
   */
  start(onChange?: (meterRunIds: string[]) => void) {
    this.onChange = onChange;
    // A claim left by a process that died is released: the lock's previous holder is gone (or there was none).
    void releaseAllClaims(this.pool).catch(() => undefined);
    // A round that fails (the database is unreachable) is logged and the timer goes on: the queue
    // is in the database, so the worker resumes by itself when the database is back.
    const timer = setInterval(
      () =>
        void this.drain().then(
          () => {
            if (this.failing) log.warn('the history worker is running again');
            this.failing = false;
          },
          (err: unknown) => {
            if (!this.failing) log.error({ err }, 'a history round failed; it is tried again every second');
            this.failing = true;
          },
        ),
      1000,
    );
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
      const queued = await queuedHourCount(this.pool);
      if (queued === 0) return;
      if (Date.now() > until) throw new Error(`history did not settle: ${queued} hours still queued`);
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  /** Works until the queue is empty; a second call while one runs waits for it. */
  async drain(): Promise<void> {
    if (this.running) return new Promise((resolve) => this.idleResolvers.push(resolve));
    this.running = true;
    const touched = new Set<string>();
    try {
      while (this.unreleased.length) {
        const left = this.unreleased[0];
        await postponeHours(this.pool, left.meterRunId, left.hours);
        this.unreleased.shift();
      }
      for (;;) {
        const claimed = await claimHours(this.pool, this.timing, hoursPerRound);
        if (!claimed) break;
        touched.add(claimed.meterRunId);
        try {
          await this.recompute(claimed.meterRunId, claimed.hours, claimed.reasons);
          await dropComputedHours(this.pool, claimed.meterRunId, claimed.hours);
        } catch (err) {
          log.error(
            { err, meterRunId: claimed.meterRunId, hours: claimed.hours.length },
            'recomputing hours failed; they stay queued and are tried again in 30 s',
          );
          // Leave the rows queued, but not in a tight loop: push them back a little.
          await this.handBack(claimed.meterRunId, claimed.hours, () =>
            postponeHours(this.pool, claimed.meterRunId, claimed.hours),
          );
          break;
        }
        // Hours that got new readings while being computed wait for another round (a live hour: ten seconds).
        await this.handBack(claimed.meterRunId, claimed.hours, () => releaseClaims(this.pool, claimed.meterRunId));
      }
    } finally {
      this.running = false;
      const waiting = this.idleResolvers;
      this.idleResolvers = [];
      waiting.forEach((r) => r());
      if (touched.size) this.onChange?.([...touched]);
    }
  }

  /** Hands claimed hours back; when that fails they are kept and handed back at the start of the next round. */
  private async handBack(meterRunId: string, hours: number[], release: () => Promise<void>) {
    try {
      await release();
    } catch (err) {
      this.unreleased.push({ meterRunId, hours });
      throw err;
    }
  }

  /**
   * Recomputes the given hours of one meter run and the periods above them. `reasons` (by hour
   * start) says why each hour waited; it becomes the cause of any new version of its record.
   * Each hour is split at every instant inside it where a configuration version, a meter-run
   * setting, a site setting or a DP transmitter's range takes effect, and each part is computed
   * with the settings in force then and stored as a record of its own (API MPMS 21.1).
   */
  async recompute(meterRunId: string, hours: number[], reasons = new Map<number, RecomputeReason>()) {
    const ctx = await loadMeterRunContext(this.pool, meterRunId);
    if (!ctx) return;
    const nowMs = this.now();
    // Far enough back for the longest hold limit or gap any version allows.
    const lookBackMs = Math.max(...ctx.settingVersions.map((v) => Math.max(v.holdLimitS, v.maxGapS))) * 1000;
    // Load readings and corrections once for the whole span of claimed hours.
    const spanStart = hours[0];
    const spanEnd = hours[hours.length - 1] + hourMs;
    const inForce = await loadCorrectionsInForce(this.pool, meterRunId, spanStart, spanEnd);
    const readings = overlayReadings(await loadReadings(this.pool, ctx, spanStart - lookBackMs, spanEnd), inForce);
    let previousChoice = await previousStackChoice(this.pool, meterRunId, spanStart);
    const splitLists: Dated[][] = [
      ctx.configVersions,
      ctx.settingVersions,
      ctx.siteVersions,
      ...ctx.transmitters.filter((t) => t.measures === 'differential-pressure').map((t) => t.ranges),
    ];
    const computed: ComputedHour[] = [];
    const held: number[] = [];
    const historyStartMs = historyStartOf(ctx);
    // One question for the whole span first: most rounds touch no closed month.
    const spanTouchesClosed = await periodIsClosed(this.pool, meterRunId, spanStart, spanEnd);
    let yieldedAt = performance.now();
    for (const startMs of hours) {
      // A round computes up to a week of hours in one go: hand the event loop back every ~20 ms so
      // live ingest (its commits and PUBACKs run in this process) is not starved by a recompute.
      if (performance.now() - yieldedAt > 20) {
        await new Promise((resolve) => setImmediate(resolve));
        yieldedAt = performance.now();
      }
      const endMs = nextHourStart(startMs, ctx.timeZone);
      if (startMs > nowMs) continue;
      // Before the meter run's first configuration version there is nothing to record.
      if (endMs <= historyStartMs) continue;
      // A closed month keeps its figures; the hour waits in held_hours until the month is reopened.
      if (spanTouchesClosed && (await periodIsClosed(this.pool, meterRunId, startMs, endMs))) {
        held.push(startMs);
        continue;
      }
      const cuts = [startMs, ...versionInstantsWithin(splitLists, startMs, endMs), endMs];
      const records: HourlyRecord[] = [];
      for (let k = 0; k + 1 < cuts.length && cuts[k] <= nowMs; k++) {
        const record = applyCorrections(
          computePart(ctx, readings, { startMs: cuts[k], endMs: cuts[k + 1], nowMs, previousChoice }),
          inForce,
        );
        previousChoice = record.finalStackChoice ?? previousChoice;
        records.push(record);
      }
      computed.push({ startMs, endMs, records });
    }
    // A month closed while this round computed keeps its figures too (asked again just before saving).
    if (!spanTouchesClosed && computed.length && (await periodIsClosed(this.pool, meterRunId, spanStart, spanEnd))) {
      for (let i = computed.length - 1; i >= 0; i--) {
        if (!(await periodIsClosed(this.pool, meterRunId, computed[i].startMs, computed[i].endMs))) continue;
        held.push(computed[i].startMs);
        computed.splice(i, 1);
      }
    }
    if (held.length) await holdHours(this.pool, meterRunId, held, reasons);
    const saved = await saveHourlyRecords(this.pool, meterRunId, computed, { asOfMs: nowMs, reasons });
    // A total changes for the reason its hours changed: the cause of an hour's new version (a
    // configuration version found in the record), else the reason the hour waited.
    const hourReasons = new Map<number, RecomputeReason>();
    for (const h of saved) {
      const reason =
        h.changed && h.cause !== 'initial'
          ? { cause: h.cause, reference: h.causeReference }
          : (reasons.get(h.hourStartMs) ?? scheduled);
      const known = hourReasons.get(h.hourStartMs);
      hourReasons.set(h.hourStartMs, known ? strongestReason([known, reason]) : reason);
    }
    await this.rollUp(ctx, hourReasons, nowMs);
  }

  /** Recomputes the contract days and months that contain the given hours (with why each hour was recomputed). */
  private async rollUp(ctx: MeterRunContext, hourReasons: Map<number, RecomputeReason>, nowMs: number) {
    const calendar = calendarOf(ctx);
    const days = new Map<string, RecomputeReason[]>();
    for (const [startMs, reason] of hourReasons) {
      const day = calendar.dayOf(startMs);
      days.set(day, [...(days.get(day) ?? []), reason]);
    }
    const months = new Map<string, RecomputeReason[]>();
    for (const [day, reasons] of days)
      months.set(day.slice(0, 7), [...(months.get(day.slice(0, 7)) ?? []), ...reasons]);
    for (const [day, reasons] of days) {
      await this.rollUpPeriod(
        { table: 'daily_totals', keyColumn: 'contract_day' },
        day,
        ctx,
        calendar.dayBounds(day),
        nowMs,
        strongestReason(reasons),
      );
    }
    for (const [month, reasons] of months) {
      await this.rollUpPeriod(
        { table: 'monthly_totals', keyColumn: 'month' },
        `${month}-01`,
        ctx,
        calendar.monthBounds(month),
        nowMs,
        strongestReason(reasons),
      );
    }
  }

  /** Rolls the hourly records of one contract day or month up and stores the total. */
  private async rollUpPeriod(
    period: PeriodTable,
    key: string,
    ctx: MeterRunContext,
    bounds: { startMs: number; endMs: number; hours: number },
    nowMs: number,
    reason: RecomputeReason,
  ) {
    if (await periodIsClosed(this.pool, ctx.meterRunId, bounds.startMs, bounds.endMs)) return;
    const records = await hourlyRecordsIn(this.pool, ctx.meterRunId, bounds.startMs, bounds.endMs);
    const total = rollUpRecords(records, bounds, { nowMs, historyStartMs: historyStartOf(ctx) });
    await savePeriodTotal(this.pool, period, ctx.meterRunId, key, total, reason);
  }

  /**
   * Queues every hour of every meter run in [fromMs, toMs) (the hourly sweep, a back-dated change),
   * saying why: `scheduled` unless told (a configuration change passes 'configuration-version').
   */
  async queueHours(meterRunIds: string[] | 'all', fromMs: number, toMs: number, reason: RecomputeReason = scheduled) {
    for (const run of await meterRunZones(this.pool, meterRunIds)) {
      // Nothing before the meter run's first reading can change: start there.
      const firstMs = await firstReadingMs(this.pool, run.id);
      if (firstMs === null) continue;
      const startMs = Math.max(fromMs, firstMs - 3_600_000);
      const starts = hourStartsBetween(startMs, Math.min(toMs, this.now()), run.timeZone);
      if (!starts.length) continue;
      await queueHourStarts(this.pool, run.id, starts, reason);
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

/** When the meter run's history starts: its first configuration version takes effect (no version: never). */
function historyStartOf(ctx: MeterRunContext): number {
  return ctx.configVersions.length ? Math.min(...ctx.configVersions.map((v) => v.effectiveFromMs)) : Infinity;
}

/** The site's contract days, with its contract hour as dated (shared/history/contract-calendar.ts). */
function calendarOf(ctx: MeterRunContext): ContractCalendar {
  return contractCalendar(
    ctx.timeZone,
    ctx.siteVersions.map((v) => ({ effectiveFromMs: v.effectiveFromMs, contractHour: v.contractHour })),
    ctx.contractHour,
  );
}

/**
 * The static pressure or temperature transmitter's accuracy in force at a time, its span in SI
 * (Pa, or K: the difference of two converted range values is a span in kelvin for °C and °F too),
 * for the hour's uncertainty budget (ISO 5167-1:2003 §8, through the density), with the dated kind
 * of the datasheet figure (k = 2 uncertainty, or a ± limit converted by √3, GUM §4.3.7; migration
 * 0023), which the budget's source names. Undefined when the meter run has no such transmitter.
 */
function pointTransmitterAt(
  ctx: MeterRunContext,
  measures: 'static-pressure' | 'temperature',
  atMs: number,
): PointTransmitter | undefined {
  const transmitter = ctx.transmitters.find((t) => t.measures === measures);
  if (!transmitter) return undefined;
  const range = inEffectAt(transmitter.ranges, atMs);
  const span = toSI(range.upperRange, transmitter.unit) - toSI(range.lowerRange, transmitter.unit);
  if (!(span > 0)) return undefined;
  return { accuracyPercentOfSpan: range.accuracyPercentOfSpan, span, accuracyKind: range.accuracyKind };
}

/**
 * One record for [startMs, endMs) (an hour, or the part of one between two version instants),
 * computed with the settings in force at its start: no version takes effect inside it.
 */
function computePart(
  ctx: MeterRunContext,
  readings: ReadingSeries,
  part: { startMs: number; endMs: number; nowMs: number; previousChoice: 'low' | 'high' | null },
): HourlyRecord {
  const { startMs, endMs } = part;
  const settings = inEffectAt(ctx.settingVersions, startMs);
  const site = inEffectAt(ctx.siteVersions, startMs);
  const dp = readings.dp.map((series) => {
    const transmitter = ctx.transmitters.find((t) => t.id === series.transmitterId);
    const range = transmitter ? inEffectAt(transmitter.ranges, startMs) : null;
    return {
      ...series,
      ...(transmitter && range
        ? {
            lowerRangePa: toSI(range.lowerRange, transmitter.unit),
            upperRangePa: toSI(range.upperRange, transmitter.unit),
            accuracyPercentOfSpan: range.accuracyPercentOfSpan,
            accuracyKind: range.accuracyKind,
          }
        : {}),
      samples: window(series.samples, startMs, endMs),
    };
  });
  return computeHour({
    startMs,
    endMs,
    asOfMs: Math.min(endMs, part.nowMs),
    dp,
    staticPressure: window(readings.staticPressure, startMs, endMs),
    temperature: window(readings.temperature, startMs, endMs),
    staticPressureTransmitter: pointTransmitterAt(ctx, 'static-pressure', startMs),
    temperatureTransmitter: pointTransmitterAt(ctx, 'temperature', startMs),
    configVersions: ctx.configVersions,
    base: { pressurePa: site.basePressurePa, temperatureK: site.baseTemperatureK },
    holdLimitS: settings.holdLimitS,
    maxGapS: settings.maxGapS,
    noFlowCutoffShare: settings.noFlowCutoffShare,
    stackSwitchUpShare: settings.stackSwitchUpShare,
    stackSwitchDownShare: settings.stackSwitchDownShare,
    initialStackChoice: part.previousChoice ?? undefined,
    // A direction input (bi-directional runs reading DP magnitude) says which way each part of the hour flows.
    ...(readings.direction.length ? { direction: window(readings.direction, startMs, endMs) } : {}),
  });
}
