import type { FlowCase } from './flow-types';
import { flowResultFromState, type FlowFluidState } from './flow-result-from-state';

/** The O1 state of TRADE.md §3: ρ = 999.1, μ = 1.1e-3, κ = 1.33, expansibility applied as the source library's tests do. */
const o1State: FlowFluidState = {
  densityKgPerM3: 999.1,
  compressibility: null,
  baseDensityKgPerM3: 999.1,
  isentropicExponent: 1.33,
  viscosityPaS: 1.1e-3,
  compressible: true,
  warnings: [],
};
const o1Case: FlowCase = {
  element: { kind: 'orifice', taps: 'D-D/2', pipeDiameterM: 0.07366, boreDiameterM: 0.05 },
  fluid: { kind: 'water' },
  conditions: { differentialPressurePa: 17000, staticPressurePa: 200000, temperatureK: 293.15 },
};

describe('flowResultFromState', () => {
  it('gives the O1 result: qm = 7.702338035732167 kg/s, C = 0.6151252900, Re_D = 121034.2529 (TRADE.md §3 O1, fluids and pvtlib)', () => {
    const r = flowResultFromState(o1Case, o1State);
    expect(r.massFlowKgPerS).toBeCloseTo(7.702338035732167, 11);
    expect(r.dischargeCoefficient).toBeCloseTo(0.61512529, 10);
    expect(r.reynoldsNumber).toBeCloseTo(121034.2529, 4);
    expect(r.beta).toBeCloseTo(0.05 / 0.07366, 15);
    expect(r.volumeFlowM3PerS).toBeCloseTo(7.702338035732167 / 999.1, 13);
    expect(r.standardVolumeFlowM3PerS).toBeCloseTo(7.702338035732167 / 999.1, 13);
    expect(r.warnings).toEqual([]);
  });

  it('has exactly the result fields of DESIGN.md (plus pressureLossPa)', () => {
    expect(Object.keys(flowResultFromState(o1Case, o1State)).sort()).toEqual(
      [
        'beta',
        'dischargeCoefficient',
        'expansibility',
        'reynoldsNumber',
        'densityKgPerM3',
        'compressibility',
        'baseDensityKgPerM3',
        'massFlowKgPerS',
        'volumeFlowM3PerS',
        'standardVolumeFlowM3PerS',
        'pressureLossPa',
        'warnings',
      ].sort(),
    );
  });

  it('gives no standard volume when the fluid has no base density', () => {
    expect(flowResultFromState(o1Case, { ...o1State, baseDensityKgPerM3: null }).standardVolumeFlowM3PerS).toBeNull();
  });

  it('passes the fluid warnings through and warns with numbers when p2/p1 < 0.75 (ISO 5167-2 §5.3.2.2)', () => {
    const r = flowResultFromState(
      { ...o1Case, conditions: { differentialPressurePa: 60000, staticPressurePa: 200000, temperatureK: 293.15 } },
      { ...o1State, warnings: [{ code: 'fluid.example', message: 'from the fluid' }] },
    );
    expect(r.warnings[0].code).toBe('fluid.example');
    const ratio = r.warnings.find((w) => w.code === 'iso5167.pressureRatioBelowLimit');
    expect(ratio?.message).toMatch(/0\.7/);
  });

  it('does not apply the pressure-ratio limit to an incompressible fluid (ε = 1)', () => {
    const r = flowResultFromState(
      { ...o1Case, conditions: { differentialPressurePa: 60000, staticPressurePa: 200000, temperatureK: 293.15 } },
      { ...o1State, compressible: false },
    );
    expect(r.expansibility).toBe(1);
    expect(r.warnings.map((w) => w.code)).not.toContain('iso5167.pressureRatioBelowLimit');
  });

  it('warns when Re_D is below the ISO 5167-2 minimum (5000 for β ≤ 0.56, corner taps)', () => {
    const r = flowResultFromState(
      {
        ...o1Case,
        element: { kind: 'orifice', taps: 'corner', pipeDiameterM: 0.1, boreDiameterM: 0.05 },
        conditions: { differentialPressurePa: 50, staticPressurePa: 2e5, temperatureK: 293.15 },
      },
      { ...o1State, viscosityPaS: 0.05 },
    );
    expect(r.reynoldsNumber).toBeLessThan(5000);
    expect(r.warnings.find((w) => w.code === 'iso5167.reynoldsBelowMinimum')?.message).toMatch(/5000/);
  });

  it('warns when a calibration curve is extrapolated and holds C at its end value', () => {
    const r = flowResultFromState(
      {
        ...o1Case,
        element: {
          kind: 'cone',
          pipeDiameterM: 0.1,
          coneDiameterM: 0.07,
          calibration: [
            { reynoldsNumber: 1e3, dischargeCoefficient: 0.8 },
            { reynoldsNumber: 1e4, dischargeCoefficient: 0.81 },
          ],
        },
      },
      o1State,
    );
    expect(r.reynoldsNumber).toBeGreaterThan(1e4);
    expect(r.dischargeCoefficient).toBe(0.81);
    expect(r.warnings.map((w) => w.code)).toContain('flow.calibrationExtrapolated');
  });

  it('iterates a calibration curve on Re_D: C is the curve value at the converged Re_D', () => {
    const calibration = [
      { reynoldsNumber: 1e4, dischargeCoefficient: 0.79 },
      { reynoldsNumber: 1e7, dischargeCoefficient: 0.83 },
    ];
    const r = flowResultFromState(
      { ...o1Case, element: { kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.07, calibration } },
      o1State,
    );
    const expectedC = 0.79 + ((Math.log10(r.reynoldsNumber) - 4) / 3) * 0.04;
    expect(r.dischargeCoefficient).toBeCloseTo(expectedC, 10);
    expect((4 * r.massFlowKgPerS) / (Math.PI * 1.1e-3 * 0.1) / r.reynoldsNumber).toBeCloseTo(1, 9);
    expect(r.warnings.map((w) => w.code)).not.toContain('flow.calibrationExtrapolated');
  });

  it('throws naming conditions.staticPressurePa when the DP is not below the absolute static pressure', () => {
    expect(() =>
      flowResultFromState(
        { ...o1Case, conditions: { differentialPressurePa: 3e5, staticPressurePa: 2e5, temperatureK: 293.15 } },
        o1State,
      ),
    ).toThrow(/conditions\.staticPressurePa/);
  });
});
