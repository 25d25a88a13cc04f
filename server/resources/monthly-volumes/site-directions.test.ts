import { siteDirections, type MeterRunMonth } from './use-cases';

/**
 * The site's month keeps forward, reverse and net apart (issue 13 §11). Figures worked by hand:
 * net = the site's forward total − the site's reverse total, each a plain sum over its meter runs.
 */
function month(tag: string, forward: number, reverse?: number): MeterRunMonth {
  return {
    meterRun: { id: tag, tag, name: tag },
    massKg: forward,
    volumeM3: forward * 1.2,
    standardVolumeM3: forward * 1.4,
    energyJ: forward * 5e4,
    coverage: 1,
    flags: [],
    uncertaintyPercent: 1,
    status: 'complete',
    previousMonth: null,
    yearEarlier: null,
    changeFromPreviousMonthPercent: null,
    changeFromYearEarlierPercent: null,
    version: 1,
    correctionsInForce: 0,
    ...(reverse === undefined
      ? {}
      : {
          reverse: {
            flowTimeS: 3600,
            massKg: reverse,
            volumeM3: reverse * 1.2,
            standardVolumeM3: reverse * 1.4,
            energyJ: reverse * 5e4,
          },
          net: { massKg: forward - reverse, volumeM3: 0, standardVolumeM3: 0, energyJ: null },
        }),
  };
}

describe('the site total of a month', () => {
  it('adds nothing when no meter run flowed in reverse (a one-way site keeps its shape)', () => {
    expect(siteDirections([month('A', 1000), month('B', 500)])).toEqual({});
  });

  it('sums the reverse parts and nets them against the whole forward total, one-way runs included', () => {
    // Forward 1000 + 500 + 200 = 1700 kg; reverse 300 + 100 = 400 kg; net 1300 kg.
    const out = siteDirections([month('A', 1000, 300), month('B', 500), month('C', 200, 100)]);
    expect(out.reverse!.massKg).toBeCloseTo(400, 9);
    expect(out.reverse!.standardVolumeM3).toBeCloseTo(560, 9); // 400 × 1.4
    expect(out.reverse!.flowTimeS).toBe(7200); // meter-run seconds: 3600 + 3600
    expect(out.net!.massKg).toBeCloseTo(1300, 9);
    expect(out.net!.volumeM3).toBeCloseTo(1560, 9); // (1700 − 400) × 1.2
    expect(out.net!.standardVolumeM3).toBeCloseTo(1820, 9); // (1700 − 400) × 1.4
    expect(out.net!.energyJ).toBeCloseTo(6.5e7, 0); // (1700 − 400) × 5e4
  });

  it('gives no net energy when a meter run has none', () => {
    const noEnergy = { ...month('B', 500), energyJ: null };
    expect(siteDirections([month('A', 1000, 300), noEnergy]).net!.energyJ).toBeNull();
  });
});
