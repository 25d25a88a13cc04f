import { waterViscosityPaS } from './water-viscosity';
import { VISCOSITY_TABLE_4 } from './release-verification-tables';

describe('water viscosity by IAPWS R12-08 (industrial use, no critical enhancement)', () => {
  // R12-08 Table 4 [mem]; (998, 298.15), (1000, 373.15), (1, 873.15) are also in TRADE.md §4;
  // all confirmed by python3-iapws in if97-vs-python-iapws.test.ts.
  it.each(VISCOSITY_TABLE_4.map((r) => [r.densityKgPerM3, r.temperatureK, r.viscosityMicroPaS] as const))(
    'gives μ(ρ = %s kg/m³, T = %s K) = %s µPa·s (R12-08 Table 4)',
    (rho, t, mu) => {
      expect(Math.abs(waterViscosityPaS(rho, t) * 1e6 - mu)).toBeLessThan(1e-6 * 0.5 + 1e-9 * mu);
    },
  );

  it('rejects a non-positive density or temperature, naming the field', () => {
    expect(() => waterViscosityPaS(0, 300)).toThrow(/waterViscosityPaS: densityKgPerM3/);
    expect(() => waterViscosityPaS(1000, NaN)).toThrow(/waterViscosityPaS: temperatureK/);
  });
});
