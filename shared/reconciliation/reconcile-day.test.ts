import { reconcileFigures, sumReconciledDays, type ReconciledDay } from './reconcile-day';

// 1 ft = 0.3048 m exactly (international yard and pound, 1959), so 1 Mscf = 1000 × 0.3048³ m³ = 28.316846592 m³.
const MSCF_M3 = 28.316846592;

describe('reconcileFigures', () => {
  it('takes Tallyrun minus field, as a percent of the field total, and finds 0.5025 % outside a 0.5 % tolerance', () => {
    // By hand: 1000 − 995 = 5 m³; 5 / 995 = 0.0050251256… → 0.50251256 %, above 0.5 %.
    const r = reconcileFigures({ tallyrunSI: 1000, fieldSI: 995, unit: 'm3', tolerancePercent: 0.5 });
    expect(r.difference).toBeCloseTo(5, 12);
    expect(r.differencePercent).toBeCloseTo(0.50251256, 8);
    expect(r.withinTolerance).toBe(false);
  });

  it("shows both figures in the field total's unit (Mscf) and finds −0.3984 % within 0.5 %", () => {
    // By hand: Tallyrun 283.16846592 m³ = 10 Mscf; field 10.04 Mscf; 10 − 10.04 = −0.04 Mscf; −0.04 / 10.04 = −0.398406 %.
    const r = reconcileFigures({
      tallyrunSI: 10 * MSCF_M3,
      fieldSI: 10.04 * MSCF_M3,
      unit: 'Mscf',
      tolerancePercent: 0.5,
    });
    expect(r.tallyrunValue).toBeCloseTo(10, 10);
    expect(r.fieldValue).toBeCloseTo(10.04, 10);
    expect(r.difference).toBeCloseTo(-0.04, 10);
    expect(r.differencePercent).toBeCloseTo(-0.39840637, 7);
    expect(r.withinTolerance).toBe(true);
  });

  it('counts a difference exactly at the tolerance as within it', () => {
    // 1005 − 1000 = 5 = 0.5 % of 1000.
    expect(
      reconcileFigures({ tallyrunSI: 1005, fieldSI: 1000, unit: 'm3', tolerancePercent: 0.5 }).withinTolerance,
    ).toBe(true);
  });

  it('gives no percent for a zero field total, and within only when Tallyrun is zero too', () => {
    expect(reconcileFigures({ tallyrunSI: 0, fieldSI: 0, unit: 'kg', tolerancePercent: 0.5 })).toMatchObject({
      differencePercent: null,
      withinTolerance: true,
    });
    expect(reconcileFigures({ tallyrunSI: 1, fieldSI: 0, unit: 'kg', tolerancePercent: 0.5 }).withinTolerance).toBe(
      false,
    );
  });

  it('gives no verdict when Tallyrun has no figure of the quantity', () => {
    expect(reconcileFigures({ tallyrunSI: null, fieldSI: 5e9, unit: 'GJ', tolerancePercent: 0.5 })).toMatchObject({
      tallyrunValue: null,
      fieldValue: 5,
      difference: null,
      withinTolerance: null,
    });
  });
});

describe('sumReconciledDays', () => {
  const day = (startMs: number, t: number, f: number): ReconciledDay => ({
    startMs,
    endMs: startMs + 86_400_000,
    quantity: 'standard-volume',
    unit: 'm3',
    ...reconcileFigures({ tallyrunSI: t, fieldSI: f, unit: 'm3', tolerancePercent: 0.5 }),
  });

  it("sums a month's days and judges the sum as a whole", () => {
    // By hand: Tallyrun 1000 + 1010 + 990 = 3000; field 995 + 1000 + 1000 = 2995; 5 / 2995 = 0.16694 %.
    const [sum] = sumReconciledDays([day(0, 1000, 995), day(1, 1010, 1000), day(2, 990, 1000)], 0.5);
    expect(sum).toMatchObject({
      quantity: 'standard-volume',
      unit: 'm3',
      days: 3,
      tallyrunValue: 3000,
      fieldValue: 2995,
    });
    expect(sum.difference).toBeCloseTo(5, 9);
    expect(sum.differencePercent).toBeCloseTo(0.16694491, 7);
    expect(sum.withinTolerance).toBe(true);
    // Day by day: 0.5025 % out, 1.0 % out, −1.0 % out.
    expect(sum.daysOutsideTolerance).toBe(3);
  });
});
