/**
 * Running sums of one hour's integration (durations in ms, exact integers) and the hourly
 * record they give. The definitions of the record's fields live here:
 * - flow time: time with flow (DP above the no-flow cutoff and a rate computed);
 * - averages of DP, static pressure and temperature: flow-dependent linear averages, i.e.
 *   time-weighted over flowing time only (API MPMS 21.1; TRADE.md §5); null without flow;
 * - integral value IV = (1/flow time) ∫ √(Δp·ρ₁) dt over flowing time, in √(Pa·kg/m³)
 *   (= kg/(m²·s)). With ISO 5167-1 eq. (1), qm = C ε (π/4) d² √2 / √(1 − β⁴) · √(Δp ρ₁), so
 *   mass = IMV × IV × flow time with the integral multiplier value
 *   IMV = C ε (π/4) d² √2 / √(1 − β⁴) (in m²);
 * - integral multiplier value IMV, as stored: ∫ qm dt / ∫ √(Δp ρ₁) dt over flowing time, i.e. the
 *   multiplier C ε (π/4) d² √2 / √(1 − β⁴) weighted by the flow extension. It equals that
 *   formula exactly when C, ε and d are constant over the record (a steady hour), and differs
 *   by their flow-weighted variation otherwise (usually well under 50 ppm). Stored this way,
 *   IMV × IV × flow time gives the record's mass to rounding, so a third party recomputes the
 *   quantity from the record alone (API MPMS 21.1); evaluating the formula at the hour's
 *   averages instead would not reproduce the mass integrated sample by sample;
 * - coverage: valid time / (min(asOf, end) − start): time with a known rate (flow or no flow)
 *   over the elapsed part of the hour, so a complete past hour with all data has coverage 1,
 *   and so does the current hour so far;
 * - uncertainty: flow-weighted (mass-weighted) mean of the samples' expanded uncertainties, on
 *   the assumption that they are systematic and fully correlated within the hour (C, ε,
 *   diameters and the transmitter's calibration do not average out over an hour); null
 *   without flow;
 * - uncertainty budget: per term of the samples' budgets (ISO 5167-1:2003 §8), its flow-weighted
 *   mean percent and the sources met during the hour (joined when they differ, e.g. when part of
 *   the hour lay outside a calibration). The terms are systematic like the total, so each is
 *   weighted the same way; the record's uncertaintyPercent stays the mean of the samples' totals.
 * Reverse flow of a bi-directional meter run is summed in a second HourSums, apart from the
 * forward one, and given as the record's `reverse` part with the same definitions; its valid time
 * and DP bands go to the forward sums, which hold the hour's coverage and bands of both directions.
 * On a one-way meter run, reverse DP is valid time without flow, flagged 'reverse-flow'.
 */
import type { OperatingPoint } from './operating-point';
import type { DirectionPart, DpBandName, HourlyRecord } from './types';

/** Flags in the order a record lists them. */
export const HOUR_FLAG_ORDER = [
  'missing-data',
  'bad-quality',
  'substituted',
  'low-in-range',
  'over-range',
  'reverse-flow',
  'outside-standard-limits',
  'outside-calibration-range',
  'config-changed',
  'calculation-error',
  'energy-unavailable',
  'energy-data-unconfirmed',
] as const;
export type HourFlag = (typeof HOUR_FLAG_ORDER)[number];

export interface HourSums {
  validMs: number;
  flowMs: number;
  massKgMs: number;
  volumeM3Ms: number;
  standardVolumeM3Ms: number;
  energyJMs: number;
  dpPaMs: number;
  pressurePaMs: number;
  temperatureKMs: number;
  flowExtensionMs: number;
  massTimesUncertaintyMs: number;
  /** Per budget term: Σ mass × percent, and the sources met, in order. */
  budget: Map<string, { massTimesPercentMs: number; sources: string[] }>;
  bands: Record<DpBandName, { ms: number; massKgMs: number }>;
  activeTransmitterMs: Record<string, number>;
  flags: Set<HourFlag>;
  versionIds: Set<string>;
  energyAvailable: boolean;
}

/** @returns zeroed sums */
export function emptyHourSums(): HourSums {
  const band = () => ({ ms: 0, massKgMs: 0 });
  return {
    validMs: 0,
    flowMs: 0,
    massKgMs: 0,
    volumeM3Ms: 0,
    standardVolumeM3Ms: 0,
    energyJMs: 0,
    dpPaMs: 0,
    pressurePaMs: 0,
    temperatureKMs: 0,
    flowExtensionMs: 0,
    massTimesUncertaintyMs: 0,
    budget: new Map(),
    bands: { '0-10': band(), '10-25': band(), '25-50': band(), '50-100': band(), over: band() },
    activeTransmitterMs: {},
    flags: new Set(),
    versionIds: new Set(),
    energyAvailable: true,
  };
}

/**
 * The band of a DP reading as a share of the active transmitter's span.
 * @param share (Δp − lower range value) / span
 * @returns '0-10' below 10 %, '10-25', '25-50', '50-100' up to and including 100 %, 'over' above
 */
export function dpBandOf(share: number): DpBandName {
  if (share < 0.1) return '0-10';
  if (share < 0.25) return '10-25';
  if (share < 0.5) return '25-50';
  if (share <= 1) return '50-100';
  return 'over';
}

/**
 * Adds a flowing interval.
 * @param sums the hour's sums (mutated)
 * @param durationMs interval length, ms
 * @param point the rates at the interval's operating point
 * @param dpPa, pressurePa, temperatureK the inputs of the operating point
 * @param band DP band of the active transmitter, in the direction of flow
 * @param hour the sums that hold the hour's valid time and DP bands (the forward sums; `sums` itself by default)
 */
export function addFlowingInterval(
  sums: HourSums,
  durationMs: number,
  point: OperatingPoint,
  dpPa: number,
  pressurePa: number,
  temperatureK: number,
  band: DpBandName,
  hour: HourSums = sums,
): void {
  const massKgMs = point.massFlowKgPerS * durationMs;
  hour.validMs += durationMs;
  sums.flowMs += durationMs;
  sums.massKgMs += massKgMs;
  sums.volumeM3Ms += point.volumeFlowM3PerS * durationMs;
  sums.standardVolumeM3Ms += point.standardVolumeFlowM3PerS * durationMs;
  if (point.energyFlowW !== null) sums.energyJMs += point.energyFlowW * durationMs;
  sums.dpPaMs += dpPa * durationMs;
  sums.pressurePaMs += pressurePa * durationMs;
  sums.temperatureKMs += temperatureK * durationMs;
  sums.flowExtensionMs += point.flowExtension * durationMs;
  sums.massTimesUncertaintyMs += massKgMs * point.uncertaintyPercent;
  for (const c of point.uncertaintyContributions ?? []) {
    let term = sums.budget.get(c.name);
    if (term === undefined) sums.budget.set(c.name, (term = { massTimesPercentMs: 0, sources: [] }));
    term.massTimesPercentMs += massKgMs * c.percent;
    if (!term.sources.includes(c.source)) term.sources.push(c.source);
  }
  hour.bands[band].ms += durationMs;
  hour.bands[band].massKgMs += massKgMs;
}

/**
 * @param sums the reverse flow's sums (their valid time and bands are in the forward sums)
 * @param energyAvailable the record has an energy figure (the forward record's energyJ is not null)
 * @returns the reverse part of the record, with the definitions of the record's own figures
 */
export function directionPartFromSums(sums: HourSums, energyAvailable: boolean): DirectionPart {
  const flowing = sums.flowMs > 0;
  const perFlowMs = (x: number) => (flowing ? x / sums.flowMs : null);
  const seconds = (ms: number) => ms / 1000;
  return {
    flowTimeS: seconds(sums.flowMs),
    massKg: seconds(sums.massKgMs),
    volumeM3: seconds(sums.volumeM3Ms),
    standardVolumeM3: seconds(sums.standardVolumeM3Ms),
    energyJ: energyAvailable ? seconds(sums.energyJMs) : null,
    averageDpPa: perFlowMs(sums.dpPaMs),
    averagePressurePa: perFlowMs(sums.pressurePaMs),
    averageTemperatureK: perFlowMs(sums.temperatureKMs),
    integralValue: perFlowMs(sums.flowExtensionMs),
    integralMultiplierValue: flowing && sums.flowExtensionMs > 0 ? sums.massKgMs / sums.flowExtensionMs : null,
    uncertaintyPercent: sums.massKgMs > 0 ? sums.massTimesUncertaintyMs / sums.massKgMs : null,
    uncertaintyBudget: budgetOf(sums),
  };
}

function budgetOf(sums: HourSums): { name: string; percent: number; source: string }[] {
  return sums.massKgMs > 0
    ? [...sums.budget].map(([name, term]) => ({
        name,
        percent: term.massTimesPercentMs / sums.massKgMs,
        source: term.sources.join(' | '),
      }))
    : [];
}

/**
 * @param sums the hour's sums
 * @param hour startMs, endMs and the elapsed length min(asOf, end) − start, ms
 * @param configVersionId version in effect at the end of the elapsed part
 * @param finalStackChoice the pair's choice at the end, or null
 * @param reverse the reverse flow's sums on a bi-directional meter run; null on a one-way one
 * @returns the hourly record (durations in s, quantities in kg, m³, J)
 */
export function hourlyRecordFromSums(
  sums: HourSums,
  hour: { startMs: number; endMs: number; elapsedMs: number },
  configVersionId: string | null,
  finalStackChoice: 'low' | 'high' | null,
  reverse: HourSums | null = null,
): HourlyRecord {
  const flowing = sums.flowMs > 0;
  const perFlowMs = (x: number) => (flowing ? x / sums.flowMs : null);
  const coverage = hour.elapsedMs > 0 ? sums.validMs / hour.elapsedMs : 0;
  const flags = new Set(sums.flags);
  if (coverage < 1) flags.add('missing-data');
  if (sums.versionIds.size > 1) flags.add('config-changed');
  const seconds = (ms: number) => ms / 1000;
  const dpBands = {} as HourlyRecord['dpBands'];
  for (const [name, band] of Object.entries(sums.bands) as [DpBandName, { ms: number; massKgMs: number }][]) {
    dpBands[name] = { timeS: seconds(band.ms), massKg: seconds(band.massKgMs) };
  }
  const activeTransmitterTimeS: Record<string, number> = {};
  for (const [id, ms] of Object.entries(sums.activeTransmitterMs)) activeTransmitterTimeS[id] = seconds(ms);
  const energyAvailable = sums.energyAvailable && sums.versionIds.size > 0;
  return {
    startMs: hour.startMs,
    endMs: hour.endMs,
    flowTimeS: seconds(sums.flowMs),
    massKg: seconds(sums.massKgMs),
    volumeM3: seconds(sums.volumeM3Ms),
    standardVolumeM3: seconds(sums.standardVolumeM3Ms),
    energyJ: energyAvailable ? seconds(sums.energyJMs) : null,
    averageDpPa: perFlowMs(sums.dpPaMs),
    averagePressurePa: perFlowMs(sums.pressurePaMs),
    averageTemperatureK: perFlowMs(sums.temperatureKMs),
    integralValue: perFlowMs(sums.flowExtensionMs),
    integralMultiplierValue: flowing && sums.flowExtensionMs > 0 ? sums.massKgMs / sums.flowExtensionMs : null,
    coverage,
    flags: HOUR_FLAG_ORDER.filter((f) => flags.has(f)),
    uncertaintyPercent: sums.massKgMs > 0 ? sums.massTimesUncertaintyMs / sums.massKgMs : null,
    uncertaintyBudget: budgetOf(sums),
    configVersionId,
    reverse: reverse === null ? null : directionPartFromSums(reverse, energyAvailable),
    dpBands,
    activeTransmitterTimeS,
    finalStackChoice,
  };
}
