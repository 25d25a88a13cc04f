import { boreDiameterForBetaM, coneDiameterForBetaM } from './element-geometry';
import { DEMO_METER_RUNS, meterRunByTag } from './index';

/** β of a cone meter as ISO 5167-5:2016 §3.3.1 defines it: sqrt(1 − dc²/D²) (TRADE.md §2), written out here on purpose. */
const coneBeta = (pipeDiameterM: number, coneDiameterM: number) =>
  Math.sqrt(1 - (coneDiameterM * coneDiameterM) / (pipeDiameterM * pipeDiameterM));

describe('cone geometry of the demo scenario', () => {
  it("gives β = 0.6995709873957624 for TRADE.md C1's cone (D 0.2575 m, dc 0.184 m), so the check below uses the standard's definition", () => {
    expect(coneBeta(0.2575, 0.184)).toBeCloseTo(0.6995709873957624, 14); // [lib] fluids docs, TRADE.md §3 C1
  });

  it.each([
    ['KFG-101', 0.55],
    ['KFG-102', 0.65],
    ['BPM-CW1', 0.65],
    ['BPM-EF1', 0.7],
  ])("seeds %s's cone so that sqrt(1 − dc²/D²) is SCENARIO.md's β %f to 1e-4", (tag, beta) => {
    const { element } = meterRunByTag(tag);
    expect(element.kind).toBe('cone');
    expect(Math.abs(coneBeta(element.pipeDiameterM, element.coneDiameterM!) - beta)).toBeLessThan(1e-4);
  });

  it("gives KFG-101's replacement cone SCENARIO.md's β 0.45 and keeps the pipe", () => {
    const run = meterRunByTag('KFG-101');
    const element = run.elementChange!.element;
    expect(element.pipeDiameterM).toBe(run.element.pipeDiameterM);
    expect(Math.abs(coneBeta(element.pipeDiameterM, element.coneDiameterM!) - 0.45)).toBeLessThan(1e-4);
  });

  it.each([
    ['KFG-103', 0.5],
    ['KFG-201', 0.6],
    ['BPM-ST1', 0.6],
  ])("seeds %s's bore as β·D with SCENARIO.md's β %f (ISO 5167-1: β = d/D)", (tag, beta) => {
    const { element } = meterRunByTag(tag);
    expect(Math.abs(element.boreDiameterM! / element.pipeDiameterM - beta)).toBeLessThan(1e-4);
  });

  it('states every element diameter to the micrometre, as a certificate would', () => {
    for (const run of DEMO_METER_RUNS) {
      const d = run.element.coneDiameterM ?? run.element.boreDiameterM!;
      expect(Math.abs(d * 1e6 - Math.round(d * 1e6))).toBeLessThan(1e-6);
    }
  });

  it('refuses a beta ratio outside 0–1, naming the function and the field', () => {
    expect(() => coneDiameterForBetaM(0.1, 1.2)).toThrow(/coneDiameterForBetaM: beta/);
    expect(() => boreDiameterForBetaM(-1, 0.5)).toThrow(/boreDiameterForBetaM: pipeDiameterM/);
  });
});
