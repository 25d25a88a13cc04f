import { prepareDetailMixture } from './prepare-detail-mixture';
import { canonicalComponentName } from './detail-composition';
import { NIST_MIXTURE } from './detail-verification-data';

describe('prepareDetailMixture', () => {
  it('reproduces the mixture parameters of the NIST test mixture (data sheet §10(a) debugging values [calc, not NIST])', () => {
    // K³ = 0.10598159795160086 dm³/mol from the sheet's verification re-implementation.
    const mix = prepareDetailMixture(NIST_MIXTURE);
    expect(Math.abs(mix.k3 / 0.10598159795160086 - 1)).toBeLessThan(1e-13);
    expect(mix.molarMassGPerMol).toBeCloseTo(20.54333051, 10); // NIST Detail_test_01.cpp
  });

  it('gives the DETAIL molar mass of the Gulf Coast gas, 16.799439 g/mol (data sheet §10(b) [calc], not the sheet row 16.7989 which uses GERG-2008 masses)', () => {
    const mix = prepareDetailMixture({
      methane: 0.965222,
      nitrogen: 0.002595,
      'carbon-dioxide': 0.005956,
      ethane: 0.018186,
      propane: 0.004596,
      isobutane: 0.000977,
      'n-butane': 0.001007,
      isopentane: 0.000473,
      'n-pentane': 0.000324,
      'n-hexane': 0.000664,
    });
    expect(mix.molarMassGPerMol).toBeCloseTo(16.799439, 6);
  });

  it.each([
    ['Carbon Dioxide', 'carbon-dioxide'],
    ['carbon_dioxide', 'carbon-dioxide'],
    ['  N-Butane ', 'n-butane'],
    ['Hydrogen Sulfide', 'hydrogen-sulfide'],
    ['hydrogen sulphide', 'hydrogen-sulfide'],
    ['CO2', 'carbon-dioxide'],
    ['i-butane', 'isobutane'],
  ])('reads the component name %p as %p', (given, canonical) => {
    expect(canonicalComponentName(given)).toBe(canonical);
  });

  it('accepts lenient names and gives the same mixture as the canonical ones', () => {
    const a = prepareDetailMixture({ methane: 0.9, 'carbon-dioxide': 0.1 });
    const b = prepareDetailMixture({ Methane: 0.9, 'Carbon Dioxide': 0.1 });
    expect(Array.from(b.moleFractions)).toEqual(Array.from(a.moleFractions));
    expect(b.k3).toBe(a.k3);
  });

  it('rejects an unknown component with an error naming it', () => {
    expect(() => prepareDetailMixture({ methane: 0.9, neon: 0.1 })).toThrow(
      /prepareDetailMixture: .*unknown component "neon"/,
    );
  });

  it('rejects a negative or non-finite fraction with an error naming the component', () => {
    expect(() => prepareDetailMixture({ methane: 1.1, ethane: -0.1 })).toThrow(
      /prepareDetailMixture: composition\["ethane"\]/,
    );
    expect(() => prepareDetailMixture({ methane: NaN })).toThrow(/composition\["methane"\]/);
  });

  it('rejects a component given twice under two spellings', () => {
    expect(() => prepareDetailMixture({ methane: 0.5, Methane: 0.5 })).toThrow(/methane twice/);
  });

  it('rejects an all-zero composition', () => {
    expect(() => prepareDetailMixture({ methane: 0 })).toThrow(/prepareDetailMixture: composition/);
  });

  it('normalises a sum off by more than 1e-4 with a fluid.compositionNormalised warning', () => {
    const mix = prepareDetailMixture({ methane: 0.95, ethane: 0.04 });
    expect(mix.warnings.map((w) => w.code)).toContain('fluid.compositionNormalised');
    expect(mix.moleFractions[0] + mix.moleFractions[3]).toBeCloseTo(1, 15);
  });

  it('normalises silently when the sum is within 1e-4 of 1', () => {
    const mix = prepareDetailMixture({ methane: 0.95, ethane: 0.04995 });
    expect(mix.warnings.map((w) => w.code)).not.toContain('fluid.compositionNormalised');
  });

  it('hints at mol % when the fractions sum to about 100', () => {
    const mix = prepareDetailMixture({ methane: 95, ethane: 5 });
    expect(mix.warnings.find((w) => w.code === 'fluid.compositionNormalised')?.message).toMatch(/mol %/);
  });

  it('warns about hydrogen sulfide (sour gas caution) and outside-normal-range compositions', () => {
    const codes = prepareDetailMixture(NIST_MIXTURE).warnings.map((w) => w.code);
    expect(codes).toContain('fluid.sourGas');
    expect(codes).toContain('aga8.compositionOutsideNormalRange');
    expect(prepareDetailMixture({ methane: 0.97, ethane: 0.03 }).warnings).toEqual([]);
  });
});
