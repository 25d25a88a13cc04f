import type { ElementSpec } from '../flow/flow-types';
import { computeHour } from './compute-hour';
import {
  HOUR_MS,
  KESTREL_GAS,
  ORIFICE_4IN,
  START_MS,
  WATER,
  hourInputs,
  samplesEvery,
  singleDp,
} from './hour-inputs-fixture';
import type { HourInputs } from './types';

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

describe('a calibrated cone outside its calibrated Re_D range', () => {
  it('widens U(C) by the rectangular term 2|C_end − 0.82|/(√3 C_end): U² grows by (200 × 0.02/(√3 × 0.8))² = 8.3333 %²', () => {
    // Rule of shared/history/sample-uncertainty.ts; GUM §4.3.7 (u = a/√3 for a ± a limit), k = 2.
    // Hand arithmetic: a = |0.8 − 0.82| / 0.8 = 2.5 %, U = 2 × 2.5/√3 = 2.886751 %, U² = 8.333333 %².
    // The in-range hour (wide curve, same Re_D, DP and fluid) differs only in this term.
    const inside = hourWith(cone(wide)).uncertaintyPercent!;
    const outside = hourWith(cone(low)).uncertaintyPercent!;
    expect(outside ** 2 - inside ** 2).toBeCloseTo(25 / 3, 6);
    expect(hourWith(cone(low)).flags).toContain('outside-calibration-range');
  });
});

describe("an hourly record's uncertainty budget", () => {
  it('lists each term with its source; the extrapolated cone hour shows U(C) = √(0.5² + 2.886751²) = 2.929733 % and says why', () => {
    // By hand: default calibrated-cone U(C) 0.5 % (no certificate figure) widened in quadrature by the
    // rectangular term 2 × 0.025/√3 × 100 = 2.886751 % (GUM §4.3.7). In a steady hour every sample has
    // the same budget, so the root-sum-square of the terms equals the record's U (ISO 5167-1:2003 §8).
    const r = hourWith(cone(low));
    const c = r.uncertaintyBudget!.find((t) => t.name === 'dischargeCoefficient')!;
    expect(c.percent).toBeCloseTo(2.929733, 5);
    expect(c.source).toMatch(/calibration extrapolated/);
    expect(c.source).toMatch(/GUM §4\.3\.7/);
    const rss = Math.sqrt(r.uncertaintyBudget!.reduce((sum, t) => sum + t.percent ** 2, 0));
    expect(rss).toBeCloseTo(r.uncertaintyPercent!, 9);
    expect(r.uncertaintyBudget!.every((t) => t.source.length > 0)).toBe(true);
  });

  it('adds the temperature transmitter through the density when the hour carries it: a ± 0.25 % of 200 K rectangular limit at 293.15 K', () => {
    // Water (incompressible): ∂lnρ/∂lnp is taken as 0, and ∂lnρ/∂lnT is not modelled yet for liquids
    // (0), so neither term may add anything; the terms still appear with their sources.
    const r = computeHour(
      hourInputs({
        dp: [singleDp(dpEvery10s())],
        configVersions: [{ id: 'cv-cone', effectiveFromMs: 0, element: cone(wide), fluid: WATER }],
        temperatureTransmitter: { accuracyPercentOfSpan: 0.25, span: 200, accuracyKind: 'rectangular-limit' },
        staticPressureTransmitter: { accuracyPercentOfSpan: 0.1, span: 1e6, accuracyKind: 'expanded-k2' },
      }),
    );
    const names = r.uncertaintyBudget!.map((t) => t.name);
    expect(names).toEqual(expect.arrayContaining(['staticPressure', 'temperature']));
    expect(r.uncertaintyBudget!.find((t) => t.name === 'temperature')!.source).toMatch(/√3/);
    expect(r.uncertaintyPercent).toBeCloseTo(hourWith(cone(wide)).uncertaintyPercent!, 12);
  });
});

describe('static pressure and temperature transmitters in a gas hour', () => {
  it('adds ½ × U(p)/p and ½ × U(T)/T (ideal-gas sensitivities 1 and −1): U² grows by 1² + 0.0984735² = 1.0096970 %²', () => {
    // By hand (ISO 5167-1:2003 §8, sensitivity ½ of qm to ρ; ρ ∝ p/(Z T), Z's own derivatives left
    // out): p: 0.1 % (k = 2) of a 10 MPa span at 500 kPa absolute → 0.1 × 1e7/5e5 = 2 % → term 1 %;
    // T: a ± 0.25 % of 200 K rectangular limit → U = 2 × 0.25/√3 = 0.288675 % of span (GUM §4.3.7)
    // → × 200/293.15 = 0.196949 % of reading → term 0.0984735 %.
    const gasHour = (extra: Partial<HourInputs>) =>
      computeHour(
        hourInputs({
          dp: [singleDp(samplesEvery(START_MS, START_MS + HOUR_MS, 10, () => 20000))],
          configVersions: [{ id: 'cv-gas', effectiveFromMs: 0, element: ORIFICE_4IN, fluid: KESTREL_GAS }],
          ...extra,
        }),
      );
    const without = gasHour({}).uncertaintyPercent!;
    const withBoth = gasHour({
      staticPressureTransmitter: { accuracyPercentOfSpan: 0.1, span: 1e7, accuracyKind: 'expanded-k2' },
      temperatureTransmitter: { accuracyPercentOfSpan: 0.25, span: 200, accuracyKind: 'rectangular-limit' },
    });
    expect(withBoth.uncertaintyPercent! ** 2 - without ** 2).toBeCloseTo(1.009697, 6);
    expect(withBoth.uncertaintyBudget!.find((t) => t.name === 'staticPressure')!.percent).toBeCloseTo(1, 9);
  });
});
