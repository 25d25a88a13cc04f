/**
 * Building blocks for the history tests (not used by production code): meter runs from the
 * demo scenario (SCENARIO.md) or from TRADE.md's check cases, and readings at regular steps.
 */
import type { ElementSpec } from '../flow/flow-types';
import type { FluidSpec } from '../fluids';
import type { DpSeries, HourInputs, Quality, Sample } from './types';

export const HOUR_MS = 3_600_000;
/** An hour of the demo month, 2026-06-01 15:00Z (09:00 MDT, the KFG contract hour). */
export const START_MS = Date.parse('2026-06-01T15:00:00Z');

/** Kestrel Flats gas (SCENARIO.md), mole fractions. */
export const KESTREL_GAS: FluidSpec = {
  kind: 'natural-gas',
  composition: {
    methane: 0.9137,
    ethane: 0.0421,
    propane: 0.0112,
    isobutane: 0.0021,
    'n-butane': 0.0028,
    isopentane: 0.0008,
    'n-pentane': 0.0007,
    'n-hexane': 0.0006,
    nitrogen: 0.0148,
    'carbon-dioxide': 0.0112,
  },
};
/** KFG-103-like orifice run: 4 in schedule 40 (ID 102.26 mm [mem]), β 0.50, flange taps; diameters given at 20 °C. */
export const ORIFICE_4IN: ElementSpec = {
  kind: 'orifice',
  taps: 'flange',
  pipeDiameterM: 0.10226,
  boreDiameterM: 0.05113,
  referenceTemperatureK: 293.15,
};
/** A machined venturi, DN 150, β 0.5, diameters taken at the flowing temperature (no thermal correction in these tests). */
export const VENTURI_150: ElementSpec = {
  kind: 'venturi',
  venturiType: 'machined',
  pipeDiameterM: 0.15,
  boreDiameterM: 0.075,
  referenceTemperatureK: 293.15,
};
export const WATER: FluidSpec = { kind: 'water' };
/** Base conditions of site KFG: 60 °F (288.705556 K) and 14.73 psia (× 6894.757 Pa/psi = 101.559775 kPa) (SCENARIO.md). */
export const KFG_BASE = { pressurePa: 101559.775, temperatureK: 288.705556 };

/**
 * Samples every stepS seconds from fromMs (inclusive) to toMs (exclusive).
 * @param value value of the sample at an offset from fromMs, s
 */
export function samplesEvery(
  fromMs: number,
  toMs: number,
  stepS: number,
  value: (offsetS: number) => number,
  quality: Quality = 'good',
): Sample[] {
  const out: Sample[] = [];
  for (let t = fromMs; t < toMs; t += stepS * 1000) out.push({ timeMs: t, value: value((t - fromMs) / 1000), quality });
  return out;
}

/** A single DP transmitter 0–upperRangePa, 0.075 % of span. */
export function singleDp(samples: Sample[], upperRangePa = 50000): DpSeries {
  return {
    transmitterId: 'dp-1',
    stackRole: 'single',
    lowerRangePa: 0,
    upperRangePa,
    accuracyPercentOfSpan: 0.075,
    samples,
  };
}

/**
 * One hour from START_MS: constant P and T (one sample 5 s before the hour, hold limit 2 h),
 * DP as given, water through the DN 150 venturi unless overridden.
 */
export function hourInputs(over: Partial<HourInputs> & Pick<HourInputs, 'dp'>): HourInputs {
  return {
    startMs: START_MS,
    endMs: START_MS + HOUR_MS,
    asOfMs: START_MS + HOUR_MS,
    staticPressure: [{ timeMs: START_MS - 5000, value: 5e5, quality: 'good' }],
    temperature: [{ timeMs: START_MS - 5000, value: 293.15, quality: 'good' }],
    configVersions: [{ id: 'cv-1', effectiveFromMs: START_MS - 30 * 24 * HOUR_MS, element: VENTURI_150, fluid: WATER }],
    base: { pressurePa: 101325, temperatureK: 288.15 },
    holdLimitS: 7200,
    maxGapS: 120,
    stackSwitchUpShare: 0.9,
    stackSwitchDownShare: 0.8,
    ...over,
  };
}
