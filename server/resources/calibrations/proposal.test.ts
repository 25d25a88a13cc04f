import { suggestedFactor } from './proposal';

/**
 * The flow factor of a failed as-found, worked by hand. ISO 5167-1:2022 eq. 1 gives
 * qm ∝ √(Δp·ρ1), and for a gas ρ1 = p·M/(Z·R·T) (ideal gas law with Z), so flow ∝ √Δp, ∝ √p
 * (absolute) and ∝ 1/√T (kelvin).
 */
const point = (appliedValue: number, indicatedValue: number) => ({
  appliedValue,
  indicatedValue,
  errorPercentOfSpan: 0,
  tolerancePercentOfSpan: 0.1,
  pass: false,
});
const site = { gauge: false, atmosphericPressurePa: 101_325 };

describe('suggestedFactor', () => {
  it('takes a temperature error in kelvin and gives √(1+e)', () => {
    // 20 °C = 293.15 K read as 20.5 °C = 293.65 K: e = 0.5/293.15; factor = √(293.65/293.15) = 1.000 852 5.
    const s = suggestedFactor('temperature', 'degC', [point(20, 20.5)], site)!;
    expect(s.meanErrorFractionOfReading).toBeCloseTo(0.5 / 293.15, 12);
    expect(s.factor).toBeCloseTo(1.0008524, 7);
  });

  it('takes a gauge static pressure as absolute (plus the site’s atmosphere) and gives 1/√(1+e)', () => {
    // 1000 kPa(g) = 1101.325 kPa abs read as 1002 kPa(g): e = 2/1101.325; factor = √(1101.325/1103.325) = 0.999 093 2.
    const s = suggestedFactor('static-pressure', 'kPa', [point(1000, 1002)], { ...site, gauge: true })!;
    expect(s.meanErrorFractionOfReading).toBeCloseTo(2 / 1101.325, 12);
    expect(s.factor).toBeCloseTo(0.9990932, 7);
  });

  it('leaves out DP points at zero, and gives nothing when every point is at zero', () => {
    const s = suggestedFactor('differential-pressure', 'kPa', [point(0, 0.02), point(25, 25.06)], site)!;
    expect(s.points.map((p) => p.appliedValue)).toEqual([25]);
    expect(s.meanErrorFractionOfReading).toBeCloseTo(0.06 / 25, 12);
    expect(suggestedFactor('differential-pressure', 'kPa', [point(0, 0.02)], site)).toBeNull();
  });
});
