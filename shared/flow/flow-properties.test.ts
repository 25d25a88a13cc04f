/**
 * Properties of the flow equation, checked with fast-check over random meter runs.
 */
import fc from 'fast-check';
import { toSI } from '../units/convert-units';
import { differentialPressureForMassFlow } from './differential-pressure-for-flow';
import { evaluateFlow } from './evaluate-flow';
import { coneExpansibility, isentropicExpansibility, orificeExpansibility } from './expansibility';
import { prepareElement } from './prepare-element';

const T = 293.15;
const gas = { densityKgPerM3: 40, viscosityPaS: 1.1e-5, isentropicExponent: 1.3, compressible: true };
const liquid = { densityKgPerM3: 998, viscosityPaS: 1e-3, isentropicExponent: 1.3, compressible: false };
const betaArb = fc.double({ min: 0.2, max: 0.75, noNaN: true });
const pipeArb = fc.double({ min: 0.05, max: 0.6, noNaN: true });
const tapsArb = fc.constantFrom('corner' as const, 'flange' as const, 'D-D/2' as const);

describe('flow equation properties (fast-check)', () => {
  it('flow rises with DP (orifice, C iterated on Re_D, gas)', () => {
    fc.assert(
      fc.property(
        betaArb,
        pipeArb,
        tapsArb,
        fc.double({ min: 10, max: 5e4, noNaN: true }),
        fc.double({ min: 1.001, max: 3, noNaN: true }),
        (beta, D, taps, dp, factor) => {
          const e = prepareElement({ kind: 'orifice', taps, pipeDiameterM: D, boreDiameterM: beta * D }, T);
          const p1 = 5e6;
          return evaluateFlow(e, dp * factor, p1, gas).massFlowKgPerS > evaluateFlow(e, dp, p1, gas).massFlowKgPerS;
        },
      ),
    );
  });

  it('ε → 1 as DP → 0 for the orifice, venturi/nozzle and cone equations', () => {
    fc.assert(
      fc.property(
        betaArb,
        fc.double({ min: 1.05, max: 1.67, noNaN: true }),
        fc.double({ min: 1e5, max: 2e7, noNaN: true }),
        (beta, k, p1) => {
          const dp = p1 * 1e-9;
          return [orificeExpansibility, isentropicExpansibility, coneExpansibility].every(
            (f) => Math.abs(f(beta, dp, p1, k) - 1) < 1e-8 && f(beta, dp, p1, k) <= 1,
          );
        },
      ),
    );
  });

  it('at fixed C, flow ∝ √DP: four times the DP gives twice the flow (liquid, ε = 1)', () => {
    fc.assert(
      fc.property(
        betaArb,
        pipeArb,
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 0.6, max: 1, noNaN: true }),
        (beta, D, dp, c) => {
          const e = prepareElement(
            {
              kind: 'venturi',
              venturiType: 'as-cast',
              pipeDiameterM: D,
              boreDiameterM: beta * D,
              dischargeCoefficient: c,
            },
            T,
          );
          const ratio =
            evaluateFlow(e, 4 * dp, 1e7, liquid).massFlowKgPerS / evaluateFlow(e, dp, 1e7, liquid).massFlowKgPerS;
          return Math.abs(ratio - 2) < 1e-12;
        },
      ),
    );
  });

  it('a 10:1 flow turndown is a 100:1 DP turndown at fixed C (common practice, TRADE.md §6)', () => {
    fc.assert(
      fc.property(betaArb, pipeArb, fc.double({ min: 100, max: 1e6, noNaN: true }), (beta, D, dpTop) => {
        const e = prepareElement(
          { kind: 'cone', pipeDiameterM: D, coneDiameterM: D * Math.sqrt(1 - beta * beta), dischargeCoefficient: 0.8 },
          T,
        );
        const qMax = evaluateFlow(e, dpTop, 1e9, liquid).massFlowKgPerS;
        const dpMax = differentialPressureForMassFlow(e, qMax, 1e9, liquid).differentialPressurePa;
        const dpMin = differentialPressureForMassFlow(e, qMax / 10, 1e9, liquid).differentialPressurePa;
        return Math.abs(dpMax / dpMin - 100) < 1e-9;
      }),
    );
  });

  it('gives the same flow whatever units the inputs arrive in (via shared/units)', () => {
    const dpUnits = ['Pa', 'kPa', 'mbar', 'bar', 'psi', 'inH2O-4C', 'inH2O-60F', 'inH2O-68F'];
    const pUnits = ['Pa', 'kPa', 'MPa', 'bar', 'psi'];
    const tUnits = ['K', 'degC', 'degF'];
    const e = prepareElement(
      {
        kind: 'orifice',
        taps: 'flange',
        pipeDiameterM: 0.2,
        boreDiameterM: 0.1,
        pipeMaterial: 'carbon-steel',
        elementMaterial: 'stainless-316',
      },
      310,
    );
    fc.assert(
      fc.property(
        fc.constantFrom(...dpUnits),
        fc.constantFrom(...pUnits),
        fc.constantFrom(...tUnits),
        fc.double({ min: 100, max: 50000, noNaN: true }),
        (dpUnit, pUnit, tUnit, dpPa) => {
          const p1Pa = 4e6;
          const TK = 310;
          // Express the same state in the chosen units, then bring it back with toSI.
          const dpIn = dpPa / toSI(1, dpUnit);
          const pIn = p1Pa / toSI(1, pUnit);
          const tIn = tUnit === 'K' ? TK : tUnit === 'degC' ? TK - 273.15 : TK * 1.8 - 459.67;
          const back = prepareElement(
            {
              kind: 'orifice',
              taps: 'flange',
              pipeDiameterM: 0.2,
              boreDiameterM: 0.1,
              pipeMaterial: 'carbon-steel',
              elementMaterial: 'stainless-316',
            },
            toSI(tIn, tUnit),
          );
          const q1 = evaluateFlow(e, dpPa, p1Pa, gas).massFlowKgPerS;
          const q2 = evaluateFlow(back, toSI(dpIn, dpUnit), toSI(pIn, pUnit), gas).massFlowKgPerS;
          return Math.abs(q2 / q1 - 1) < 1e-12;
        },
      ),
    );
  });
});
