import {
  formatPercent,
  percentChart,
  reconciliationGroups,
  recentMonthsWindow,
  tableDecimals,
  type ReconciliationDay,
  type ReconciliationSum,
} from './reconciliationView';

// The two days worked by hand in tests/api/reconciliations.test.ts: +500 m³ (+0.5025 %), −200 m³ (−0.1992 %).
const day = (start: string, end: string, t: number, f: number, within: boolean): ReconciliationDay => ({
  start,
  end,
  quantity: 'standard-volume',
  unit: 'm3',
  tallyrunValue: t,
  fieldValue: f,
  difference: t - f,
  differencePercent: (100 * (t - f)) / f,
  tolerancePercent: 0.5,
  withinTolerance: within,
});
const days = [
  day('2026-09-01T06:00:00Z', '2026-09-02T06:00:00Z', 100_000, 99_500, false),
  day('2026-09-02T06:00:00Z', '2026-09-03T06:00:00Z', 100_200, 100_400, true),
];
const sum: ReconciliationSum = {
  from: '2026-09-01T00:00:00Z',
  to: '2026-10-01T00:00:00Z',
  quantity: 'standard-volume',
  unit: 'm3',
  days: 2,
  daysOutsideTolerance: 1,
  daysWithoutTallyrunFigure: 0,
  tallyrunValue: 200_200,
  fieldValue: 199_900,
  difference: 300,
  differencePercent: (100 * 300) / 199_900,
  tolerancePercent: 0.5,
  withinTolerance: true,
};

describe('reconciliationGroups', () => {
  const [group] = reconciliationGroups(days, [sum], 'UTC');

  it('puts the unit in every header of a figure, and names the contract day on the site clock', () => {
    expect(group.title).toBe('Volume at base conditions, m³');
    expect(group.columns.map((c) => c.title)).toEqual([
      'Contract day',
      'Tallyrun, m³',
      'Field, m³',
      'Difference, m³',
      'Difference, % of field',
      'Tolerance, %',
      'Verdict',
    ]);
    expect(group.rows[0].cells.day).toBe('2026-09-01');
  });

  it('groups thousands, signs the difference and says which day is outside', () => {
    expect(group.rows[0].cells).toMatchObject({
      tallyrun: '100,000',
      field: '99,500',
      difference: '+500',
      percent: '+0.50 %',
      verdict: 'Outside',
    });
    expect(group.rows[1].cells).toMatchObject({ difference: '−200', percent: '−0.20 %', verdict: 'Within' });
    expect(group.outsideDays).toBe(1);
  });

  it("adds the month's sum row", () => {
    expect(group.sumRow?.cells).toMatchObject({
      day: 'Sum, 2 d',
      tallyrun: '200,200',
      field: '199,900',
      difference: '+300',
      percent: '+0.15 %',
      verdict: 'Within (1 d outside)',
    });
  });
});

describe('percentChart', () => {
  it('draws one stepped line of the percent per day with the tolerance above and below zero', () => {
    const chart = percentChart(days, 'UTC');
    expect(chart.x.values).toEqual([Date.parse(days[0].start) / 1000, Date.parse(days[1].start) / 1000]);
    expect(chart.series).toHaveLength(1);
    expect(chart.series[0].values[0]).toBeCloseTo(0.50251256, 8);
    expect(chart.lines?.map((l) => l.value)).toEqual([0.5, -0.5]);
  });

  it('spans the chosen window on the site clock, so a single day still has a dated axis', () => {
    // 2026-11-01 00:00 in Denver is 06:00Z (MDT, UTC−6, until 2026-11-01 08:00Z); 2026-12-01 00:00 is 07:00Z (MST).
    const chart = percentChart(days.slice(0, 1), 'America/Denver', { from: '2026-11-01', to: '2026-12-01' });
    expect(chart.x.range).toEqual([
      Date.parse('2026-11-01T06:00:00Z') / 1000,
      Date.parse('2026-12-01T07:00:00Z') / 1000,
    ]);
    expect(percentChart(days.slice(0, 1), 'UTC').x.range).toEqual([
      Date.parse(days[0].start) / 1000,
      Date.parse(days[0].start) / 1000 + 86_400,
    ]);
  });
});

describe('tableDecimals', () => {
  it('gives six significant figures of the largest field total, from none to three decimals', () => {
    expect(tableDecimals([99_500, 100_400])).toBe(0);
    expect(tableDecimals([1_002.5])).toBe(2);
    expect(tableDecimals([3.2])).toBe(3);
    expect(tableDecimals([])).toBe(0);
  });
});

describe('formatPercent', () => {
  it('signs with a true minus and shows a dash for no value', () => {
    expect(formatPercent(-0.1992)).toBe('−0.20 %');
    expect(formatPercent(null)).toBe('—');
    expect(formatPercent(0.001)).toBe('0.00 %');
  });
});

describe('recentMonthsWindow', () => {
  it("runs from the first of last month to the first of next month on the site's clock", () => {
    // 2026-10-01T03:00Z is still 30 Sep in Denver (UTC−6): last month is August there.
    expect(recentMonthsWindow(Date.parse('2026-10-01T03:00:00Z'), 'America/Denver')).toEqual({
      from: '2026-08-01',
      to: '2026-10-01',
    });
  });
});
