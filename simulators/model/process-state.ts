/**
 * What flows in a demo meter run at an instant, before any transmitter sees it: mass flow (load
 * shape × decline × the flow's own fluctuation), the DP the element in use develops, and the
 * line's static pressure and temperature. Pure and deterministic (seeded noise by time).
 */
import { IANAZone } from 'luxon';
import type { ElementSpec } from '../../shared/flow/flow-types';
import { meterRunByTag, siteOf, type ScenarioMeterRun, type ScenarioTimeline } from '../scenario';
import { nominalMassFlowKgPerS, nominalOperatingPoint } from './nominal-operating-point';
import { gaussianAt, seedOfText } from './seeded-noise';

export interface ProcessState {
  massFlowKgPerS: number;
  differentialPressurePa: number;
  /** Absolute, Pa. */
  staticPressurePa: number;
  temperatureK: number;
}

const MS_PER_HOUR = 3_600_000;
/** The mean Gregorian month, 365.2425 / 12 days: the wells' decline is stated per month. */
const MS_PER_MEAN_MONTH = (365.2425 / 12) * 24 * MS_PER_HOUR;
/** The line's temperature peaks with the afternoon sun (invented, common practice for buried-then-exposed runs). */
const WARMEST_HOUR_LOCAL = 15;
/** Noise of the line pressure and temperature themselves, beyond their daily swing. */
const STATIC_PRESSURE_NOISE_SHARE_OF_SWING = 0.05;
const TEMPERATURE_NOISE_K = 0.05;

const MS_PER_QUARTER_HOUR = 900_000;
/**
 * UTC offsets (minutes) by zone and quarter hour: every zone changes its offset on a
 * quarter-hour boundary (IANA tz database), so one look-up per quarter hour is exact.
 */
const offsets = new Map<string, { zone: IANAZone; byQuarter: Map<number, number> }>();

/** Local hour of the day (0–24, fractional) of an instant in a zone. */
function localHourOfDay(timeMs: number, timeZone: string): number {
  let entry = offsets.get(timeZone);
  if (!entry) offsets.set(timeZone, (entry = { zone: IANAZone.create(timeZone), byQuarter: new Map() }));
  const quarter = Math.floor(timeMs / MS_PER_QUARTER_HOUR);
  let offsetMinutes = entry.byQuarter.get(quarter);
  if (offsetMinutes === undefined) {
    if (entry.byQuarter.size > 100_000) entry.byQuarter.clear();
    offsetMinutes = entry.zone.offset(quarter * MS_PER_QUARTER_HOUR);
    entry.byQuarter.set(quarter, offsetMinutes);
  }
  const localMs = timeMs + offsetMinutes * 60_000;
  return (((localMs % 86_400_000) + 86_400_000) % 86_400_000) / MS_PER_HOUR;
}

const cosineOfHour = (hour: number, peakHour: number) => Math.cos((2 * Math.PI * (hour - peakHour)) / 24);

/**
 * The element of a meter run in effect at an instant (its scenario element change, if any).
 * @param run scenario meter run
 * @param timeMs instant, epoch ms
 * @param timeline the scenario's instants
 * @returns the element
 */
export function elementAt(run: ScenarioMeterRun, timeMs: number, timeline: ScenarioTimeline): ElementSpec {
  const changeMs = timeline.elementChangeMs[run.tag];
  return run.elementChange && changeMs !== undefined && timeMs >= changeMs ? run.elementChange.element : run.element;
}

/**
 * Mass flow of a meter run at an instant.
 * @param run scenario meter run
 * @param timeMs instant, epoch ms (whole seconds: the noise is drawn per second)
 * @param timeline the scenario's instants
 * @returns qm, kg/s
 */
export function massFlowAtKgPerS(run: ScenarioMeterRun, timeMs: number, timeline: ScenarioTimeline): number {
  const flow = run.operating.flow;
  // An outlet carries what its inlets send, less fuel and losses, at every instant: the balance holds.
  if (flow.kind === 'balance-outlet') {
    return (
      (1 - flow.lossShare) *
      flow.inletTags.reduce((sum, tag) => sum + massFlowAtKgPerS(meterRunByTag(tag), timeMs, timeline), 0)
    );
  }
  const load = run.operating.load;
  const hour = localHourOfDay(timeMs, siteOf(run).timeZone);
  const months = (timeMs - timeline.declineStartMs) / MS_PER_MEAN_MONTH;
  const decline = Math.pow(1 - load.declinePerMonth, months);
  const diurnal = 1 + load.diurnalAmplitude * cosineOfHour(hour, load.peakHourLocal);
  const fluctuation = 1 + load.noiseShare * gaussianAt(seedOfText(run.tag), Math.floor(timeMs / 1000));
  return nominalMassFlowKgPerS(run) * decline * diurnal * fluctuation;
}

/**
 * @param run scenario meter run
 * @param timeMs instant, epoch ms
 * @param timeline the scenario's instants
 * @returns flow, DP, static pressure (absolute) and temperature
 */
export function processStateAt(run: ScenarioMeterRun, timeMs: number, timeline: ScenarioTimeline): ProcessState {
  const nominal = nominalOperatingPoint(run, elementAt(run, timeMs, timeline));
  const massFlowKgPerS = massFlowAtKgPerS(run, timeMs, timeline);
  // qm ∝ √Δp (ISO 5167-1 eq. 1): the DP follows the square of the flow's ratio to nominal.
  const ratio = massFlowKgPerS / nominal.massFlowKgPerS;
  const hour = localHourOfDay(timeMs, siteOf(run).timeZone);
  const second = Math.floor(timeMs / 1000);
  const op = run.operating;
  // Line pressure sags when the draw peaks (line pack, header control lagging the load).
  const staticPressurePa =
    nominal.staticPressurePa -
    op.staticPressureSwingPa * cosineOfHour(hour, op.load.peakHourLocal) +
    op.staticPressureSwingPa * STATIC_PRESSURE_NOISE_SHARE_OF_SWING * gaussianAt(seedOfText(`${run.tag}/p`), second);
  const temperatureK =
    op.temperatureK +
    op.temperatureSwingK * cosineOfHour(hour, WARMEST_HOUR_LOCAL) +
    TEMPERATURE_NOISE_K * gaussianAt(seedOfText(`${run.tag}/t`), second);
  return {
    massFlowKgPerS,
    differentialPressurePa: nominal.differentialPressurePa * ratio * ratio,
    staticPressurePa,
    temperatureK,
  };
}
