import {
  allocationColumns,
  allocationRows,
  balanceColumns,
  balanceRows,
  balanceSummary,
  columnDecimals,
  formatFigure,
} from './balanceView';
import type { Allocation, BalancePeriod } from './useBalanceGroups';

/** The balance day of tests/api/balance-groups.test.ts (worked by hand there): 1 500 m³ out, U 1 581.27 m³. */
const day: BalancePeriod = {
  start: '2026-09-10T00:00:00.000Z',
  end: '2026-09-11T00:00:00.000Z',
  inletStandardVolumeM3: 150_000,
  outletStandardVolumeM3: 147_000,
  allowanceM3: 1_500,
  imbalanceM3: 1_500,
  imbalancePercent: 1,
  uncertaintyM3: 1581.2732,
  withinTolerance: false,
  exceedsUncertainty: false,
  missingMeterRunIds: [],
};

describe('balanceView', () => {
  it('groups thousands, keeps one number of decimals per column, and writes a true minus', () => {
    expect(formatFigure(1234567.891, 1)).toBe('1,234,567.9');
    expect(formatFigure(-1500, 0, true)).toBe('−1,500');
    expect(formatFigure(1500, 0, true)).toBe('+1,500');
    expect(formatFigure(null, 2)).toBe('—');
    expect(columnDecimals([150_000, 3])).toBe(0);
    expect(columnDecimals([150.5])).toBe(3);
  });

  it('puts the unit in every figure header', () => {
    expect(balanceColumns('si').map((c) => c.title)).toContain('Imbalance, m³');
    expect(balanceColumns('us').map((c) => c.title)).toContain('Inlet, Mscf');
    expect(allocationColumns('si').map((c) => c.title)).toContain('Allocated energy, GJ');
  });

  it('shows a balance day with its verdicts on the tolerance and on its own uncertainty', () => {
    const [row] = balanceRows([day], { displayUnits: 'si', timeZone: 'UTC', interval: 'day' });
    expect(row.cells).toMatchObject({
      period: '10 Sep 2026',
      inlet: '150,000',
      outlet: '147,000',
      allowance: '1,500',
      imbalance: '+1,500',
      percent: '+1.00',
      uncertainty: '±1,581',
      verdict: 'Outside',
      beyondUncertainty: 'No',
    });
    expect(balanceSummary([day], 0.5)).toBe(
      '1 period is outside the tolerance of ±0.50 % of the inlet; 0 of them are larger than their own uncertainty.',
    );
  });

  it('names a month by its month and year on the site clock, as the shared date formatter spells it', () => {
    // 00:30 UTC on the 1st of October is still the 30th of September in Denver (UTC−6 then).
    const [row] = balanceRows([{ ...day, start: '2026-10-01T00:30:00Z' }], {
      displayUnits: 'si',
      timeZone: 'America/Denver',
      interval: 'month',
    });
    expect(row.cells.period).toBe('Sep 2026');
  });

  it('says whether any imbalance is larger than its own uncertainty when every period is within tolerance', () => {
    const within = { ...day, withinTolerance: true, exceedsUncertainty: false };
    expect(balanceSummary([within], 2)).toBe(
      'Every period is within the tolerance of ±2.00 % of the inlet. No imbalance is larger than its own uncertainty.',
    );
    expect(balanceSummary([within, { ...within, exceedsUncertainty: true }], 2)).toBe(
      'Every period is within the tolerance of ±2.00 % of the inlet. 1 imbalance is larger than its own uncertainty.',
    );
  });

  it('shows the allocation with a total row equal to the sales meter', () => {
    // The pro-rata month of the API test: factors 0.6, 0.3, 0.1 of 98 000 m³ and of 3.92 TJ (3 920 GJ);
    // six significant figures of the column's largest value: 98,000.0 m³ and 3,920.00 GJ.
    const allocation: Allocation = {
      balanceGroupId: '1',
      month: '2026-09',
      sales: { meterRunId: 'S', tag: 'S-1', standardVolumeM3: 98_000, energyJ: 3.92e12, status: 'complete' },
      wells: [
        ['A', 60_000, 2.4e12, 0.6, 0.6],
        ['B', 30_000, 1.26e12, 0.3, 0.315],
        ['C', 10_000, 0.34e12, 0.1, 0.085],
      ].map(([id, v, e, f, ef]) => ({
        meterRunId: id as string,
        tag: `${id}-1`,
        status: 'complete',
        standardVolumeM3: v as number,
        energyJ: e as number,
        factor: f as number,
        allocatedStandardVolumeM3: (f as number) * 98_000,
        energyFactor: ef as number,
        allocatedEnergyJ: (ef as number) * 3.92e12,
      })),
    };
    const rows = allocationRows(allocation, 'si');
    expect(rows[0].cells).toMatchObject({
      well: 'A-1',
      factor: '0.600000',
      allocated: '58,800.0',
      allocatedEnergy: '2,352.00',
    });
    expect(rows[3].cells).toMatchObject({
      well: 'Total (sales S-1)',
      own: '100,000.0',
      factor: '1.000000',
      allocated: '98,000.0',
      allocatedEnergy: '3,920.00',
    });
  });
});
