/**
 * Walks one meter run's readings forward in time and turns them into alarm raises and clears
 * at the readings' own times (so imported history gets its alarm log too). The state carried
 * between walks is small and JSON-able: a watermark (readings at or before it were judged), the
 * stacked pair's choice, and each alarm point's delay tracker. Readings before the watermark are
 * passed in only to warm up windows (frozen) and the DP selection; they are not judged again.
 *
 * Conditions judged here, per instant with readings:
 * - dp-low-in-range / dp-over-range: the DP in use (shared/history's dpSelector, with the pair's
 *   hysteresis) as a share of ITS span, while there is flow (above the no-flow cutoff); a DP
 *   transmitter that is not in use is not low or over range; no usable DP = no judgement;
 * - stack-disagreement: |low − high| in the overlap (both usable, the low one inside its range),
 *   as a share of the low-range span; outside the overlap there is no judgement;
 * - frozen: σ of the readings over the window (plus the one in force at its start), while the
 *   reading is inside the NAMUR NE 43 saturation limits (signal-levels.ts): a flat output at a
 *   saturation limit is over or under range, not frozen;
 * - bad-quality: also a reading at an NE 43 failure level (beyond 21 mA or below 3.6 mA);
 * - stale: a gap between readings longer than the limit (raised at last + limit, cleared by the
 *   next reading), and by the clock after the last reading;
 * - bad-quality: the reading in force is bad;
 * - outside-standard-limits: from the hourly records' flags, hour by hour;
 * - reverse-flow (a one-way meter run): with `reverseFlow`, live from the DP in use by the rule of
 *   the hourly records (shared/history directionalReading: a transmitter ranged below zero reading
 *   beyond the no-flow cutoff of its reverse side), raised by reverse DP, cleared by forward flow,
 *   no judgement without flow; without it, from the hourly records' 'reverse-flow' flag. One source
 *   per walk, so the alarm point never sees observations out of time order.
 */
import { directionalReading, NO_FLOW_CUTOFF_SHARE_OF_SPAN } from '../history/compute-hour';
import { dpSelector, type DpSelector } from '../history/dp-selector';
import { chooseStackedTransmitter } from '../flow/stacked-pair';
import type { DpSeries, Quality } from '../history/types';
import type { AlarmCondition } from './alarm-codes';
import type { AlarmLimits } from './alarm-limits';
import { alarmMessage, type AlarmDetail } from './alarm-message';
import { advanceDelayTracker, initialDelayTracker, observeCondition, type DelayTrackerState } from './delay-tracker';
import { aboveWithDeadband, belowWithDeadband } from './level-with-deadband';
import { isFrozenSignal } from './frozen-signal';
import { signalLevel, type SignalLevel } from './signal-levels';

export interface WalkTransmitter {
  id: string;
  tag: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature';
  stackRole: 'single' | 'low' | 'high';
  /** Range in SI (Pa, K), the same units as the readings' values. */
  lowerRangeSI: number;
  upperRangeSI: number;
  accuracyPercentOfSpan: number;
}

export interface WalkReading {
  transmitterId: string;
  timeMs: number;
  /** SI (Pa, K). */
  value: number;
  quality: Quality;
}

export interface WalkHour {
  startMs: number;
  endMs: number;
  flowTimeS: number;
  flags: readonly string[];
}

export interface AlarmWalkState {
  /** Readings at or before this time have been judged (null: none yet). */
  watermarkMs: number | null;
  /** Hourly records ending at or before this time have been judged. */
  recordsToMs: number | null;
  stackChoice: 'low' | 'high' | null;
  /** Delay tracker of each alarm point, by `condition|transmitterId` ('' for the meter run). */
  points: Record<string, DelayTrackerState>;
  /** What was observed when each point's condition began (for the raise message). */
  onsetDetail: Record<string, AlarmDetail>;
  lastReadingMs: Record<string, number>;
  frozenCheckedMs: Record<string, number>;
}

export interface AlarmSignal {
  kind: 'raise' | 'clear';
  condition: AlarmCondition;
  transmitterId: string | null;
  /** When raised (condition onset + on-delay) or cleared (end + off-delay), epoch ms. */
  timeMs: number;
  /** When the condition began (raise) or ended (clear), epoch ms. */
  onsetMs: number;
  message: string;
  detail: AlarmDetail;
}

export interface AlarmWalkInput {
  state: AlarmWalkState;
  meterRunTag: string;
  /** The site's IANA zone: the messages say times in it (UTC ISO 8601 when absent). */
  timeZone?: string;
  transmitters: readonly WalkTransmitter[];
  /** Sorted by time; those at or before state.watermarkMs only warm up. */
  readings: readonly WalkReading[];
  /** Hourly records, sorted; those before state.recordsToMs are skipped. */
  hours: readonly WalkHour[];
  /** Judge readings and fire delays up to here (inclusive), epoch ms. */
  horizonMs: number;
  /** Wall clock: a transmitter silent for longer than its stale limit by then is stale. */
  clockMs?: number;
  /** The latest stored reading of each transmitter (may be past the horizon), epoch ms. */
  latestReadingMs?: Readonly<Record<string, number>>;
  limits: (condition: AlarmCondition, transmitterId: string | null) => AlarmLimits;
  meterRun: { maxGapS: number; stackSwitchUpShare: number; stackSwitchDownShare: number };
  /**
   * Judge reverse flow live from the DP (issue 13 §11). Absent: from the hourly records' flag (a
   * meter run whose direction comes from a direction input, which the walk does not read).
   */
  reverseFlow?: {
    /** Whether the configuration in force at a time is one-way (no reverseElement). */
    oneWayAt: (timeMs: number) => boolean;
    /** The meter run's no-flow cutoff in force at a time (a dated setting), share of the side's range. */
    noFlowCutoffShareAt: (timeMs: number) => number;
  };
}

/** @returns the state of a meter run never walked */
export function initialAlarmWalkState(): AlarmWalkState {
  return {
    watermarkMs: null,
    recordsToMs: null,
    stackChoice: null,
    points: {},
    onsetDetail: {},
    lastReadingMs: {},
    frozenCheckedMs: {},
  };
}

const pointKey = (condition: AlarmCondition, transmitterId: string | null) => `${condition}|${transmitterId ?? ''}`;
/** A frozen window is re-judged at most this often while it is not frozen (bounds the work at 1 Hz). */
const FROZEN_CHECK_EVERY_MS = 60_000;
/**
 * While frozen, a reading that differs from the one before is judged at once (so the alarm
 * clears at that reading's time); repeats of the same value are re-judged at most this often —
 * otherwise every reading of a fast, flat signal would cost a pass over the whole window.
 */
const FROZEN_RECHECK_UNCHANGED_MS = 5_000;

/**
 * @param input state, transmitters, readings, hourly records, horizon, clock and limits
 * @returns the raises and clears in time order, and the new state (the input state is not changed)
 */
export function walkMeterRunAlarms(input: AlarmWalkInput): { signals: AlarmSignal[]; state: AlarmWalkState } {
  const st: AlarmWalkState = JSON.parse(JSON.stringify(input.state));
  st.onsetDetail ??= {};
  const watermark = st.watermarkMs ?? -Infinity;
  const horizon = input.horizonMs;
  const signals: AlarmSignal[] = [];
  const byId = new Map(input.transmitters.map((t) => [t.id, t]));
  const limitCache = new Map<string, AlarmLimits>();
  const limitsOf = (condition: AlarmCondition, tid: string | null) => {
    const key = pointKey(condition, tid);
    let l = limitCache.get(key);
    if (!l) limitCache.set(key, (l = input.limits(condition, tid)));
    return l;
  };
  const subjectOf = (tid: string | null) => (tid === null ? input.meterRunTag : (byId.get(tid)?.tag ?? tid));

  const emit = (
    condition: AlarmCondition,
    tid: string | null,
    kind: 'raise' | 'clear',
    timeMs: number,
    onsetMs: number,
  ) => {
    const key = pointKey(condition, tid);
    const detail = kind === 'raise' ? (st.onsetDetail[key] ?? {}) : {};
    signals.push({
      kind,
      condition,
      transmitterId: tid,
      timeMs,
      onsetMs,
      message: kind === 'raise' ? alarmMessage(condition, subjectOf(tid), detail, input.timeZone) : '',
      detail,
    });
  };
  /** Observes a point's condition (null: cannot judge now); disabled points are observed as off. */
  const observe = (
    condition: AlarmCondition,
    tid: string | null,
    raw: boolean | null,
    timeMs: number,
    detail?: AlarmDetail,
  ) => {
    const limits = limitsOf(condition, tid);
    const key = pointKey(condition, tid);
    const p = (st.points[key] ??= initialDelayTracker());
    const value = limits.enabled ? raw : false;
    if (value === true && !p.raw && detail) st.onsetDetail[key] = detail;
    for (const tr of observeCondition(p, value, timeMs, {
      onDelayMs: limits.onDelayS * 1000,
      offDelayMs: limits.offDelayS * 1000,
    })) {
      emit(condition, tid, tr.kind, tr.timeMs, tr.onsetMs);
    }
  };
  const previousRaw = (condition: AlarmCondition, tid: string | null) =>
    st.points[pointKey(condition, tid)]?.raw ?? false;

  // Readings per transmitter (warm-up and new), and the DP selection over them.
  const series = new Map<string, WalkReading[]>();
  for (const r of input.readings) {
    if (!byId.has(r.transmitterId) || r.timeMs > horizon) continue;
    let list = series.get(r.transmitterId);
    if (!list) series.set(r.transmitterId, (list = []));
    list.push(r);
  }
  const dps = input.transmitters.filter((t) => t.measures === 'differential-pressure');
  const low = dps.find((t) => t.stackRole === 'low');
  const high = dps.find((t) => t.stackRole === 'high');
  const maxGapMs = input.meterRun.maxGapS * 1000;
  let selector: DpSelector | null = null;
  try {
    const dpSeries: DpSeries[] = dps.map((t) => ({
      transmitterId: t.id,
      stackRole: t.stackRole,
      lowerRangePa: t.lowerRangeSI,
      upperRangePa: t.upperRangeSI,
      accuracyPercentOfSpan: t.accuracyPercentOfSpan,
      samples: (series.get(t.id) ?? []).map((r) => ({ timeMs: r.timeMs, value: r.value, quality: r.quality })),
    }));
    if (dpSeries.length) {
      selector = dpSelector(dpSeries, {
        maxGapMs,
        stackSwitchUpShare: input.meterRun.stackSwitchUpShare,
        stackSwitchDownShare: input.meterRun.stackSwitchDownShare,
        initialStackChoice: st.stackChoice ?? undefined,
      });
    }
  } catch {
    selector = null; // a meter run whose DP transmitters do not form a single or a pair: no DP conditions
  }

  // Position in each transmitter's list (for frozen windows) and its latest reading (for the pair).
  const index = new Map<string, number>();
  const windowStart = new Map<string, number>();
  const latest = new Map<string, WalkReading>();
  for (const [tid, list] of series) {
    let i = 0;
    while (i < list.length && list[i].timeMs <= watermark) latest.set(tid, list[i++]);
    index.set(tid, i);
    windowStart.set(tid, 0);
  }

  const fresh = input.readings.filter((r) => r.timeMs > watermark && r.timeMs <= horizon && byId.has(r.transmitterId));
  let k = 0;
  while (k < fresh.length) {
    const t = fresh[k].timeMs;
    let dpAtT = false;
    for (; k < fresh.length && fresh[k].timeMs === t; k++) {
      const r = fresh[k];
      const tr = byId.get(r.transmitterId)!;
      if (tr.measures === 'differential-pressure') dpAtT = true;
      latest.set(tr.id, r);
      index.set(tr.id, (index.get(tr.id) ?? 0) + 1);
      // Stale: a gap longer than the limit was a stale period from last + limit to now.
      const last = st.lastReadingMs[tr.id];
      const maxAgeMs = (limitsOf('stale', tr.id).maxAgeS ?? Infinity) * 1000;
      if (last !== undefined && t - last > maxAgeMs)
        observe('stale', tr.id, true, last + maxAgeMs, { lastReadingMs: last, maxAgeS: maxAgeMs / 1000 });
      observe('stale', tr.id, false, t);
      st.lastReadingMs[tr.id] = t;
      // NE 43: an output at or beyond a failure threshold is the transmitter signalling a fault.
      const level = signalLevel(r.value, tr.lowerRangeSI, tr.upperRangeSI);
      observe('bad-quality', tr.id, r.quality === 'bad' || level.startsWith('failure'), t, {});
      judgeFrozen(tr, t, level);
    }
    if (dpAtT && selector) judgeDp(t);
  }

  function judgeFrozen(tr: WalkTransmitter, t: number, level: SignalLevel) {
    // A flat output at a saturation (or failure) limit is the process outside the range, not a
    // frozen signal: the DP in use is over range (dp-over-range), the out-of-use member of a
    // stacked pair is simply not in use, and a failure level is bad quality.
    if (level !== 'in-span') return observe('frozen', tr.id, false, t);
    const limits = limitsOf('frozen', tr.id);
    const windowMs = (limits.windowS ?? 1800) * 1000;
    const checked = st.frozenCheckedMs[tr.id] ?? -Infinity;
    const list = series.get(tr.id)!;
    const end = index.get(tr.id)!; // list[end - 1] is the reading at t
    const spanForCheck = tr.upperRangeSI - tr.lowerRangeSI;
    if (previousRaw('frozen', tr.id)) {
      const changed =
        end >= 2 &&
        Math.abs(list[end - 1].value - list[end - 2].value) > (limits.maxStdDevShareOfSpan ?? 0) * spanForCheck;
      if (!changed && t - checked < Math.min(FROZEN_RECHECK_UNCHANGED_MS, windowMs / 10)) return;
    } else if (t - checked < Math.min(FROZEN_CHECK_EVERY_MS, windowMs / 10)) return;
    st.frozenCheckedMs[tr.id] = t;
    let j = windowStart.get(tr.id)!;
    while (j < end && list[j].timeMs < t - windowMs) j++;
    windowStart.set(tr.id, j);
    // The window must be covered: a reading in force at its start.
    if (j === 0) return observe('frozen', tr.id, null, t);
    const values: number[] = [];
    for (let i = j - 1; i < end; i++)
      if (list[i].quality !== 'bad' && Number.isFinite(list[i].value)) values.push(list[i].value);
    const span = tr.upperRangeSI - tr.lowerRangeSI;
    const frozen = isFrozenSignal(values, span, {
      minSamples: limits.minSamples ?? 5,
      maxStdDevShareOfSpan: limits.maxStdDevShareOfSpan ?? 0,
    });
    let sigma = 0;
    if (frozen) {
      const mean = values.reduce((a, b) => a + b, 0) / values.length;
      sigma = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
    }
    observe('frozen', tr.id, frozen, t, {
      windowS: windowMs / 1000,
      count: values.length,
      stdDevShareOfSpan: sigma / span,
      sinceMs: list[j - 1].timeMs,
    });
  }

  function judgeDp(t: number) {
    const selection = selector!.at(t);
    st.stackChoice = selector!.stackChoice();
    if (input.reverseFlow && selection.series !== null && selection.sample !== null)
      judgeReverseFlow(t, selection.series, selection.sample.value, input.reverseFlow);
    if (selection.series !== null && selection.sample !== null) {
      for (const tr of dps) {
        if (tr.id !== selection.series.transmitterId) {
          observe('dp-low-in-range', tr.id, false, t);
          observe('dp-over-range', tr.id, false, t);
          continue;
        }
        const value = selection.sample.value;
        const share = (value - tr.lowerRangeSI) / (tr.upperRangeSI - tr.lowerRangeSI);
        const flowing = value > 0 && share >= NO_FLOW_CUTOFF_SHARE_OF_SPAN;
        const lowLimits = limitsOf('dp-low-in-range', tr.id);
        const lowRaw =
          flowing &&
          belowWithDeadband(
            share,
            previousRaw('dp-low-in-range', tr.id),
            lowLimits.thresholdShareOfSpan ?? 0.1,
            lowLimits.deadbandShareOfSpan ?? 0,
          );
        observe('dp-low-in-range', tr.id, lowRaw, t, {
          shareOfSpan: share,
          thresholdShareOfSpan: lowLimits.thresholdShareOfSpan ?? 0.1,
        });
        const overLimits = limitsOf('dp-over-range', tr.id);
        const overRaw = aboveWithDeadband(
          share,
          previousRaw('dp-over-range', tr.id),
          overLimits.thresholdShareOfSpan ?? 1,
          overLimits.deadbandShareOfSpan ?? 0,
        );
        observe('dp-over-range', tr.id, overRaw, t, {
          shareOfSpan: share,
          thresholdShareOfSpan: overLimits.thresholdShareOfSpan ?? 1,
        });
      }
    }
    if (low && high) {
      const inForce = (tr: WalkTransmitter) => {
        const r = latest.get(tr.id);
        return r && t - r.timeMs < maxGapMs ? { valuePa: r.value, quality: r.quality } : null;
      };
      const choice = chooseStackedTransmitter(inForce(low), inForce(high), null, {
        lowLowerRangePa: low.lowerRangeSI,
        lowUpperRangePa: low.upperRangeSI,
        highUpperRangePa: high.upperRangeSI,
        switchUpShare: input.meterRun.stackSwitchUpShare,
        switchDownShare: input.meterRun.stackSwitchDownShare,
      });
      if (choice.inOverlap && choice.disagreementPa !== null) {
        const limits = limitsOf('stack-disagreement', null);
        const difference = Math.abs(choice.disagreementPa) / (low.upperRangeSI - low.lowerRangeSI);
        const raw = aboveWithDeadband(
          difference,
          previousRaw('stack-disagreement', null),
          limits.toleranceShareOfSpan ?? 0.02,
          limits.deadbandShareOfSpan ?? 0,
        );
        observe('stack-disagreement', null, raw, t, {
          differenceShareOfLowSpan: difference,
          toleranceShareOfSpan: limits.toleranceShareOfSpan ?? 0.02,
        });
      }
    }
  }

  /** The hourly records' rule at one reading: reverse beyond the cutoff is reverse flow; no flow says nothing. */
  function judgeReverseFlow(t: number, dp: DpSeries, dpPa: number, rule: NonNullable<AlarmWalkInput['reverseFlow']>) {
    if (!rule.oneWayAt(t)) return observe('reverse-flow', null, false, t); // counted as reverse flow
    const reading = directionalReading(dp, dpPa);
    if (reading.magnitudePa <= 0 || reading.share < rule.noFlowCutoffShareAt(t))
      return observe('reverse-flow', null, null, t);
    observe('reverse-flow', null, reading.direction === 'reverse', t, { sinceMs: t, shareOfSpan: reading.share });
  }

  // Hourly records: outside the standard's limits, hour by hour (an hour without flow says nothing).
  for (const h of input.hours) {
    if (h.endMs > horizon || (st.recordsToMs !== null && h.startMs < st.recordsToMs)) continue;
    const raw = h.flags.includes('outside-standard-limits') ? true : h.flowTimeS > 0 ? false : null;
    observe('outside-standard-limits', null, raw, h.startMs, { hourStartMs: h.startMs });
    // Reverse flow on a one-way meter run (issue 13 §11): raised by a flagged hour, cleared by an hour of forward flow.
    if (!input.reverseFlow) {
      const reverse = h.flags.includes('reverse-flow') ? true : h.flowTimeS > 0 ? false : null;
      observe('reverse-flow', null, reverse, h.startMs, { hourStartMs: h.startMs });
    }
    st.recordsToMs = h.endMs;
  }

  // Stale by the clock: silent since the last reading for longer than the limit.
  if (input.clockMs !== undefined) {
    for (const tr of input.transmitters) {
      const last = Math.max(st.lastReadingMs[tr.id] ?? -Infinity, input.latestReadingMs?.[tr.id] ?? -Infinity);
      if (!Number.isFinite(last)) continue;
      const maxAgeMs = (limitsOf('stale', tr.id).maxAgeS ?? Infinity) * 1000;
      if (input.clockMs - last > maxAgeMs && last >= (st.lastReadingMs[tr.id] ?? -Infinity)) {
        observe('stale', tr.id, true, last + maxAgeMs, { lastReadingMs: last, maxAgeS: maxAgeMs / 1000 });
      }
    }
  }

  // Delays that elapsed by the horizon (stale ones by the clock).
  for (const [key, p] of Object.entries(st.points)) {
    const [condition, tid] = key.split('|') as [AlarmCondition, string];
    const limits = limitsOf(condition, tid || null);
    const until = condition === 'stale' && input.clockMs !== undefined ? Math.max(horizon, input.clockMs) : horizon;
    const tr = advanceDelayTracker(p, until, {
      onDelayMs: limits.onDelayS * 1000,
      offDelayMs: limits.offDelayS * 1000,
    });
    if (tr) emit(condition, tid || null, tr.kind, tr.timeMs, tr.onsetMs);
  }
  for (const key of Object.keys(st.onsetDetail)) if (!st.points[key]?.raw) delete st.onsetDetail[key];
  if (horizon > watermark) st.watermarkMs = horizon;
  signals.sort((a, b) => a.timeMs - b.timeMs);
  return { signals, state: st };
}
