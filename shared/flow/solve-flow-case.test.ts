import type { FlowCase } from './flow-types';
import { DEFAULT_BASE_CONDITIONS, solveFlowCase } from './solve-flow-case';

const R = 8.314462618; // J/(mol·K), CODATA 2018 (exact)

describe('solveFlowCase (with shared/fluids)', () => {
  it('solves the O2 orifice with an ideal gas of ρ = 15 kg/m³: qm = 15555.29024 kg/h (TRADE.md §3 O2, pvtlib)', () => {
    const M = (15 * R * 300) / 2e6;
    const r = solveFlowCase({
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1, referenceTemperatureK: 300 },
      fluid: {
        kind: 'ideal-gas',
        molarMassKgPerMol: M,
        compressibility: 1,
        isentropicExponent: 1.2,
        viscosityPaS: 1.12e-5,
      },
      conditions: { differentialPressurePa: 28000, staticPressurePa: 2e6, temperatureK: 300 },
    });
    expect(r.densityKgPerM3).toBeCloseTo(15, 9);
    expect(r.massFlowKgPerS * 3600).toBeCloseTo(15555.29024, 4);
    // Base conditions default to 101325 Pa, 288.15 K: ρb = pb M/(R Tb) for the ideal gas.
    expect(r.baseDensityKgPerM3).toBeCloseTo((101325 * M) / (R * 288.15), 9);
    expect(r.standardVolumeFlowM3PerS).toBeCloseTo(r.massFlowKgPerS / r.baseDensityKgPerM3!, 12);
    expect(DEFAULT_BASE_CONDITIONS).toEqual({ pressurePa: 101325, temperatureK: 288.15 });
  });

  it('uses the given base conditions (0 °C) for the standard volume', () => {
    const M = 0.02897;
    const r = solveFlowCase({
      element: { kind: 'venturi', venturiType: 'machined', pipeDiameterM: 0.1, boreDiameterM: 0.05 },
      fluid: { kind: 'ideal-gas', molarMassKgPerMol: M, compressibility: 1 },
      conditions: { differentialPressurePa: 20000, staticPressurePa: 1e6, temperatureK: 293.15 },
      base: { pressurePa: 101325, temperatureK: 273.15 },
    });
    expect(r.baseDensityKgPerM3).toBeCloseTo((101325 * M) / (R * 273.15), 9);
  });

  it('gives the Gulf Coast gas Z = 0.885078 at 6 MPa, 293.15 K and ρ = pM/(ZRT) with the DETAIL molar mass 16.7994391 g/mol and R = 8.31451 (AGA 8 DETAIL example gas, ../shared/data/aga8-detail.md §1)', () => {
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
    const r = solveFlowCase({
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1023, boreDiameterM: 0.05 },
      fluid: { kind: 'natural-gas', composition: gulfCoast, viscosityPaS: 1.1e-5 },
      conditions: { differentialPressurePa: 25000, staticPressurePa: 6e6, temperatureK: 293.15 },
    });
    expect(r.compressibility).toBeCloseTo(0.885078, 6);
    // M = Σ x_i M_i with the DETAIL molar masses of ../shared/data/aga8-detail.md §1 (usnistgov/AGA8
    // SetupDetail), summed by hand: 0.965222·16.043 + 0.002595·28.0135 + 0.005956·44.01 + 0.018186·30.07
    // + 0.004596·44.097 + (0.000977 + 0.001007)·58.123 + (0.000473 + 0.000324)·72.15 + 0.000664·86.177
    // = 16.7994391 g/mol. The 16.7989 g/mol printed beside this gas in the NIST test sheet is the GERG-2008
    // molar mass (the data sheet says so), so it belongs to another equation of state. R is the DETAIL
    // value 8.31451 J/(mol·K) (data sheet §1). Z is rounded to 6 decimals as published, so agreement
    // is to about 1e-6 relative.
    const mDetailKgPerMol = 0.0167994391;
    expect(r.densityKgPerM3 / ((6e6 * mDetailKgPerMol) / (0.885078 * 8.31451 * 293.15))).toBeCloseTo(1, 5);
    expect(r.expansibility).toBeLessThan(1);
    expect(r.warnings.map((w) => w.code)).not.toContain('iso5167.betaOutOfRange');
  });

  it('takes ε = 1 for water and its IF97 density: v(300 K, 3 MPa) = 0.100215168e-2 m³/kg (IAPWS R7-97 Table 5, TRADE.md §4)', () => {
    const r = solveFlowCase({
      element: { kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.07, dischargeCoefficient: 0.81 },
      fluid: { kind: 'water' },
      conditions: { differentialPressurePa: 20000, staticPressurePa: 3e6, temperatureK: 300 },
    });
    expect(r.expansibility).toBe(1);
    expect(r.densityKgPerM3).toBeCloseTo(1 / 0.100215168e-2, 5);
    expect(r.warnings.map((w) => w.code)).not.toContain('iso5167.pressureRatioBelowLimit');
  });

  it('throws naming the field for an element the engine cannot prepare', () => {
    const bad: FlowCase = {
      element: { kind: 'nozzle', pipeDiameterM: 0.1, boreDiameterM: 0.05 },
      fluid: { kind: 'water' },
      conditions: { differentialPressurePa: 20000, staticPressurePa: 3e6, temperatureK: 300 },
    };
    expect(() => solveFlowCase(bad)).toThrow(/element\.nozzleType/);
  });
});
