import { waterStatePT } from './water-state-pt';
import { region3StateRhoT } from './region3';
import { region1State } from './region1';
import { region2State } from './region2';
import { region5State } from './region5';
import {
  type PtCheckPoint,
  REGION_1_TABLE_5,
  REGION_2_TABLE_15,
  REGION_3_TABLE_33,
  REGION_5_TABLE_42,
} from './release-verification-tables';
import { type WaterState } from './water-state';

/** Relative difference |a/b − 1|. */
const rel = (a: number, b: number) => Math.abs(a / b - 1);
// The release prints 9 significant digits: a half unit in the 9th digit is ≤ 5e-9 relative.
const TOL = 1e-8;

function expectMatchesTable(state: WaterState, row: PtCheckPoint): void {
  expect(rel(state.specificVolumeM3PerKg, row.v)).toBeLessThan(TOL);
  expect(rel(state.specificEnthalpyJPerKg / 1e3, row.h)).toBeLessThan(TOL);
  expect(rel(state.specificInternalEnergyJPerKg / 1e3, row.u)).toBeLessThan(TOL);
  expect(rel(state.specificEntropyJPerKgK / 1e3, row.s)).toBeLessThan(TOL);
  expect(rel(state.isobaricHeatCapacityJPerKgK / 1e3, row.cp)).toBeLessThan(TOL);
  expect(rel(state.speedOfSoundMPerS, row.w)).toBeLessThan(TOL);
}

describe('IAPWS-IF97 properties from pressure and temperature', () => {
  // Expected values: IAPWS R7-97(2012) Tables 5, 15, 42 [mem], confirmed by python3-iapws in
  // if97-vs-python-iapws.test.ts; v(300 K, 3 MPa), v(500 K, 3 MPa), v(700 K, 30 MPa) and
  // v(300 K, 3.5 kPa) are also quoted in TRADE.md §4.
  it.each(REGION_1_TABLE_5.map((r) => [r.temperatureK, r.pressureMPa, r] as const))(
    'reproduces R7-97(2012) Table 5 (region 1) at %s K and %s MPa to 9 digits',
    (t, p, row) => {
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(1);
      expectMatchesTable(s, row);
    },
  );

  it.each(REGION_2_TABLE_15.map((r) => [r.temperatureK, r.pressureMPa, r] as const))(
    'reproduces R7-97(2012) Table 15 (region 2) at %s K and %s MPa to 9 digits',
    (t, p, row) => {
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(2);
      expectMatchesTable(s, row);
    },
  );

  it.each(REGION_5_TABLE_42.map((r) => [r.temperatureK, r.pressureMPa, r] as const))(
    'reproduces R7-97(2012) Table 42 (region 5) at %s K and %s MPa to 9 digits',
    (t, p, row) => {
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(5);
      expectMatchesTable(s, row);
    },
  );

  it.each(REGION_3_TABLE_33.map((r) => [r.temperatureK, r.densityKgPerM3, r] as const))(
    'reproduces R7-97(2012) Table 33 (region 3, from density) at %s K and %s kg/m³ to 9 digits',
    (t, rho, row) => {
      const s = region3StateRhoT(rho, t);
      expect(rel(s.pressurePa / 1e6, row.pressureMPa)).toBeLessThan(TOL);
      expect(rel(s.specificEnthalpyJPerKg / 1e3, row.h)).toBeLessThan(TOL);
      expect(rel(s.specificInternalEnergyJPerKg / 1e3, row.u)).toBeLessThan(TOL);
      expect(rel(s.specificEntropyJPerKgK / 1e3, row.s)).toBeLessThan(TOL);
      expect(rel(s.isobaricHeatCapacityJPerKgK / 1e3, row.cp)).toBeLessThan(TOL);
      expect(rel(s.speedOfSoundMPerS, row.w)).toBeLessThan(TOL);
    },
  );

  it.each(REGION_3_TABLE_33.map((r) => [r.temperatureK, r.pressureMPa, r] as const))(
    'solves region 3 from p,T back to the Table 33 density at %s K and %s MPa',
    (t, p, row) => {
      // Table 33's (ρ, T) → p, inverted: the density solve must land on the tabulated ρ
      // (to the 9 digits of the tabulated p, amplified by the near-critical slope at 650 K).
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(3);
      expect(rel(s.densityKgPerM3, row.densityKgPerM3)).toBeLessThan(
        t === 650 && row.densityKgPerM3 === 200 ? 1e-6 : 1e-7,
      );
    },
  );

  it('gives the isentropic exponent as ISO 5167-1 defines it, κ = w²ρ/p', () => {
    // Definition, ISO 5167-1:2003 §3.3.4 (common practice); for steam at low pressure κ ≈ cp/cv
    // ≈ 1.3 (ideal-gas limit, common practice).
    const steam = waterStatePT(3500, 700);
    expect(steam.isentropicExponent).toBeCloseTo((steam.speedOfSoundMPerS ** 2 * steam.densityKgPerM3) / 3500, 12);
    expect(
      Math.abs(steam.isentropicExponent - steam.isobaricHeatCapacityJPerKgK / steam.isochoricHeatCapacityJPerKgK),
    ).toBeLessThan(1e-3);
  });

  it('selects region 1 below and region 2 above the saturation temperature at 1 MPa', () => {
    // Tsat(1 MPa) = 453.035632 K, R7-97(2012) Table 36 [mem].
    expect(waterStatePT(1e6, 453.0).region).toBe(1);
    expect(waterStatePT(1e6, 453.1).region).toBe(2);
  });

  it('agrees with the region-specific functions it dispatches to', () => {
    expect(waterStatePT(5e6, 400)).toEqual(region1State(5e6, 400));
    expect(waterStatePT(5e6, 800)).toEqual(region2State(5e6, 800));
    expect(waterStatePT(5e6, 1200)).toEqual(region5State(5e6, 1200));
  });

  it.each([
    [NaN, 300, 'pressurePa'],
    [0, 300, 'pressurePa'],
    [-1, 300, 'pressurePa'],
    [1e5, Infinity, 'temperatureK'],
    [1e5, 0, 'temperatureK'],
    [1e5, 250, 'temperatureK'],
    [101e6, 300, 'pressurePa'],
    [60e6, 1500, 'pressurePa'],
    [1e5, 2300, 'temperatureK'],
  ])('rejects p = %s Pa, T = %s K with an error naming %s', (p, t, field) => {
    expect(() => waterStatePT(p, t)).toThrow(new RegExp(`if97Region: ${field}`));
  });
});
