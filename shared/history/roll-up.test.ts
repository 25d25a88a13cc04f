import { rollUpRecords } from './roll-up';
import type { RollUpRecord } from './types';

const H = 3_600_000;
/** The 25-hour America/Denver contract day (09:00) that contains the 2026-11-01 change: 2026-10-31 15:00Z to 2026-11-01 16:00Z (worked by hand in contract-day.test.ts from the US DST rules). */
const longDay = { startMs: Date.parse('2026-10-31T15:00:00Z'), endMs: Date.parse('2026-11-01T16:00:00Z'), hours: 25 };

/** A constant hour: 1000.25 kg, 1.5 m³, 1200.75 Sm³, 50 MJ, 3600 s flowing, U = 0.8 %. */
function hour(k: number, over: Partial<RollUpRecord> = {}): RollUpRecord {
  return {
    startMs: longDay.startMs + k * H,
    endMs: longDay.startMs + (k + 1) * H,
    flowTimeS: 3600,
    massKg: 1000.25,
    volumeM3: 1.5,
    standardVolumeM3: 1200.75,
    energyJ: 50e6,
    coverage: 1,
    flags: [],
    uncertaintyPercent: 0.8,
    ...over,
  };
}
const allHours = (over: (k: number) => Partial<RollUpRecord> = () => ({})) =>
  Array.from({ length: 25 }, (_, k) => hour(k, over(k)));

describe('rollUpRecords', () => {
  it('sums a 25-hour day of constant hourly records to 25 × the hourly figure: 25006.25 kg, 90000 s, 30018.75 Sm³, 1.25 GJ', () => {
    const t = rollUpRecords(allHours(), longDay, { nowMs: longDay.endMs });
    expect(t.hours).toBe(25);
    expect(t.massKg).toBeCloseTo(25 * 1000.25, 9); // 25006.25, by hand
    expect(t.flowTimeS).toBe(90000); // 25 h × 3600 s
    expect(t.volumeM3).toBeCloseTo(37.5, 12);
    expect(t.standardVolumeM3).toBeCloseTo(30018.75, 9);
    expect(t.energyJ).toBeCloseTo(1.25e9, 3);
    expect(t.coverage).toBe(1);
    expect(t.uncertaintyPercent).toBeCloseTo(0.8, 12);
    expect(t.flags).toEqual([]);
    expect(t.status).toBe('complete');
  });

  it('writes start and end as ISO 8601 UTC strings', () => {
    const t = rollUpRecords(allHours(), longDay, { nowMs: longDay.endMs });
    expect(t.start).toBe('2026-10-31T15:00:00.000Z');
    expect(t.end).toBe('2026-11-01T16:00:00.000Z');
  });

  it('counts a missing hour as coverage 0: 24 of 25 hours gives 0.96, missing-data, and stays provisional after the day ends', () => {
    const records = allHours().filter((_, k) => k !== 7);
    const t = rollUpRecords(records, longDay, { nowMs: longDay.endMs + 10 * H });
    expect(t.coverage).toBeCloseTo(24 / 25, 12);
    expect(t.flags).toContain('missing-data');
    expect(t.status).toBe('provisional');
  });

  it('weights coverage by hour: one hour at 0.5 coverage in 25 gives (24 + 0.5)/25 = 0.98', () => {
    const t = rollUpRecords(
      allHours((k) => (k === 3 ? { coverage: 0.5, flags: ['missing-data', 'bad-quality'] } : {})),
      longDay,
      { nowMs: longDay.endMs },
    );
    expect(t.coverage).toBeCloseTo(0.98, 12);
    expect(t.flags).toEqual(['missing-data', 'bad-quality']);
  });

  it('judges a running day on its elapsed part: at 6.5 h into the day with 7 complete records the coverage is 1 and the status provisional', () => {
    const records = allHours().slice(0, 7);
    const t = rollUpRecords(records, longDay, { nowMs: longDay.startMs + 6.5 * H });
    expect(t.coverage).toBe(1);
    expect(t.status).toBe('provisional');
    expect(t.massKg).toBeCloseTo(7 * 1000.25, 9);
  });

  it('gives 6/6.5 coverage to a running day whose current hour has no record yet', () => {
    const t = rollUpRecords(allHours().slice(0, 6), longDay, { nowMs: longDay.startMs + 6.5 * H });
    expect(t.coverage).toBeCloseTo(6 / 6.5, 12);
  });

  it('takes the mass-weighted mean of hourly uncertainties: 3 h × 100 kg at 1 % and 1 h × 300 kg at 2 % give 1.5 %', () => {
    const bounds = { startMs: 0, endMs: 4 * H, hours: 4 };
    const rec = (k: number, massKg: number, u: number): RollUpRecord => ({
      ...hour(0),
      startMs: k * H,
      endMs: (k + 1) * H,
      massKg,
      uncertaintyPercent: u,
    });
    const t = rollUpRecords([rec(0, 100, 1), rec(1, 100, 1), rec(2, 100, 1), rec(3, 300, 2)], bounds, { nowMs: 4 * H });
    // (3 × 100 × 1 + 300 × 2) / 600 = 900 / 600 = 1.5, by hand
    expect(t.uncertaintyPercent).toBeCloseTo(1.5, 12);
  });

  it('gives null uncertainty and null energy to a day without flow or energy', () => {
    const t = rollUpRecords(
      allHours(() => ({
        massKg: 0,
        volumeM3: 0,
        standardVolumeM3: 0,
        flowTimeS: 0,
        energyJ: null,
        uncertaintyPercent: null,
      })),
      longDay,
      { nowMs: longDay.endMs },
    );
    expect(t.uncertaintyPercent).toBeNull();
    expect(t.energyJ).toBeNull();
    expect(t.massKg).toBe(0);
  });

  it('reports closed when the month is closed, whatever the records', () => {
    expect(rollUpRecords(allHours().slice(0, 3), longDay, { nowMs: longDay.endMs, closed: true }).status).toBe(
      'closed',
    );
  });

  it('ignores records outside the period', () => {
    const t = rollUpRecords([...allHours(), hour(25), hour(-1)], longDay, { nowMs: longDay.endMs });
    expect(t.massKg).toBeCloseTo(25 * 1000.25, 9);
  });

  it('rejects bounds that end before they start, naming the field', () => {
    expect(() => rollUpRecords([], { startMs: 10, endMs: 5, hours: 1 }, { nowMs: 0 })).toThrow(/rollUpRecords: bounds/);
  });

  it('counts an hour stored as two parts (split at 20 min where a setting took effect) once: the day stays complete with coverage 1 and the sum of the parts', () => {
    const records = allHours().flatMap((r, k) =>
      k === 5
        ? [
            { ...r, endMs: r.startMs + 20 * 60_000, flowTimeS: 1200, massKg: 400 },
            { ...r, startMs: r.startMs + 20 * 60_000, flowTimeS: 2400, massKg: 600.25 },
          ]
        : [r],
    );
    const t = rollUpRecords(records, longDay, { nowMs: longDay.endMs });
    expect(t.hours).toBe(25);
    expect(t.status).toBe('complete');
    expect(t.coverage).toBe(1);
    expect(t.flowTimeS).toBe(90000);
    expect(t.massKg).toBeCloseTo(25 * 1000.25, 9);
  });

  it('weights each part by its own length: a 20-minute part at coverage 0.4 beside a full 40-minute part gives (24 + (20 × 0.4 + 40)/60)/25', () => {
    const records = allHours().flatMap((r, k) =>
      k === 5
        ? [
            { ...r, endMs: r.startMs + 20 * 60_000, coverage: 0.4 },
            { ...r, startMs: r.startMs + 20 * 60_000 },
          ]
        : [r],
    );
    const t = rollUpRecords(records, longDay, { nowMs: longDay.endMs });
    expect(t.coverage).toBeCloseTo((24 + (20 * 0.4 + 40) / 60) / 25, 12);
  });

  it('leaves a day provisional when a split hour lacks its second part', () => {
    const records = allHours().map((r, k) => (k === 5 ? { ...r, endMs: r.startMs + 20 * 60_000 } : r));
    expect(rollUpRecords(records, longDay, { nowMs: longDay.endMs }).status).toBe('provisional');
  });

  it('calls a day that has ended with every hour recorded but nothing measured (coverage 0) missing, not complete', () => {
    const t = rollUpRecords(
      allHours(() => ({ coverage: 0, flowTimeS: 0, massKg: 0, volumeM3: 0, standardVolumeM3: 0, energyJ: null })),
      longDay,
      { nowMs: longDay.endMs },
    );
    expect(t.coverage).toBe(0);
    expect(t.flags).toContain('missing-data');
    expect(t.status).toBe('missing');
  });

  it('calls a day that has ended without a single record missing, and a closed one closed', () => {
    expect(rollUpRecords([], longDay, { nowMs: longDay.endMs }).status).toBe('missing');
    expect(rollUpRecords([], longDay, { nowMs: longDay.endMs, closed: true }).status).toBe('closed');
  });

  it('leaves out the hours before the history starts: a meter run starting 10 h into the 25-hour day, recorded since, is complete with coverage 1', () => {
    // By hand: hours 10..24 are the 15 hours of history, each recorded at coverage 1, so the
    // elapsed time is 15 h, the covered time 15 h: coverage 15/15 = 1, and 15 × 1000.25 kg.
    const records = allHours().filter((_, k) => k >= 10);
    const t = rollUpRecords(records, longDay, { nowMs: longDay.endMs, historyStartMs: longDay.startMs + 10 * H });
    expect(t.coverage).toBe(1);
    expect(t.massKg).toBeCloseTo(15 * 1000.25, 9);
    expect(t.flags).toEqual([]);
    expect(t.status).toBe('complete');
  });

  it('still counts an unrecorded hour after the history starts: 14 of 15 hours gives coverage 14/15 and stays provisional', () => {
    const records = allHours().filter((_, k) => k >= 10 && k !== 12);
    const t = rollUpRecords(records, longDay, { nowMs: longDay.endMs, historyStartMs: longDay.startMs + 10 * H });
    expect(t.coverage).toBeCloseTo(14 / 15, 12);
    expect(t.status).toBe('provisional');
  });
});

describe('rollUpRecords widens the uncertainty of a total for missing and estimated time', () => {
  it('widens 0.8 % to √(0.64 + 28.867513²) = 28.878596 % when 5 of 25 hours have no record (coverage 0.8)', () => {
    // Rule of widenForUnmeasuredTime: a = Q (1 − c)/c, U = 2a/√3 (GUM §4.3.7): 200 × 0.2/(0.8 × √3) = 28.867513, by hand.
    const t = rollUpRecords(allHours().slice(0, 20), longDay, { nowMs: longDay.endMs });
    expect(t.coverage).toBeCloseTo(0.8, 12);
    expect(t.uncertaintyPercent).toBeCloseTo(28.878596, 5);
  });
  it('widens 0.8 % to √(0.64 + 23.094011²) = 23.107863 % when 5 of 25 equal hours rest on substituted readings', () => {
    // s = 5/25 = 0.2 of the mass: 200 × 0.2/√3 = 23.094011, by hand.
    const t = rollUpRecords(
      allHours((k) => (k < 5 ? { flags: ['substituted'] } : {})),
      longDay,
      { nowMs: longDay.endMs },
    );
    expect(t.uncertaintyPercent).toBeCloseTo(23.107863, 5);
  });
});
