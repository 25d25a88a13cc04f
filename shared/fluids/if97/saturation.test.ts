import { saturationPressurePa, saturationTemperatureK } from './saturation';
import { SATURATION_PRESSURE_TABLE_35, SATURATION_TEMPERATURE_TABLE_36 } from './release-verification-tables';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('IAPWS-IF97 region 4 (saturation line)', () => {
  // R7-97(2012) Table 35 [mem]; psat(500 K) = 2.63889776 MPa is also in TRADE.md §4.
  it.each(SATURATION_PRESSURE_TABLE_35.map((r) => [r.temperatureK, r.pressureMPa] as const))(
    'gives psat(%s K) = %s MPa (R7-97(2012) Table 35)',
    (t, p) => {
      expect(rel(saturationPressurePa(t) / 1e6, p)).toBeLessThan(1e-8);
    },
  );

  // R7-97(2012) Table 36 [mem]; Tsat(1 MPa) = 453.035632 K is also in TRADE.md §4.
  it.each(SATURATION_TEMPERATURE_TABLE_36.map((r) => [r.pressureMPa, r.temperatureK] as const))(
    'gives Tsat(%s MPa) = %s K (R7-97(2012) Table 36)',
    (p, t) => {
      expect(rel(saturationTemperatureK(p * 1e6), t)).toBeLessThan(1e-8);
    },
  );

  it('is consistent between eqs. (30) and (31) (the release states they are inverse to each other)', () => {
    for (let t = 275; t <= 645; t += 10) {
      expect(Math.abs(saturationTemperatureK(saturationPressurePa(t)) - t)).toBeLessThan(1e-6);
    }
  });

  it('reaches the critical point: psat(647.096 K) = 22.064 MPa (R7-97(2012) eq. (4))', () => {
    expect(rel(saturationPressurePa(647.096), 22.064e6)).toBeLessThan(1e-7);
  });

  it('rejects temperatures outside 273.15…647.096 K, naming the field', () => {
    expect(() => saturationPressurePa(650)).toThrow(/saturationPressurePa: temperatureK/);
    expect(() => saturationPressurePa(NaN)).toThrow(/saturationPressurePa: temperatureK/);
    expect(() => saturationTemperatureK(23e6)).toThrow(/saturationTemperatureK: pressurePa/);
    expect(() => saturationTemperatureK(100)).toThrow(/saturationTemperatureK: pressurePa/);
  });
});
