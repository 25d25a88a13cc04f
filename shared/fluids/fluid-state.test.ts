import { fluidState, type FluidSpec } from './index';
import { NIST_MIXTURE } from './aga8/detail-verification-data';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const codes = (s: { warnings: { code: string }[] }) => s.warnings.map((w) => w.code);

describe('fluidState for water and steam (IAPWS-IF97)', () => {
  it('gives liquid water at 300 K and 3 MPa: ρ = 1/0.100215168e-2 kg/m³, incompressible, no Z (R7-97(2012) Table 5)', () => {
    const s = fluidState({ kind: 'water' }, 3e6, 300);
    expect(rel(s.densityKgPerM3, 1 / 0.100215168e-2)).toBeLessThan(1e-8);
    expect(s.compressible).toBe(false);
    expect(s.compressibility).toBeNull();
    // κ = w²ρ/p with w = 1507.73921 m/s and v from Table 5.
    expect(rel(s.isentropicExponent, 1507.73921 ** 2 / 0.100215168e-2 / 3e6)).toBeLessThan(1e-8);
    expect(s.molarMassKgPerMol).toBeCloseTo(0.018015268, 12); // IAPWS-95 molar mass [mem]
    expect(s.warnings).toEqual([]);
  });

  it('gives steam at 700 K and 10 MPa as python3-iapws 1.5.2 does (ρ = 35.35069987497606, μ = 2.577304563264926e-5 Pa·s, κ = 1.2820919158400077)', () => {
    const s = fluidState({ kind: 'steam' }, 10e6, 700);
    expect(rel(s.densityKgPerM3, 35.35069987497606)).toBeLessThan(1e-10);
    expect(rel(s.viscosityPaS, 2.577304563264926e-5)).toBeLessThan(1e-9);
    expect(rel(s.isentropicExponent, 1.2820919158400077)).toBeLessThan(1e-9);
    expect(s.compressible).toBe(true);
    // Z = pv/(RT) from R7-97(2012) Table 15 at 700 K, 30 MPa checked below; here only 0 < Z < 1.
    expect(s.compressibility).toBeGreaterThan(0.8);
    expect(s.compressibility).toBeLessThan(1);
    expect(s.warnings).toEqual([]);
  });

  it('gives Z = pv/(RT) = 0.504176… for steam at 700 K and 30 MPa (v from R7-97(2012) Table 15, R = 461.526 J/(kg K))', () => {
    const s = fluidState({ kind: 'steam' }, 30e6, 700);
    expect(rel(s.compressibility as number, (30e6 * 0.542946619e-2) / (461.526 * 700))).toBeLessThan(1e-8);
  });

  it('gives the base density of water at 101.325 kPa and 15 °C as python3-iapws does (999.101114187188 kg/m³)', () => {
    const s = fluidState({ kind: 'water' }, 3e6, 300, { pressurePa: 101325, temperatureK: 288.15 });
    expect(rel(s.baseDensityKgPerM3 as number, 999.101114187188)).toBeLessThan(1e-10);
  });

  it("warns, without failing, when 'water' is vapour or 'steam' is liquid", () => {
    expect(codes(fluidState({ kind: 'water' }, 1e5, 450))).toContain('fluid.waterIsVapour');
    const liquidSteam = fluidState({ kind: 'steam' }, 1e6, 400);
    expect(codes(liquidSteam)).toContain('fluid.steamIsLiquid');
    expect(liquidSteam.compressible).toBe(false);
  });

  it('warns near saturation (Tsat(1 MPa) = 453.035632 K, R7-97(2012) Table 36) and in region 3', () => {
    expect(codes(fluidState({ kind: 'steam' }, 1e6, 453.5))).toContain('if97.nearSaturation');
    expect(codes(fluidState({ kind: 'steam' }, 1e6, 460))).not.toContain('if97.nearSaturation');
    expect(codes(fluidState({ kind: 'steam' }, 25e6, 650))).toContain('if97.region3');
  });

  it('lets the overrides win', () => {
    const s = fluidState({ kind: 'steam', isentropicExponent: 1.3, viscosityPaS: 2e-5 }, 10e6, 700);
    expect(s.isentropicExponent).toBe(1.3);
    expect(s.viscosityPaS).toBe(2e-5);
  });

  it('throws, naming fluidState and the field, outside IF97 validity', () => {
    expect(() => fluidState({ kind: 'water' }, 1e5, 250)).toThrow(/^fluidState: .*temperatureK/);
    expect(() => fluidState({ kind: 'steam' }, 150e6, 700)).toThrow(/^fluidState: .*pressurePa/);
    expect(() => fluidState({ kind: 'water' }, 1e5, 300, { pressurePa: 1e5, temperatureK: 200 })).toThrow(
      /^fluidState: base: .*temperatureK/,
    );
  });
});

describe('fluidState for natural gas (AGA 8 DETAIL)', () => {
  const gulfCoast = {
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
  };

  it('gives Z = 0.885078 for the Gulf Coast gas at 6 MPa and 293.15 K and the matching density (AGA 8 example, NIST Tables.xls; M = 16.799439 g/mol, data sheet §10(b))', () => {
    const s = fluidState({ kind: 'natural-gas', composition: gulfCoast, viscosityPaS: 1.2e-5 }, 6e6, 293.15);
    expect(Math.abs((s.compressibility as number) - 0.885078)).toBeLessThan(5.0001e-7);
    expect(rel(s.densityKgPerM3, (6e6 * 0.016799439) / (0.885078 * 8.31451 * 293.15))).toBeLessThan(1e-6);
    expect(s.compressible).toBe(true);
    expect(s.warnings).toEqual([]);
  });

  it("gives κ = 2.672509225184606 and Z = 1.173801364147326 for NIST's 21-component test point (Detail_test_01.cpp)", () => {
    const s = fluidState({ kind: 'natural-gas', composition: NIST_MIXTURE }, 50e6, 400);
    expect(rel(s.isentropicExponent, 2.672509225184606)).toBeLessThan(1e-11);
    expect(rel(s.compressibility as number, 1.173801364147326)).toBeLessThan(1e-12);
    expect(codes(s)).toEqual(
      expect.arrayContaining([
        'aga8.compositionOutsideNormalRange',
        'fluid.sourGas',
        'aga8.outsideNormalRange',
        'fluid.defaultViscosity',
      ]),
    );
  });

  it('gives the base density at 101.325 kPa and 15 °C with Z from DETAIL (Z ≈ 0.998, so ρb ≈ pM/(RT)/0.998)', () => {
    const s = fluidState({ kind: 'natural-gas', composition: gulfCoast, viscosityPaS: 1.2e-5 }, 6e6, 293.15, {
      pressurePa: 101325,
      temperatureK: 288.15,
    });
    const ideal = (101325 * 0.016799439) / (8.31451 * 288.15);
    expect((s.baseDensityKgPerM3 as number) / ideal).toBeGreaterThan(1.001);
    expect((s.baseDensityKgPerM3 as number) / ideal).toBeLessThan(1.003);
  });

  it('defaults the viscosity to Lee–Gonzalez–Eakin with a warning: methane near 15 °C and 1 atm within 4 % of 11.0 µPa·s (handbook value [mem])', () => {
    const s = fluidState({ kind: 'natural-gas', composition: { methane: 1 } }, 101325, 288.15);
    expect(codes(s)).toContain('fluid.defaultViscosity');
    expect(Math.abs(s.viscosityPaS / 11.0e-6 - 1)).toBeLessThan(0.04);
  });

  it('accepts lenient names and warns when it normalises the composition', () => {
    const s = fluidState(
      { kind: 'natural-gas', composition: { Methane: 90, 'Carbon Dioxide': 10 }, viscosityPaS: 1e-5 },
      5e6,
      300,
    );
    const t = fluidState(
      { kind: 'natural-gas', composition: { methane: 0.9, 'carbon-dioxide': 0.1 }, viscosityPaS: 1e-5 },
      5e6,
      300,
    );
    expect(codes(s)).toContain('fluid.compositionNormalised');
    expect(s.densityKgPerM3).toBe(t.densityKgPerM3);
  });

  it('rejects an unknown component, naming it', () => {
    expect(() => fluidState({ kind: 'natural-gas', composition: { methane: 0.9, kryptonite: 0.1 } }, 5e6, 300)).toThrow(
      /^fluidState: .*"kryptonite"/,
    );
  });

  it('reuses the prepared mixture for the same composition object and notices in-place changes', () => {
    const composition: Record<string, number> = { methane: 0.9, ethane: 0.1 };
    const spec: FluidSpec = { kind: 'natural-gas', composition, viscosityPaS: 1e-5 };
    const a = fluidState(spec, 5e6, 300).densityKgPerM3;
    expect(fluidState(spec, 5e6, 300).densityKgPerM3).toBe(a);
    composition.ethane = 0.05;
    composition.nitrogen = 0.05;
    const b = fluidState(spec, 5e6, 300).densityKgPerM3;
    expect(b).toBe(
      fluidState(
        { kind: 'natural-gas', composition: { methane: 0.9, ethane: 0.05, nitrogen: 0.05 }, viscosityPaS: 1e-5 },
        5e6,
        300,
      ).densityKgPerM3,
    );
    expect(b).not.toBe(a);
  });

  it('uses a given κ instead of the DETAIL caloric value', () => {
    expect(
      fluidState({ kind: 'natural-gas', composition: gulfCoast, isentropicExponent: 1.27 }, 6e6, 293.15)
        .isentropicExponent,
    ).toBe(1.27);
  });
});

describe('fluidState for an ideal gas', () => {
  it('gives the ICAO standard sea-level air density, 1.225 kg/m³ at 101.325 kPa and 15 °C (M = 28.9644 g/mol; common practice)', () => {
    const s = fluidState({ kind: 'ideal-gas', molarMassKgPerMol: 0.0289644 }, 101325, 288.15);
    expect(Math.abs(s.densityKgPerM3 - 1.225)).toBeLessThan(5e-5);
    expect(s.compressibility).toBe(1);
  });

  it.each([
    [273.15, 22.41397],
    [288.15, 23.64483],
    [293.15, 24.05512],
  ])('gives the ideal molar volume at %s K and 101.325 kPa as %s L/mol (TRADE.md §4 [calc])', (t, litres) => {
    const s = fluidState(
      { kind: 'ideal-gas', molarMassKgPerMol: 1, isentropicExponent: 1.4, viscosityPaS: 1e-5 },
      101325,
      t,
    );
    expect(Math.abs(1000 / s.densityKgPerM3 - litres)).toBeLessThan(5e-6);
  });

  it('defaults κ to 1.4 and μ to 1.8e-5 Pa·s, each with a warning, and Z = 1 at base', () => {
    const s = fluidState({ kind: 'ideal-gas', molarMassKgPerMol: 0.028, compressibility: 0.9 }, 5e6, 300, {
      pressurePa: 101325,
      temperatureK: 288.15,
    });
    expect(s.isentropicExponent).toBe(1.4);
    expect(s.viscosityPaS).toBe(1.8e-5);
    expect(codes(s)).toEqual(['fluid.defaultIsentropicExponent', 'fluid.defaultViscosity']);
    expect(rel(s.densityKgPerM3, (5e6 * 0.028) / (0.9 * 8.314462618 * 300))).toBeLessThan(1e-15);
    expect(rel(s.baseDensityKgPerM3 as number, (101325 * 0.028) / (8.314462618 * 288.15))).toBeLessThan(1e-15);
  });

  it('requires the molar mass', () => {
    expect(() => fluidState({ kind: 'ideal-gas' } as unknown as FluidSpec, 1e5, 300)).toThrow(
      /^fluidState: fluid.molarMassKgPerMol/,
    );
  });
});

describe('fluidState for a liquid', () => {
  it('gives ρ = 850/(1 + 9e-4 × 10) = 842.41823588 kg/m³ ten kelvin above the reference (hand calculation)', () => {
    const s = fluidState(
      { kind: 'liquid', densityKgPerM3: 850, referenceTemperatureK: 288.15, expansionPerK: 9e-4, viscosityPaS: 5e-3 },
      2e6,
      298.15,
      { pressurePa: 101325, temperatureK: 288.15 },
    );
    expect(s.densityKgPerM3).toBeCloseTo(842.41823588, 7);
    expect(s.baseDensityKgPerM3).toBe(850);
    expect(s.compressible).toBe(false);
    expect(s.compressibility).toBeNull();
    expect(s.molarMassKgPerMol).toBeNull();
    expect(s.isentropicExponent).toBe(Number.POSITIVE_INFINITY);
    expect(s.warnings).toEqual([]);
  });

  it('defaults the viscosity to 1.0e-3 Pa·s with a warning', () => {
    const s = fluidState(
      { kind: 'liquid', densityKgPerM3: 998, referenceTemperatureK: 293.15, expansionPerK: 2.1e-4 },
      2e5,
      293.15,
    );
    expect(s.viscosityPaS).toBe(1e-3);
    expect(codes(s)).toEqual(['fluid.defaultViscosity']);
  });
});

describe('fluidState input checks', () => {
  it.each([
    ['pressurePa', () => fluidState({ kind: 'water' }, NaN, 300)],
    ['pressurePa', () => fluidState({ kind: 'water' }, 0, 300)],
    ['temperatureK', () => fluidState({ kind: 'water' }, 1e5, -1)],
    ['base.pressurePa', () => fluidState({ kind: 'water' }, 1e5, 300, { pressurePa: -5, temperatureK: 300 })],
    ['base.temperatureK', () => fluidState({ kind: 'water' }, 1e5, 300, { pressurePa: 1e5, temperatureK: Infinity })],
    ['fluid.isentropicExponent', () => fluidState({ kind: 'steam', isentropicExponent: -1 }, 1e5, 400)],
    ['fluid.viscosityPaS', () => fluidState({ kind: 'steam', viscosityPaS: 0 }, 1e5, 400)],
    ['fluid.kind', () => fluidState({ kind: 'plasma' } as unknown as FluidSpec, 1e5, 400)],
    [
      'fluid.densityKgPerM3',
      () =>
        fluidState({ kind: 'liquid', densityKgPerM3: 0, referenceTemperatureK: 288, expansionPerK: 1e-3 }, 1e5, 300),
    ],
    [
      'fluid.expansionPerK',
      () =>
        fluidState({ kind: 'liquid', densityKgPerM3: 800, referenceTemperatureK: 288, expansionPerK: NaN }, 1e5, 300),
    ],
  ])('throws an error naming fluidState and %s', (field, call) => {
    expect(call).toThrow(new RegExp(`^fluidState: ${field.replace('.', '\\.')}`));
  });
});
