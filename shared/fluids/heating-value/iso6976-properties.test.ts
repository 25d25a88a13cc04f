import { iso6976Properties } from './iso6976-properties';

const annexD1 = {
  methane: 0.933212,
  ethane: 0.025656,
  propane: 0.015368,
  nitrogen: 0.01035,
  'carbon-dioxide': 0.015414,
};

describe('ISO 6976:2016 calorific value and relative density', () => {
  // Expected: ISO 6976:2016 Annex D example 1 at 15 °C / 15 °C, 101.325 kPa, as quoted in
  // TRADE.md §4 ([std annex as transcribed by an open implementation]).
  const r = iso6976Properties(annexD1);
  it('gives M = 17.388430 g/mol for Annex D example 1', () => {
    expect((r.molarMassKgPerMol * 1000).toFixed(6)).toBe('17.388430');
  });
  it('gives Z = 0.99776224 for Annex D example 1', () => {
    expect(r.compressibility.toFixed(8)).toBe('0.99776224');
  });
  it('gives a superior volumetric calorific value of 38.410611 MJ/m³ for Annex D example 1', () => {
    expect((r.superiorVolumetricJPerM3 / 1e6).toFixed(6)).toBe('38.410611');
  });

  it('keeps the defining relations between the bases (ISO 6976:2016 clause 5–7 formulas, checked by hand arithmetic)', () => {
    // mass CV = molar CV / M; volumetric = molar · p/(RT) / Z; R = 8.3144621 (Table A.1).
    expect(r.superiorMassJPerKg).toBeCloseTo(r.superiorMolarJPerMol / r.molarMassKgPerMol, 3);
    expect(r.superiorVolumetricJPerM3).toBeCloseTo(
      (r.superiorMolarJPerMol * 101325) / (8.3144621 * 288.15) / r.compressibility,
      3,
    );
    // Relative density with Z_air(15 °C) = 0.999595 (Table A.4) and M_air = 28.96546 (Table A.3).
    expect(r.relativeDensity).toBeCloseTo(((17.38843008292 / 28.96546) * 0.999595) / 0.9977622439155842, 12);
    expect(r.superiorWobbeIndexJPerM3).toBeCloseTo(r.superiorVolumetricJPerM3 / Math.sqrt(r.relativeDensity), 6);
  });

  it('gives an inferior value lower by the water formed: Σ x (b/2) L°(15 °C), L° = 44.431 kJ/mol (Table A.5)', () => {
    const water = (0.933212 * 4 + 0.025656 * 6 + 0.015368 * 8) / 2; // mol H2O per mol gas
    expect((r.superiorMolarJPerMol - r.inferiorMolarJPerMol) / 1e3).toBeCloseTo(water * 44.431, 9);
  });

  it('gives hydrogen a superior molar value of 285.83 kJ/mol at 25 °C, the enthalpy of formation of liquid water (common chemistry data [mem])', () => {
    expect(iso6976Properties({ hydrogen: 1 }, { combustionTemperatureK: 298.15 }).superiorMolarJPerMol).toBeCloseTo(
      285830,
      6,
    );
  });

  it('gives water vapour a net calorific value of zero', () => {
    expect(iso6976Properties({ methane: 0.99, water: 0.01 }).inferiorMolarJPerMol).toBeCloseTo(
      0.99 * (891.51 - 2 * 44.431) * 1e3,
      6,
    );
  });

  it('rejects reference temperatures the standard does not tabulate, naming the field', () => {
    expect(() => iso6976Properties(annexD1, { meteringTemperatureK: 298.15 })).toThrow(
      /iso6976Properties: meteringTemperatureK/,
    );
    expect(() => iso6976Properties(annexD1, { combustionTemperatureK: 300 })).toThrow(
      /iso6976Properties: combustionTemperatureK/,
    );
    expect(() => iso6976Properties(annexD1, { meteringPressurePa: 5e6 })).toThrow(
      /iso6976Properties: meteringPressurePa/,
    );
  });

  it('rejects unknown components, naming them', () => {
    expect(() => iso6976Properties({ methane: 0.9, ethylene: 0.1 })).toThrow(/iso6976Properties: .*"ethylene"/);
  });
});
