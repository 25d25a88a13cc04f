import fc from 'fast-check';
import type { ElementSpec } from '../flow/flow-types';
import { computeHour } from './compute-hour';
import { HOUR_MS, START_MS, VENTURI_150, WATER } from './hour-inputs-fixture';
import type { DpSeries, HourInputs, HourlyRecord, Quality, Sample } from './types';

/*
 * Additivity (a property of integration, not a value from anywhere): the mass, volumes, flow
 * time and covered time of two hours computed as one 2-hour period equal those of the two
 * hours computed separately, for any readings: irregular times, gaps, bad and substituted
 * samples, P and T held and expiring, a stacked pair, a configuration version mid-period.
 */
const quality = fc.constantFrom<Quality>('good', 'good', 'good', 'good', 'uncertain', 'substituted', 'bad');

/** Samples from 200 s before the period at irregular steps of 1–240 s. */
function series(value: fc.Arbitrary<number>, minLength: number, maxLength: number): fc.Arbitrary<Sample[]> {
  return fc.array(fc.record({ stepS: fc.integer({ min: 1, max: 240 }), value, quality }), { minLength, maxLength }).map((steps) => {
    let t = START_MS - 200_000;
    return steps.map((s) => ({ timeMs: (t += s.stepS * 1000), value: s.value, quality: s.quality }));
  });
}

// Whole pascals: fc.double is biased towards tiny values, which would all fall below the no-flow cutoff.
const dpValue = fc.oneof(fc.constant(0), fc.integer({ min: 0, max: 60000 }));
const scenario = fc.record({
  low: series(dpValue, 20, 120),
  high: series(dpValue, 20, 120),
  stacked: fc.boolean(),
  pressure: series(fc.double({ min: 3e5, max: 8e5, noNaN: true }), 5, 40),
  temperature: series(fc.double({ min: 280, max: 350, noNaN: true }), 5, 40),
  holdLimitS: fc.integer({ min: 30, max: 3600 }),
  maxGapS: fc.integer({ min: 5, max: 900 }),
  versionChangeS: fc.option(fc.integer({ min: 1, max: 7199 }), { nil: undefined }),
});

type Scenario = typeof scenario extends fc.Arbitrary<infer T> ? T : never;

function inputsFor(s: Scenario, startMs: number, endMs: number, initialStackChoice?: 'low' | 'high'): HourInputs {
  const dp: DpSeries[] = s.stacked
    ? [
        { transmitterId: 'lo', stackRole: 'low', lowerRangePa: 0, upperRangePa: 25000, accuracyPercentOfSpan: 0.075, samples: s.low },
        { transmitterId: 'hi', stackRole: 'high', lowerRangePa: 0, upperRangePa: 250000, accuracyPercentOfSpan: 0.075, samples: s.high },
      ]
    : [{ transmitterId: 'dp', stackRole: 'single', lowerRangePa: 0, upperRangePa: 50000, accuracyPercentOfSpan: 0.1, samples: s.low }];
  const v2: ElementSpec = { ...VENTURI_150, dischargeCoefficient: 0.97 };
  return {
    startMs,
    endMs,
    asOfMs: endMs,
    dp,
    staticPressure: s.pressure,
    temperature: s.temperature,
    configVersions: [
      { id: 'v1', effectiveFromMs: 0, element: VENTURI_150, fluid: WATER },
      ...(s.versionChangeS === undefined ? [] : [{ id: 'v2', effectiveFromMs: START_MS + s.versionChangeS * 1000, element: v2, fluid: WATER }]),
    ],
    base: { pressurePa: 101325, temperatureK: 288.15 },
    holdLimitS: s.holdLimitS,
    maxGapS: s.maxGapS,
    stackSwitchUpShare: 0.9,
    stackSwitchDownShare: 0.8,
    initialStackChoice,
  };
}

const close = (whole: number, parts: number) => Math.abs(whole - parts) <= 1e-9 * Math.max(1, Math.abs(whole));
const coveredS = (r: HourlyRecord, lengthS: number) => r.coverage * lengthS;

describe('computeHour additivity (fast-check)', () => {
  it('gives the same mass, volumes, flow time, covered time and transmitter times for a 2-hour period as for its two hours computed apart', () => {
    let withFlow = 0;
    let withStackSwitch = 0;
    fc.assert(
      fc.property(scenario, (s) => {
        const whole = computeHour(inputsFor(s, START_MS, START_MS + 2 * HOUR_MS));
        const first = computeHour(inputsFor(s, START_MS, START_MS + HOUR_MS));
        const second = computeHour(inputsFor(s, START_MS + HOUR_MS, START_MS + 2 * HOUR_MS, first.finalStackChoice ?? undefined));
        expect(close(whole.massKg, first.massKg + second.massKg)).toBe(true);
        expect(close(whole.volumeM3, first.volumeM3 + second.volumeM3)).toBe(true);
        expect(close(whole.standardVolumeM3, first.standardVolumeM3 + second.standardVolumeM3)).toBe(true);
        expect(whole.flowTimeS).toBeCloseTo(first.flowTimeS + second.flowTimeS, 9);
        expect(coveredS(whole, 7200)).toBeCloseTo(coveredS(first, 3600) + coveredS(second, 3600), 6);
        for (const id of ['dp', 'lo', 'hi']) {
          expect(whole.activeTransmitterTimeS[id] ?? 0).toBeCloseTo((first.activeTransmitterTimeS[id] ?? 0) + (second.activeTransmitterTimeS[id] ?? 0), 9);
        }
        expect(whole.finalStackChoice).toBe(second.finalStackChoice);
        if (whole.massKg > 0) withFlow++;
        if ((whole.activeTransmitterTimeS.lo ?? 0) > 0 && (whole.activeTransmitterTimeS.hi ?? 0) > 0) withStackSwitch++;
      }),
      { numRuns: 300 },
    );
    // The generator must exercise the interesting cases, not only empty hours.
    expect(withFlow).toBeGreaterThan(100);
    expect(withStackSwitch).toBeGreaterThan(20);
  });
});
