import { execFileSync } from 'node:child_process';
import { BTU_IT_J } from './other-units';
import { fromSI, toSI, TRANSMITTER_UNIT_CODES, unitQuantity, UNIT_CODES } from './convert-units';
import { WATER_DENSITY_KG_PER_M3 } from './pressure-units';

/**
 * Reference values from Debian's python3-pint (default registry) and python3-iapws (IAPWS-95),
 * asked once for the whole file. /usr/bin/python3 is Debian's (the pyenv python3 on PATH has neither).
 */
const PYTHON = `
import json, pint, iapws
u = pint.UnitRegistry()
si = lambda q: u.Quantity(1, q).to_base_units().magnitude
out = {q: si(q) for q in ['psi','inch_H2O_39F','inch_H2O_60F','bar','mbar','kilopascal','megapascal','cubic_foot','oil_barrel','pound','metric_ton','Btu_it','gigajoule']}
out['degF_100'] = u.Quantity(100, 'degF').to('kelvin').magnitude
out['degC_25'] = u.Quantity(25, 'degC').to('kelvin').magnitude
out['rho_20C'] = iapws.IAPWS95(T=293.15, P=0.101325).rho
out['rho_60F'] = iapws.IAPWS95(T=(60 + 459.67) * 5 / 9, P=0.101325).rho
out['rho_4C'] = iapws.IAPWS95(T=277.15, P=0.101325).rho
out['g_0'] = u.Quantity(1, 'g_0').to_base_units().magnitude
out['inch'] = u.Quantity(1, 'inch').to_base_units().magnitude
print(json.dumps(out))
`;
let ref: Record<string, number>;
beforeAll(() => {
  ref = JSON.parse(execFileSync('/usr/bin/python3', ['-c', PYTHON], { encoding: 'utf8' }));
});

const relativeDifference = (a: number, b: number) => Math.abs(a / b - 1);

describe('toSI against python3-pint (each constant derived from exact definitions)', () => {
  it.each([
    ['psi', 'psi'],
    ['inH2O-4C', 'inch_H2O_39F'],
    ['inH2O-60F', 'inch_H2O_60F'],
    ['bar', 'bar'],
    ['mbar', 'mbar'],
    ['kPa', 'kilopascal'],
    ['MPa', 'megapascal'],
    ['ft3', 'cubic_foot'],
    ['bbl', 'oil_barrel'],
    ['lb', 'pound'],
    ['t', 'metric_ton'],
    ['GJ', 'gigajoule'],
  ])('gives 1 %s the SI value pint gives for %s (to 1e-12)', (unit, pintName) => {
    expect(relativeDifference(toSI(1, unit), ref[pintName])).toBeLessThan(1e-12);
  });

  it('gives 1 Mscf = 1000 ft³ (pint cubic_foot × 1000)', () => {
    expect(relativeDifference(toSI(1, 'Mscf'), 1000 * ref.cubic_foot)).toBeLessThan(1e-12);
  });

  it('uses the International Table Btu: 1 MMBtu = 1e6 × pint Btu_it = 1.05505585262 GJ', () => {
    expect(relativeDifference(BTU_IT_J, ref.Btu_it)).toBeLessThan(1e-12);
    expect(relativeDifference(toSI(1, 'MMBtu'), 1e6 * ref.Btu_it)).toBeLessThan(1e-12);
  });

  it('gives 100 °F = 310.927777… K and 25 °C = 298.15 K as pint does', () => {
    expect(toSI(100, 'degF')).toBeCloseTo(ref.degF_100, 11);
    expect(toSI(25, 'degC')).toBeCloseTo(ref.degC_25, 11);
  });

  it('derives inH2O-68F from ρ(20 °C) × g_n × 0.0254 m with pint g_0 and inch, ρ within 1 ppm of IAPWS-95 (python3-iapws)', () => {
    expect(relativeDifference(toSI(1, 'inH2O-68F'), WATER_DENSITY_KG_PER_M3['68F'] * ref.g_0 * ref.inch)).toBeLessThan(
      1e-12,
    );
    expect(relativeDifference(WATER_DENSITY_KG_PER_M3['68F'], ref.rho_20C)).toBeLessThan(1e-6);
  });

  it('uses water densities for 4 °C and 60 °F within 20 ppm of IAPWS-95 at 101.325 kPa (python3-iapws)', () => {
    expect(relativeDifference(WATER_DENSITY_KG_PER_M3['4C'], ref.rho_4C)).toBeLessThan(2e-5);
    expect(relativeDifference(WATER_DENSITY_KG_PER_M3['60F'], ref.rho_60F)).toBeLessThan(2e-5);
  });
});

describe('toSI against TRADE.md §4 (inches of water carry their reference temperature)', () => {
  it('gives 1 inH2O at 4 °C ≈ 249.082 Pa (TRADE.md §4)', () => {
    expect(toSI(1, 'inH2O-4C')).toBeCloseTo(249.082, 3);
  });
  it('gives 1 inH2O at 60 °F = 248.840 Pa (TRADE.md §4)', () => {
    expect(toSI(1, 'inH2O-60F')).toBeCloseTo(248.84, 3);
  });
  it('gives 1 inH2O at 68 °F ≈ 248.6 Pa (TRADE.md §4)', () => {
    expect(toSI(1, 'inH2O-68F')).toBeCloseTo(248.6, 1);
  });
});

describe('fromSI and unit codes', () => {
  it('inverts toSI for every unit', () => {
    for (const unit of UNIT_CODES) expect(fromSI(toSI(123.456, unit), unit)).toBeCloseTo(123.456, 9);
  });

  it('knows every transmitter unit code of DESIGN.md', () => {
    expect([...TRANSMITTER_UNIT_CODES]).toEqual([
      'Pa',
      'kPa',
      'MPa',
      'mbar',
      'bar',
      'psi',
      'inH2O-4C',
      'inH2O-60F',
      'inH2O-68F',
      'K',
      'degC',
      'degF',
    ]);
    for (const unit of TRANSMITTER_UNIT_CODES) expect(['pressure', 'temperature']).toContain(unitQuantity(unit));
  });

  it('names an unknown unit in its error', () => {
    expect(() => toSI(1, 'psig')).toThrow(/toSI: unknown unit 'psig'/);
    expect(() => fromSI(1, 'inH2O')).toThrow(/fromSI: unknown unit 'inH2O'/);
    expect(() => toSI(1, 'toString')).toThrow(/unknown unit/);
  });
});
