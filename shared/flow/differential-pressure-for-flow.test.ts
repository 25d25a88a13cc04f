import { differentialPressureForMassFlow } from './differential-pressure-for-flow';
import { evaluateFlow } from './evaluate-flow';
import { prepareElement } from './prepare-element';

describe('differentialPressureForMassFlow', () => {
  const gas = { densityKgPerM3: 999.1, viscosityPaS: 1.1e-3, isentropicExponent: 1.33, compressible: true };

  it('returns Δp = 17 kPa for the O1 mass flow 7.702338035732167 kg/s (TRADE.md §3 O1, fluids and pvtlib)', () => {
    const element = prepareElement(
      { kind: 'orifice', taps: 'D-D/2', pipeDiameterM: 0.07366, boreDiameterM: 0.05 },
      293.15,
    );
    const r = differentialPressureForMassFlow(element, 7.702338035732167, 200000, gas);
    expect(r.differentialPressurePa).toBeCloseTo(17000, 6);
    expect(r.expansibility).toBeCloseTo(0.9711026967, 10);
  });

  it('returns Δp = 17 kPa for the C6 cone mass flow 12.33112236221754 kg/s (TRADE.md §3 C6, fluids tests)', () => {
    const element = prepareElement(
      { kind: 'cone', pipeDiameterM: 0.07366, coneDiameterM: 0.05, dischargeCoefficient: 0.82 },
      293.15,
    );
    expect(differentialPressureForMassFlow(element, 12.33112236221754, 200000, gas).differentialPressurePa).toBeCloseTo(
      17000,
      6,
    );
  });

  it('round-trips with evaluateFlow for a nozzle in gas', () => {
    const element = prepareElement(
      { kind: 'nozzle', nozzleType: 'isa-1932', pipeDiameterM: 0.15, boreDiameterM: 0.09 },
      293.15,
    );
    const fluid = { densityKgPerM3: 45, viscosityPaS: 1.1e-5, isentropicExponent: 1.3, compressible: true };
    const dp = differentialPressureForMassFlow(element, 3.2, 6e6, fluid).differentialPressurePa;
    expect(evaluateFlow(element, dp, 6e6, fluid).massFlowKgPerS).toBeCloseTo(3.2, 9);
  });

  it('throws, naming massFlowKgPerS, when the flow would need a DP above the static pressure', () => {
    const element = prepareElement(
      { kind: 'orifice', taps: 'corner', pipeDiameterM: 0.1, boreDiameterM: 0.02 },
      293.15,
    );
    expect(() => differentialPressureForMassFlow(element, 50, 2e5, { ...gas, densityKgPerM3: 2 })).toThrow(
      /massFlowKgPerS/,
    );
  });
});
