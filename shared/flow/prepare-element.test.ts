import { prepareElement } from './prepare-element';

describe('prepareElement', () => {
  it('gives the C1 cone β = 0.6995709873957624 for D = 0.2575, dc = 0.184 (TRADE.md §3 C1, fluids docs)', () => {
    const e = prepareElement({ kind: 'cone', pipeDiameterM: 0.2575, coneDiameterM: 0.184 }, 293.15);
    expect(e.beta).toBeCloseTo(0.6995709873957624, 15);
    expect(e.boreDiameterM).toBeCloseTo(0.6995709873957624 * 0.2575, 15);
  });

  it('corrects diameters to flowing temperature, d = d_ref (1 + α (T − T_ref)) (ISO 5167-1 §5.1, TRADE.md §1)', () => {
    // 50 K above 20 °C: carbon steel pipe 1.116e-5/K, 316 SS plate 1.665e-5/K (TRADE.md §1 [mem]).
    const e = prepareElement(
      {
        kind: 'orifice',
        taps: 'flange',
        pipeDiameterM: 0.2,
        boreDiameterM: 0.1,
        pipeMaterial: 'carbon-steel',
        elementMaterial: 'stainless-316',
      },
      343.15,
    );
    expect(e.pipeDiameterM).toBeCloseTo(0.2 * (1 + 1.116e-5 * 50), 15);
    expect(e.boreDiameterM).toBeCloseTo(0.1 * (1 + 1.665e-5 * 50), 15);
    expect(e.warnings).toEqual([]);
  });

  it('lets a given coefficient win over a material name', () => {
    const e = prepareElement(
      {
        kind: 'venturi',
        venturiType: 'as-cast',
        pipeDiameterM: 0.2,
        boreDiameterM: 0.1,
        pipeExpansionPerK: 2e-5,
        pipeMaterial: 'carbon-steel',
        elementExpansionPerK: 0,
        referenceTemperatureK: 288.15,
      },
      298.15,
    );
    expect(e.pipeDiameterM).toBeCloseTo(0.2 * (1 + 2e-5 * 10), 15);
    expect(e.boreDiameterM).toBe(0.1);
  });

  it('warns when diameters cannot be corrected and the fluid is far from the reference temperature', () => {
    const e = prepareElement({ kind: 'venturi', venturiType: 'as-cast', pipeDiameterM: 0.2, boreDiameterM: 0.1 }, 400);
    expect(e.warnings.map((w) => w.code)).toContain('flow.thermalExpansionNotCorrected');
  });

  it('warns with the numbers when β and D are outside ISO 5167-2 §5.3.1 and the bore is below 12.5 mm', () => {
    const e = prepareElement({ kind: 'orifice', taps: 'corner', pipeDiameterM: 0.04, boreDiameterM: 0.032 }, 293.15);
    const byCode = Object.fromEntries(e.warnings.map((w) => [w.code, w.message]));
    expect(byCode['iso5167.betaOutOfRange']).toMatch(/0\.8/);
    expect(byCode['iso5167.pipeDiameterOutOfRange']).toMatch(/40 mm/);
    expect(e.warnings.map((w) => w.code)).not.toContain('iso5167.boreDiameterBelowMinimum');
    const small = prepareElement({ kind: 'orifice', taps: 'corner', pipeDiameterM: 0.05, boreDiameterM: 0.01 }, 293.15);
    expect(small.warnings.map((w) => w.code)).toContain('iso5167.boreDiameterBelowMinimum');
  });

  it('marks an uncalibrated cone meter (C = 0.82) with a warning', () => {
    const e = prepareElement({ kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.07 }, 293.15);
    expect(e.fixedDischargeCoefficient).toBe(0.82);
    expect(e.warnings.map((w) => w.code)).toContain('flow.coneUncalibrated');
  });

  it('throws naming the field when the bore is not below the pipe diameter or taps are missing', () => {
    expect(() =>
      prepareElement({ kind: 'orifice', taps: 'corner', pipeDiameterM: 0.1, boreDiameterM: 0.1 }, 293.15),
    ).toThrow(/element\.boreDiameterM/);
    expect(() => prepareElement({ kind: 'orifice', pipeDiameterM: 0.1, boreDiameterM: 0.05 }, 293.15)).toThrow(
      /element\.taps/,
    );
    expect(() => prepareElement({ kind: 'cone', pipeDiameterM: 0.1 }, 293.15)).toThrow(/element\.coneDiameterM/);
  });
});
