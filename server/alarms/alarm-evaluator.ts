/**
 * Evaluates alarm conditions for meter runs: after each history recompute round (the history
 * worker's onChange) and on the minute (the clock: stale transmitters, calibration dates,
 * shelving that ran out, contract days against field totals).
 *
 * Per meter run a watermark is kept in alarm_evaluations: each round walks the readings after it
 * in time order (shared/alarms/meter-run-alarm-walk.ts), in chunks, up to a horizon of
 * min(latest reading, now − grace) — the grace lets a live reading that arrives a few seconds
 * late still be judged in order — and stores the raises and clears at the readings' own times.
 * The walk state (delay timers, the pair's choice) is saved with the watermark in the same
 * transaction as the alarms, so the same readings never raise twice, even across restarts.
 *
 * Late data: a reading older than the watermark is not judged for alarms (the alarm log is
 * append-only: what was announced stays as announced). It still goes into its hourly record, so
 * totals, flags and range health include it, and a gap that it fills has already shown as a
 * stale alarm. Hourly records are judged only once no hour before them waits in the recompute
 * queue.
 */
import { EventEmitter } from 'node:events';
import type { Pool, PoolClient } from 'pg';
import { toSI } from '../../shared/units';
import { walkMeterRunAlarms, type WalkReading, type WalkTransmitter } from '../../shared/alarms/meter-run-alarm-walk';
import { alarmMessage } from '../../shared/alarms/alarm-message';
import { judgeDueDate, todayIn } from '../../shared/alarms/due-date';
import { careDuties, type CareRecordKind } from '../../shared/alarms/care-duties';
import { careMeterRuns } from '../resources/care-due/repository';
import type { Quality } from '../../shared/history/types';
import { loadMeterRunContext, type MeterRunContext } from '../history/load-context';
import { componentLogger } from '../log';
import { applySignal, setClockCondition, unshelveExpired } from './alarm-store';
import {
  calibrationTransmitters,
  lockWalkState,
  meterRunIds,
  meterRunTag,
  nextReadingMs,
  readingSpan,
  readingsAround,
  saveWalkState,
  settledHours,
  transmitterTags,
} from './evaluation-repository';
import { limitsResolver, loadStoredLimits } from './limits-store';
import { judgeReconciliationAlarms } from './reconciliation-alarm';
import { judgeBalanceAlarms } from './balance-alarm';

const log = componentLogger('alarms');

const qualityName: Quality[] = ['good', 'uncertain', 'bad', 'substituted'];
const dayMs = 86_400_000;
/** Readings walked per transaction, by time (bounds memory: a day at 1 Hz is 86 400 readings per transmitter). */
const CHUNK_MS = dayMs / 4;

export interface AlarmEvaluatorOptions {
  /** A live reading this late is still judged in order (default 30 s). */
  graceS?: number;
  now?: () => number;
}

export class AlarmEvaluator extends EventEmitter {
  private readonly running = new Map<string, Promise<void>>();
  private readonly again = new Set<string>();
  private readonly graceMs: number;
  private readonly now: () => number;

  constructor(
    private readonly pool: Pool,
    options: AlarmEvaluatorOptions = {},
  ) {
    super();
    this.graceMs = (options.graceS ?? 30) * 1000;
    this.now = options.now ?? Date.now;
  }

  /** The history worker recomputed these meter runs: judge their new readings (in the background). */
  meterRunsChanged(meterRunIds: string[]) {
    for (const id of meterRunIds)
      void this.evaluate(id).catch((err) => log.error({ err, meterRunId: id }, 'evaluating alarms failed'));
  }

  /**
   * Judges a meter run's readings up to the horizon; one evaluation per meter run at a time (a
   * call during one queues one more round).
   * @param meterRunId the meter run
   * @param options clock: also judge stale by the clock
   */
  evaluate(meterRunId: string, options: { clock?: boolean } = {}): Promise<void> {
    const current = this.running.get(meterRunId);
    if (current) {
      this.again.add(meterRunId);
      return current.then(() => this.running.get(meterRunId) ?? Promise.resolve());
    }
    const run = (async () => {
      try {
        do {
          this.again.delete(meterRunId);
          await this.evaluateOnce(meterRunId, options.clock ?? false);
        } while (this.again.has(meterRunId));
      } finally {
        this.running.delete(meterRunId);
      }
    })();
    this.running.set(meterRunId, run);
    return run;
  }

  /** The minute's work: every meter run judged with the clock, calibration dates, expired shelving. */
  async tick(): Promise<void> {
    const nowMs = this.now();
    const unshelved = await unshelveExpired(this.pool, nowMs);
    if (unshelved.length) this.emit('changed', unshelved);
    for (const id of await meterRunIds(this.pool)) {
      try {
        await this.evaluate(id, { clock: true });
      } catch (err) {
        log.error({ err, meterRunId: id }, 'evaluating alarms by the clock failed');
      }
    }
    await this.evaluateCalibration(nowMs);
    await this.evaluateCare(nowMs);
    await this.evaluateReconciliation(nowMs);
    await this.evaluateBalances(nowMs);
  }

  /** Station balances of the balance groups (server/alarms/balance-alarm.ts), judged on the minute. */
  async evaluateBalances(nowMs = this.now()) {
    const { touched, raised } = await judgeBalanceAlarms(this.pool, nowMs);
    if (touched.length) this.emit('changed', touched);
    if (raised.length) this.emit('raised', raised);
  }

  /** Contract days against field totals (server/alarms/reconciliation-alarm.ts), judged on the minute. */
  async evaluateReconciliation(nowMs = this.now()) {
    const { touched, raised } = await judgeReconciliationAlarms(this.pool, nowMs);
    if (touched.length) this.emit('changed', touched);
    if (raised.length) this.emit('raised', raised);
  }

  private async evaluateOnce(meterRunId: string, clock: boolean) {
    const ctx = await loadMeterRunContext(this.pool, meterRunId);
    if (!ctx) return;
    // Its id stands in for the tag (as a transmitter's does below) only if the meter run vanished meanwhile.
    const tag = (await meterRunTag(this.pool, meterRunId)) ?? meterRunId;
    const transmitters = walkTransmitters(ctx, await transmitterTags(this.pool, meterRunId));
    const limits = limitsResolver(await loadStoredLimits(this.pool, meterRunId));
    const latest: Record<string, number> = {};
    let first = Infinity;
    for (const t of transmitters) {
      const span = await readingSpan(this.pool, t.id);
      if (span.lastMs !== null) latest[t.id] = span.lastMs;
      if (span.firstMs !== null) first = Math.min(first, span.firstMs);
    }
    const nowMs = this.now();
    const lastMs = Math.max(-Infinity, ...Object.values(latest));
    const horizon = Math.min(lastMs, nowMs - this.graceMs);
    const lookbackMs = this.lookbackMs(transmitters, limits, ctx);
    const raisedIds: string[] = [];
    const touchedIds: string[] = [];

    for (let round = 0; round < 10_000; round++) {
      const client = await this.pool.connect();
      try {
        await client.query('BEGIN');
        const state = await lockWalkState(client, meterRunId);
        const watermark = state.watermarkMs ?? (Number.isFinite(first) ? first - 1 : null);
        if (watermark === null) {
          await client.query('ROLLBACK');
          break; // no reading yet
        }
        const hasReadings = Number.isFinite(horizon) && horizon > watermark;
        // Skip a stretch without readings in one step (sparse or back-filled data).
        const next = hasReadings ? await this.nextReadingMs(client, transmitters, watermark) : null;
        const chunkEnd = hasReadings
          ? Math.min(horizon, Math.max(watermark, (next ?? horizon) - 1) + CHUNK_MS)
          : watermark;
        const lastChunk = !hasReadings || chunkEnd >= horizon;
        const readings = hasReadings ? await this.loadReadings(client, ctx, watermark - lookbackMs, chunkEnd) : [];
        const hours = Number.isFinite(chunkEnd)
          ? await settledHours(client, meterRunId, state.recordsToMs, chunkEnd)
          : [];
        const walked = walkMeterRunAlarms({
          state: { ...state, watermarkMs: watermark },
          meterRunTag: tag,
          timeZone: ctx.timeZone,
          transmitters,
          readings,
          hours,
          horizonMs: chunkEnd,
          clockMs: clock && lastChunk ? nowMs : undefined,
          latestReadingMs: latest,
          limits,
          meterRun: {
            maxGapS: ctx.maxGapS,
            stackSwitchUpShare: ctx.stackSwitchUpShare,
            stackSwitchDownShare: ctx.stackSwitchDownShare,
          },
          reverseFlow: liveReverseFlowRule(ctx),
        });
        for (const signal of walked.signals) {
          const applied = await applySignal(
            client,
            meterRunId,
            signal,
            limits(signal.condition, signal.transmitterId).priority,
            nowMs,
          );
          if (applied) touchedIds.push(applied.alarmId);
          if (applied?.raised) raisedIds.push(applied.alarmId);
        }
        await saveWalkState(client, meterRunId, walked.state);
        await client.query('COMMIT');
        if (lastChunk) break;
      } catch (err) {
        await client.query('ROLLBACK').catch(() => undefined);
        throw err;
      } finally {
        client.release();
      }
    }
    if (touchedIds.length) this.emit('changed', touchedIds);
    if (raisedIds.length) this.emit('raised', raisedIds);
  }

  /** How far before the watermark readings are needed: the longest frozen window plus a sample's coverage. */
  private lookbackMs(transmitters: WalkTransmitter[], limits: ReturnType<typeof limitsResolver>, ctx: MeterRunContext) {
    const windows = transmitters.map((t) => (limits('frozen', t.id).windowS ?? 0) * 1000);
    return Math.max(0, ...windows) + ctx.maxGapS * 1000;
  }

  /** The first reading of any of the transmitters after `afterMs`, or null. */
  private async nextReadingMs(
    db: PoolClient,
    transmitters: WalkTransmitter[],
    afterMs: number,
  ): Promise<number | null> {
    let next = Infinity;
    for (const t of transmitters) {
      const timeMs = await nextReadingMs(db, t.id, afterMs);
      if (timeMs !== null) next = Math.min(next, timeMs);
    }
    return Number.isFinite(next) ? next : null;
  }

  /** Readings of [fromMs, toMs] per transmitter in SI, plus the latest one before fromMs, merged in time order. */
  private async loadReadings(
    db: PoolClient,
    ctx: MeterRunContext,
    fromMs: number,
    toMs: number,
  ): Promise<WalkReading[]> {
    const out: WalkReading[] = [];
    for (const t of measuringTransmitters(ctx)) {
      const offset =
        t.measures === 'static-pressure' && t.pressureReference === 'gauge' ? ctx.atmosphericPressurePa : 0;
      for (const r of await readingsAround(db, t.id, fromMs, toMs))
        out.push({
          transmitterId: t.id,
          timeMs: r.timeMs,
          value: toSI(r.value, t.unit) + offset,
          quality: qualityName[r.quality] ?? 'bad',
        });
    }
    return out.sort((a, b) => a.timeMs - b.timeMs);
  }

  /**
   * Calibration due soon and overdue, by the date in the site's time zone: due from dueSoonDays
   * before the due date up to and including it, overdue after it. Judged by the clock, not readings.
   */
  async evaluateCalibration(nowMs = this.now()) {
    const raised: string[] = [];
    const touched: string[] = [];
    const byRun = new Map<string, ReturnType<typeof limitsResolver>>();
    for (const r of await calibrationTransmitters(this.pool)) {
      let limits = byRun.get(r.meterRunId);
      if (!limits) byRun.set(r.meterRunId, (limits = limitsResolver(await loadStoredLimits(this.pool, r.meterRunId))));
      const due = r.due;
      const dueLimits = limits('calibration-due', r.id);
      const overdueLimits = limits('calibration-overdue', r.id);
      const state =
        due === null ? null : judgeDueDate(due, todayIn(nowMs, r.timeZone), dueLimits.dueSoonDays ?? 14).state;
      const overdue = state === 'overdue' && overdueLimits.enabled;
      const dueSoon = state === 'due-soon' && dueLimits.enabled;
      const detail = { calibrationDue: due };
      for (const [condition, holds, priority] of [
        ['calibration-due', dueSoon, dueLimits.priority],
        ['calibration-overdue', overdue, overdueLimits.priority],
      ] as const) {
        const applied = await setClockCondition(
          this.pool,
          r.meterRunId,
          r.id,
          condition,
          holds,
          priority,
          alarmMessage(condition, r.tag, detail, r.timeZone),
          detail,
          nowMs,
        );
        if (applied) touched.push(applied.alarmId);
        if (applied?.raised) raised.push(applied.alarmId);
      }
    }
    if (touched.length) this.emit('changed', touched);
    if (raised.length) this.emit('raised', raised);
  }

  /**
   * The element's care records (issue 11 §4), per meter run: care-due while any of the latest
   * element calibration, gas analysis or inspection is due soon, care-overdue while any is past
   * its date, by the same rule and window as a transmitter's calibration (shared/alarms/due-date.ts).
   * The detail names the record kinds and their dates. Judged by the clock.
   */
  async evaluateCare(nowMs = this.now()) {
    const raised: string[] = [];
    const touched: string[] = [];
    for (const run of await careMeterRuns(this.pool, null)) {
      const limits = limitsResolver(await loadStoredLimits(this.pool, run.id));
      const dueLimits = limits('care-due', null);
      const overdueLimits = limits('care-overdue', null);
      const today = todayIn(nowMs, run.timeZone);
      const judged = careDuties(run).flatMap((d) =>
        d.dueOn === null
          ? []
          : [{ ...d, dueOn: d.dueOn, ...judgeDueDate(d.dueOn, today, dueLimits.dueSoonDays ?? 14) }],
      );
      for (const [condition, state, conditionLimits] of [
        ['care-due', 'due-soon', dueLimits],
        ['care-overdue', 'overdue', overdueLimits],
      ] as const) {
        const records = judged.filter((d) => d.state === state);
        const detail = {
          kinds: records.map((d) => d.kind).join(','),
          records: records.map((d) => `${careWords[d.kind]} due ${d.dueOn}`).join('; '),
        };
        const applied = await setClockCondition(
          this.pool,
          run.id,
          null,
          condition,
          records.length > 0 && conditionLimits.enabled,
          conditionLimits.priority,
          alarmMessage(condition, run.tag, detail, run.timeZone),
          detail,
          nowMs,
        );
        if (applied) touched.push(applied.alarmId);
        if (applied?.raised) raised.push(applied.alarmId);
      }
    }
    if (touched.length) this.emit('changed', touched);
    if (raised.length) this.emit('raised', raised);
  }
}

/**
 * Reverse flow on a one-way meter run judged live from the DP (issue 13 §11), with the dated
 * configuration and no-flow cutoff in force at each reading. A meter run with a direction input is
 * judged from its hourly records instead (undefined): the walk does not read the direction input.
 */
function liveReverseFlowRule(ctx: MeterRunContext) {
  if (ctx.transmitters.some((t) => t.measures === 'flow-direction')) return undefined;
  const inForce = <T extends { effectiveFromMs: number }>(versions: readonly T[], timeMs: number) => {
    let found: T | undefined = versions[0]; // before the first one: the first (no hour is computed there)
    for (const v of versions) if (v.effectiveFromMs <= timeMs) found = v;
    return found;
  };
  return {
    oneWayAt: (timeMs: number) => !inForce(ctx.configVersions, timeMs)?.reverseElement,
    noFlowCutoffShareAt: (timeMs: number) =>
      inForce(ctx.settingVersions, timeMs)?.noFlowCutoffShare ?? ctx.noFlowCutoffShare,
  };
}

/** The transmitters the alarm walk judges: every one but a direction input. */
function measuringTransmitters(ctx: MeterRunContext) {
  return ctx.transmitters.flatMap((t) => (t.measures === 'flow-direction' ? [] : [{ ...t, measures: t.measures }]));
}

/** The record kinds in the alarm's words. */
const careWords: Record<CareRecordKind, string> = {
  'element-calibration': 'element calibration',
  'gas-analysis': 'gas analysis',
  'element-inspection': 'element inspection',
};

/** The meter run's transmitters with their ranges in SI (as the readings are converted). */
function walkTransmitters(ctx: MeterRunContext, tags: Map<string, string>): WalkTransmitter[] {
  // A direction input (unit `sign`) has no span to judge: its reverse flow is judged from the hourly records.
  return measuringTransmitters(ctx).map((t) => {
    const offset = t.measures === 'static-pressure' && t.pressureReference === 'gauge' ? ctx.atmosphericPressurePa : 0;
    return {
      id: t.id,
      tag: tags.get(t.id) ?? t.id,
      measures: t.measures,
      stackRole: t.stackRole,
      lowerRangeSI: toSI(t.lowerRange, t.unit) + offset,
      upperRangeSI: toSI(t.upperRange, t.unit) + offset,
      accuracyPercentOfSpan: t.accuracyPercentOfSpan,
    };
  });
}
