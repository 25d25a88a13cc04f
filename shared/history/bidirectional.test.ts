import type { ElementSpec } from '../flow/flow-types';
import type { FluidSpec } from '../fluids';
import { computeHour } from './compute-hour';
import { HOUR_MS, START_MS, hourInputs, samplesEvery } from './hour-inputs-fixture';
import { rollUpRecords } from './roll-up';
import type { DpSeries, HourlyRecord, RollUpRecord, Sample } from './types';

/*
 * Bi-directional meter runs, worked by hand. The element is a cone meter whose C is fixed and
 * comes from a calibration (one C per direction), carrying a liquid of fixed density
 * ρ = 1000 kg/m³, so that C, ε = 1 (incompressible) and ρ are constants and the mass rate is
 * ISO 5167-1:2003 eq. (1) with ISO 5167-5:2016 eq. (1)'s d = βD for a cone:
 *   qm = C / √(1 − β⁴) · ε · (π/4) · (βD)² · √(2 Δp ρ)
 * Cone: D = 0.100 m, cone diameter dc = 0.080 m, so β = √(1 − dc²/D²) (ISO 5167-5:2016 §3.3.1)
 *   = √(1 − 0.64) = 0.6, β² = 0.36, β⁴ = 0.1296, √(1 − β⁴) = √0.8704 = 0.932952303…,
 *   (π/4) (βD)² = (π/4) × 0.36 × 0.01 = 0.00282743339 m².
 * Forward C = 0.800, reverse C = 0.760 (a calibration per direction, figures of this test).
 * No pipe or element material is given, so diameters are not corrected for temperature.
 */
const CONE_FORWARD: ElementSpec = {
  kind: 'cone',
  pipeDiameterM: 0.1,
  coneDiameterM: 0.08,
  dischargeCoefficient: 0.8,
  dischargeCoefficientCalibrated: true,
  calibrationUncertaintyPercent: 0.5,
};
const CONE_REVERSE: ElementSpec = { ...CONE_FORWARD, dischargeCoefficient: 0.76 };
/** A liquid of fixed density: 1000 kg/m³ at any temperature (expansion 0), 1 mPa·s. */
const FIXED_LIQUID: FluidSpec = {
  kind: 'liquid',
  densityKgPerM3: 1000,
  referenceTemperatureK: 293.15,
  expansionPerK: 0,
  viscosityPaS: 0.001,
};
const RHO = 1000;
const AREA_M2 = (Math.PI / 4) * 0.36 * 0.01; // (π/4)(βD)² = 0.00282743339 m²
const ROOT_1_MINUS_BETA4 = Math.sqrt(1 - 0.1296); // 0.932952303
/** ISO 5167-1:2003 eq. (1), ε = 1: qm = C/√(1 − β⁴) · (π/4)(βD)² · √(2 Δp ρ), kg/s. */
const qm = (c: number, dpPa: number) => (c / ROOT_1_MINUS_BETA4) * AREA_M2 * Math.sqrt(2 * dpPa * RHO);
// By hand: qm(0.80, 10 kPa) = 0.857493 × 0.00282743 × √(2e7 = 4472.136) = 10.8427 kg/s;
//          qm(0.76, 5 kPa)  = 0.814618 × 0.00282743 × √(1e7 = 3162.278) = 7.28361 kg/s;
//          qm(0.76, 10 kPa) = 0.814618 × 0.00282743 × 4472.136 = 10.3006 kg/s.
const Q_FORWARD_10K = qm(0.8, 10000);
const Q_REVERSE_5K = qm(0.76, 5000);
const Q_REVERSE_10K = qm(0.76, 10000);

const S = 1000;
const relative = (a: number, b: number) => Math.abs(a / b - 1);
/** DP samples every 10 s from 10 s before the hour, from a function of the offset into the hour, s. */
const dpEvery10s = (value: (offsetS: number) => number) =>
  samplesEvery(START_MS - 10 * S, START_MS + HOUR_MS, 10, (o) => value(o - 10));
/** A DP transmitter ranged both ways, −25…+25 kPa (span 50 kPa), 0.075 % of span. */
const twoWayDp = (samples: Sample[]): DpSeries => ({
  transmitterId: 'dp-1',
  stackRole: 'single',
  lowerRangePa: -25000,
  upperRangePa: 25000,
  accuracyPercentOfSpan: 0.075,
  samples,
});
const bidirectionalVersion = (over: Partial<{ directionSource: 'dp-sign' | 'direction-input' }> = {}) => ({
  id: 'cv-bi',
  effectiveFromMs: 0,
  element: CONE_FORWARD,
  fluid: FIXED_LIQUID,
  reverseElement: CONE_REVERSE,
  ...over,
});
const oneWayVersion = { id: 'cv-one', effectiveFromMs: 0, element: CONE_FORWARD, fluid: FIXED_LIQUID };

/** Half forward (DP +10 kPa for 1800 s), half reverse (DP −5 kPa for 1800 s). */
function halfAndHalfHour(startMs = START_MS): HourlyRecord {
  return computeHour(
    hourInputs({
      startMs,
      endMs: startMs + HOUR_MS,
      asOfMs: startMs + HOUR_MS,
      dp: [twoWayDp(samplesEvery(startMs - 10 * S, startMs + HOUR_MS, 10, (o) => (o - 10 < 1800 ? 10000 : -5000)))],
      staticPressure: [{ timeMs: startMs - 5 * S, value: 5e5, quality: 'good' }],
      temperature: [{ timeMs: startMs - 5 * S, value: 293.15, quality: 'good' }],
      configVersions: [bidirectionalVersion()],
    }),
  );
}

describe('computeHour on a bi-directional meter run', () => {
  it('keeps an hour of 1800 s forward at DP +10 kPa and 1800 s reverse at DP −5 kPa apart: forward 19516.9 kg with C 0.80, reverse 13110.5 kg with C 0.76, never netted', () => {
    const r = halfAndHalfHour();
    // Forward: 10.8427 kg/s × 1800 s = 19516.9 kg; reverse: 7.2836 kg/s × 1800 s = 13110.5 kg (arithmetic above).
    expect(relative(r.massKg, Q_FORWARD_10K * 1800)).toBeLessThan(1e-12);
    expect(r.massKg).toBeCloseTo(19516.9, 0);
    expect(r.flowTimeS).toBe(1800);
    expect(r.volumeM3).toBeCloseTo(r.massKg / RHO, 9); // fixed density: V = m/ρ
    expect(r.averageDpPa).toBe(10000);
    const reverse = r.reverse;
    if (!reverse) throw new Error('a bi-directional hour carries a reverse part');
    expect(relative(reverse.massKg, Q_REVERSE_5K * 1800)).toBeLessThan(1e-12);
    expect(reverse.massKg).toBeCloseTo(13110.5, 0);
    expect(reverse.flowTimeS).toBe(1800);
    expect(reverse.volumeM3).toBeCloseTo(reverse.massKg / RHO, 9);
    expect(reverse.standardVolumeM3).toBeCloseTo(reverse.massKg / RHO, 9);
    // The magnitude, flow-weighted over reverse flowing time.
    expect(reverse.averageDpPa).toBe(5000);
    expect(reverse.averagePressurePa).toBe(5e5);
    // IV = √(Δp ρ) = √(5e6) = 2236.068; IMV = C (π/4)(βD)² √2 / √(1 − β⁴) (ISO 5167-1 eq. 1) = 0.76 × 0.00282743 × 1.414214 / 0.932952.
    expect(reverse.integralValue).toBeCloseTo(Math.sqrt(5000 * RHO), 9);
    const imvReverse = (0.76 * AREA_M2 * Math.SQRT2) / ROOT_1_MINUS_BETA4;
    expect(relative(reverse.integralMultiplierValue as number, imvReverse)).toBeLessThan(1e-12);
    expect(reverse.uncertaintyPercent).toBeGreaterThan(0);
    expect(reverse.uncertaintyBudget.length).toBeGreaterThan(0);
    // A liquid has no energy basis.
    expect(r.energyJ).toBeNull();
    expect(reverse.energyJ).toBeNull();
    // Bands in each direction's share: 10/25 = 40 % forward, 5/25 = 20 % reverse; they sum to 1800 + 1800 s.
    expect(r.dpBands['25-50'].timeS).toBe(1800);
    expect(r.dpBands['10-25'].timeS).toBe(1800);
    expect(r.coverage).toBe(1);
    expect(r.flags).toEqual([]);
  });

  it('takes the direction from a direction input while the DP transmitter (0–25 kPa) reads the magnitude 10 kPa: +1 for 1800 s, −1 for 1200 s, 0 for 600 s give forward 19516.9 kg, reverse 12360.7 kg and 600 s without flow', () => {
    const r = computeHour(
      hourInputs({
        dp: [
          {
            transmitterId: 'dp-1',
            stackRole: 'single',
            lowerRangePa: 0,
            upperRangePa: 25000,
            accuracyPercentOfSpan: 0.075,
            samples: dpEvery10s(() => 10000),
          },
        ],
        direction: [
          { timeMs: START_MS - 5 * S, value: 1, quality: 'good' },
          { timeMs: START_MS + 1800 * S, value: -1, quality: 'good' },
          { timeMs: START_MS + 3000 * S, value: 0, quality: 'good' },
        ],
        configVersions: [bidirectionalVersion({ directionSource: 'direction-input' })],
      }),
    );
    // Forward 10.8427 kg/s × 1800 s = 19516.9 kg; reverse 10.3006 kg/s × 1200 s = 12360.7 kg.
    expect(relative(r.massKg, Q_FORWARD_10K * 1800)).toBeLessThan(1e-12);
    expect(relative(r.reverse?.massKg as number, Q_REVERSE_10K * 1200)).toBeLessThan(1e-12);
    expect(r.reverse?.massKg).toBeCloseTo(12360.7, 0);
    expect(r.flowTimeS).toBe(1800);
    expect(r.reverse?.flowTimeS).toBe(1200);
    expect(r.coverage).toBe(1); // the 600 s at direction 0 are valid time without flow
    expect(r.flags).toEqual([]);
  });

  it('counts time as missing when the direction input is older than the hold limit: a direction sample 5 s before the hour with holdLimitS 600 covers 595 s of forward flow', () => {
    const r = computeHour(
      hourInputs({
        dp: [twoWayDp(dpEvery10s(() => 10000))],
        direction: [{ timeMs: START_MS - 5 * S, value: 1, quality: 'good' }],
        staticPressure: [{ timeMs: START_MS - 5 * S, value: 5e5, quality: 'good' }],
        temperature: [{ timeMs: START_MS - 5 * S, value: 293.15, quality: 'good' }],
        holdLimitS: 7200,
        configVersions: [bidirectionalVersion({ directionSource: 'direction-input' })],
      }),
    );
    expect(r.flowTimeS).toBe(3600);
    const stale = computeHour(
      hourInputs({
        dp: [twoWayDp(dpEvery10s(() => 10000))],
        direction: [{ timeMs: START_MS - 5 * S, value: 1, quality: 'good' }],
        staticPressure: samplesEvery(START_MS - 5 * S, START_MS + HOUR_MS, 60, () => 5e5),
        temperature: samplesEvery(START_MS - 5 * S, START_MS + HOUR_MS, 60, () => 293.15),
        holdLimitS: 600,
        configVersions: [bidirectionalVersion({ directionSource: 'direction-input' })],
      }),
    );
    // The direction input is held on [−5 s, 595 s): 595 s of flow, the rest is missing time.
    expect(stale.flowTimeS).toBe(595);
    expect(stale.coverage).toBeCloseTo(595 / 3600, 12);
    expect(stale.flags).toContain('missing-data');
  });

  it('chooses a stacked pair ranged both ways on the magnitude: low −25…+25 kPa reading −23 kPa (92 % of its reverse range) switches up to the high −250…+250 kPa one reading −23.1 kPa', () => {
    const low: DpSeries = { ...twoWayDp(dpEvery10s(() => -23000)), transmitterId: 'dp-low', stackRole: 'low' };
    const high: DpSeries = {
      transmitterId: 'dp-high',
      stackRole: 'high',
      lowerRangePa: -250000,
      upperRangePa: 250000,
      accuracyPercentOfSpan: 0.075,
      samples: dpEvery10s(() => -23100),
    };
    const r = computeHour(hourInputs({ dp: [low, high], configVersions: [bidirectionalVersion()] }));
    // |−23 kPa| > 90 % × 25 kPa = 22.5 kPa: up to the high-range transmitter; reverse at 23.1 kPa for 3600 s.
    expect(r.activeTransmitterTimeS).toEqual({ 'dp-high': 3600 });
    expect(r.finalStackChoice).toBe('high');
    expect(relative(r.reverse?.massKg as number, qm(0.76, 23100) * 3600)).toBeLessThan(1e-12);
    expect(r.massKg).toBe(0);
    // On the high-range transmitter 23.1 kPa is 23.1/250 = 9.24 % of its reverse range: low in range.
    expect(r.dpBands['0-10'].timeS).toBe(3600);
    expect(r.flags).toEqual(['low-in-range']);
  });
});

describe('computeHour on a one-way meter run seeing reverse flow', () => {
  it("flags an hour that is half forward (+10 kPa) and half reverse (−5 kPa) 'reverse-flow', counts only the forward 19516.9 kg and keeps the reverse half as valid time without flow", () => {
    const r = computeHour(
      hourInputs({
        dp: [twoWayDp(dpEvery10s((o) => (o < 1800 ? 10000 : -5000)))],
        configVersions: [oneWayVersion],
      }),
    );
    expect(relative(r.massKg, Q_FORWARD_10K * 1800)).toBeLessThan(1e-12);
    expect(r.flowTimeS).toBe(1800);
    expect(r.coverage).toBe(1);
    expect(r.flags).toEqual(['reverse-flow']);
    expect(r.reverse).toBeNull();
    // Only the forward flow is in the bands.
    expect(r.dpBands['25-50'].timeS).toBe(1800);
    expect(r.dpBands['10-25'].timeS).toBe(0);
  });

  it('does not flag a reverse DP within the no-flow cutoff: −100 Pa is 0.4 % of the 25 kPa reverse range, below 0.5 %', () => {
    const r = computeHour(hourInputs({ dp: [twoWayDp(dpEvery10s(() => -100))], configVersions: [oneWayVersion] }));
    expect(r.flowTimeS).toBe(0);
    expect(r.coverage).toBe(1);
    expect(r.flags).toEqual([]);
  });
});

describe('rollUpRecords with reverse flow', () => {
  it('sums a day of 24 half-forward, half-reverse hours to forward 468405 kg, reverse 314652 kg and net 153753 kg', () => {
    const dayStartMs = START_MS;
    const records = Array.from({ length: 24 }, (_, k) => halfAndHalfHour(dayStartMs + k * HOUR_MS));
    const t = rollUpRecords(
      records,
      { startMs: dayStartMs, endMs: dayStartMs + 24 * HOUR_MS, hours: 24 },
      { nowMs: dayStartMs + 24 * HOUR_MS },
    );
    // Forward 24 × 1800 s × 10.8427 kg/s = 468405 kg; reverse 24 × 1800 s × 7.2836 kg/s = 314652 kg.
    const forwardKg = 24 * 1800 * Q_FORWARD_10K;
    const reverseKg = 24 * 1800 * Q_REVERSE_5K;
    expect(relative(t.massKg, forwardKg)).toBeLessThan(1e-12);
    expect(t.massKg).toBeCloseTo(468405, -1);
    expect(t.flowTimeS).toBe(24 * 1800);
    expect(t.reverse?.flowTimeS).toBe(24 * 1800);
    expect(relative(t.reverse?.massKg as number, reverseKg)).toBeLessThan(1e-12);
    expect(t.reverse?.massKg).toBeCloseTo(314652, -1);
    expect(relative(t.net?.massKg as number, forwardKg - reverseKg)).toBeLessThan(1e-10);
    expect(t.net?.massKg).toBeCloseTo(153753, -1);
    // Fixed density: volumes are mass / 1000.
    expect(t.net?.volumeM3).toBeCloseTo((forwardKg - reverseKg) / RHO, 6);
    expect(t.reverse?.energyJ).toBeNull();
    expect(t.net?.energyJ).toBeNull();
    expect(t.status).toBe('complete');
  });

  it('derives net energy only when both directions have one: 10 MJ forward − 4 MJ reverse = 6 MJ; a one-way day has no reverse or net', () => {
    const part = { flowTimeS: 600, massKg: 40, volumeM3: 0.05, standardVolumeM3: 50, energyJ: 2e6 };
    const reversePart = {
      ...part,
      averageDpPa: null,
      averagePressurePa: null,
      averageTemperatureK: null,
      integralValue: null,
      integralMultiplierValue: null,
      uncertaintyPercent: null,
      uncertaintyBudget: [],
    };
    const record = (k: number, reverse: RollUpRecord['reverse']): RollUpRecord => ({
      startMs: START_MS + k * HOUR_MS,
      endMs: START_MS + (k + 1) * HOUR_MS,
      flowTimeS: 3000,
      massKg: 100,
      volumeM3: 0.125,
      standardVolumeM3: 125,
      energyJ: 5e6,
      coverage: 1,
      flags: [],
      uncertaintyPercent: 1,
      reverse,
    });
    const bounds = { startMs: START_MS, endMs: START_MS + 2 * HOUR_MS, hours: 2 };
    const t = rollUpRecords([record(0, reversePart), record(1, reversePart)], bounds, { nowMs: bounds.endMs });
    expect(t.reverse).toEqual({ flowTimeS: 1200, massKg: 80, volumeM3: 0.1, standardVolumeM3: 100, energyJ: 4e6 });
    expect(t.net?.massKg).toBe(120); // 200 − 80
    expect(t.net?.standardVolumeM3).toBe(150); // 250 − 100
    expect(t.net?.energyJ).toBe(6e6); // 10 MJ − 4 MJ
    // A one-way day keeps today's shape: no reverse or net key at all.
    const oneWay = rollUpRecords([record(0, null), record(1, null)], bounds, { nowMs: bounds.endMs });
    expect('reverse' in oneWay).toBe(false);
    expect('net' in oneWay).toBe(false);
  });
});
