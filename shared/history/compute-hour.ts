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
 */
import { dpSelector } from './dp-selector';
import { addFlowingInterval, dpBandOf, emptyHourSums, hourlyRecordFromSums } from './hour-sums';
import { evaluateOperatingPoint, type OperatingPoint } from './operating-point';
import { prepareConfigVersion, type PreparedConfigVersion } from './prepared-config-version';
import { isUsableSample, sampleCursor } from './sample-cursor';
import type { DpSeries, HourInputs, HourlyRecord, Sample } from './types';

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
  inputs.configVersions.forEach((v, i) => {
    finite(v.effectiveFromMs, `configVersions.${i}.effectiveFromMs`);
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
  const prepared: (PreparedConfigVersion | undefined)[] = [];
  const sums = emptyHourSums();
  let versionIndex = -1;
  let lastVersionId: string | null = null;
  // The previous piece's operating point and what it was computed from (reused when unchanged).
  let lastPoint: OperatingPoint | null = null;
  let lastKey: [DpSeries | null, Sample | null, Sample | null, Sample | null, number] = [null, null, null, null, -1];

  const boundaries = pieceBoundaries(inputs, elapsedEndMs);
  for (let k = 0; k < boundaries.length; k++) {
    const t = boundaries[k];
    const durationMs = (k + 1 < boundaries.length ? boundaries[k + 1] : elapsedEndMs) - t;
    if (!(durationMs > 0)) continue;
    while (versionIndex + 1 < configVersions.length && configVersions[versionIndex + 1].effectiveFromMs <= t)
      versionIndex++;
    const version =
      versionIndex >= 0 ? (prepared[versionIndex] ??= prepareConfigVersion(configVersions[versionIndex], base)) : null;
    if (version) {
      sums.versionIds.add(version.id);
      lastVersionId = version.id;
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
    const share = (dpPa - series.lowerRangePa) / spanPa;
    if (dpPa <= 0 || share < noFlowCutoffShare) {
      sums.validMs += durationMs; // known to be no flow
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

    let point: OperatingPoint | null;
    if (
      lastKey[0] === series &&
      lastKey[1] === dpSample &&
      lastKey[2] === p &&
      lastKey[3] === temperature &&
      lastKey[4] === versionIndex
    ) {
      point = lastPoint;
    } else {
      try {
        point = evaluateOperatingPoint(version, dpPa, p.value, temperature.value, {
          accuracyPercentOfSpan: series.accuracyPercentOfSpan,
          spanPa,
          accuracyKind: series.accuracyKind,
          staticPressureTransmitter: inputs.staticPressureTransmitter,
          temperatureTransmitter: inputs.temperatureTransmitter,
        });
      } catch {
        point = null;
      }
      lastKey = [series, dpSample, p, temperature, versionIndex];
      lastPoint = point;
    }
    if (point === null) {
      sums.flags.add('calculation-error');
      continue; // missing time
    }
    if (share < LOW_IN_RANGE_SHARE_OF_SPAN) sums.flags.add('low-in-range');
    if (dpPa > series.upperRangePa) sums.flags.add('over-range');
    if (point.outsideStandardLimits) sums.flags.add('outside-standard-limits');
    if (point.outsideCalibrationRange) sums.flags.add('outside-calibration-range');
    addFlowingInterval(sums, durationMs, point, dpPa, p.value, temperature.value, dpBandOf(share));
  }

  return hourlyRecordFromSums(
    sums,
    { startMs, endMs, elapsedMs: elapsedEndMs - startMs },
    lastVersionId,
    selector.stackChoice(),
  );
}

/** A P or T sample is used for at most the hold limit after its time: on [t, t + hold). */
function heldSample(sample: Sample | null, timeMs: number, holdMs: number): Sample | null {
  return sample !== null && timeMs - sample.timeMs < holdMs ? sample : null;
}
