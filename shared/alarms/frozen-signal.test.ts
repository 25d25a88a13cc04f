import { isFrozenSignal } from './frozen-signal';

describe('isFrozenSignal', () => {
  const limits = { minSamples: 5, maxStdDevShareOfSpan: 1e-5 };
  it('finds a value repeated to the last digit frozen', () => {
    expect(isFrozenSignal([12.345, 12.345, 12.345, 12.345, 12.345], 50, limits)).toBe(true);
  });
  it('finds a live signal varying by 0.01 % of span not frozen (σ of 0/±0.005 ≈ 0.0045 > 5e-4)', () => {
    // sample σ of [12, 12.005, 11.995, 12, 12.005] by hand: mean 12.001, deviations −0.001, 0.004, −0.006, −0.001, 0.004 → Σd² = 7e-5, /4 → σ = 0.00418
    expect(isFrozenSignal([12, 12.005, 11.995, 12, 12.005], 50, limits)).toBe(false);
  });
  it('does not judge with too few readings', () => {
    expect(isFrozenSignal([1, 1, 1], 50, limits)).toBeNull();
  });
  it('refuses a span that is not positive, naming it', () => {
    expect(() => isFrozenSignal([1, 1, 1, 1, 1], 0, limits)).toThrow(/span/);
  });
});
