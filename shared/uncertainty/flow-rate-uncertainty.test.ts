import { massFlowFromEquationKgPerS } from '../flow/mass-flow-equation';
import { diameterSensitivities, flowRateUncertainty } from './flow-rate-uncertainty';

describe('flowRateUncertainty (ISO 5167-1:2003 §8, TRADE.md §6)', () => {
  it('combines the inputs by the formula of TRADE.md §6 for an orifice at β = 0.5', () => {
    const beta4 = 0.5 ** 4;
    // TRADE.md §6 written out: U² = U_C² + U_ε² + (2β⁴/(1−β⁴))² U_D² + (2/(1−β⁴))² U_d² + ¼U_Δp² + ¼U_ρ²
    const expected = Math.sqrt(
      0.5 ** 2 +
        0.02 ** 2 +
        ((2 * beta4) / (1 - beta4)) ** 2 * 0.4 ** 2 +
        (2 / (1 - beta4)) ** 2 * 0.07 ** 2 +
        0.25 * 0.75 ** 2 +
        0.25 * 0.2 ** 2,
    );
    const r = flowRateUncertainty({
      kind: 'orifice',
      beta: 0.5,
      dischargeCoefficientPercent: 0.5,
      expansibilityPercent: 0.02,
      pipeDiameterPercent: 0.4,
      elementDiameterPercent: 0.07,
      differentialPressurePercent: 0.75,
      densityPercent: 0.2,
    });
    expect(r.expandedPercent).toBeCloseTo(expected, 12);
    expect(r.expandedPercent).toBeCloseTo(0.65282, 4); // by hand: sqrt(0.25 + 0.0004 + 0.0028444 + 0.0223004 + 0.140625 + 0.01)
    expect(r.standardPercent).toBeCloseTo(expected / 2, 12);
  });

  it('halves the DP uncertainty on flow: 0.75 % of reading gives 0.375 % of flow (TRADE.md §6 [calc])', () => {
    const r = flowRateUncertainty({
      kind: 'venturi',
      beta: 0.6,
      dischargeCoefficientPercent: 0,
      expansibilityPercent: 0,
      pipeDiameterPercent: 0,
      elementDiameterPercent: 0,
      differentialPressurePercent: 0.75,
      densityPercent: 0,
    });
    expect(r.expandedPercent).toBeCloseTo(0.375, 12);
  });

  it.each([0.45, 0.6, 0.75])(
    'uses cone sensitivities that match a finite difference of the flow equation with d = βD, β = sqrt(1 − dc²/D²) (β = %p)',
    (beta) => {
      const D = 0.2;
      const dc = D * Math.sqrt(1 - beta * beta);
      const qm = (pipe: number, cone: number) => {
        const b = Math.sqrt(1 - (cone * cone) / (pipe * pipe));
        return massFlowFromEquationKgPerS(0.82, 1, b, b * pipe, 1e4, 50);
      };
      const h = 1e-6;
      const dLnD = (Math.log(qm(D * (1 + h), dc)) - Math.log(qm(D * (1 - h), dc))) / (2 * h);
      const dLnDc = (Math.log(qm(D, dc * (1 + h))) - Math.log(qm(D, dc * (1 - h)))) / (2 * h);
      const s = diameterSensitivities('cone', beta);
      expect(s.pipe).toBeCloseTo(dLnD, 6);
      expect(s.element).toBeCloseTo(dLnDc, 6);
    },
  );

  it('uses orifice sensitivities that match a finite difference of the flow equation (β = 0.6)', () => {
    const qm = (pipe: number, bore: number) => massFlowFromEquationKgPerS(0.6, 1, bore / pipe, bore, 1e4, 50);
    const h = 1e-6;
    const s = diameterSensitivities('orifice', 0.6);
    expect(s.pipe).toBeCloseTo((Math.log(qm(0.2 * (1 + h), 0.12)) - Math.log(qm(0.2 * (1 - h), 0.12))) / (2 * h), 6);
    expect(s.element).toBeCloseTo((Math.log(qm(0.2, 0.12 * (1 + h))) - Math.log(qm(0.2, 0.12 * (1 - h)))) / (2 * h), 6);
  });

  it('rejects a negative input, naming it', () => {
    expect(() =>
      flowRateUncertainty({
        kind: 'orifice',
        beta: 0.5,
        dischargeCoefficientPercent: -1,
        expansibilityPercent: 0,
        pipeDiameterPercent: 0,
        elementDiameterPercent: 0,
        differentialPressurePercent: 0,
        densityPercent: 0,
      }),
    ).toThrow(/dischargeCoefficientPercent/);
  });
});

describe('static pressure and temperature terms through the density', () => {
  it('adds ½ × |∂lnρ/∂ln x| × U(x): 0.2 % on p and 0.2309 % on T of a gas give 0.1 % and 0.11547 % (ISO 5167-1:2003 §8)', () => {
    // Hand arithmetic: p: 0.1 % of a 10 MPa span at 5 MPa → 0.2 % of reading; T: a ± 0.3 % of a
    // 200 K span rectangular limit → U = 2 × 0.3/√3 = 0.34641 % of span → × 200/300 K = 0.230940 %.
    const base = {
      kind: 'orifice' as const,
      beta: 0.5,
      dischargeCoefficientPercent: 0.5,
      expansibilityPercent: 0,
      pipeDiameterPercent: 0,
      elementDiameterPercent: 0,
      differentialPressurePercent: 0,
      densityPercent: 0,
    };
    const r = flowRateUncertainty({
      ...base,
      staticPressurePercent: 0.2,
      temperaturePercent: ((2 * 0.3) / Math.sqrt(3)) * (200 / 300),
      densityPressureSensitivity: 1,
      densityTemperatureSensitivity: -1,
    });
    const byName = Object.fromEntries(r.contributions.map((c) => [c.name, c]));
    expect(byName.staticPressure.percent).toBeCloseTo(0.1, 12);
    expect(byName.temperature.percent).toBeCloseTo(0.11547005, 8);
    expect(r.expandedPercent).toBeCloseTo(Math.sqrt(0.25 + 0.01 + 0.11547005 ** 2), 8);
    expect(byName.staticPressure.source).toMatch(/ISO 5167-1/);
    expect(flowRateUncertainty(base).contributions.map((c) => c.name)).not.toContain('staticPressure');
    expect(r.contributions.every((c) => c.source.length > 0)).toBe(true);
  });
});
