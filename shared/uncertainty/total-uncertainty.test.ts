import { totalUncertainty, widenForUnmeasuredTime } from './total-uncertainty';

describe('totalUncertainty (systematic fully correlated, random uncorrelated)', () => {
  it('keeps a fully correlated systematic 1 % at 1 % of the total, however many samples', () => {
    const samples = Array.from({ length: 100 }, () => ({ quantity: 10, systematicPercent: 1, randomPercent: 0 }));
    expect(totalUncertainty(samples).expandedPercent).toBeCloseTo(1, 12);
  });

  it('shrinks an uncorrelated random 1 % by √N: 100 equal samples give 0.1 %', () => {
    const samples = Array.from({ length: 100 }, () => ({ quantity: 10, systematicPercent: 0, randomPercent: 1 }));
    expect(totalUncertainty(samples).expandedPercent).toBeCloseTo(0.1, 12);
  });

  it('weights by quantity and combines the parts in quadrature: two samples 3 and 1 with 2 % / 1 % systematic and 1 % random', () => {
    const r = totalUncertainty([
      { quantity: 3, systematicPercent: 2, randomPercent: 1 },
      { quantity: 1, systematicPercent: 1, randomPercent: 1 },
    ]);
    // systematic (3·2 + 1·1)/4 = 1.75; random sqrt(9 + 1)/4 = 0.790569; total sqrt(1.75² + 0.790569²) = 1.920286
    expect(r.total).toBe(4);
    expect(r.systematicPercent).toBeCloseTo(1.75, 12);
    expect(r.randomPercent).toBeCloseTo(Math.sqrt(10) / 4, 12);
    expect(r.expandedPercent).toBeCloseTo(1.920286, 6);
  });

  it('gives 0 % for an empty or zero total', () => {
    expect(totalUncertainty([]).expandedPercent).toBe(0);
  });
});

describe('widenForUnmeasuredTime (rectangular rule, GUM §4.3.7 and §6.2)', () => {
  it('leaves a fully covered, fully measured total unchanged', () => {
    expect(widenForUnmeasuredTime(0.8, 1)).toBe(0.8);
  });
  it('adds 200 (1 − c)/(c √3) % for a coverage c: 1 % at c = 0.9 becomes √(1 + 12.830006²) = 12.868918 %', () => {
    // By hand: 200 × 0.1 / (0.9 × 1.7320508) = 20 / 1.5588457 = 12.830006.
    expect(widenForUnmeasuredTime(1, 0.9)).toBeCloseTo(12.868918, 5);
  });
  it('adds 200 s/√3 % for an estimated share s: 0.8 % with s = 0.25 becomes √(0.64 + 28.867513²) = 28.878596 %', () => {
    expect(widenForUnmeasuredTime(0.8, 1, 0.25)).toBeCloseTo(28.878596, 5);
  });
  it('refuses a coverage above 1 or a share outside [0, 1], naming the field', () => {
    expect(() => widenForUnmeasuredTime(1, 1.5)).toThrow(/coverage/);
    expect(() => widenForUnmeasuredTime(1, 1, -0.1)).toThrow(/estimatedShare/);
  });
});
