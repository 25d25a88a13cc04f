import { dischargeCoefficientUncertaintyPercent, expansibilityUncertaintyPercent } from './element-uncertainty';

describe('dischargeCoefficientUncertaintyPercent', () => {
  const orifice = { kind: 'orifice' as const, pipeDiameterM: 0.2, reynoldsNumber: 1e6 };

  it('gives 0.5 % for an orifice with 0.2 ≤ β ≤ 0.6 (ISO 5167-2:2003 §5.3.3.1, TRADE.md §2)', () => {
    expect(dischargeCoefficientUncertaintyPercent({ ...orifice, beta: 0.2 })).toBe(0.5);
    expect(dischargeCoefficientUncertaintyPercent({ ...orifice, beta: 0.6 })).toBe(0.5);
  });

  it('gives (1.667β − 0.5) % = 0.6669 % for an orifice at β = 0.7 (ISO 5167-2:2003 §5.3.3.1)', () => {
    expect(dischargeCoefficientUncertaintyPercent({ ...orifice, beta: 0.7 })).toBeCloseTo(0.6669, 10);
  });

  it('adds 0.9(0.75 − β)(2.8 − D/25.4) % below D = 71.12 mm: β = 0.5, D = 50 mm → 0.687087 % (ISO 5167-2:2003 §5.3.3.1)', () => {
    // 0.5 + 0.9 × 0.25 × (2.8 − 50/25.4) = 0.5 + 0.225 × 0.831496 = 0.687087
    expect(dischargeCoefficientUncertaintyPercent({ ...orifice, beta: 0.5, pipeDiameterM: 0.05 })).toBeCloseTo(
      0.687087,
      6,
    );
  });

  it('adds 0.5 % when β > 0.5 and Re_D < 10 000 (ISO 5167-2:2003 §5.3.3.1)', () => {
    expect(dischargeCoefficientUncertaintyPercent({ ...orifice, beta: 0.55, reynoldsNumber: 8000 })).toBeCloseTo(
      1.0,
      12,
    );
  });

  it('gives 5 % for an uncalibrated cone meter (TRADE.md §2 [mem])', () => {
    expect(
      dischargeCoefficientUncertaintyPercent({ kind: 'cone', beta: 0.6, pipeDiameterM: 0.1, reynoldsNumber: 1e6 }),
    ).toBe(5);
  });
});

describe('expansibilityUncertaintyPercent', () => {
  it('gives 3.5Δp/(κp1) % for an orifice: Δp = 25 kPa, p1 = 6 MPa, κ = 1.3 → 0.0112179 % (ISO 5167-2:2003 §5.3.3.2, TRADE.md §2)', () => {
    expect(expansibilityUncertaintyPercent('orifice', 0.5, 25000, 6e6, 1.3)).toBeCloseTo(
      (3.5 * 25000) / (1.3 * 6e6),
      12,
    );
    expect(expansibilityUncertaintyPercent('orifice', 0.5, 25000, 6e6, 1.3)).toBeCloseTo(0.0112179, 7);
  });

  it('is 0 for an incompressible fluid (ε = 1 exactly)', () => {
    expect(expansibilityUncertaintyPercent('orifice', 0.5, 25000, 6e6, 1.3, false)).toBe(0);
  });
});

describe('dischargeCoefficientUncertaintyPercent with a calibration certificate (issue 11 §2)', () => {
  const base = { beta: 0.5, pipeDiameterM: 0.1, reynoldsNumber: 1e6 };
  it("gives a calibrated cone the certificate's U(C) (0.8 %) rather than the typical 0.5 %", () => {
    expect(
      dischargeCoefficientUncertaintyPercent({
        ...base,
        kind: 'cone',
        calibrated: true,
        certificateUncertaintyPercent: 0.8,
      }),
    ).toBe(0.8);
    expect(dischargeCoefficientUncertaintyPercent({ ...base, kind: 'cone', calibrated: true })).toBe(0.5);
  });
  it("gives any element with a laboratory curve its certificate's U(C), and ignores a certificate without a curve", () => {
    expect(
      dischargeCoefficientUncertaintyPercent({
        ...base,
        kind: 'orifice',
        calibrated: true,
        certificateUncertaintyPercent: 0.3,
      }),
    ).toBe(0.3);
    // ISO 5167-2:2003 §5.3.3.1: 0.5 % for 0.2 ≤ β ≤ 0.6 (D = 100 mm ≥ 71.12 mm, Re_D ≥ 10 000).
    expect(
      dischargeCoefficientUncertaintyPercent({ ...base, kind: 'orifice', certificateUncertaintyPercent: 0.3 }),
    ).toBe(0.5);
  });
});
