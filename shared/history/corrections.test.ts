import {
  correctRecord,
  estimateFromPreviousDays,
  estimateFromSalesMeter,
  studentT975,
  substituteSamples,
  type CorrectionToApply,
} from './corrections';
import type { HourlyRecord } from './types';

const H = 3_600_000;
const T0 = Date.parse('2026-06-01T15:00:00Z');

/** A record of one hour with round figures: 100 kg, 120 m³, 140 m³ at base, 5 MJ, U 1 %. */
function record(overrides: Partial<HourlyRecord> = {}): HourlyRecord {
  return {
    startMs: T0,
    endMs: T0 + H,
    flowTimeS: 3600,
    massKg: 100,
    volumeM3: 120,
    standardVolumeM3: 140,
    energyJ: 5e6,
    averageDpPa: 1000,
    averagePressurePa: 2e6,
    averageTemperatureK: 300,
    integralValue: null,
    coverage: 1,
    flags: [],
    uncertaintyPercent: 1,
    configVersionId: '1',
    dpBands: {
      '0-10': { timeS: 0, massKg: 0 },
      '10-25': { timeS: 1800, massKg: 40 },
      '25-50': { timeS: 1800, massKg: 60 },
      '50-100': { timeS: 0, massKg: 0 },
      over: { timeS: 0, massKg: 0 },
    },
    activeTransmitterTimeS: { '7': 3600 },
    finalStackChoice: null,
    ...overrides,
  };
}

function correction(overrides: Partial<CorrectionToApply>): CorrectionToApply {
  return {
    id: '1',
    startMs: T0,
    endMs: T0 + H,
    kind: 'substitute',
    massKg: null,
    factor: null,
    readings: false,
    origin: 'manual',
    estimateUncertaintyPercent: null,
    fallbackRatios: null,
    ...overrides,
  };
}

describe('correctRecord', () => {
  it('multiplies every quantity of a record inside the period by the factor and flags it corrected', () => {
    const out = correctRecord(record(), [correction({ kind: 'adjust', factor: 1.05 })]);
    // 100 × 1.05 = 105 kg; 120 × 1.05 = 126 m³; 140 × 1.05 = 147 m³; 5 MJ × 1.05 = 5.25 MJ
    expect(out.massKg).toBeCloseTo(105, 12);
    expect(out.volumeM3).toBeCloseTo(126, 12);
    expect(out.standardVolumeM3).toBeCloseTo(147, 12);
    expect(out.energyJ).toBeCloseTo(5.25e6, 6);
    expect(out.dpBands['25-50'].massKg).toBeCloseTo(63, 12);
    expect(out.uncertaintyPercent).toBe(1);
    expect(out.flags).toEqual(['corrected']);
  });

  it('adjusts only the share of a record that lies inside the period', () => {
    // The correction covers the last 15 minutes: scale 1 + (0.8 − 1) × 0.25 = 0.95.
    const out = correctRecord(record(), [correction({ kind: 'adjust', factor: 0.8, startMs: T0 + 0.75 * H })]);
    expect(out.massKg).toBeCloseTo(95, 12);
  });

  it('spreads a substituted mass over the period pro rata by time, at the record’s own ratios', () => {
    // 240 kg over two hours: this hour gets 120 kg; its own ratios 1.2 m³/kg, 1.4 m³/kg, 50 kJ/kg.
    const out = correctRecord(record(), [correction({ massKg: 240, endMs: T0 + 2 * H })]);
    expect(out.massKg).toBeCloseTo(120, 12);
    expect(out.volumeM3).toBeCloseTo(144, 12);
    expect(out.standardVolumeM3).toBeCloseTo(168, 12);
    expect(out.energyJ).toBeCloseTo(6e6, 6);
    // A mass typed by a person states no uncertainty.
    expect(out.uncertaintyPercent).toBeNull();
    expect(out.flags).toEqual(['corrected']);
  });

  it('fills a record without flow at the ratios of the last records with flow, with the estimate’s uncertainty', () => {
    const gap = record({ massKg: 0, volumeM3: 0, standardVolumeM3: 0, energyJ: null, flags: ['missing-data'] });
    const out = correctRecord(gap, [
      correction({
        massKg: 80,
        origin: 'estimate',
        estimateUncertaintyPercent: 4,
        fallbackRatios: { volumeM3PerKg: 1.5, standardVolumeM3PerKg: 1.25, energyJPerKg: 5e4 },
      }),
    ]);
    // 80 kg × 1.5 = 120 m³; × 1.25 = 100 m³ at base; × 50 kJ/kg = 4 MJ.
    expect(out.massKg).toBe(80);
    expect(out.volumeM3).toBeCloseTo(120, 12);
    expect(out.standardVolumeM3).toBeCloseTo(100, 12);
    expect(out.energyJ).toBeCloseTo(4e6, 6);
    expect(out.uncertaintyPercent).toBe(4);
    expect(out.flags).toEqual(['missing-data', 'corrected', 'estimated']);
  });

  it('keeps the record’s own mass outside the period and weights the uncertainty by mass', () => {
    // Substitution of the first half hour with 30 kg (an estimate at 6 %): kept 50 kg at 1 %, 30 kg at 6 %.
    const out = correctRecord(record(), [
      correction({ massKg: 30, endMs: T0 + 0.5 * H, origin: 'estimate', estimateUncertaintyPercent: 6 }),
    ]);
    expect(out.massKg).toBeCloseTo(80, 12);
    expect(out.volumeM3).toBeCloseTo(60 + 36, 12);
    expect(out.uncertaintyPercent).toBeCloseTo((50 * 1 + 30 * 6) / 80, 12);
  });

  it('applies corrections in order: a substitution, then a factor on it', () => {
    const out = correctRecord(record(), [correction({ massKg: 50 }), correction({ kind: 'adjust', factor: 2 })]);
    expect(out.massKg).toBeCloseTo(100, 12);
    expect(out.volumeM3).toBeCloseTo(120, 12);
  });

  it('leaves a record outside every correction as it is', () => {
    const r = record();
    expect(correctRecord(r, [correction({ kind: 'adjust', factor: 2, startMs: T0 + H, endMs: T0 + 2 * H })])).toBe(r);
  });

  it('flags a record under a reading substitution as corrected without changing its figures', () => {
    const out = correctRecord(record(), [correction({ readings: true })]);
    expect(out.massKg).toBe(100);
    expect(out.flags).toEqual(['corrected']);
  });
});

describe('correctRecord on a bi-directional hour', () => {
  /** 1800 s forward (the record's own 100 kg …) and 1800 s reverse: 50 kg, 60 m³, 70 m³ at base, 2.5 MJ. */
  const reverse = {
    flowTimeS: 1800,
    massKg: 50,
    volumeM3: 60,
    standardVolumeM3: 70,
    energyJ: 2.5e6,
    averageDpPa: 800,
    averagePressurePa: 2e6,
    averageTemperatureK: 300,
    integralValue: null,
    integralMultiplierValue: null,
    uncertaintyPercent: 1.2,
    uncertaintyBudget: [],
  };
  /** Bands hold both directions: 40 + 60 kg forward and 50 kg reverse in 10–25 %. */
  const bidirectional = () =>
    record({
      reverse,
      dpBands: {
        '0-10': { timeS: 0, massKg: 0 },
        '10-25': { timeS: 3600, massKg: 90 },
        '25-50': { timeS: 1800, massKg: 60 },
        '50-100': { timeS: 0, massKg: 0 },
        over: { timeS: 0, massKg: 0 },
      },
    });

  it('adjusts both directions by the factor (a transmitter measures both ways) and the bands with them', () => {
    // Factor 1.02 over the whole hour: every quantity × 1.02, by hand.
    const out = correctRecord(bidirectional(), [correction({ kind: 'adjust', factor: 1.02 })]);
    expect(out.massKg).toBeCloseTo(102, 9);
    expect(out.reverse!.massKg).toBeCloseTo(51, 9);
    expect(out.reverse!.volumeM3).toBeCloseTo(61.2, 9);
    expect(out.reverse!.standardVolumeM3).toBeCloseTo(71.4, 9);
    expect(out.reverse!.energyJ).toBeCloseTo(2.55e6, 3);
    expect(out.reverse!.flowTimeS).toBe(1800);
    expect(out.reverse!.uncertaintyPercent).toBe(1.2);
    // 150 kg of bands become 153 kg: 91.8 and 61.2, summing to forward + reverse.
    expect(out.dpBands['10-25'].massKg).toBeCloseTo(91.8, 9);
    expect(out.dpBands['25-50'].massKg).toBeCloseTo(61.2, 9);
  });

  it('keeps the reverse part of a record a forward substitution meets, and scales the bands by the change of both', () => {
    // 130 kg forward for the hour: bands hold 130 + 50 = 180 kg where they held 150 kg (× 1.2).
    const out = correctRecord(bidirectional(), [correction({ massKg: 130 })]);
    expect(out.massKg).toBeCloseTo(130, 9);
    expect(out.reverse).toEqual(reverse);
    expect(out.dpBands['10-25'].massKg).toBeCloseTo(108, 9);
    expect(out.dpBands['25-50'].massKg).toBeCloseTo(72, 9);
  });

  it('leaves a one-way record without a reverse part', () => {
    const out = correctRecord(record({ reverse: null }), [correction({ kind: 'adjust', factor: 1.02 })]);
    expect(out.reverse).toBeNull();
  });
});

describe('substituteSamples', () => {
  const good = (timeMs: number, value: number) => ({ timeMs, value, quality: 'good' as const });

  it('writes substituted samples every minute inside the period and gives the stored reading back at its end', () => {
    const stored = [good(T0 - 60_000, 10), good(T0 + 30 * 60_000, 99), good(T0 + 3 * 60_000 + 5_000, 11)].sort(
      (a, b) => a.timeMs - b.timeMs,
    );
    const out = substituteSamples(stored, T0, T0 + 3 * 60_000, 20, { coverMs: 120_000, markGapAfter: true });
    expect(out.map((s) => [s.timeMs - T0, s.value, s.quality])).toEqual([
      [-60_000, 10, 'good'],
      [0, 20, 'substituted'],
      [60_000, 20, 'substituted'],
      [120_000, 20, 'substituted'],
      // Nothing stored was in force at the end (the last stored sample before it is at −1 min, older than 2 min): a gap.
      [180_000, Number.NaN, 'bad'],
      [185_000, 11, 'good'],
      [1_800_000, 99, 'good'],
    ]);
  });

  it('holds the last usable stored value from before the period, never a bad one', () => {
    const stored = [good(T0 - 120_000, 7), { timeMs: T0 - 60_000, value: 1e9, quality: 'bad' as const }];
    const out = substituteSamples(stored, T0, T0 + 60_000, 'hold', { coverMs: 30_000, markGapAfter: false });
    // Every 30 s (the cover is shorter than a minute): 0 and 30 s.
    expect(out.filter((s) => s.quality === 'substituted').map((s) => [s.timeMs - T0, s.value])).toEqual([
      [0, 7],
      [30_000, 7],
    ]);
  });

  it('repeats the stored sample that would be in force at the end of the period', () => {
    const stored = [good(T0 + 50_000, 5)];
    const out = substituteSamples(stored, T0, T0 + 60_000, 3, { coverMs: 120_000, markGapAfter: true });
    expect(out[out.length - 1]).toEqual(good(T0 + 60_000, 5));
  });
});

describe('estimateFromPreviousDays', () => {
  it('is the mean of the same hour on previous days with a 95 % prediction interval, worked by hand', () => {
    // 100, 102, 98, 101, 99, 100, 100: mean 100; deviations 0, 2, −2, 1, −1, 0, 0 → Σd² = 10,
    // s = √(10 / 6) = 1.290994; √(1 + 1/7) = 1.069045; t(0.975, 6) = 2.447 →
    // U = 2.447 × 1.290994 × 1.069045 = 3.37716 kg, 3.37716 % of 100 kg.
    const est = estimateFromPreviousDays([{ startMs: T0, previousMassesKg: [100, 102, 98, 101, 99, 100, 100] }]);
    expect(est.ok).toBe(true);
    if (!est.ok) return;
    expect(est.massKg).toBeCloseTo(100, 12);
    expect(est.hours[0].standardDeviationKg).toBeCloseTo(1.290994, 6);
    expect(est.uncertaintyPercent).toBeCloseTo(3.37716, 4);
  });

  it('adds the hours and their intervals (hours taken as fully correlated)', () => {
    // Hour 1: 10, 20 → mean 15, s = 7.071068, t(1) = 12.706, √1.5 = 1.224745 → 110.0382 kg.
    // Hour 2: 30, 30, 30 → mean 30, s = 0. Total 45 kg, U = 110.0382 / 45 = 244.529 %.
    const est = estimateFromPreviousDays([
      { startMs: T0, previousMassesKg: [10, 20] },
      { startMs: T0 + H, previousMassesKg: [30, 30, 30] },
    ]);
    expect(est.ok && est.massKg).toBeCloseTo(45, 12);
    expect(est.ok && est.uncertaintyPercent).toBeCloseTo(244.529, 2);
  });

  it('refuses an hour with fewer than two previous days, naming it', () => {
    const est = estimateFromPreviousDays([{ startMs: T0, previousMassesKg: [5] }]);
    expect(est).toEqual({ ok: false, problem: expect.stringContaining('2026-06-01T15:00:00.000Z') });
  });

  it('reads Student’s t from the NIST table', () => {
    expect(studentT975(1)).toBe(12.706);
    expect(studentT975(6)).toBe(2.447);
    expect(studentT975(100)).toBe(2.042);
  });
});

describe('estimateFromSalesMeter', () => {
  /**
   * Worked by hand. Two hours; sales meter S 1 000 kg and 1 400 m³ at base each hour, U 0.5 %;
   * the other well B 300 kg and 420 m³ each hour, U 1 %. Over the period S = 2 000 kg (U_S = 10 kg,
   * the hours of one meter adding), B = 600 kg (U_B = 6 kg).
   * Allowance 2 % of the inlet: well = S / (1 − 0.02) − B = 2 040.816 327 − 600 = 1 440.816 327 kg;
   *   at base 2 800 / 0.98 − 840 = 2 017.142 857 m³.
   *   U² = (10 / 0.98)² + 6² = 104.123 282 + 36 = 140.123 282 (JCGM 100:2008 §5.1.2 eq. 10)
   *   → U = 11.837 368 kg = 0.821 574 % of 1 440.816 327 kg.
   * Fixed allowance 20 m³ for the two hours (240 m³ a day): at S's 2 000 / 2 800 kg/m³ = 14.285 714 kg;
   *   well = 2 000 + 14.285 714 − 600 = 1 414.285 714 kg, 2 800 + 20 − 840 = 1 980 m³;
   *   U = √(10² + 6²) = 11.661 904 kg = 0.824 579 %.
   */
  const rec = (k: number, massKg: number, standardVolumeM3: number, uncertaintyPercent: number) => ({
    startMs: T0 + k * H,
    endMs: T0 + (k + 1) * H,
    massKg,
    standardVolumeM3,
    coverage: 1,
    flags: [] as string[],
    uncertaintyPercent,
  });
  const sales = { meterRunId: '1', tag: 'S', records: [rec(0, 1000, 1400, 0.5), rec(1, 1000, 1400, 0.5)] };
  const wellB = { meterRunId: '2', tag: 'B', records: [rec(0, 300, 420, 1), rec(1, 300, 420, 1)] };
  const period = { startMs: T0, endMs: T0 + 2 * H };

  it('is the sales meter over (1 − allowance) minus the other wells, with a root-sum-square uncertainty', () => {
    const e = estimateFromSalesMeter({ ...period, sales, otherWells: [wellB], allowance: { percent: 2 } });
    if (!e.ok) throw new Error(e.problem);
    expect(e.massKg).toBeCloseTo(1440.816327, 5);
    expect(e.standardVolumeM3).toBeCloseTo(2017.142857, 5);
    expect(e.expandedUncertaintyKg).toBeCloseTo(11.837368, 5);
    expect(e.uncertaintyPercent).toBeCloseTo(0.821574, 5);
    expect(e.sales).toMatchObject({ tag: 'S', massKg: 2000, expandedUncertaintyKg: 10 });
    expect(e.allowance.massKg).toBeCloseTo(40.816327, 5);
  });

  it('adds a fixed allowance at the sales meter’s mass per standard cubic metre, taken as exact', () => {
    const e = estimateFromSalesMeter({ ...period, sales, otherWells: [wellB], allowance: { standardVolumeM3: 20 } });
    if (!e.ok) throw new Error(e.problem);
    expect(e.massKg).toBeCloseTo(1414.285714, 5);
    expect(e.standardVolumeM3).toBeCloseTo(1980, 9);
    expect(e.uncertaintyPercent).toBeCloseTo(0.824579, 5);
  });

  it('counts an hour split by a configuration version as its two records', () => {
    const split = {
      ...wellB,
      records: [
        { ...rec(0, 100, 140, 1), endMs: T0 + H / 3 },
        { ...rec(0, 200, 280, 1), startMs: T0 + H / 3 },
        rec(1, 300, 420, 1),
      ],
    };
    const e = estimateFromSalesMeter({ ...period, sales, otherWells: [split], allowance: { percent: 2 } });
    if (!e.ok) throw new Error(e.problem);
    expect(e.massKg).toBeCloseTo(1440.816327, 5);
  });

  it('is refused, naming the member, when a member has an incomplete or estimated hour', () => {
    const gappy = { ...wellB, records: [{ ...rec(0, 150, 210, 1), coverage: 0.5 }, rec(1, 300, 420, 1)] };
    const e = estimateFromSalesMeter({ ...period, sales, otherWells: [gappy], allowance: { percent: 2 } });
    expect(e).toEqual({
      ok: false,
      problem: expect.stringContaining('B has complete, not estimated records for 1.00 of the 2.00 hours'),
    });
    const estimated = {
      ...sales,
      records: [sales.records[0], { ...sales.records[1], flags: ['corrected', 'estimated'] }],
    };
    expect(
      estimateFromSalesMeter({ ...period, sales: estimated, otherWells: [wellB], allowance: { percent: 0 } }).ok,
    ).toBe(false);
  });

  it('is refused when the other wells exceed the sales meter', () => {
    const big = { ...wellB, records: [rec(0, 1200, 1680, 1), rec(1, 1200, 1680, 1)] };
    const e = estimateFromSalesMeter({ ...period, sales, otherWells: [big], allowance: { percent: 0 } });
    expect(e.ok).toBe(false);
  });
});
