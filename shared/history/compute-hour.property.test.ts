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
  return fc
    .array(fc.record({ stepS: fc.integer({ min: 1, max: 240 }), value, quality }), { minLength, maxLength })
    .map((steps) => {
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
        {
          transmitterId: 'lo',
          stackRole: 'low',
          lowerRangePa: 0,
          upperRangePa: 25000,
          accuracyPercentOfSpan: 0.075,
          samples: s.low,
        },
        {
          transmitterId: 'hi',
          stackRole: 'high',
          lowerRangePa: 0,
          upperRangePa: 250000,
          accuracyPercentOfSpan: 0.075,
          samples: s.high,
        },
      ]
    : [
        {
          transmitterId: 'dp',
          stackRole: 'single',
          lowerRangePa: 0,
          upperRangePa: 50000,
          accuracyPercentOfSpan: 0.1,
          samples: s.low,
        },
      ];
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
      ...(s.versionChangeS === undefined
        ? []
        : [{ id: 'v2', effectiveFromMs: START_MS + s.versionChangeS * 1000, element: v2, fluid: WATER }]),
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
        const second = computeHour(
          inputsFor(s, START_MS + HOUR_MS, START_MS + 2 * HOUR_MS, first.finalStackChoice ?? undefined),
        );
        expect(close(whole.massKg, first.massKg + second.massKg)).toBe(true);
        expect(close(whole.volumeM3, first.volumeM3 + second.volumeM3)).toBe(true);
        expect(close(whole.standardVolumeM3, first.standardVolumeM3 + second.standardVolumeM3)).toBe(true);
        expect(whole.flowTimeS).toBeCloseTo(first.flowTimeS + second.flowTimeS, 9);
        expect(coveredS(whole, 7200)).toBeCloseTo(coveredS(first, 3600) + coveredS(second, 3600), 6);
        for (const id of ['dp', 'lo', 'hi']) {
          expect(whole.activeTransmitterTimeS[id] ?? 0).toBeCloseTo(
            (first.activeTransmitterTimeS[id] ?? 0) + (second.activeTransmitterTimeS[id] ?? 0),
            9,
          );
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

describe('computeHour additivity (counterexamples found by fast-check)', () => {
  it('chooses a stacked pair again when a new reading arrives exactly at the hour boundary, so the second hour covers 915 s as the 2-hour period does (seed 1699624194)', () => {
    // The shrunk counterexample, times in s from START_MS. Low-range (0–25 kPa) reads 0 except
    // 22501 Pa exactly at the boundary (3600 s), then 0 every second to 3620 s; the high-range
    // one reads 0, last at 2706 s, so with maxGapS 895 it covers until 3601 s. P and T only at
    // −199…−195 s with holdLimitS 30: stale in both hours, so any DP above the cutoff is missing time.
    const at = (offsetsS: number[], value: (offsetS: number) => number): Sample[] =>
      offsetsS.map((o) => ({ timeMs: START_MS + o * 1000, value: value(o), quality: 'good' }));
    const lowS = [
      -127, 45, 216, 404, 627, 716, 818, 1002, 1140, 1294, 1374, 1425, 1656, 1770, 1776, 1778, 1902, 2108, 2341, 2418,
      2538, 2554, 2668, 2880, 3100, 3220, 3375, 3577, 3583,
    ];
    const everySecond = Array.from({ length: 21 }, (_, i) => 3600 + i);
    const highS = [
      -144, -64, 173, 330, 401, 566, 692, 837, 994, 1194, 1274, 1360, 1504, 1671, 1822, 2002, 2240, 2327, 2549, 2706,
    ];
    const s: Scenario = {
      low: at([...lowS, ...everySecond], (o) => (o === 3600 ? 22501 : 0)),
      high: at(highS, () => 0),
      stacked: true,
      pressure: at([-199, -198, -197, -196, -195], () => 300000),
      temperature: at([-199, -198, -197, -196, -195], () => 280),
      holdLimitS: 30,
      maxGapS: 895,
      versionChangeS: undefined,
    };
    const whole = computeHour(inputsFor(s, START_MS, START_MS + 2 * HOUR_MS));
    const first = computeHour(inputsFor(s, START_MS, START_MS + HOUR_MS));
    const second = computeHour(
      inputsFor(s, START_MS + HOUR_MS, START_MS + 2 * HOUR_MS, first.finalStackChoice ?? undefined),
    );
    // Worked by hand: no two low samples are 895 s apart, so the low one covers the first hour,
    // reading 0 (≤ 90 % of 25 kPa): on 'lo', no flow, covered. At 3600 s, 22501 Pa > 22500 Pa
    // switches up from 'lo' to 'hi' (0 Pa: no flow, covered) until the high expires at 3601 s;
    // then 'lo' (0 Pa) until the last low sample (3620 s) expires at 3620 + 895 = 4515 s.
    expect(first.finalStackChoice).toBe('low');
    expect(first.activeTransmitterTimeS).toEqual({ lo: 3600 });
    expect(second.activeTransmitterTimeS).toEqual({ hi: 1, lo: 914 });
    expect(coveredS(second, 3600)).toBeCloseTo(915, 9);
    expect(coveredS(whole, 7200)).toBeCloseTo(3600 + 915, 9);
    expect(whole.activeTransmitterTimeS).toEqual({ hi: 1, lo: 4514 });
    expect(whole.flowTimeS).toBe(0);
    expect(second.flowTimeS).toBe(0);
    expect(whole.finalStackChoice).toBe(second.finalStackChoice);
  });
});

describe('computeHour additivity with reverse flow (fast-check)', () => {
  // Signed whole pascals: forward and reverse readings on transmitters ranged both ways.
  const signedDp = fc.oneof(fc.constant(0), fc.integer({ min: -60000, max: 60000 }));
  const twoWayScenario = fc.record({
    low: series(signedDp, 20, 120),
    high: series(signedDp, 20, 120),
    stacked: fc.boolean(),
    pressure: series(fc.double({ min: 3e5, max: 8e5, noNaN: true }), 5, 40),
    temperature: series(fc.double({ min: 280, max: 350, noNaN: true }), 5, 40),
    direction: series(fc.constantFrom(-1, 0, 1), 3, 40),
    holdLimitS: fc.integer({ min: 30, max: 3600 }),
    maxGapS: fc.integer({ min: 5, max: 900 }),
    /** 'one-way': no reverseElement (reverse time flagged, not flow); else the direction source. */
    mode: fc.constantFrom<'one-way' | 'dp-sign' | 'direction-input'>('one-way', 'dp-sign', 'direction-input'),
  });
  type TwoWayScenario = typeof twoWayScenario extends fc.Arbitrary<infer T> ? T : never;

  function twoWayInputs(s: TwoWayScenario, startMs: number, endMs: number, initialStackChoice?: 'low' | 'high') {
    const base = inputsFor({ ...s, versionChangeS: undefined }, startMs, endMs, initialStackChoice);
    const reverseElement: ElementSpec = { ...VENTURI_150, dischargeCoefficient: 0.95 };
    const inputs: HourInputs = {
      ...base,
      dp: base.dp.map((d) => ({ ...d, lowerRangePa: -d.upperRangePa })),
      direction: s.direction,
      configVersions: [
        s.mode === 'one-way'
          ? { id: 'v1', effectiveFromMs: 0, element: VENTURI_150, fluid: WATER }
          : {
              id: 'v1',
              effectiveFromMs: 0,
              element: VENTURI_150,
              fluid: WATER,
              reverseElement,
              directionSource: s.mode,
            },
      ],
    };
    return inputs;
  }

  it('gives the same forward and reverse mass, volumes, flow times and covered time for a 2-hour period as for its two hours computed apart', () => {
    let withReverse = 0;
    let flagged = 0;
    fc.assert(
      fc.property(twoWayScenario, (s) => {
        const whole = computeHour(twoWayInputs(s, START_MS, START_MS + 2 * HOUR_MS));
        const first = computeHour(twoWayInputs(s, START_MS, START_MS + HOUR_MS));
        const second = computeHour(
          twoWayInputs(s, START_MS + HOUR_MS, START_MS + 2 * HOUR_MS, first.finalStackChoice ?? undefined),
        );
        expect(close(whole.massKg, first.massKg + second.massKg)).toBe(true);
        expect(close(whole.volumeM3, first.volumeM3 + second.volumeM3)).toBe(true);
        expect(whole.flowTimeS).toBeCloseTo(first.flowTimeS + second.flowTimeS, 9);
        expect(coveredS(whole, 7200)).toBeCloseTo(coveredS(first, 3600) + coveredS(second, 3600), 6);
        if (s.mode === 'one-way') {
          expect(whole.reverse).toBeNull();
          expect(whole.flags.includes('reverse-flow')).toBe(
            first.flags.includes('reverse-flow') || second.flags.includes('reverse-flow'),
          );
          if (whole.flags.includes('reverse-flow')) flagged++;
        } else {
          const [w, a, b] = [whole.reverse, first.reverse, second.reverse];
          if (!w || !a || !b) throw new Error('a bi-directional record carries a reverse part');
          expect(close(w.massKg, a.massKg + b.massKg)).toBe(true);
          expect(close(w.volumeM3, a.volumeM3 + b.volumeM3)).toBe(true);
          expect(close(w.standardVolumeM3, a.standardVolumeM3 + b.standardVolumeM3)).toBe(true);
          expect(w.flowTimeS).toBeCloseTo(a.flowTimeS + b.flowTimeS, 9);
          expect(whole.flags).not.toContain('reverse-flow');
          if (w.massKg > 0) withReverse++;
        }
      }),
      { numRuns: 200 },
    );
    expect(withReverse).toBeGreaterThan(40);
    expect(flagged).toBeGreaterThan(20);
  });
});
