import { leeGonzalezEakinViscosityPaS } from './lee-gonzalez-eakin-viscosity';

describe('leeGonzalezEakinViscosityPaS', () => {
  it('gives methane at 15 °C and 1 atm within 4 % of 11.0 µPa·s (handbook value [mem]; the correlation claims 2–4 %)', () => {
    // Methane density at 15 °C, 1 atm ≈ 0.678 kg/m³ (ideal gas, M = 16.043 g/mol).
    expect(Math.abs(leeGonzalezEakinViscosityPaS(0.678, 288.15, 0.016043) / 11.0e-6 - 1)).toBeLessThan(0.04);
  });

  it("rises with density (dense gas) as the correlation's exp(Xρ^Y) factor requires", () => {
    const low = leeGonzalezEakinViscosityPaS(1, 300, 0.0175);
    const high = leeGonzalezEakinViscosityPaS(100, 300, 0.0175);
    expect(high).toBeGreaterThan(low * 1.1);
  });

  it('rejects bad input, naming the field', () => {
    expect(() => leeGonzalezEakinViscosityPaS(0, 300, 0.017)).toThrow(/leeGonzalezEakinViscosityPaS: densityKgPerM3/);
    expect(() => leeGonzalezEakinViscosityPaS(1, NaN, 0.017)).toThrow(/leeGonzalezEakinViscosityPaS: temperatureK/);
    expect(() => leeGonzalezEakinViscosityPaS(1, 300, -1)).toThrow(/leeGonzalezEakinViscosityPaS: molarMassKgPerMol/);
  });
});
