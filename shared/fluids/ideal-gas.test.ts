import { idealGasDensityKgPerM3, MOLAR_GAS_CONSTANT_J_PER_MOL_K } from './ideal-gas';

describe('idealGasDensityKgPerM3', () => {
  it('uses R = 8.314462618 J/(mol K) (CODATA 2018, exact product N_A k)', () => {
    expect(MOLAR_GAS_CONSTANT_J_PER_MOL_K).toBeCloseTo(6.02214076e23 * 1.380649e-23, 9);
  });

  it('gives 1/22.41397 kmol/m³ for M = 1 kg/mol at 0 °C and 101.325 kPa (TRADE.md §4 ideal molar volume [calc])', () => {
    expect(Math.abs(1000 / idealGasDensityKgPerM3(101325, 273.15, 1) - 22.41397)).toBeLessThan(5e-6);
  });

  it('divides by Z', () => {
    expect(idealGasDensityKgPerM3(5e6, 300, 0.016, 0.9) * 0.9).toBeCloseTo(idealGasDensityKgPerM3(5e6, 300, 0.016), 12);
  });

  it.each(['pressurePa', 'temperatureK', 'molarMassKgPerMol', 'compressibility'])(
    'rejects a bad %s, naming it',
    (field) => {
      const args: [number, number, number, number] = [1e5, 300, 0.029, 1];
      args[['pressurePa', 'temperatureK', 'molarMassKgPerMol', 'compressibility'].indexOf(field)] = -1;
      expect(() => idealGasDensityKgPerM3(...args)).toThrow(new RegExp(`idealGasDensityKgPerM3: ${field}`));
    },
  );
});
