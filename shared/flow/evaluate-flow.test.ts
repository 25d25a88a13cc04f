import { evaluateFlow, type FlowFluidProperties } from './evaluate-flow';
import { prepareElement } from './prepare-element';

/** Diameters given at flowing temperature: reference temperature = flowing temperature, so no thermal correction. */
const T = 293.15;

describe('evaluateFlow (ISO 5167-1 eq. 1, C iterated on Re_D per Annex C)', () => {
  // O1 / C6 / V2 inputs: D = 0.07366, d or dc = 0.05, p1 = 200 kPa, p2 = 183 kPa, ρ = 999.1, κ = 1.33.
  // TRADE.md §3 notes these apply the gas ε equations to liquid-like inputs, as the source library's tests do.
  const o1Fluid: FlowFluidProperties = {
    densityKgPerM3: 999.1,
    viscosityPaS: 1.1e-3,
    isentropicExponent: 1.33,
    compressible: true,
  };

  it('gives the O1 orifice (D-D/2) ε = 0.9711026967, C = 0.6151252900, Re_D = 121034.2529, qm = 7.702338035732167 kg/s (TRADE.md §3 O1, fluids and pvtlib)', () => {
    const element = prepareElement({ kind: 'orifice', taps: 'D-D/2', pipeDiameterM: 0.07366, boreDiameterM: 0.05 }, T);
    const r = evaluateFlow(element, 17000, 200000, o1Fluid);
    expect(r.expansibility).toBeCloseTo(0.9711026967, 10);
    expect(r.dischargeCoefficient).toBeCloseTo(0.61512529, 10);
    expect(r.reynoldsNumber).toBeCloseTo(121034.2529, 4);
    expect(r.massFlowKgPerS).toBeCloseTo(7.702338035732167, 11);
  });

  it('gives the O2 orifice (flange) ε = 0.9958616, C = 0.599031, qm = 15555.29024 kg/h (TRADE.md §3 O2, pvtlib)', () => {
    const element = prepareElement({ kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 }, T);
    const r = evaluateFlow(element, 28000, 2e6, {
      densityKgPerM3: 15,
      viscosityPaS: 1.12e-5,
      isentropicExponent: 1.2,
      compressible: true,
    });
    expect(r.expansibility).toBeCloseTo(0.9958616, 7);
    expect(r.dischargeCoefficient).toBeCloseTo(0.599031, 6);
    expect(r.massFlowKgPerS * 3600).toBeCloseTo(15555.29024, 4);
  });

  it('gives the C6 cone β = 0.734328, ε = 0.945588, qm = 12.33112236221754 kg/s with C = 0.82 (TRADE.md §3 C6, fluids tests)', () => {
    const element = prepareElement(
      { kind: 'cone', pipeDiameterM: 0.07366, coneDiameterM: 0.05, dischargeCoefficient: 0.82 },
      T,
    );
    const r = evaluateFlow(element, 17000, 200000, o1Fluid);
    expect(element.beta).toBeCloseTo(0.734328, 6);
    expect(r.expansibility).toBeCloseTo(0.945588, 6);
    expect(r.massFlowKgPerS).toBeCloseTo(12.33112236221754, 11);
  });

  it('gives the V2 machined venturi ε = 0.9353633365, qm = 12.000442363269464 kg/s with C = 0.995 (TRADE.md §3 V2, fluids)', () => {
    const element = prepareElement(
      { kind: 'venturi', venturiType: 'machined', pipeDiameterM: 0.07366, boreDiameterM: 0.05 },
      T,
    );
    const r = evaluateFlow(element, 17000, 200000, o1Fluid);
    expect(r.dischargeCoefficient).toBe(0.995);
    expect(r.expansibility).toBeCloseTo(0.9353633365, 10);
    expect(r.massFlowKgPerS).toBeCloseTo(12.000442363269464, 11);
  });

  // Debian python3-fluids 1.0.22: differential_pressure_meter_solver(D=0.1, D2=0.06, P1=5e6, P2=4.97e6, rho=40,
  // mu=1.1e-5, k=1.3, meter_type=...) printed 4.498389427498863 (ISA 1932) and 4.648989837656686 (long radius).
  it.each([
    ['isa-1932', 4.498389427498863],
    ['long-radius', 4.648989837656686],
  ] as const)('gives the %s nozzle the mass flow python3-fluids solves (%p kg/s)', (nozzleType, expected) => {
    const element = prepareElement({ kind: 'nozzle', nozzleType, pipeDiameterM: 0.1, boreDiameterM: 0.06 }, T);
    const r = evaluateFlow(element, 30000, 5e6, {
      densityKgPerM3: 40,
      viscosityPaS: 1.1e-5,
      isentropicExponent: 1.3,
      compressible: true,
    });
    expect(r.massFlowKgPerS / expected - 1).toBeLessThan(1e-9);
    expect(expected / r.massFlowKgPerS - 1).toBeLessThan(1e-9);
  });

  it('takes ε = 1 for an incompressible fluid (TRADE.md §1)', () => {
    const element = prepareElement({ kind: 'orifice', taps: 'corner', pipeDiameterM: 0.1, boreDiameterM: 0.05 }, T);
    const r = evaluateFlow(element, 25000, 5e5, { ...o1Fluid, compressible: false });
    expect(r.expansibility).toBe(1);
  });

  it('satisfies Re_D = 4 qm/(π μ D) at the converged point to |δ/A1| < 1e-10 (ISO 5167-1 Annex C)', () => {
    const element = prepareElement({ kind: 'orifice', taps: 'corner', pipeDiameterM: 0.2, boreDiameterM: 0.12 }, T);
    const r = evaluateFlow(element, 5000, 3e6, {
      densityKgPerM3: 25,
      viscosityPaS: 1.1e-5,
      isentropicExponent: 1.3,
      compressible: true,
    });
    const reFromFlow = (4 * r.massFlowKgPerS) / (Math.PI * 1.1e-5 * 0.2);
    expect(Math.abs(reFromFlow / r.reynoldsNumber - 1)).toBeLessThan(1e-9);
  });

  it('gives no flow at zero or negative differential pressure', () => {
    const element = prepareElement({ kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.07 }, T);
    expect(evaluateFlow(element, 0, 1e6, o1Fluid).massFlowKgPerS).toBe(0);
    expect(evaluateFlow(element, -5, 1e6, o1Fluid).massFlowKgPerS).toBe(0);
  });
});
