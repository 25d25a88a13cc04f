import { solveFlowCase } from '../flow/solve-flow-case';
import type { ElementSpec } from '../flow/flow-types';
import type { FluidSpec } from '../fluids';
import { iso6976Properties } from '../fluids/heating-value';
import { computeHour } from './compute-hour';
import {
  HOUR_MS,
  KESTREL_GAS,
  KFG_BASE,
  ORIFICE_4IN,
  START_MS,
  VENTURI_150,
  WATER,
  hourInputs,
  samplesEvery,
  singleDp,
} from './hour-inputs-fixture';
import type { DpSeries, HourInputs } from './types';

/*
 * These tests check the INTEGRATION: where a rate is needed as an input it comes from the flow
 * engine's solveFlowCase for the constant case (the engine has its own tests against ISO 5167
 * check values, TRADE.md §3); durations and quantities are worked by hand.
 */
const S = 1000;
const rate = (
  differentialPressurePa: number,
  element: ElementSpec = VENTURI_150,
  fluid: FluidSpec = WATER,
  staticPressurePa = 5e5,
  temperatureK = 293.15,
  base = { pressurePa: 101325, temperatureK: 288.15 },
) => solveFlowCase({ element, fluid, conditions: { differentialPressurePa, staticPressurePa, temperatureK }, base });
/** DP samples every 10 s from 10 s before the hour to its end, from a function of the offset into the hour, s. */
const dpEvery10s = (value: (offsetS: number) => number) =>
  samplesEvery(START_MS - 10 * S, START_MS + HOUR_MS, 10, (o) => value(o - 10));
const relative = (a: number, b: number) => Math.abs(a / b - 1);

describe('computeHour: integration of rate × time', () => {
  it('gives mass = rate × 3600 s for constant natural gas through a 4 in orifice (rate from solveFlowCase at 20 kPa, 4.2 MPa, 290 K)', () => {
    const q = rate(20000, ORIFICE_4IN, KESTREL_GAS, 4.2e6, 290, KFG_BASE);
    const r = computeHour(
      hourInputs({
        dp: [singleDp(samplesEvery(START_MS - 30 * S, START_MS + HOUR_MS, 60, () => 20000))],
        staticPressure: [{ timeMs: START_MS - 5 * S, value: 4.2e6, quality: 'good' }],
        temperature: [{ timeMs: START_MS - 5 * S, value: 290, quality: 'good' }],
        configVersions: [{ id: 'cv-gas', effectiveFromMs: 0, element: ORIFICE_4IN, fluid: KESTREL_GAS }],
        base: KFG_BASE,
      }),
    );
    expect(relative(r.massKg, q.massFlowKgPerS * 3600)).toBeLessThan(1e-12);
    expect(relative(r.volumeM3, q.volumeFlowM3PerS * 3600)).toBeLessThan(1e-12);
    expect(relative(r.standardVolumeM3, (q.standardVolumeFlowM3PerS as number) * 3600)).toBeLessThan(1e-12);
    expect(r.flowTimeS).toBe(3600);
    expect(r.coverage).toBe(1);
    // The gas holds butanes, pentanes and hexane, whose ISO 6976 data no worked example has confirmed
    // (shared/fluids/heating-value/iso6976-data.ts), so its energy is flagged; nothing else is.
    expect(r.flags).toEqual(['energy-data-unconfirmed']);
    expect(r.averageDpPa).toBe(20000);
    expect(r.averagePressurePa).toBe(4.2e6);
    expect(r.averageTemperatureK).toBe(290);
    expect(r.configVersionId).toBe('cv-gas');
    expect(r.activeTransmitterTimeS).toEqual({ 'dp-1': 3600 });
    expect(r.finalStackChoice).toBeNull();
    // Energy: standard volume × ISO 6976 superior volumetric CV at 60 °F / 60 °F and base pressure.
    const cv = iso6976Properties((KESTREL_GAS as { composition: Record<string, number> }).composition, {
      combustionTemperatureK: 288.7,
      meteringTemperatureK: 288.7,
      meteringPressurePa: KFG_BASE.pressurePa,
    });
    expect(relative(r.energyJ as number, r.standardVolumeM3 * cv.superiorVolumetricJPerM3)).toBeLessThan(1e-12);
    // Integral value √(Δp ρ1), and mass recomputed from it: IMV = C ε (π/4) d² √2 / √(1 − β⁴) (ISO 5167-1 eq. 1).
    expect(relative(r.integralValue as number, Math.sqrt(20000 * q.densityKgPerM3))).toBeLessThan(1e-12);
    const d = q.beta * ORIFICE_4IN.pipeDiameterM; // no material given: diameters are not corrected
    const imv =
      (q.dischargeCoefficient * q.expansibility * (Math.PI / 4) * d * d * Math.SQRT2) / Math.sqrt(1 - q.beta ** 4);
    expect(relative(imv * (r.integralValue as number) * r.flowTimeS, r.massKg)).toBeLessThan(1e-12);
    // The stored integral multiplier value is that IMV for a steady hour (flow-extension-weighted otherwise).
    expect(relative(r.integralMultiplierValue as number, imv)).toBeLessThan(1e-12);
  });

  it('counts a gap longer than maxGapS as missing time: samples stop at 600 s and resume at 1800 s with maxGapS 120, so 1200 − 120 = 1080 s are missing and coverage is 2520/3600 = 0.7', () => {
    const q = rate(20000);
    const samples = dpEvery10s(() => 20000).filter(
      (s) => s.timeMs <= START_MS + 600 * S || s.timeMs >= START_MS + 1800 * S,
    );
    const r = computeHour(hourInputs({ dp: [singleDp(samples)], maxGapS: 120 }));
    expect(r.coverage).toBeCloseTo(0.7, 15);
    expect(r.flowTimeS).toBe(2520);
    expect(relative(r.massKg, q.massFlowKgPerS * 2520)).toBeLessThan(1e-12);
    expect(r.flags).toEqual(['missing-data']);
  });

  it('integrates 30 min at 100 mbar + 30 min at 25 mbar to (rate(100) + rate(25)) × 1800 s, which rate(mean DP 62.5 mbar) × 3600 s overstates by √62.5/7.5 − 1 = 5.41 % (TRADE.md §5 [calc])', () => {
    const q100 = rate(10000).massFlowKgPerS;
    const q25 = rate(2500).massFlowKgPerS;
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s((o) => (o < 1800 ? 10000 : 2500)))] }));
    expect(relative(r.massKg, (q100 + q25) * 1800)).toBeLessThan(1e-12);
    // Water through a venturi: ε = 1 and C fixed, so qm ∝ √Δp and the ratio is exactly the handbook's √62.5/7.5 = 7.905694/7.5.
    const fromAveragedDp = rate(6250).massFlowKgPerS * 3600;
    expect(fromAveragedDp / r.massKg).toBeCloseTo(Math.sqrt(62.5) / 7.5, 12);
    expect(fromAveragedDp / r.massKg - 1).toBeCloseTo(0.0541, 4);
    // The stored DP average is the flow-dependent linear one (the handbook's 62.5 mbar), for the record only.
    expect(r.averageDpPa).toBe(6250);
  });

  it('switches a stacked pair (0–25 kPa and 0–250 kPa, up at 90 %, down at 80 %) with hysteresis and reports 1800 s on each transmitter', () => {
    // Four 15-minute phases; the high-range transmitter reads 100 Pa above the low one, so the mass shows which was used.
    const lowPa = (o: number) => [20000, 23000, 21000, 19000][Math.min(3, Math.floor(Math.max(0, o) / 900))];
    const low: DpSeries = {
      transmitterId: 'dp-low',
      stackRole: 'low',
      lowerRangePa: 0,
      upperRangePa: 25000,
      accuracyPercentOfSpan: 0.075,
      samples: dpEvery10s(lowPa),
    };
    const high: DpSeries = {
      transmitterId: 'dp-high',
      stackRole: 'high',
      lowerRangePa: 0,
      upperRangePa: 250000,
      accuracyPercentOfSpan: 0.075,
      samples: dpEvery10s((o) => lowPa(o) + 100),
    };
    const r = computeHour(hourInputs({ dp: [low, high], initialStackChoice: 'low' }));
    // 20 kPa ≤ 22.5 kPa: low; 23 kPa > 22.5: up to high (23.1); 21.1 kPa ≥ 20 kPa: stays high; 19.1 kPa < 20 kPa: down to low (19.0).
    expect(r.activeTransmitterTimeS).toEqual({ 'dp-low': 1800, 'dp-high': 1800 });
    expect(r.finalStackChoice).toBe('low');
    const expected =
      900 *
      (rate(20000).massFlowKgPerS +
        rate(23100).massFlowKgPerS +
        rate(21100).massFlowKgPerS +
        rate(19000).massFlowKgPerS);
    expect(relative(r.massKg, expected)).toBeLessThan(1e-12);
    // On the high-range transmitter 21–23 kPa is 8–9 % of its 250 kPa span: low in range for 1800 s.
    expect(r.dpBands['0-10'].timeS).toBe(1800);
    expect(r.dpBands['50-100'].timeS).toBe(1800);
    expect(r.flags).toContain('low-in-range');
  });

  it('carries the pair choice across the hour boundary: readings in the hysteresis band stay on the transmitter the previous hour ended on', () => {
    const pair = (v: number): DpSeries[] => [
      {
        transmitterId: 'dp-low',
        stackRole: 'low',
        lowerRangePa: 0,
        upperRangePa: 25000,
        accuracyPercentOfSpan: 0.075,
        samples: dpEvery10s(() => v),
      },
      {
        transmitterId: 'dp-high',
        stackRole: 'high',
        lowerRangePa: 0,
        upperRangePa: 250000,
        accuracyPercentOfSpan: 0.075,
        samples: dpEvery10s(() => v),
      },
    ];
    expect(computeHour(hourInputs({ dp: pair(21000), initialStackChoice: 'high' })).activeTransmitterTimeS).toEqual({
      'dp-high': 3600,
    });
    expect(computeHour(hourInputs({ dp: pair(21000), initialStackChoice: 'low' })).activeTransmitterTimeS).toEqual({
      'dp-low': 3600,
    });
  });

  it('keeps the choice the previous hour ended on while the readings in force are unchanged, even where choosing again would flip it (a pair disagreeing: low 23 kPa, high 5 kPa)', () => {
    // One reading each, 10 s before the hour, covering it (maxGapS 7200). From 'low', 23 kPa > 22.5 kPa switched up to high;
    // choosing again from 'high' would see 5 kPa < 20 kPa and switch down, which a continuous computation never does.
    const one = (v: number) => [{ timeMs: START_MS - 10 * S, value: v, quality: 'good' as const }];
    const dp: DpSeries[] = [
      {
        transmitterId: 'dp-low',
        stackRole: 'low',
        lowerRangePa: 0,
        upperRangePa: 25000,
        accuracyPercentOfSpan: 0.075,
        samples: one(23000),
      },
      {
        transmitterId: 'dp-high',
        stackRole: 'high',
        lowerRangePa: 0,
        upperRangePa: 250000,
        accuracyPercentOfSpan: 0.075,
        samples: one(5000),
      },
    ];
    expect(computeHour(hourInputs({ dp, maxGapS: 7200, initialStackChoice: 'high' })).activeTransmitterTimeS).toEqual({
      'dp-high': 3600,
    });
    // Ended on 'low' (reachable from 'high' on these readings): stays low. No history: 23 kPa > 22.5 kPa chooses high.
    expect(computeHour(hourInputs({ dp, maxGapS: 7200, initialStackChoice: 'low' })).activeTransmitterTimeS).toEqual({
      'dp-low': 3600,
    });
    expect(computeHour(hourInputs({ dp, maxGapS: 7200 })).activeTransmitterTimeS).toEqual({ 'dp-high': 3600 });
  });

  it('changes the rate exactly at a configuration version effective mid-hour (1234.5 s, between samples): mass = q₁ × 1234.5 s + q₂ × 2365.5 s', () => {
    const v2Element: ElementSpec = { ...VENTURI_150, dischargeCoefficient: 0.98 };
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        configVersions: [
          { id: 'cv-1', effectiveFromMs: 0, element: VENTURI_150, fluid: WATER },
          { id: 'cv-2', effectiveFromMs: START_MS + 1234.5 * S, element: v2Element, fluid: WATER },
        ],
      }),
    );
    const expected = rate(20000).massFlowKgPerS * 1234.5 + rate(20000, v2Element).massFlowKgPerS * 2365.5;
    expect(relative(r.massKg, expected)).toBeLessThan(1e-12);
    expect(r.flags).toEqual(['config-changed']);
    expect(r.configVersionId).toBe('cv-2');
  });
});

describe('computeHour: coverage, cutoff and quality', () => {
  it('treats DP below 0.5 % of span as no flow, valid time: 30 min at 200 Pa (0.4 % of 50 kPa) and 30 min at 300 Pa (0.6 %) give 1800 s of flow and coverage 1', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s((o) => (o < 1800 ? 200 : 300)))] }));
    expect(r.flowTimeS).toBe(1800);
    expect(r.coverage).toBe(1);
    expect(relative(r.massKg, rate(300).massFlowKgPerS * 1800)).toBeLessThan(1e-12);
    expect(r.averageDpPa).toBe(300);
    // 300 Pa of water through the DN 150 venturi is Re_D ≈ 3e4 (qm ≈ 3.5 kg/s, μ ≈ 1.0 mPa·s), below the 2e5 of ISO 5167-4 (machined).
    expect(r.flags).toEqual(['low-in-range', 'outside-standard-limits']);
    expect(r.activeTransmitterTimeS).toEqual({ 'dp-1': 3600 });
  });

  it('gives no flow, null averages, null integral value and null uncertainty to an hour at zero DP', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 0))] }));
    expect(r).toEqual(
      expect.objectContaining({
        flowTimeS: 0,
        massKg: 0,
        coverage: 1,
        averageDpPa: null,
        averagePressurePa: null,
        averageTemperatureK: null,
        integralValue: null,
        uncertaintyPercent: null,
        energyJ: null,
      }),
    );
  });

  it('does not use a bad DP sample: its 10 s interval is missing time (coverage 3590/3600) and the record is flagged bad-quality', () => {
    const samples = dpEvery10s(() => 20000).map((s) =>
      s.timeMs === START_MS + 1000 * S ? { ...s, quality: 'bad' as const } : s,
    );
    const r = computeHour(hourInputs({ dp: [singleDp(samples)] }));
    expect(r.coverage).toBeCloseTo(3590 / 3600, 15);
    expect(relative(r.massKg, rate(20000).massFlowKgPerS * 3590)).toBeLessThan(1e-12);
    expect(r.flags).toEqual(['missing-data', 'bad-quality']);
  });

  it('skips a bad static pressure sample, keeps the previous one within the hold limit, and flags bad-quality', () => {
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        staticPressure: [
          { timeMs: START_MS - 5 * S, value: 5e5, quality: 'good' },
          { timeMs: START_MS + 100 * S, value: -1, quality: 'bad' },
        ],
      }),
    );
    expect(r.coverage).toBe(1);
    expect(relative(r.massKg, rate(20000).massFlowKgPerS * 3600)).toBeLessThan(1e-12);
    expect(r.flags).toEqual(['bad-quality']);
  });

  it('flags a substituted static pressure sample that was used', () => {
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        staticPressure: [
          { timeMs: START_MS - 5 * S, value: 5e5, quality: 'good' },
          { timeMs: START_MS + 1800 * S, value: 5e5, quality: 'substituted' },
        ],
      }),
    );
    expect(r.flags).toEqual(['substituted']);
  });

  it('stops using a static pressure sample once it is older than the hold limit: a sample 5 s before the hour with holdLimitS 600 covers 595 s', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 20000))], holdLimitS: 600 }));
    expect(r.flowTimeS).toBe(595);
    expect(r.coverage).toBeCloseTo(595 / 3600, 15);
    expect(relative(r.massKg, rate(20000).massFlowKgPerS * 595)).toBeLessThan(1e-12);
  });

  it('judges the current hour on its elapsed part: at 30 min with all data, coverage is 1 and mass = rate × 1800 s', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 20000))], asOfMs: START_MS + 1800 * S }));
    expect(r.coverage).toBe(1);
    expect(r.flowTimeS).toBe(1800);
    expect(relative(r.massKg, rate(20000).massFlowKgPerS * 1800)).toBeLessThan(1e-12);
    expect(r.flags).toEqual([]);
  });

  it('gives an hour without a configuration version coverage 0, no configuration id and no energy', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 20000))], configVersions: [] }));
    expect(r).toEqual(expect.objectContaining({ coverage: 0, massKg: 0, configVersionId: null, energyJ: null }));
  });
});

describe('computeHour: bands, flags and uncertainty', () => {
  it('puts 20 min each at 5 %, 30 % and 110 % of a 50 kPa span into the bands 0-10, 25-50 and over, and flags low-in-range and over-range', () => {
    const dp = (o: number) => (o < 1200 ? 2500 : o < 2400 ? 15000 : 55000);
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(dp))] }));
    expect(r.dpBands['0-10'].timeS).toBe(1200);
    expect(r.dpBands['10-25'].timeS).toBe(0);
    expect(r.dpBands['25-50'].timeS).toBe(1200);
    expect(r.dpBands['50-100'].timeS).toBe(0);
    expect(r.dpBands.over.timeS).toBe(1200);
    expect(relative(r.dpBands.over.massKg, rate(55000).massFlowKgPerS * 1200)).toBeLessThan(1e-12);
    // 2.5 kPa of water through the venturi is Re_D ≈ 9e4, below the 2e5 of ISO 5167-4 (machined): outside the standard as well.
    expect(r.flags).toEqual(['low-in-range', 'over-range', 'outside-standard-limits']);
  });

  it('flags outside-standard-limits for an orifice of β = 0.8 (ISO 5167-2 allows 0.1 ≤ β ≤ 0.75)', () => {
    const element: ElementSpec = {
      kind: 'orifice',
      taps: 'flange',
      pipeDiameterM: 0.1,
      boreDiameterM: 0.08,
      referenceTemperatureK: 293.15,
    };
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        configVersions: [{ id: 'cv-wide', effectiveFromMs: 0, element, fluid: WATER }],
      }),
    );
    expect(r.flags).toEqual(['outside-standard-limits']);
  });

  it('gives U = 1.0800 % (k = 2) at 10 % of span for water through a machined venturi, β = 0.5 (TRADE.md §6 formula, 0.075 % of span → 0.75 % of reading)', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 5000))] }));
    // TRADE.md §6 by hand: U_C 1.0 % (machined venturi, ISO 5167-4 [mem]); ε exact for a liquid; D 0.4 % and d 0.07 % [mem]
    // with sensitivities 2β⁴/(1−β⁴) = 0.133333 and 2/(1−β⁴) = 2.133333; ½ × 0.75 % DP; ½ × 0.05 % IF97 density [mem].
    const expected = Math.sqrt(
      1.0 ** 2 + (0.133333333 * 0.4) ** 2 + (2.133333333 * 0.07) ** 2 + (0.5 * 0.75) ** 2 + (0.5 * 0.05) ** 2,
    );
    expect(expected).toBeCloseTo(1.08, 4); // √1.1663949 = 1.079998
    expect(r.uncertaintyPercent).toBeCloseTo(expected, 6);
  });

  it('weights the hour uncertainty by mass: 30 min at 10 % and 30 min at 100 % of span give (m₁U₁ + m₂U₂)/(m₁ + m₂)', () => {
    const r = computeHour(hourInputs({ dp: [singleDp(dpEvery10s((o) => (o < 1800 ? 5000 : 50000)))] }));
    const u = (dpPercent: number) =>
      Math.sqrt(1 + (0.4 / 7.5) ** 2 + ((2 / 0.9375) * 0.07) ** 2 + (0.5 * dpPercent) ** 2 + 0.025 ** 2);
    const m1 = rate(5000).massFlowKgPerS;
    const m2 = rate(50000).massFlowKgPerS;
    expect(r.uncertaintyPercent).toBeCloseTo((m1 * u(0.75) + m2 * u(0.075)) / (m1 + m2), 6);
  });
});

describe('computeHour: energy and bad input', () => {
  it('gives steam energy = mass × (h − h_triple) with h(1.1 MPa, 473.15 K) = 2822.2614837 kJ/kg (Debian python3-iapws, IAPWS-IF97) and h′(triple point) = 0.611783 J/kg (IAPWS-IF97 region 1)', () => {
    const steam: FluidSpec = { kind: 'steam' };
    const venturi: ElementSpec = {
      kind: 'venturi',
      venturiType: 'machined',
      pipeDiameterM: 0.15,
      boreDiameterM: 0.09,
      referenceTemperatureK: 473.15,
    };
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        staticPressure: [{ timeMs: START_MS - 5 * S, value: 1.1e6, quality: 'good' }],
        temperature: [{ timeMs: START_MS - 5 * S, value: 473.15, quality: 'good' }],
        configVersions: [{ id: 'cv-steam', effectiveFromMs: 0, element: venturi, fluid: steam }],
      }),
    );
    const q = rate(20000, venturi, steam, 1.1e6, 473.15);
    expect(relative(r.massKg, q.massFlowKgPerS * 3600)).toBeLessThan(1e-12);
    expect(relative(r.energyJ as number, r.massKg * (2822.2614837213373e3 - 0.611783))).toBeLessThan(1e-9);
  });

  it('gives no energy, flagged energy-unavailable, for natural gas at a base temperature ISO 6976 does not tabulate (300 K)', () => {
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s(() => 20000))],
        staticPressure: [{ timeMs: START_MS - 5 * S, value: 4.2e6, quality: 'good' }],
        temperature: [{ timeMs: START_MS - 5 * S, value: 290, quality: 'good' }],
        configVersions: [{ id: 'cv-gas', effectiveFromMs: 0, element: ORIFICE_4IN, fluid: KESTREL_GAS }],
        base: { pressurePa: 101325, temperatureK: 300 },
      }),
    );
    expect(r.energyJ).toBeNull();
    expect(r.massKg).toBeGreaterThan(0);
    expect(r.flags).toEqual(['energy-unavailable']);
  });

  it('gives no energy for water', () => {
    expect(computeHour(hourInputs({ dp: [singleDp(dpEvery10s(() => 20000))] })).energyJ).toBeNull();
  });

  it('rejects malformed inputs, naming the field', () => {
    const dp = [singleDp(dpEvery10s(() => 20000))];
    expect(() => computeHour(hourInputs({ dp, endMs: START_MS }))).toThrow(/computeHour: endMs/);
    expect(() => computeHour(hourInputs({ dp, maxGapS: 0 }))).toThrow(/computeHour: maxGapS/);
    expect(() => computeHour(hourInputs({ dp: [] }))).toThrow(/computeHour: dp/);
    expect(() => computeHour(hourInputs({ dp: [{ ...dp[0], samples: [...dp[0].samples].reverse() }] }))).toThrow(
      /computeHour: dp\.0\.samples must be sorted/,
    );
    const three = [dp[0], { ...dp[0], stackRole: 'low' as const }, { ...dp[0], stackRole: 'high' as const }];
    expect(() => computeHour(hourInputs({ dp: three }))).toThrow(/computeHour: dp must hold/);
    const badElement = { ...VENTURI_150, boreDiameterM: 0.2 };
    expect(() =>
      computeHour(
        hourInputs({
          dp,
          configVersions: [{ id: 'x', effectiveFromMs: 0, element: badElement, fluid: WATER }],
        } as Partial<HourInputs> & Pick<HourInputs, 'dp'>),
      ),
    ).toThrow(/boreDiameterM/);
  });
});

describe('computeHour: the no-flow cutoff as a dated setting', () => {
  // 400 Pa on a 0–50 kPa transmitter is 0.8 % of span.
  const at400Pa = () => hourInputs({ dp: [singleDp(dpEvery10s(() => 400))] });

  it('counts 400 Pa on a 0–50 kPa span (0.8 %) as flow under the default 0.5 % cutoff: mass = rate(400 Pa) × 3600 s', () => {
    const r = computeHour(at400Pa());
    expect(r.flowTimeS).toBe(3600);
    expect(relative(r.massKg, rate(400).massFlowKgPerS * 3600)).toBeLessThan(1e-12);
  });

  it('counts the same hour as valid time without flow under a 1 % cutoff: no mass, coverage 1, no integral multiplier value', () => {
    const r = computeHour({ ...at400Pa(), noFlowCutoffShare: 0.01 });
    expect(r).toMatchObject({ flowTimeS: 0, massKg: 0, coverage: 1, integralMultiplierValue: null });
  });

  it('refuses a cutoff that is not a share in [0, 1), naming noFlowCutoffShare', () => {
    expect(() => computeHour({ ...at400Pa(), noFlowCutoffShare: 1.5 })).toThrow(/noFlowCutoffShare/);
  });
});
