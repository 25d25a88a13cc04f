import { prepareDetailMixture } from './prepare-detail-mixture';
import { detailPropertiesPT, detailPropertiesTD } from './detail-properties';
import { detailMolarDensityMolPerM3 } from './detail-molar-density';
import {
  FIVE_GASES,
  FIVE_GAS_Z,
  FIVE_GAS_Z_9,
  GAS_ORDER,
  NIST_MIXTURE,
  TEST_DATA_GAS_2,
  TEST_DATA_GAS_2_POINTS,
} from './detail-verification-data';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('AGA 8 Part 1 DETAIL: NIST reference test point (21 components, 400 K, 50 MPa)', () => {
  // Expected: NIST AGA8CODE/C/Detail_test_01.cpp, commit 3bdb9ab8 (data sheet §10(a)); NIST
  // checks each to 1e-8 absolute; we hold relative 1e-11 (the sheet's re-implementation agreed to 2e-14).
  const props = detailPropertiesPT(prepareDetailMixture(NIST_MIXTURE), 50e6, 400);
  it.each([
    ['Z = 1.173801364147326', props.compressibility, 1.173801364147326],
    ['molar mass 20.54333051 g/mol', props.molarMassKgPerMol * 1000, 20.54333051],
    ['molar density 12.80792403648801 mol/L', props.molarDensityMolPerM3 / 1000, 12.80792403648801],
    ['dP/dD 6971.387690924090 kPa/(mol/L)', props.dPdDPaM3PerMol, 6971.38769092409],
    ['d²P/dD² 1118.803636639520 kPa/(mol/L)²', props.d2PdD2PaM6PerMol2 * 1000, 1118.80363663952],
    ['dP/dT 235.6641493068212 kPa/K', props.dPdTPaPerK / 1000, 235.6641493068212],
    ['U = -2739.134175817231 J/mol', props.internalEnergyJPerMol, -2739.134175817231],
    ['H = 1164.699096269404 J/mol', props.enthalpyJPerMol, 1164.699096269404],
    ['S = -38.54882684677111 J/(mol K)', props.entropyJPerMolK, -38.54882684677111],
    ['Cv = 39.12076154430332 J/(mol K)', props.isochoricHeatCapacityJPerMolK, 39.12076154430332],
    ['Cp = 58.54617672380667 J/(mol K)', props.isobaricHeatCapacityJPerMolK, 58.54617672380667],
    ['w = 712.6393684057903 m/s', props.speedOfSoundMPerS, 712.6393684057903],
    ['G = 16584.22983497785 J/mol', props.gibbsEnergyJPerMol, 16584.22983497785],
    ['μJT = 7.432969304794577e-5 K/kPa', props.jouleThomsonKPerPa * 1000, 7.432969304794577e-5],
    ['κ = 2.672509225184606', props.isentropicExponent, 2.672509225184606],
  ])('gives %s (NIST Detail_test_01.cpp)', (_label, actual, expected) => {
    expect(rel(actual, expected)).toBeLessThan(1e-11);
  });
});

describe('AGA 8 Part 1 DETAIL: Z of the five AGA 8 example gases', () => {
  const cases = FIVE_GAS_Z.flatMap(([t, p, ...zs]) => GAS_ORDER.map((gas, g) => [gas, t, p, zs[g]] as const));
  const mixtures = Object.fromEntries(GAS_ORDER.map((g) => [g, prepareDetailMixture(FIVE_GASES[g])]));
  // All 60 values: NIST TESTDATA/Tables.xls, sheet Tables, D74:H85 (data sheet §10(b)), 6 decimals.
  it.each(cases)('gives the tabulated Z for %s at %s K and %s MPa (Z = %s, NIST Tables.xls)', (gas, t, p, z) => {
    const props = detailPropertiesPT(mixtures[gas], p * 1e6, t);
    expect(Math.abs(props.compressibility - z)).toBeLessThanOrEqual(5.0001e-7);
  });

  // Tighter regression: the data sheet's 9-decimal re-implementation table ([calc], not NIST).
  it.each(FIVE_GAS_Z_9.flatMap(([t, p, ...zs]) => GAS_ORDER.map((gas, g) => [gas, t, p, zs[g]] as const)))(
    "agrees to 1e-9 with the data sheet's 9-decimal re-implementation for %s at %s K and %s MPa (Z = %s [calc])",
    (gas, t, p, z) => {
      expect(Math.abs(detailPropertiesPT(mixtures[gas], p * 1e6, t).compressibility - z)).toBeLessThanOrEqual(
        5.0001e-10,
      );
    },
  );

  it('gives Z = 0.885078 for the Gulf Coast gas at 6 MPa and 293.15 K (TRADE.md §4, NIST Tables.xls)', () => {
    const z = detailPropertiesPT(mixtures['Gulf Coast'], 6e6, 293.15).compressibility;
    expect(z.toFixed(6)).toBe('0.885078');
  });
});

describe('AGA 8 Part 1 DETAIL: caloric properties at given T and D (no density iteration)', () => {
  const mix = prepareDetailMixture(TEST_DATA_GAS_2);
  // Expected: NIST TESTDATA/Test Data.xls gas #2 = AGA8CODE/RUST/tests/integration-tests.rs
  // (data sheet §10(c)); tolerances as in that Rust test: |ΔP| < 0.1 kPa, |Δ| < 1e-4 on cv, cp, w.
  it.each(TEST_DATA_GAS_2_POINTS.map((r) => [r.temperatureK, r.molarDensityMolPerL, r] as const))(
    'reproduces NIST Test Data gas #2 at %s K and %s mol/L (P, cv, cp, w)',
    (t, d, row) => {
      const props = detailPropertiesTD(mix, t, d * 1000);
      expect(Math.abs(props.pressurePa / 1000 - row.pressureKPa)).toBeLessThan(0.1);
      expect(Math.abs(props.isochoricHeatCapacityJPerMolK - row.cv)).toBeLessThan(1e-4);
      expect(Math.abs(props.isobaricHeatCapacityJPerMolK - row.cp)).toBeLessThan(1e-4);
      expect(Math.abs(props.speedOfSoundMPerS - row.w)).toBeLessThan(1e-4);
    },
  );
});

describe('AGA 8 DETAIL density solve', () => {
  it('inverts P(T, D) to 1e-12 over a grid of the five gases, 250…450 K and 10 kPa…40 MPa', () => {
    let worst = 0;
    for (const gas of GAS_ORDER) {
      const mix = prepareDetailMixture(FIVE_GASES[gas]);
      for (let t = 250; t <= 450; t += 25) {
        for (const p of [1e4, 1e5, 1e6, 3e6, 6e6, 10e6, 15e6, 20e6, 30e6, 40e6]) {
          const d = detailMolarDensityMolPerM3(mix, p, t);
          const back = detailPropertiesTD(mix, t, d).pressurePa;
          worst = Math.max(worst, rel(back, p));
        }
      }
    }
    expect(worst).toBeLessThan(1e-12);
  });

  it('gives identical results whatever order temperatures are asked in (temperature cache)', () => {
    const mix = prepareDetailMixture(FIVE_GASES.Ekofisk);
    const a = detailMolarDensityMolPerM3(mix, 6e6, 280);
    detailMolarDensityMolPerM3(mix, 101325, 288.15);
    detailMolarDensityMolPerM3(mix, 6e6, 300);
    detailMolarDensityMolPerM3(mix, 6e6, 310);
    expect(detailMolarDensityMolPerM3(mix, 6e6, 280)).toBe(a);
    expect(detailMolarDensityMolPerM3(prepareDetailMixture(FIVE_GASES.Ekofisk), 6e6, 280)).toBe(a);
  });

  it('returns a mechanically stable gas root or throws, never a silent ideal-gas value, in the two-phase region', () => {
    // A rich gas at 200 K and 5 MPa lies near or inside its phase envelope (common practice).
    const mix = prepareDetailMixture({ methane: 0.7, ethane: 0.15, propane: 0.1, 'n-butane': 0.05 });
    let d: number | undefined;
    try {
      d = detailMolarDensityMolPerM3(mix, 5e6, 200);
    } catch (e) {
      expect((e as Error).message).toMatch(/detailMolarDensityMolPerM3/);
    }
    if (d !== undefined) {
      const props = detailPropertiesTD(mix, 200, d);
      expect(rel(props.pressurePa, 5e6)).toBeLessThan(1e-9);
      expect(props.dPdDPaM3PerMol).toBeGreaterThan(0);
    }
  });

  it('rejects non-positive or non-finite pressure and temperature, naming the field', () => {
    const mix = prepareDetailMixture({ methane: 1 });
    expect(() => detailMolarDensityMolPerM3(mix, 0, 300)).toThrow(/detailMolarDensityMolPerM3: pressurePa/);
    expect(() => detailMolarDensityMolPerM3(mix, 1e6, NaN)).toThrow(/detailMolarDensityMolPerM3: temperatureK/);
  });
});
