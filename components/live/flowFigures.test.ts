/**
 * Expected values: NIST SP 811 (2008), Appendix B.8, exact: 1 ft³ = 0.028316846592 m³;
 * 1 barrel (42 US gal) = 0.158987294928 m³; 1 lb = 0.45359237 kg; 1 Btu_IT = 1055.05585262 J.
 * An hour is 3600 s and a day 86 400 s by definition.
 */
import { flowFigures, fluidFamily } from './flowFigures';

const CUBIC_FOOT_M3 = 0.028316846592;
const BARREL_M3 = 0.158987294928;
const POUND_KG = 0.45359237;
const BTU_IT_J = 1055.05585262;

const flow = {
  massFlowKgPerS: 1,
  standardVolumeFlowM3PerS: 1,
  todayMassKg: 1000,
  todayStandardVolumeM3: 1000 * CUBIC_FOOT_M3,
  todayEnergyJ: 1e6 * BTU_IT_J,
};

describe('fluidFamily', () => {
  it('shows steam as steam, water and other liquids as liquid, and every gas (or an unknown fluid) as gas', () => {
    expect(fluidFamily('steam')).toBe('steam');
    expect(fluidFamily('water')).toBe('liquid');
    expect(fluidFamily('liquid')).toBe('liquid');
    expect(fluidFamily('natural-gas')).toBe('gas');
    expect(fluidFamily('ideal-gas')).toBe('gas');
    expect(fluidFamily(undefined)).toBe('gas');
  });
});

describe('flowFigures', () => {
  it('shows gas on a US site in Mscf/d and Mscf: 1 m³/s is 3051.19 Mscf/d, 28.316 846 592 m³ is 1 Mscf', () => {
    const figures = flowFigures(flow, 'gas', 'us');
    expect(figures).toMatchObject({ rateUnit: 'Mscf/d', totalUnit: 'Mscf', basis: 'volume at base conditions' });
    expect(figures.rate).toBeCloseTo(86_400 / (1000 * CUBIC_FOOT_M3), 6);
    expect(figures.total).toBeCloseTo(1, 12);
  });

  it('shows gas on an SI site in m³/h at base conditions', () => {
    const figures = flowFigures(flow, 'gas', 'si');
    expect(figures).toMatchObject({ rateUnit: 'm³/h', totalUnit: 'm³' });
    expect(figures.rate).toBeCloseTo(3600, 9);
    expect(figures.total).toBeCloseTo(1000 * CUBIC_FOOT_M3, 12);
  });

  it('shows liquid on a US site in bbl/d: one barrel a second is 86 400 bbl/d', () => {
    const figures = flowFigures(
      { ...flow, standardVolumeFlowM3PerS: BARREL_M3, todayStandardVolumeM3: BARREL_M3 },
      'liquid',
      'us',
    );
    expect(figures).toMatchObject({ rateUnit: 'bbl/d', totalUnit: 'bbl' });
    expect(figures.rate).toBeCloseTo(86_400, 6);
    expect(figures.total).toBeCloseTo(1, 12);
  });

  it('shows steam as mass: 1 kg/s is 7936.64 lb/h on a US site and 3.6 t/h on an SI site', () => {
    const us = flowFigures(flow, 'steam', 'us');
    expect(us).toMatchObject({ rateUnit: 'lb/h', totalUnit: 'lb', basis: 'mass' });
    expect(us.rate).toBeCloseTo(3600 / POUND_KG, 6);
    expect(us.total).toBeCloseTo(1000 / POUND_KG, 6);
    const si = flowFigures(flow, 'steam', 'si');
    expect(si).toMatchObject({ rateUnit: 't/h', totalUnit: 't' });
    expect(si.rate).toBeCloseTo(3.6, 12);
    expect(si.total).toBeCloseTo(1, 12);
  });

  it('shows energy in MMBtu on a US site and GJ on an SI site (1 MMBtu = 1.05505585262 GJ)', () => {
    expect(flowFigures(flow, 'gas', 'us').energy?.unit).toBe('MMBtu');
    expect(flowFigures(flow, 'gas', 'us').energy?.value).toBeCloseTo(1, 12);
    expect(flowFigures(flow, 'gas', 'si').energy).toEqual({ value: expect.any(Number), unit: 'GJ' });
    expect(flowFigures(flow, 'gas', 'si').energy?.value).toBeCloseTo(1.05505585262, 12);
  });

  it('shows no rate when the server could not compute one, and no energy when it has none', () => {
    const figures = flowFigures(
      { ...flow, massFlowKgPerS: null, standardVolumeFlowM3PerS: null, todayEnergyJ: null },
      'gas',
      'us',
    );
    expect(figures.rate).toBeNull();
    expect(figures.energy).toBeNull();
    expect(flowFigures({ ...flow, massFlowKgPerS: null }, 'steam', 'si').rate).toBeNull();
  });
});
