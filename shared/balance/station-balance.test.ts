import { stationBalance } from './station-balance';

/**
 * A balance day worked by hand. Inlets A 100 000 m³ (U = 1.0 %) and B 50 000 m³ (U = 2.0 %), outlet
 * S 147 000 m³ (U = 0.5 %), allowance 1 % of the inlet, tolerance 0.5 %.
 *   inlet = 150 000 m³; allowance = 0.01 × 150 000 = 1 500 m³
 *   imbalance = 150 000 − 147 000 − 1 500 = 1 500 m³ = 1.0 % of the inlet → outside 0.5 %
 * Uncertainty, GUM (JCGM 100:2008) §5.1.2 eq. 10, uncorrelated: sensitivity of an inlet 1 − 0.01 = 0.99,
 * of the outlet −1; U_A = 1 000 m³, U_B = 1 000 m³, U_S = 735 m³:
 *   U² = (0.99 × 1 000)² + (0.99 × 1 000)² + 735² = 980 100 + 980 100 + 540 225 = 2 500 425
 *   U = √2 500 425 = 1 581.27 m³ → |1 500| is not larger than its own uncertainty.
 */
const day = {
  inlets: [
    { meterRunId: 'A', standardVolumeM3: 100_000, uncertaintyPercent: 1 },
    { meterRunId: 'B', standardVolumeM3: 50_000, uncertaintyPercent: 2 },
  ],
  outlets: [{ meterRunId: 'S', standardVolumeM3: 147_000, uncertaintyPercent: 0.5 }],
  days: 1,
};

describe('stationBalance', () => {
  it('gives the imbalance, its percent of the inlet and its expanded uncertainty as worked by hand', () => {
    const b = stationBalance({ allowancePercent: 1, allowanceDailyM3: null, tolerancePercent: 0.5 }, day);
    expect(b.inletStandardVolumeM3).toBe(150_000);
    expect(b.outletStandardVolumeM3).toBe(147_000);
    expect(b.allowanceM3).toBeCloseTo(1_500, 9);
    expect(b.imbalanceM3).toBeCloseTo(1_500, 9);
    expect(b.imbalancePercent).toBeCloseTo(1.0, 12);
    expect(b.uncertaintyM3).toBeCloseTo(Math.sqrt(2_500_425), 9);
    expect(b.uncertaintyM3).toBeCloseTo(1581.27, 2);
    expect(b.withinTolerance).toBe(false);
    expect(b.exceedsUncertainty).toBe(false);
  });

  it('takes a fixed daily allowance once per contract day of the period, as exact', () => {
    // 2 000 m³/d over a 30-day month = 60 000 m³; inlet 3 000 000, outlet 2 937 000 → imbalance 3 000 = 0.1 %.
    // Sensitivities all ±1: U² = 30 000² + 14 685² → U = √(900 000 000 + 215 649 225) = 33 401.34 m³.
    const b = stationBalance(
      { allowancePercent: null, allowanceDailyM3: 2_000, tolerancePercent: 0.5 },
      {
        inlets: [{ meterRunId: 'A', standardVolumeM3: 3_000_000, uncertaintyPercent: 1 }],
        outlets: [{ meterRunId: 'S', standardVolumeM3: 2_937_000, uncertaintyPercent: 0.5 }],
        days: 30,
      },
    );
    expect(b.allowanceM3).toBe(60_000);
    expect(b.imbalanceM3).toBeCloseTo(3_000, 6);
    expect(b.imbalancePercent).toBeCloseTo(0.1, 9);
    expect(b.uncertaintyM3).toBeCloseTo(33_401.34, 1);
    expect(b.withinTolerance).toBe(true);
  });

  it('leaves the uncertainty unknown when a member with volume has none, and the percent when the inlet is empty', () => {
    const unknown = stationBalance(
      { allowancePercent: 0, allowanceDailyM3: null, tolerancePercent: 1 },
      { ...day, outlets: [{ meterRunId: 'S', standardVolumeM3: 149_000, uncertaintyPercent: null }] },
    );
    expect(unknown.uncertaintyM3).toBeNull();
    expect(unknown.exceedsUncertainty).toBeNull();
    const empty = stationBalance(
      { allowancePercent: 0, allowanceDailyM3: null, tolerancePercent: 1 },
      { inlets: [{ meterRunId: 'A', standardVolumeM3: 0, uncertaintyPercent: null }], outlets: [], days: 1 },
    );
    expect(empty.imbalancePercent).toBeNull();
    expect(empty.uncertaintyM3).toBe(0);
    expect(empty.withinTolerance).toBe(true);
  });
});
