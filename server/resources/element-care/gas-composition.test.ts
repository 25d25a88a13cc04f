import { analysedComposition } from './gas-composition';

const fieldOf = (f: () => unknown) => {
  try {
    f();
  } catch (err) {
    return (err as { field?: string }).field;
  }
  return 'no error';
};

describe('analysedComposition', () => {
  it('reads mol % in laboratory spellings as mole fractions by canonical name (90 + 6 + 2 + 2 = 100 %)', () => {
    const r = analysedComposition({ Methane: 90, C2H6: 6, CO2: 2, N2: 2 }, 0.0001);
    expect(r.basis).toBe('percent');
    expect(r.composition).toEqual({ methane: 0.9, ethane: 0.06, 'carbon-dioxide': 0.02, nitrogen: 0.02 });
  });

  it('accepts fractions summing to 0.99995 (|Σ − 1| = 5e-5 ≤ 1e-4) and keeps them as given', () => {
    const r = analysedComposition({ methane: 0.95, ethane: 0.04995 }, 0.0001);
    expect(r.basis).toBe('fraction');
    expect(r.composition).toEqual({ methane: 0.95, ethane: 0.04995 });
  });

  it('refuses fractions summing to 0.9998 (|Σ − 1| = 2e-4 > 1e-4) naming components, and takes them with sumTolerance 0.0005', () => {
    expect(fieldOf(() => analysedComposition({ methane: 0.95, ethane: 0.0498 }, 0.0001))).toBe('components');
    expect(analysedComposition({ methane: 0.95, ethane: 0.0498 }, 0.0005).basis).toBe('fraction');
  });

  it('refuses mol % summing to 99.9 (|Σ − 100| = 0.1 > 100 × 1e-4)', () => {
    expect(fieldOf(() => analysedComposition({ methane: 94.9, ethane: 5 }, 0.0001))).toBe('components');
  });

  it('names an unknown component and a component given twice under two spellings', () => {
    expect(fieldOf(() => analysedComposition({ methane: 0.9, unobtainium: 0.1 }, 0.0001))).toBe(
      'components.unobtainium',
    );
    expect(fieldOf(() => analysedComposition({ CO2: 0.5, 'carbon dioxide': 0.5 }, 0.0001))).toBe(
      'components.carbon dioxide',
    );
  });
});
