import { lastMonth, monthCells, shiftMonth } from './monthFormat';

const figures = {
  massKg: 1_234_567,
  volumeM3: 10_000,
  standardVolumeM3: 1_000_000,
  energyJ: 38e12,
  coverage: 0.995,
  flags: [],
  uncertaintyPercent: 0.72,
  status: 'complete' as const,
  correctionsInForce: 2,
  previousMonth: null,
  yearEarlier: null,
  changeFromPreviousMonthPercent: 1.5,
  changeFromYearEarlierPercent: -3.25,
};

describe('monthCells', () => {
  it('shows SI figures in t, m³ and GJ with thousands separators', () => {
    const cells = monthCells(figures, 'si');
    expect(cells.mass).toBe('1,234.57');
    expect(cells.standardVolume).toBe('1,000,000');
    expect(cells.energy).toBe('38,000.0');
    expect(cells.previous).toBe('+1.50');
    expect(cells.yearEarlier).toBe('-3.25');
  });

  it('shows US figures in Mscf, 1 Mscf being 1000 × 0.3048³ m³ (NIST SP 811 B.8)', () => {
    expect(monthCells(figures, 'us').standardVolume).toBe('35,314.7');
  });
});

describe('shiftMonth and lastMonth', () => {
  it('crosses years both ways', () => {
    expect(shiftMonth('2026-01', -1)).toBe('2025-12');
    expect(shiftMonth('2025-12', 1)).toBe('2026-01');
    expect(lastMonth(Date.parse('2026-03-15T00:00:00Z'))).toBe('2026-02');
  });
});
