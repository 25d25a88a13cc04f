/**
 * One hourly record (API MPMS Ch. 21.1 quantity transaction record) of a DP meter run from its
 * stored readings. Rates are integrated over time sample by sample; flow is never computed
 * from averaged inputs (TRADE.md §5: averaging DP first overstates flow, 5.4 % in the
 * handbook's example).
 *
 * How the hour is walked. The rate at each instant is the engine's rate for the inputs in force
 * at that instant, and the elapsed part [start, min(asOf, end)) is cut wherever one of them
 * may change, so that the rate is constant within each piece:
 * - DP: a sample is in force from its time until the next sample of its transmitter, but at
 *   most maxGapS (beyond that, missing time, not flow); a stacked pair's samples are merged on
 *   time and the transmitter is chosen with hysteresis (shared/flow/stacked-pair.ts) whenever
 *   the pair of readings in force changes;
 * - static pressure and temperature: the latest usable sample, for at most holdLimitS after
 *   its time (a sample older than that is not used);
 * - the configuration version in effect (effectiveFromMs ≤ t).
 * The samples before the hour (the latest of each series) cover its start. With P and T
 * sampled alongside DP, as field devices report them, this is "each DP sample's rate holds
 * until the next DP sample"; a P or T sample arriving between two DP samples re-evaluates the
 * rate from its time. Because the rate is a function of time only, records are additive:
 * splitting a period at any boundary gives the same total (a property test checks it).
 * - DP at or below the no-flow cutoff: valid time without flow (P, T not needed).
 * - Otherwise the engine gives the rate; without P, T or a configuration version, or when the
 *   engine fails (flag 'calculation-error'), the piece is missing time.
 * - A bad DP sample is not used: its interval is missing time. A bad P or T sample is skipped
 *   (the last usable one within the hold limit is used) and flagged.
 * A configuration version taking effect mid-hour changes the rate exactly at its effective
 * time. API 21.1 wants a separate record when a constant changes: the server's history worker
 * calls computeHour once per part of the hour (startMs/endMs need not be whole hours), split at
 * every instant where a configuration version or a dated setting (transmitter range, meter-run
 * setting, site setting) takes effect, and stores one record per part. Called over a span with
 * several versions, computeHour still splits internally per version and reports ONE record
 * flagged 'config-changed', whose configVersionId is the version in effect at the end.
 *
 * Direction of flow (a piece at a time). A version with reverseElement is bi-directional: with
 * directionSource 'dp-sign' (the default) a negative DP is reverse flow; with 'direction-input'
 * the DP transmitters read magnitude and the direction input's latest usable sample, held for
 * holdLimitS like P and T (its times cut the pieces too), says which way (> 0 forward, < 0
 * reverse, 0 no flow; none in force: missing time while the DP is above the cutoff). Reverse
 * flow is evaluated with the reverse element (prepared once per version like the forward one)
 * and summed apart, as the record's `reverse` part; the record's own figures are forward flow.
 * On a one-way version (no reverseElement), reverse DP beyond the cutoff, or a direction input
 * saying reverse, is not flow: valid time with forward flow known to be zero, flagged
 * 'reverse-flow'. A DP transmitter ranged below zero reads both ways: its share of span in a
 * direction is Δp / upper range value forward and |Δp| / |lower range value| in reverse; one
 * ranged from ≥ 0 keeps (Δp − lower) / span. The cutoff, low-in-range, over-range and the DP
 * bands use the direction's share; the stated accuracy stays a percent of upper − lower.
 */
import { dpSelector } from './dp-selector';
import { addFlowingInterval, dpBandOf, emptyHourSums, hourlyRecordFromSums } from './hour-sums';
import { evaluateOperatingPoint, type OperatingPoint } from './operating-point';
import { prepareConfigVersion, type PreparedConfigVersion } from './prepared-config-version';
import { isUsableSample, sampleCursor } from './sample-cursor';
import type { DpSeries, HourInputs, HourlyRecord, Sample } from './types';

type Direction = 'forward' | 'reverse';

/** A DP reading in the direction it says, as a share of the transmitter's range on that side. */
export interface DirectionalReading {
  direction: Direction;
  /** |Δp| in the direction of flow, Pa. */
  magnitudePa: number;
  /** Share of the range on that side (may be ≤ 0 for a one-way transmitter reading below its lower range value). */
  share: number;
  overRange: boolean;
}

/**
 * @param series the DP transmitter in use
 * @param dpPa its reading, Pa
 * @returns the reading's direction by its sign, magnitude and share of the range on that side
 */
export function directionalReading(series: DpSeries, dpPa: number): DirectionalReading {
  if (series.lowerRangePa < 0 && dpPa < 0) {
    const magnitudePa = -dpPa;
    return {
      direction: 'reverse',
      magnitudePa,
      share: magnitudePa / -series.lowerRangePa,
      overRange: magnitudePa > -series.lowerRangePa,
    };
  }
  const share =
    series.lowerRangePa < 0
      ? dpPa / series.upperRangePa
      : (dpPa - series.lowerRangePa) / (series.upperRangePa - series.lowerRangePa);
  return { direction: 'forward', magnitudePa: dpPa, share, overRange: dpPa > series.upperRangePa };
}

/**
 * Default no-flow cutoff (a dated meter-run setting since issue 9, `noFlowCutoffShare`): a DP
 * below 0.5 % of the active transmitter's span (or ≤ 0) is no flow.
 * Near zero a transmitter's offset (e.g. 0.075 % of span) is a large share of the reading, so
 * readings there are noise rather than flow; a low-flow cutoff of about 0.5 % of DP span is
 * common practice (flow then is about 7 % of the flow at full span, since qm ∝ √Δp).
 */
export const NO_FLOW_CUTOFF_SHARE_OF_SPAN = 0.005;

/** Flowing time below 10 % of the active span is 'low-in-range' (TRADE.md §6: 0.075 % of span is 0.75 % of reading there). */
export const LOW_IN_RANGE_SHARE_OF_SPAN = 0.1;

function checkInputs(inputs: HourInputs): void {
  const finite = (value: number, field: string) => {
    if (!Number.isFinite(value)) throw new Error(`computeHour: ${field} must be a finite number (got ${value})`);
  };
  finite(inputs.startMs, 'startMs');
  finite(inputs.endMs, 'endMs');
  finite(inputs.asOfMs, 'asOfMs');
  if (!(inputs.endMs > inputs.startMs))
    throw new Error(`computeHour: endMs must be after startMs (got ${inputs.startMs} to ${inputs.endMs})`);
  if (!(inputs.holdLimitS > 0)) throw new Error(`computeHour: holdLimitS must be > 0 (got ${inputs.holdLimitS})`);
  if (!(inputs.maxGapS > 0)) throw new Error(`computeHour: maxGapS must be > 0 (got ${inputs.maxGapS})`);
  const cutoff = inputs.noFlowCutoffShare;
  if (cutoff !== undefined && !(cutoff >= 0 && cutoff < 1))
    throw new Error(`computeHour: noFlowCutoffShare must be a share in [0, 1) (got ${cutoff})`);
  if (!Array.isArray(inputs.dp) || inputs.dp.length === 0)
    throw new Error('computeHour: dp must hold at least one DP series');
  for (const field of ['staticPressure', 'temperature', 'configVersions'] as const) {
    if (!Array.isArray(inputs[field]))
      throw new Error(`computeHour: ${field} must be an array (got ${typeof inputs[field]})`);
  }
  if (!(inputs.base?.pressurePa > 0) || !(inputs.base?.temperatureK > 0)) {
    throw new Error(
      `computeHour: base.pressurePa and base.temperatureK must be > 0 (got ${inputs.base?.pressurePa}, ${inputs.base?.temperatureK})`,
    );
  }
  if (inputs.direction !== undefined && !Array.isArray(inputs.direction))
    throw new Error(`computeHour: direction must be an array of samples (got ${typeof inputs.direction})`);
  inputs.configVersions.forEach((v, i) => {
    finite(v.effectiveFromMs, `configVersions.${i}.effectiveFromMs`);
    if (v.directionSource !== undefined && v.reverseElement === undefined)
      throw new Error(
        `computeHour: configVersions.${i}.directionSource needs reverseElement (a bi-directional meter run)`,
      );
    if (v.directionSource !== undefined && v.directionSource !== 'dp-sign' && v.directionSource !== 'direction-input')
      throw new Error(
        `computeHour: configVersions.${i}.directionSource must be 'dp-sign' or 'direction-input' (got ${String(v.directionSource)})`,
      );
    if (i > 0 && v.effectiveFromMs < inputs.configVersions[i - 1].effectiveFromMs) {
      throw new Error(`computeHour: configVersions must be sorted by effectiveFromMs (${i} is earlier than ${i - 1})`);
    }
  });
}

/**
 * Adds the times in (startMs, elapsedEndMs) at which a series' samples start and stop being
 * in force: each sample's time, and its time + coverMs when no newer usable (for P and T) or
 * newer (for DP) sample comes first.
 */
function addSeriesTimes(
  times: number[],
  samples: readonly Sample[],
  coverMs: number,
  startMs: number,
  elapsedEndMs: number,
  replacedOnlyByUsable: boolean,
): void {
  let nextReplacementMs = Infinity;
  for (let j = samples.length - 1; j >= 0; j--) {
    const t = samples[j].timeMs;
    if (t > startMs && t < elapsedEndMs) times.push(t);
    const expiry = t + coverMs;
    if (expiry > startMs && expiry < elapsedEndMs && nextReplacementMs > expiry) times.push(expiry);
    if (!replacedOnlyByUsable || isUsableSample(samples[j])) nextReplacementMs = t;
  }
}

/** The times at which the inputs may change within [startMs, elapsedEndMs), sorted, unique, starting with startMs. */
function pieceBoundaries(inputs: HourInputs, elapsedEndMs: number): Float64Array {
  const { startMs } = inputs;
  const times: number[] = [startMs];
  for (const series of inputs.dp)
    addSeriesTimes(times, series.samples, inputs.maxGapS * 1000, startMs, elapsedEndMs, false);
  addSeriesTimes(times, inputs.staticPressure, inputs.holdLimitS * 1000, startMs, elapsedEndMs, true);
  addSeriesTimes(times, inputs.temperature, inputs.holdLimitS * 1000, startMs, elapsedEndMs, true);
  if (inputs.direction) addSeriesTimes(times, inputs.direction, inputs.holdLimitS * 1000, startMs, elapsedEndMs, true);
  for (const v of inputs.configVersions)
    if (v.effectiveFromMs > startMs && v.effectiveFromMs < elapsedEndMs) times.push(v.effectiveFromMs);
  const sorted = Float64Array.from(times).sort();
  let n = 0;
  for (let i = 0; i < sorted.length; i++) if (i === 0 || sorted[i] !== sorted[n - 1]) sorted[n++] = sorted[i];
  return sorted.subarray(0, n);
}

/**
 * @param inputs the hour's readings, configuration versions and limits (see HourInputs)
 * @returns the hourly record: flow time, mass, volumes, energy, flow-dependent averages,
 *   integral value, coverage, flags, uncertainty, DP bands and transmitter times
 * @throws Error naming the field for malformed inputs or an invalid configuration version
 */
export function computeHour(inputs: HourInputs): HourlyRecord {
  checkInputs(inputs);
  const { startMs, endMs, configVersions, base } = inputs;
  const elapsedEndMs = Math.max(startMs, Math.min(inputs.asOfMs, endMs));
  const holdMs = inputs.holdLimitS * 1000;
  const noFlowCutoffShare = inputs.noFlowCutoffShare ?? NO_FLOW_CUTOFF_SHARE_OF_SPAN;
  const selector = dpSelector(inputs.dp, {
    maxGapMs: inputs.maxGapS * 1000,
    stackSwitchUpShare: inputs.stackSwitchUpShare,
    stackSwitchDownShare: inputs.stackSwitchDownShare,
    initialStackChoice: inputs.initialStackChoice,
  });
  const pressures = sampleCursor(inputs.staticPressure, 'staticPressure');
  const temperatures = sampleCursor(inputs.temperature, 'temperature');
  const directions = inputs.direction ? sampleCursor(inputs.direction, 'direction') : null;
  const prepared: (PreparedConfigVersion | undefined)[] = [];
  const preparedReverse: (PreparedConfigVersion | null | undefined)[] = [];
  const sums = emptyHourSums();
  // Reverse flow of a bi-directional version, kept apart from the forward sums.
  const reverseSums = emptyHourSums();
  let bidirectionalSeen = false;
  let versionIndex = -1;
  let lastVersionId: string | null = null;
  // The previous piece's operating point and what it was computed from (reused when unchanged).
  let lastPoint: OperatingPoint | null = null;
  let lastKey: [DpSeries | null, Sample | null, Sample | null, Sample | null, number, Direction | null] = [
    null,
    null,
    null,
    null,
    -1,
    null,
  ];

  const boundaries = pieceBoundaries(inputs, elapsedEndMs);
  for (let k = 0; k < boundaries.length; k++) {
    const t = boundaries[k];
    const durationMs = (k + 1 < boundaries.length ? boundaries[k + 1] : elapsedEndMs) - t;
    if (!(durationMs > 0)) continue;
    while (versionIndex + 1 < configVersions.length && configVersions[versionIndex + 1].effectiveFromMs <= t)
      versionIndex++;
    const version =
      versionIndex >= 0 ? (prepared[versionIndex] ??= prepareConfigVersion(configVersions[versionIndex], base)) : null;
    const reverseVersion =
      versionIndex >= 0 ? (preparedReverse[versionIndex] ??= prepareReverse(configVersions, versionIndex, base)) : null;
    if (version) {
      sums.versionIds.add(version.id);
      lastVersionId = version.id;
      if (reverseVersion) bidirectionalSeen = true;
      if (version.energy.kind === 'standard-volume' && version.energy.unconfirmedComponents.length > 0)
        sums.flags.add('energy-data-unconfirmed');
      if (version.energy.kind === 'none') {
        sums.energyAvailable = false;
        if (version.fluid.kind === 'natural-gas' || version.fluid.kind === 'steam')
          sums.flags.add('energy-unavailable');
      }
    }

    const selection = selector.at(t);
    if (selection.badSampleInForce) sums.flags.add('bad-quality');
    const series = selection.series;
    const dpSample = selection.sample;
    if (series === null || dpSample === null) continue; // missing time
    sums.activeTransmitterMs[series.transmitterId] = (sums.activeTransmitterMs[series.transmitterId] ?? 0) + durationMs;
    if (dpSample.quality === 'substituted') sums.flags.add('substituted');
    const dpPa = dpSample.value;
    const spanPa = series.upperRangePa - series.lowerRangePa;
    const reading = directionalReading(series, dpPa);
    if (reading.magnitudePa <= 0 || reading.share < noFlowCutoffShare) {
      sums.validMs += durationMs; // known to be no flow
      continue;
    }

    // Which way: the DP's sign, or the direction input held for the hold limit.
    let direction: Direction = reading.direction;
    let heldDirection: Sample | null = null;
    if (directions !== null) {
      directions.moveTo(t);
      heldDirection = heldSample(directions.latestUsable(), t, holdMs);
    }
    if (reverseVersion !== null && configVersions[versionIndex].directionSource === 'direction-input') {
      const latest = directions?.latest() ?? null;
      if (latest !== null && latest.quality === 'bad' && t - latest.timeMs < holdMs) sums.flags.add('bad-quality');
      if (heldDirection === null) continue; // missing time: which way it flows is not known
      if (heldDirection.quality === 'substituted') sums.flags.add('substituted');
      if (heldDirection.value === 0) {
        sums.validMs += durationMs; // the direction input says no flow
        continue;
      }
      direction = heldDirection.value > 0 ? 'forward' : 'reverse';
    } else if (reverseVersion === null && heldDirection !== null && heldDirection.value < 0) {
      direction = 'reverse';
    }
    if (direction === 'reverse' && version !== null && reverseVersion === null) {
      // A one-way meter run: reverse flow is not counted as flow (forward flow is known to be zero).
      sums.validMs += durationMs;
      sums.flags.add('reverse-flow');
      continue;
    }

    pressures.moveTo(t);
    temperatures.moveTo(t);
    const p = heldSample(pressures.latestUsable(), t, holdMs);
    const temperature = heldSample(temperatures.latestUsable(), t, holdMs);
    for (const latest of [pressures.latest(), temperatures.latest()]) {
      if (latest !== null && latest.quality === 'bad' && t - latest.timeMs < holdMs) sums.flags.add('bad-quality');
    }
    if (p === null || temperature === null || version === null) continue; // missing time
    if (p.quality === 'substituted' || temperature.quality === 'substituted') sums.flags.add('substituted');
    const evaluated = direction === 'reverse' && reverseVersion !== null ? reverseVersion : version;

    let point: OperatingPoint | null;
    if (
      lastKey[0] === series &&
      lastKey[1] === dpSample &&
      lastKey[2] === p &&
      lastKey[3] === temperature &&
      lastKey[4] === versionIndex &&
      lastKey[5] === direction
    ) {
      point = lastPoint;
    } else {
      try {
        point = evaluateOperatingPoint(evaluated, reading.magnitudePa, p.value, temperature.value, {
          accuracyPercentOfSpan: series.accuracyPercentOfSpan,
          spanPa,
          accuracyKind: series.accuracyKind,
          staticPressureTransmitter: inputs.staticPressureTransmitter,
          temperatureTransmitter: inputs.temperatureTransmitter,
        });
      } catch {
        point = null;
      }
      lastKey = [series, dpSample, p, temperature, versionIndex, direction];
      lastPoint = point;
    }
    if (point === null) {
      sums.flags.add('calculation-error');
      continue; // missing time
    }
    if (reading.share < LOW_IN_RANGE_SHARE_OF_SPAN) sums.flags.add('low-in-range');
    if (reading.overRange) sums.flags.add('over-range');
    if (point.outsideStandardLimits) sums.flags.add('outside-standard-limits');
    if (point.outsideCalibrationRange) sums.flags.add('outside-calibration-range');
    addFlowingInterval(
      direction === 'reverse' ? reverseSums : sums,
      durationMs,
      point,
      reading.magnitudePa,
      p.value,
      temperature.value,
      dpBandOf(reading.share),
      sums,
    );
  }
  return hourlyRecordFromSums(
    sums,
    { startMs, endMs, elapsedMs: elapsedEndMs - startMs },
    lastVersionId,
    selector.stackChoice(),
    bidirectionalSeen ? reverseSums : null,
  );
}

/** The version's reverse element prepared like its forward one (once per version), or null on a one-way version. */
function prepareReverse(
  versions: HourInputs['configVersions'],
  index: number,
  base: { pressurePa: number; temperatureK: number },
): PreparedConfigVersion | null {
  const version = versions[index];
  if (version.reverseElement === undefined) return null;
  try {
    return prepareConfigVersion({ ...version, id: `${version.id}:reverse`, element: version.reverseElement }, base);
  } catch (err) {
    throw new Error(`computeHour: configVersions.${index}.reverseElement: ${(err as Error).message}`, { cause: err });
  }
}

/** A P or T sample is used for at most the hold limit after its time: on [t, t + hold). */
function heldSample(sample: Sample | null, timeMs: number, holdMs: number): Sample | null {
  return sample !== null && timeMs - sample.timeMs < holdMs ? sample : null;
}
