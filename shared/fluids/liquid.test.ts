import { liquidDensityKgPerM3 } from './liquid';

describe('liquidDensityKgPerM3', () => {
  it('gives 850/(1 + 9e-4 × 10) = 842.4182359 kg/m³ ten kelvin above the reference (hand calculation)', () => {
    expect(liquidDensityKgPerM3(298.15, 850, 288.15, 9e-4)).toBeCloseTo(842.4182359, 6);
  });

  it('returns the reference density at the reference temperature and is denser when colder', () => {
    expect(liquidDensityKgPerM3(288.15, 850, 288.15, 9e-4)).toBe(850);
    expect(liquidDensityKgPerM3(278.15, 850, 288.15, 9e-4)).toBeGreaterThan(850);
  });

  it('rejects bad input, naming the field', () => {
    expect(() => liquidDensityKgPerM3(NaN, 850, 288.15, 9e-4)).toThrow(/liquidDensityKgPerM3: temperatureK/);
    expect(() => liquidDensityKgPerM3(300, 0, 288.15, 9e-4)).toThrow(/liquidDensityKgPerM3: densityKgPerM3/);
    expect(() => liquidDensityKgPerM3(300, 850, -1, 9e-4)).toThrow(/liquidDensityKgPerM3: referenceTemperatureK/);
    expect(() => liquidDensityKgPerM3(300, 850, 288.15, Infinity)).toThrow(/liquidDensityKgPerM3: expansionPerK/);
    expect(() => liquidDensityKgPerM3(2000, 850, 288.15, -1e-3)).toThrow(/liquidDensityKgPerM3: expansionPerK/);
  });
});
