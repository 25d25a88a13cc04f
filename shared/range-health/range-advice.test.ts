import { rangeAdvice, type RangeAdviceInput } from './range-advice';

/**
 * A water venturi, D 0.2 m, d 0.1 m (β 0.5), as-cast C = 0.984 (ISO 5167-4 [mem]), ε = 1, so
 * qm = C/√(1−β⁴)·(π/4)d²·√(2ρΔp) and by hand, with ρ ≈ 998 kg/m³ (water at 20 °C, IAPWS):
 * 40 kg/s ↔ Δp ≈ 12.6 kPa, 20 kg/s ↔ 3.2 kPa, 4 kg/s ↔ 0.13 kPa. On a 0–25 kPa transmitter the
 * top flow uses half the span. The range check's own numbers are tested in shared/flow; here
 * only the decision is tested.
 */
const base: RangeAdviceInput = {
  element: { kind: 'venturi', venturiType: 'as-cast', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
  fluid: { kind: 'water' },
  conditions: { staticPressurePa: 1e6, temperatureK: 293.15 },
  flowRange: { minimumKgPerS: 20, normalKgPerS: 30, maximumKgPerS: 40 },
  transmitters: [
    { id: '1', tag: 'FT-1', stackRole: 'single', spanPa: 25_000, accuracyPercentOfSpan: 0.075, unit: 'kPa' },
  ],
  lowInRangeTimeShare: 0,
  overRangeTimeShare: 0,
  uncertaintyLimitPercent: 1,
  pipeDiameterPercent: 0,
  elementDiameterPercent: 0,
  densityPercent: 0,
};

describe('rangeAdvice', () => {
  it('needs no change when the flows sit in the upper part of the span', () => {
    const a = rangeAdvice(base);
    expect(a.kind).toBe('none');
  });

  it('re-ranges a single transmitter down when the highest flow uses little of the span', () => {
    // 4 kg/s max: DP is (4/40)² = 1 % of the DP at 40 kg/s, far below half the span.
    const a = rangeAdvice({
      ...base,
      flowRange: { minimumKgPerS: 2, normalKgPerS: 3, maximumKgPerS: 4 },
      lowInRangeTimeShare: 0.8,
    });
    expect(a.kind).toBe('re-range');
    const dpMax = Number(a.numbers.dpAtMaximumFlowPa);
    expect(Number(a.numbers.suggestedSpan) * 1000).toBeGreaterThanOrEqual(dpMax * 1.1);
    expect(a.text).toMatch(/^Re-range FT-1 from 0–25 to 0–/);
    expect(dpMax).toBeGreaterThan(120);
    expect(dpMax).toBeLessThan(130); // ≈ 0.126 kPa by hand
  });

  it('adds a low-range transmitter when the span must stay for the top flow but the low flows are low in range', () => {
    const a = rangeAdvice({
      ...base,
      flowRange: { minimumKgPerS: 4, normalKgPerS: 20, maximumKgPerS: 40 },
      lowInRangeTimeShare: 0.3,
    });
    expect(a.kind).toBe('add-low-range-transmitter');
    expect(Number(a.numbers.suggestedSpan)).toBeLessThan(25);
  });

  it('re-ranges up when flow was over range', () => {
    const a = rangeAdvice({
      ...base,
      transmitters: [{ ...base.transmitters[0], spanPa: 10_000 }],
      overRangeTimeShare: 0.2,
    });
    expect(a.kind).toBe('re-range');
    expect(a.text).toMatch(/up to/);
  });

  it('says no DP span can meet the limit when the terms other than the DP already exceed it', () => {
    // As-cast venturi U(C) 0.7 % (ISO 5167-4 [mem]) and a 2 % density allowance (½ × 2 = 1 % on qm):
    // √(0.7² + 1²) = 1.22 % > 1 % before any DP term, so no span or bore change reaches 1 %.
    const a = rangeAdvice({ ...base, densityPercent: 2 });
    expect(a.kind).toBe('change-element');
    expect(a.text).toMatch(/^No DP span can meet 1 %/);
  });
});
