/**
 * Expected values: 1 mol % = 0.01 mole fraction (ISO 80000-1, the percent); 1 g/mol =
 * 0.001 kg/mol (SI prefix milli); ISO 80000-5, T/K = t/°C + 273.15; AGA Report No. 8 (DETAIL
 * method) lists 21 components (from memory).
 */
import { DETAIL_COMPONENTS } from '@/shared/fluids/aga8/detail-constants';
import {
  commonComponents,
  compositionFromDraft,
  compositionUnitOfSum,
  describeFluid,
  draftFromFluid,
  emptyFluidDraft,
  fluidFromDraft,
  otherComponents,
  switchCompositionUnit,
} from './fluidDraft';

describe('the component lists', () => {
  it('offers every one of the 21 AGA 8 DETAIL components once, common ones first', () => {
    expect(DETAIL_COMPONENTS).toHaveLength(21);
    expect([...commonComponents, ...otherComponents].sort()).toEqual([...DETAIL_COMPONENTS].sort());
    expect(commonComponents[0]).toBe('methane');
  });
});

describe('compositionFromDraft', () => {
  it('reads mol % as hundredths of a mole fraction', () => {
    const draft = {
      ...emptyFluidDraft,
      compositionUnit: 'percent' as const,
      composition: { methane: '96.5', ethane: '3.5' },
    };
    const composition = compositionFromDraft(draft);
    expect(composition.methane).toBeCloseTo(0.965, 12);
    expect(composition.ethane).toBeCloseTo(0.035, 12);
  });

  it('takes mole fractions as typed, skips blank components and marks a bad one NaN', () => {
    const draft = { ...emptyFluidDraft, composition: { methane: '0.9', ethane: ' ', propane: 'some' } };
    const composition = compositionFromDraft(draft);
    expect(Object.keys(composition)).toEqual(['methane', 'propane']);
    expect(composition.methane).toBe(0.9);
    expect(composition.propane).toBeNaN();
  });
});

describe('fluidFromDraft', () => {
  it('sends an ideal gas’s molar mass in kg/mol and leaves out a blank compressibility', () => {
    const fluid = fluidFromDraft({ ...emptyFluidDraft, kind: 'ideal-gas', molarMassGPerMol: '28.96442' });
    expect(Object.keys(fluid).sort()).toEqual(['kind', 'molarMassKgPerMol']);
    expect(fluid.molarMassKgPerMol).toBeCloseTo(0.02896442, 12);
  });

  it('sends a liquid’s reference temperature in K', () => {
    const fluid = fluidFromDraft({
      ...emptyFluidDraft,
      kind: 'liquid',
      densityKgPerM3: '850',
      referenceTemperatureC: '15',
      expansionPerK: '0.0009',
    });
    expect(fluid).toMatchObject({ kind: 'liquid', densityKgPerM3: 850, expansionPerK: 0.0009 });
    expect(fluid.referenceTemperatureK).toBeCloseTo(288.15, 10);
  });

  it('adds typed overrides of κ and viscosity to any fluid, and nothing else to steam', () => {
    expect(fluidFromDraft({ ...emptyFluidDraft, kind: 'steam' })).toEqual({ kind: 'steam' });
    expect(
      fluidFromDraft({
        ...emptyFluidDraft,
        composition: { methane: '1' },
        isentropicExponent: '1.3',
        viscosityPaS: '1.1e-5',
      }),
    ).toEqual({ kind: 'natural-gas', composition: { methane: 1 }, isentropicExponent: 1.3, viscosityPaS: 1.1e-5 });
  });
});

describe('draftFromFluid', () => {
  it('writes a natural gas’s mole fractions as text, in fractions', () => {
    const draft = draftFromFluid({ kind: 'natural-gas', composition: { methane: 0.965222, ethane: 0.034778 } });
    expect(draft).toMatchObject({
      kind: 'natural-gas',
      compositionUnit: 'fraction',
      composition: { methane: '0.965222', ethane: '0.034778' },
    });
  });

  it('writes an ideal gas’s molar mass in g/mol and a liquid’s reference temperature in °C', () => {
    expect(draftFromFluid({ kind: 'ideal-gas', molarMassKgPerMol: 0.02897, compressibility: 0.998 })).toMatchObject({
      molarMassGPerMol: '28.97',
      compressibility: '0.998',
    });
    expect(
      draftFromFluid({ kind: 'liquid', densityKgPerM3: 998.2, referenceTemperatureK: 293.15, expansionPerK: 0.00021 }),
    ).toMatchObject({ densityKgPerM3: '998.2', referenceTemperatureC: '20', expansionPerK: '0.00021' });
  });
});

describe('describeFluid', () => {
  it('sums up each kind of fluid in a few words', () => {
    expect(describeFluid({ kind: 'natural-gas', composition: { methane: 0.9, ethane: 0.1 } })).toBe(
      'natural gas, 2 components',
    );
    expect(describeFluid({ kind: 'ideal-gas', molarMassKgPerMol: 0.02897 })).toBe('ideal gas, M 28.97 g/mol');
    expect(
      describeFluid({ kind: 'liquid', densityKgPerM3: 850, referenceTemperatureK: 288.15, expansionPerK: 0 }),
    ).toBe('liquid, 850 kg/m³');
    expect(describeFluid({ kind: 'steam' })).toBe('steam');
    expect(describeFluid(undefined)).toBe('no fluid');
  });
});

describe('switchCompositionUnit', () => {
  // 1 mol % = 0.01 mole fraction (ISO 80000-1, the percent).
  const typed = (compositionUnit: 'fraction' | 'percent', composition: Record<string, string>) => ({
    ...emptyFluidDraft,
    compositionUnit,
    composition,
  });

  it('turns 90, 5, 2 and 3 mol % into mole fractions 0.9, 0.05, 0.02 and 0.03, once', () => {
    const switched = switchCompositionUnit(
      typed('percent', { methane: '90', ethane: '5', propane: '2', nitrogen: '3' }),
      'fraction',
    );
    expect(switched.compositionUnit).toBe('fraction');
    expect(switched.composition).toEqual({ methane: '0.9', ethane: '0.05', propane: '0.02', nitrogen: '0.03' });
  });

  it('turns mole fractions back into the mol % first typed', () => {
    const start = typed('percent', { methane: '90', ethane: '5', propane: '2', nitrogen: '3' });
    const back = switchCompositionUnit(switchCompositionUnit(start, 'fraction'), 'percent');
    expect(back).toEqual(start);
  });

  it('converts a composition still being typed (90, 5, 2 mol %) both ways', () => {
    const start = typed('percent', { methane: '90', ethane: '5', propane: '2' });
    const fractions = switchCompositionUnit(start, 'fraction');
    expect(fractions.composition).toEqual({ methane: '0.9', ethane: '0.05', propane: '0.02' });
    expect(compositionFromDraft(fractions).methane).toBeCloseTo(0.9, 12);
    expect(switchCompositionUnit(fractions, 'percent').composition).toEqual(start.composition);
  });

  it('keeps numbers that already add up to 100 as typed when mol % is chosen after typing them', () => {
    const switched = switchCompositionUnit(typed('fraction', { methane: '96', ethane: '3', nitrogen: '1' }), 'percent');
    expect(switched.compositionUnit).toBe('percent');
    expect(switched.composition).toEqual({ methane: '96', ethane: '3', nitrogen: '1' });
  });

  it('keeps numbers that already add up to 1 as typed when mole fraction is chosen after typing them', () => {
    const switched = switchCompositionUnit(typed('percent', { methane: '0.96', ethane: '0.04' }), 'fraction');
    expect(switched.composition).toEqual({ methane: '0.96', ethane: '0.04' });
  });

  it('leaves text that is not a number and blank components as they are', () => {
    const switched = switchCompositionUnit(typed('percent', { methane: '90', ethane: 'abc', propane: '' }), 'fraction');
    expect(switched.composition).toEqual({ methane: '0.9', ethane: 'abc', propane: '' });
  });

  it('returns the same draft when the unit does not change', () => {
    const start = typed('percent', { methane: '90' });
    expect(switchCompositionUnit(start, 'percent')).toBe(start);
  });
});

describe('compositionUnitOfSum', () => {
  it('reads a sum near 1 as mole fractions, near 100 as mol %, and anything else as neither', () => {
    expect(compositionUnitOfSum({ ...emptyFluidDraft, composition: { methane: '0.97', ethane: '0.03' } })).toBe(
      'fraction',
    );
    expect(compositionUnitOfSum({ ...emptyFluidDraft, composition: { methane: '97', ethane: '3' } })).toBe('percent');
    expect(compositionUnitOfSum({ ...emptyFluidDraft, composition: { methane: '40' } })).toBeUndefined();
  });
});
