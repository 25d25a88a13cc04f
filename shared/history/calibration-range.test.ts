import type { ElementSpec } from '../flow/flow-types';
import { computeHour } from './compute-hour';
import { HOUR_MS, START_MS, WATER, hourInputs, samplesEvery, singleDp } from './hour-inputs-fixture';

/**
 * A calibrated cone in the hourly records (issue 11 §2): its U(C) is the certificate's, and an
 * hour whose Re_D lies outside the certificate's points is flagged. Water at 20 °C, 5 bar,
 * 20 kPa through a DN 150 cone of 100 mm: β = √(1 − (100/150)²) = 0.745, E = 1/√(1 − β⁴) = 1.202,
 * βarea = π/4 β² D² = 9.82e-3 m², so with C = 0.8 qm = C E A √(2ρΔp) ≈ 0.8 × 1.202 × 9.82e-3 × 6318
 * ≈ 59.6 kg/s and Re_D = 4qm/(πDμ) ≈ 238.5/(π × 0.15 × 1.0e-3) ≈ 5 × 10⁵ (ISO 5167-1 §3.3.2.3
 * [mem] defines Re_D; μ of water at 20 °C ≈ 1.0 mPa·s, IAPWS 2008 [mem]): far above the 2e4 of the
 * low curve and inside the 1e4–1e8 of the wide one.
 */
const dpEvery10s = () => samplesEvery(START_MS, START_MS + HOUR_MS, 10, () => 20000);
const cone = (calibration: ElementSpec['calibration'], calibrationUncertaintyPercent?: number): ElementSpec => ({
  kind: 'cone',
  pipeDiameterM: 0.15,
  coneDiameterM: 0.1,
  referenceTemperatureK: 293.15,
  calibration,
  ...(calibrationUncertaintyPercent !== undefined ? { calibrationUncertaintyPercent } : {}),
});
const hourWith = (element: ElementSpec) =>
  computeHour(
    hourInputs({
      dp: [singleDp(dpEvery10s())],
      configVersions: [{ id: 'cv-cone', effectiveFromMs: 0, element, fluid: WATER }],
    }),
  );
const wide = [
  { reynoldsNumber: 1e4, dischargeCoefficient: 0.8 },
  { reynoldsNumber: 1e8, dischargeCoefficient: 0.8 },
];
const low = [
  { reynoldsNumber: 1e3, dischargeCoefficient: 0.8 },
  { reynoldsNumber: 2e4, dischargeCoefficient: 0.8 },
];

describe('a calibrated cone in the hourly records', () => {
  it("flags outside-calibration-range for an hour whose Re_D lies above the certificate's points, and not inside them", () => {
    expect(hourWith(cone(low)).flags).toContain('outside-calibration-range');
    expect(hourWith(cone(wide)).flags).not.toContain('outside-calibration-range');
  });

  it("takes U(C) from the certificate: U² grows by exactly 2² − 0.5² = 3.75 (%²) for a certificate's 2 % against the default 0.5 %", () => {
    // ISO 5167-1:2003 §8 (eq. 13 [mem]): C enters (δqm/qm)² with sensitivity 1, every other term is unchanged.
    const withDefault = hourWith(cone(wide)).uncertaintyPercent!;
    const withCertificate = hourWith(cone(wide, 2)).uncertaintyPercent!;
    expect(withCertificate ** 2 - withDefault ** 2).toBeCloseTo(3.75, 9);
  });

  it('keeps the mass when only the certificate uncertainty changes (the curve, not its uncertainty, sets C)', () => {
    expect(hourWith(cone(wide, 2)).massKg).toBe(hourWith(cone(wide)).massKg);
  });
});
