import { rangeCheckCurve, rangeCheckWithFluid, type RangeCheckInput } from './range-check';

/** Water-like liquid: ε = 1, so the venturi's C is fixed and qm ∝ √Δp exactly. */
const liquid = { densityKgPerM3: 998.2, viscosityPaS: 1.0e-3, isentropicExponent: 1.3, compressible: false };
const venturiRun: RangeCheckInput = {
  element: { kind: 'venturi', venturiType: 'as-cast', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
  fluid: { kind: 'water' },
  conditions: { staticPressurePa: 1e6, temperatureK: 293.15 },
  flowRange: { minimumKgPerS: 5, normalKgPerS: 20, maximumKgPerS: 40 },
  transmitters: [{ spanPa: 250000, accuracyPercentOfSpan: 0.075, unit: 'kPa' }],
  uncertaintyLimitPercent: 1,
};

describe('rangeCheckWithFluid', () => {
  it('inverts the flow equation: the O1 mass flow gives Δp = 17 kPa (TRADE.md §3 O1, fluids and pvtlib)', () => {
    const r = rangeCheckWithFluid(
      {
        ...venturiRun,
        element: { kind: 'orifice', taps: 'D-D/2', pipeDiameterM: 0.07366, boreDiameterM: 0.05 },
        conditions: { staticPressurePa: 200000, temperatureK: 293.15 },
        flowRange: { minimumKgPerS: 1, normalKgPerS: 7.702338035732167, maximumKgPerS: 8 },
        transmitters: [{ spanPa: 50000, accuracyPercentOfSpan: 0.075 }],
      },
      { densityKgPerM3: 999.1, viscosityPaS: 1.1e-3, isentropicExponent: 1.33, compressible: true },
    );
    expect(r.flows[1].differentialPressurePa).toBeCloseTo(17000, 5);
    expect(r.flows[1].transmitters[0].shareOfSpanPercent).toBeCloseTo(34, 8);
  });

  it('shows a 10:1 flow turndown as a 100:1 DP turndown at fixed C (TRADE.md §6, common practice)', () => {
    const r = rangeCheckWithFluid(
      { ...venturiRun, flowRange: { minimumKgPerS: 4, normalKgPerS: 20, maximumKgPerS: 40 } },
      liquid,
    );
    expect(r.flows[2].differentialPressurePa / r.flows[0].differentialPressurePa).toBeCloseTo(100, 9);
  });

  it('gives the flow at 10 % of span as √0.1 of the flow at full span (qm ∝ √Δp)', () => {
    const t = rangeCheckWithFluid(venturiRun, liquid).transmitters[0];
    expect(t.flowAtTenPercentSpanKgPerS / t.flowAtFullSpanKgPerS).toBeCloseTo(Math.sqrt(0.1), 10);
  });

  it('gives the turndown within 1 %: as-cast venturi U(C) = 0.7 %, 0.075 % of span → DP down to 0.075/(2·sqrt(1 − 0.7²)) of span, turndown 4.36394 (ISO 5167-4 [mem] and TRADE.md §6)', () => {
    // ½ · 0.075 · span/dp = sqrt(1² − 0.7²) → dp/span = 0.0375/0.714143 = 0.0525105; turndown = 1/sqrt(0.0525105) = 4.36394
    const t = rangeCheckWithFluid(venturiRun, liquid).transmitters[0];
    expect(t.turndown).toBeCloseTo(4.36394, 4);
  });

  it('marks readings below 10 % of span as low in range and gives their flow uncertainty', () => {
    const r = rangeCheckWithFluid(venturiRun, liquid);
    const atMinimum = r.flows[0].transmitters[0];
    expect(atMinimum.lowInRange).toBe(true);
    // flow uncertainty = sqrt(0.7² + (½ · reading %)²)
    expect(atMinimum.flowUncertaintyPercent).toBeCloseTo(Math.hypot(0.7, atMinimum.readingUncertaintyPercent / 2), 12);
    expect(atMinimum.readingUncertaintyPercent).toBeCloseTo((0.075 * 250000) / r.flows[0].differentialPressurePa, 10);
  });

  it('suggests a standard low-range span when one transmitter is not enough, and that span reaches the minimum flow', () => {
    const r = rangeCheckWithFluid(venturiRun, liquid);
    expect(r.rangeCovered).toBe(false);
    const s = r.suggestedLowRangeSpan!;
    expect(s.unit).toBe('kPa');
    expect(
      [1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 6, 7.5].map((x) => x * Math.pow(10, Math.floor(Math.log10(s.value)))),
    ).toContainEqual(expect.closeTo(s.value, 9));
    expect(s.minimumFlowWithinLimitKgPerS).toBeLessThanOrEqual(venturiRun.flowRange.minimumKgPerS);
    const withPair = rangeCheckWithFluid(
      { ...venturiRun, transmitters: [...venturiRun.transmitters, { spanPa: s.spanPa, accuracyPercentOfSpan: 0.075 }] },
      liquid,
    );
    expect(withPair.transmitters[1].coversMinimumFlow).toBe(true);
  });

  it('finds the range covered by one transmitter when the turndown is small', () => {
    const r = rangeCheckWithFluid(
      { ...venturiRun, flowRange: { minimumKgPerS: 50, normalKgPerS: 100, maximumKgPerS: 150 } },
      liquid,
    );
    expect(r.rangeCovered).toBe(true);
    expect(r.suggestedLowRangeSpan).toBeNull();
  });

  it('rejects a flow range out of order, naming flowRange', () => {
    expect(() =>
      rangeCheckWithFluid(
        { ...venturiRun, flowRange: { minimumKgPerS: 50, normalKgPerS: 20, maximumKgPerS: 40 } },
        liquid,
      ),
    ).toThrow(/flowRange/);
  });
});

describe('rangeCheckCurve', () => {
  it('gives log-spaced points up to the maximum flow with DP rising as flow² and no uncertainty above span', () => {
    const points = rangeCheckCurve(
      { ...venturiRun, flowRange: { minimumKgPerS: 5, normalKgPerS: 20, maximumKgPerS: 200 } },
      liquid,
      11,
      10,
    );
    expect(points).toHaveLength(11);
    expect(points[10].massFlowKgPerS).toBeCloseTo(200, 9);
    expect(points[0].massFlowKgPerS).toBeCloseTo(20, 9);
    expect(points[10].differentialPressurePa / points[0].differentialPressurePa).toBeCloseTo(100, 8);
    expect(points[10].flowUncertaintyPercent[0]).toBeNull();
  });
});

describe('rangeCheckWithFluid: a cone with a fixed C from a calibration', () => {
  // Liquid, so U(ε) = 0; only U(C) differs between the two runs. ISO 5167-1:2003 §8 [mem] combines
  // the terms in quadrature with sensitivity 1 for C, so U_uncal² − U_cal² = 5² − 0.5² = 24.75
  // (5 %: ISO 5167-5:2016 uncalibrated cone, TRADE.md §6 [mem]; 0.5 %: the certificate figure configured).
  const cone: RangeCheckInput = {
    ...venturiRun,
    element: { kind: 'cone', pipeDiameterM: 0.2, coneDiameterM: 0.14, dischargeCoefficient: 0.81 },
  };

  it('takes the certificate U(C) of 0.5 % instead of the uncalibrated 5 %', () => {
    const uncalibrated = rangeCheckWithFluid(cone, liquid).flows[1].transmitters[0].flowUncertaintyPercent;
    const calibrated = rangeCheckWithFluid(
      {
        ...cone,
        element: { ...cone.element, dischargeCoefficientCalibrated: true, calibrationUncertaintyPercent: 0.5 },
      },
      liquid,
    ).flows[1].transmitters[0].flowUncertaintyPercent;
    expect(uncalibrated ** 2 - calibrated ** 2).toBeCloseTo(24.75, 9);
  });
});
