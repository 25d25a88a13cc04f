import { signalLevel } from './signal-levels';

/**
 * Expected levels worked by hand from NAMUR NE 43 as remembered [mem] (measurement 3.8–20.5 mA,
 * failure ≤ 3.6 mA or ≥ 21 mA) on a 0–100 range, where 1 mA = 100/16 = 6.25 units:
 * 20.5 mA = 103.125, 21 mA = 106.25, 3.8 mA = −1.25, 3.6 mA = −2.5.
 */
describe('signalLevel', () => {
  it('reads the linear over- and under-range inside the saturation limits as in span', () => {
    expect(signalLevel(50, 0, 100)).toBe('in-span');
    expect(signalLevel(103, 0, 100)).toBe('in-span');
    expect(signalLevel(-1.2, 0, 100)).toBe('in-span');
  });

  it('finds a reading at 20.5 mA (103.125 % of span) or at 3.8 mA saturated, within display rounding', () => {
    expect(signalLevel(103.125, 0, 100)).toBe('saturated-high');
    expect(signalLevel(25.7813, 0, 25)).toBe('saturated-high'); // 25 × 1.03125 = 25.78125, shown rounded
    expect(signalLevel(25.7812, 0, 25)).toBe('saturated-high');
    expect(signalLevel(-1.25, 0, 100)).toBe('saturated-low');
  });

  it('finds a reading at or beyond 21 mA or at or below 3.6 mA a failure level', () => {
    expect(signalLevel(106.25, 0, 100)).toBe('failure-high');
    expect(signalLevel(-2.5, 0, 100)).toBe('failure-low');
  });

  it('maps a range that does not start at zero', () => {
    // 20–120: span 100, 20.5 mA = 123.125.
    expect(signalLevel(123.125, 20, 120)).toBe('saturated-high');
    expect(signalLevel(70, 20, 120)).toBe('in-span');
  });

  it('refuses a range whose upper value is not above the lower', () => {
    expect(() => signalLevel(1, 5, 5)).toThrow(/upperRange must exceed lowerRange/);
  });
});
