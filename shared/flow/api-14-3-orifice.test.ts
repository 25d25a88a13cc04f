/**
 * Checks of the API MPMS 14.3 / AGA Report No. 3 Part 1 orifice method. Every expected value is worked by
 * hand from the published constants (A0…A6, S1…S8 of the 1992 RG equation as carried by the open
 * implementation shakeelr/AGA3, aga3.py procedures 4.3.2.5/4.3.2.9, in its X = 4000/Re_D form, which is a
 * different arrangement of the terms from the module's) or written out below; none from the module.
 */
import { fluidState } from '../fluids';
import { apiDownstreamCompressibilityRatio } from './api-14-3-compressibility-ratio';
import {
  apiExpansionFactorDownstream,
  apiExpansionFactorUpstream,
  apiOrificeDischargeCoefficient,
} from './api-14-3-orifice';
import { calculateFlow } from './calculate-flow';
import { orificeExpansibility } from './expansibility';
import { orificeDischargeCoefficient } from './orifice-discharge-coefficient';

const R = 8.314462618; // J/(mol·K), CODATA 2018 (exact)

/**
 * The 1992 RG equation in the X = 4000/Re_D form of AGA 3 Part 4 procedure 4.3.2.5 (constants Cd0…Cd4),
 * written out independently of the module for Re_D ≥ 4000/1.142139.
 */
function handApiC(pipeDiameterM: number, beta: number, reynoldsNumber: number): number {
  const n4 = 0.0254;
  const l = n4 / pipeDiameterM;
  const m2 = (2 * l) / (1 - beta);
  const tu = ((0.0433 + 0.0712 * Math.exp(-8.5 * l) - 0.1145 * Math.exp(-6.0 * l)) * beta ** 4) / (1 - beta ** 4);
  const td = -0.0116 * (m2 - 0.52 * m2 ** 1.3) * beta ** 1.1;
  const ts = pipeDiameterM > 2.8 * n4 ? 0 : 0.003 * (1 - beta) * (2.8 - pipeDiameterM / n4);
  const cd0 = 0.5961 + 0.0291 * beta ** 2 - 0.229 * beta ** 8 + tu + td + ts;
  const cd1 = 0.000511 * beta ** 0.7 * 250 ** 0.7;
  const cd2 = 0.021 * beta ** 4 * 250 ** 0.35;
  const cd3 = 0.0049 * beta ** 4 * beta ** 0.8 * 4.75 ** 0.8 * 250 ** 0.35;
  const cd4 = (-0.23 * tu - 0.14 * td) * beta ** 0.8 * 4.75 ** 0.8;
  const x = 4000 / reynoldsNumber;
  return cd0 + (cd1 * x ** 0.35 + cd2 + cd3 * x ** 0.8) * x ** 0.35 + cd4 * x ** 0.8;
}

describe('API MPMS 14.3 discharge coefficient (AGA 3 Part 1 §1.7.2, 1992 RG equation, flange taps)', () => {
  it.each([
    // D m, β, Re_D, C worked by hand (python3, the X form above): 0.60346934497, 0.60062350332, …
    [0.2, 0.5, 1e6, 0.6034693449702078],
    [0.3, 1 / 3, 1e5, 0.6006235033219605],
    [0.3, 1 / 3, 3e6, 0.5991221851096384],
    [0.05, 0.6, 2e4, 0.621703497144421], // D < 2.8 in: the small-pipe term 0.003(1 − β)(2.8 − D/N4)
    [0.1023, 0.5, 5e5, 0.6038346386400709],
  ])('gives C by the published constants for D = %p m, β = %p, Re_D = %p', (pipeDiameterM, beta, re, expected) => {
    expect(apiOrificeDischargeCoefficient(beta, re, pipeDiameterM)).toBeCloseTo(expected, 12);
    expect(apiOrificeDischargeCoefficient(beta, re, pipeDiameterM)).toBeCloseTo(handApiC(pipeDiameterM, beta, re), 12);
  });

  it('agrees with ISO 5167-2:2003 eq. (4) within the 0.5 % uncertainty of §5.3.3.1 over the mid range', () => {
    // Worked by hand: the two equations differ by +0.052 %, +0.012 %, +0.035 % and −0.018 % at these points.
    for (const [pipeDiameterM, beta, re] of [
      [0.2, 0.5, 1e6],
      [0.3, 1 / 3, 1e5],
      [0.3, 1 / 3, 3e6],
      [0.05, 0.6, 2e4],
    ]) {
      const api = apiOrificeDischargeCoefficient(beta, re, pipeDiameterM);
      const iso = orificeDischargeCoefficient(beta, re, pipeDiameterM, 'flange');
      expect(Math.abs(api / iso - 1)).toBeLessThan(0.001);
    }
  });

  it('stays continuous where the low-Reynolds form takes over (X = 4000/Re_D = 1.142139)', () => {
    const reSwitch = 4000 / 1.142139337256165;
    const below = apiOrificeDischargeCoefficient(0.5, reSwitch * (1 - 1e-9), 0.2);
    const above = apiOrificeDischargeCoefficient(0.5, reSwitch * (1 + 1e-9), 0.2);
    expect(below).toBeCloseTo(0.63273731, 7); // python3 from the X form, both sides
    expect(Math.abs(below - above)).toBeLessThan(1e-8);
  });

  it('refuses a Reynolds number that is not positive', () => {
    expect(() => apiOrificeDischargeCoefficient(0.5, 0, 0.2)).toThrow(/reynoldsNumber must be > 0/);
  });
});

describe('API MPMS 14.3 expansion factor (AGA 3 Part 1 §1.7.3, from memory)', () => {
  it('gives Y1 = 1 − (0.41 + 0.35β⁴) x1/κ at the upstream tap', () => {
    // β 0.5, x1 = 0.01, κ 1.3: 1 − (0.41 + 0.021875)(0.01)/1.3 = 0.99667788461538…
    expect(apiExpansionFactorUpstream(0.5, 1e4, 1e6, 1.3)).toBeCloseTo(0.9966778846153846, 14);
  });

  it('gives Y2 = sqrt(1 + x2) − (0.41 + 0.35β⁴) x2/(κ sqrt(1 + x2)) at the downstream tap (Z_f2 = Z_f1)', () => {
    // β 0.5, p2 = 1 MPa, Δp = 20 kPa (x2 = 0.02), κ 1.3: sqrt(1.02) − 0.431875 · 0.02/(1.3 sqrt(1.02))
    // = 1.0099505 − 0.0065788 = 1.003371725065084 (python3, by hand).
    expect(apiExpansionFactorDownstream(0.5, 2e4, 1e6, 1.3)).toBeCloseTo(1.003371725065084, 13);
    // With a compressibility ratio Z_f2/Z_f1, Y2 scales by its square root.
    expect(apiExpansionFactorDownstream(0.5, 2e4, 1e6, 1.3, 1.0004)).toBeCloseTo(
      1.003371725065084 * Math.sqrt(1.0004),
      13,
    );
  });

  it('is close to ISO 5167-2:2003 eq. (5) for a small x (Y1 is the ISO 5167-1:1991 form, from memory)', () => {
    // ISO 5167-2:2003 ε1 = 1 − (0.351 + 0.256β⁴ + 0.93β⁸)(1 − τ^(1/κ)); at β 0.5, κ 1.3 the two differ by
    // −0.0612 x/κ (worked by hand: −4.71e-5 at x = 0.001, −4.68e-4 at x = 0.01), from the constants alone.
    for (const [x, difference] of [
      [0.001, -4.707646509305441e-5],
      [0.01, -4.6779053793621905e-4],
    ]) {
      const y1 = apiExpansionFactorUpstream(0.5, x * 1e6, 1e6, 1.3);
      const eps = orificeExpansibility(0.5, x * 1e6, 1e6, 1.3);
      expect(y1 - eps).toBeCloseTo(difference, 10);
      expect(Math.abs(y1 - eps)).toBeLessThan(0.07 * (x / 1.3));
    }
    expect(apiExpansionFactorUpstream(0.5, 0, 1e6, 1.3)).toBe(1);
  });

  it('refuses a DP at or above the static pressure, naming it', () => {
    expect(() => apiExpansionFactorUpstream(0.5, 1e6, 1e6, 1.3)).toThrow(/differentialPressurePa must be below/);
  });
});

describe('calculateFlow with method api-14.3', () => {
  // TRADE.md §3 O2's inputs: D 0.3 m, d 0.1 m, flange taps, Δp 28 kPa, p1 2 MPa, ρ 15 kg/m³, μ 1.12e-5 Pa·s, κ 1.2.
  const molarMassKgPerMol = (15 * R * 300) / 2e6;
  const gas = {
    kind: 'ideal-gas',
    molarMassKgPerMol,
    compressibility: 1,
    isentropicExponent: 1.2,
    viscosityPaS: 1.12e-5,
  };
  const element = {
    kind: 'orifice',
    taps: 'flange',
    pipeDiameterM: 0.3,
    boreDiameterM: 0.1,
    referenceTemperatureK: 300,
  };

  it('solves O2 by API 14.3: Y1 0.99516626, C 0.59922241, qm 15549.3854 kg/h (hand iteration on Re_D)', () => {
    const r = calculateFlow({
      element: { ...element, method: 'api-14.3', expansionReference: 'upstream' },
      fluid: gas,
      conditions: { differentialPressurePa: 28000, staticPressurePa: 2e6, temperatureK: 300 },
    });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.result.expansibility).toBeCloseTo(0.9951662551440329, 12);
    expect(r.result.dischargeCoefficient).toBeCloseTo(0.5992224091135684, 8);
    expect(Math.abs(r.result.reynoldsNumber / 1636747.0584860442 - 1)).toBeLessThan(1e-7);
    expect(r.result.massFlowKgPerS * 3600).toBeCloseTo(15549.385425006765, 3);
    // ISO 5167-2 gives 15555.29024 kg/h for the same case (TRADE.md §3 O2, pvtlib): within 0.05 %.
    expect(Math.abs((r.result.massFlowKgPerS * 3600) / 15555.29024 - 1)).toBeLessThan(5e-4);
  });

  it('gives the same mass flow referred to the downstream tap (ideal gas, so Z_f2 = Z_f1 exactly)', () => {
    const r = calculateFlow({
      element: { ...element, method: 'api-14.3', expansionReference: 'downstream' },
      fluid: gas,
      conditions: { differentialPressurePa: 28000, staticPressurePa: 2e6 - 28000, temperatureK: 300 },
    });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.result.densityKgPerM3).toBeCloseTo((15 * (2e6 - 28000)) / 2e6, 9);
    expect(r.result.massFlowKgPerS * 3600).toBeCloseTo(15549.385425006765, 3);
  });

  it('leaves a case without a method on ISO 5167-2 (qm 15555.29024 kg/h, TRADE.md §3 O2)', () => {
    const r = calculateFlow({
      element,
      fluid: gas,
      conditions: { differentialPressurePa: 28000, staticPressurePa: 2e6, temperatureK: 300 },
    });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.result.massFlowKgPerS * 3600).toBeCloseTo(15555.29024, 4);
  });

  it('refuses api-14.3 with corner taps, and a reference tap without api-14.3, naming the field', () => {
    const conditions = { differentialPressurePa: 28000, staticPressurePa: 2e6, temperatureK: 300 };
    const corner = calculateFlow({
      element: { ...element, taps: 'corner', method: 'api-14.3' },
      fluid: gas,
      conditions,
    });
    expect(corner.ok).toBe(false);
    if (!corner.ok) expect(corner.error.field).toBe('element.taps');
    const stray = calculateFlow({ element: { ...element, expansionReference: 'downstream' }, fluid: gas, conditions });
    expect(stray.ok).toBe(false);
    if (!stray.ok) expect(stray.error.field).toBe('element.expansionReference');
    const unknown = calculateFlow({ element: { ...element, method: 'aga' }, fluid: gas, conditions });
    expect(unknown.ok).toBe(false);
    if (!unknown.ok) expect(unknown.error.field).toBe('element.method');
  });
});

describe('Z_f2/Z_f1 of the downstream-tap expansion factor (AGA 3 Part 1 §1.7.3, Y2 = Y1 sqrt[(p_f1 Z_f2)/(p_f2 Z_f1)])', () => {
  // AGA Report No. 8 Part 1 "Gulf Coast" gas (TRADE.md §4), the engine's DETAIL equation of state.
  const gulfCoast = {
    kind: 'natural-gas',
    composition: {
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
    },
  } as const;
  const p2 = 4e6;
  const dp = 4e4; // x2 = 1 %
  const t = 288.15;

  it('is Z at p_f2 over Z at p_f1 = p_f2 + Δp (AGA 3 Part 4 procedure 4.3.2.6), both at the flowing temperature', () => {
    const z2 = fluidState(gulfCoast, p2, t).compressibility as number;
    const z1 = fluidState(gulfCoast, p2 + dp, t).compressibility as number;
    expect(apiDownstreamCompressibilityRatio(gulfCoast, p2, dp, t)).toBeCloseTo(z2 / z1, 14);
  });

  it('is above 1 for a lean gas below 10 MPa, by about (1 − Z)·x: not negligible beside a 0.5 % budget', () => {
    // Z falls with pressure in this range (Z ≈ 0.91 at 4 MPa, 15 °C, from memory of AGA 8 tables), so Z_f2 > Z_f1.
    const ratio = apiDownstreamCompressibilityRatio(gulfCoast, p2, dp, t);
    const z = fluidState(gulfCoast, p2, t).compressibility as number;
    expect(z).toBeGreaterThan(0.88);
    expect(z).toBeLessThan(0.94);
    expect(ratio - 1).toBeGreaterThan(0.5 * (1 - z) * (dp / p2));
    expect(ratio - 1).toBeLessThan(2 * (1 - z) * (dp / p2));
  });

  it('makes Y2·sqrt(ρ2) equal Y1·sqrt(ρ1), so the flow is the same whichever tap the density is taken at', () => {
    // The defining identity of Y2 (AGA 3 Part 1 §1.7.3): qm ∝ Y sqrt(ρ Δp), with ρ from DETAIL at each tap.
    const beta = 0.6;
    const kappa = 1.3;
    const rho1 = fluidState(gulfCoast, p2 + dp, t).densityKgPerM3;
    const rho2 = fluidState(gulfCoast, p2, t).densityKgPerM3;
    const y1 = apiExpansionFactorUpstream(beta, dp, p2 + dp, kappa);
    const ratio = apiDownstreamCompressibilityRatio(gulfCoast, p2, dp, t);
    const y2 = apiExpansionFactorDownstream(beta, dp, p2, kappa, ratio);
    expect(Math.abs((y2 * Math.sqrt(rho2)) / (y1 * Math.sqrt(rho1)) - 1)).toBeLessThan(1e-12);
    // Taking Z_f2/Z_f1 as 1 misses that by half the ratio's departure from 1.
    const y2Unity = apiExpansionFactorDownstream(beta, dp, p2, kappa);
    expect(Math.abs((y2Unity * Math.sqrt(rho2)) / (y1 * Math.sqrt(rho1)) - 1)).toBeGreaterThan(1e-4);
  });

  it('works Y2 by hand for β 0.6, κ 1.3, x2 = 1 % and Z_f2/Z_f1 = 1.0008', () => {
    // p_f1 = 4.04 MPa, x1 = 0.04/4.04: Y1 = 1 − (0.41 + 0.04536)(0.0099010)/1.3 = 0.9965319116527037
    // (python3, by hand); Y2 = Y1 sqrt[(p_f1/p_f2)(Z_f2/Z_f1)] = Y1 sqrt(1.01 × 1.0008).
    const y1 = 1 - ((0.41 + 0.35 * 0.6 ** 4) * (4e4 / 4.04e6)) / 1.3;
    expect(y1).toBeCloseTo(0.9965319116527037, 13);
    expect(apiExpansionFactorDownstream(0.6, 4e4, 4e6, 1.3, 1.0008)).toBeCloseTo(
      0.9965319116527037 * Math.sqrt(1.01 * 1.0008),
      13,
    );
  });

  it('is 1 for a liquid, which has no compressibility', () => {
    const water = {
      kind: 'liquid',
      densityKgPerM3: 998.2,
      referenceTemperatureK: 293.15,
      expansionPerK: 0.00021,
    } as const;
    expect(apiDownstreamCompressibilityRatio(water, 1e6, 1e4, 293.15)).toBe(1);
  });

  it('refuses a pressure that is not above zero, naming it', () => {
    expect(() => apiDownstreamCompressibilityRatio(gulfCoast, 0, 1e4, t)).toThrow(/downstreamPressurePa must be > 0/);
  });

  it('is used by the flow calculation: a real gas gives the same flow referred to either tap', () => {
    // AGA 3 Part 1 §1.7.3 defines Y2 so that Y2 sqrt(ρ2) = Y1 sqrt(ρ1): the same installation measured at p_f1 or at
    // p_f2 = p_f1 − Δp must give one mass flow. Only Re_D differs (viscosity at two pressures), which moves C by far
    // less than the 1e-5 allowed here; with Z_f2/Z_f1 taken as 1 the two would differ by about 2e-4.
    const orifice = {
      kind: 'orifice',
      taps: 'flange',
      pipeDiameterM: 0.3,
      boreDiameterM: 0.15,
      referenceTemperatureK: t,
      method: 'api-14.3',
    } as const;
    const up = calculateFlow({
      element: { ...orifice, expansionReference: 'upstream' },
      fluid: gulfCoast,
      conditions: { differentialPressurePa: dp, staticPressurePa: p2 + dp, temperatureK: t },
    });
    const down = calculateFlow({
      element: { ...orifice, expansionReference: 'downstream' },
      fluid: gulfCoast,
      conditions: { differentialPressurePa: dp, staticPressurePa: p2, temperatureK: t },
    });
    if (!up.ok || !down.ok) throw new Error('calculation failed');
    expect(Math.abs(down.result.massFlowKgPerS / up.result.massFlowKgPerS - 1)).toBeLessThan(1e-5);
  });
});
