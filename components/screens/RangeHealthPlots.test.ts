/**
 * US daylight saving time (Energy Policy Act of 2005) is not in force in January:
 * America/Denver is then UTC−7, so its 1 January starts at 07:00 UTC.
 */
import type { BandShare, MonthHealth } from '@/hooks/api/rangeHealth';
import { bandInWords, bandSharesPlot, monthlyTrendPlot, percentText } from './RangeHealthPlots';

function band(name: BandShare['band'], flowTimeShare: number, standardVolumeShare = flowTimeShare): BandShare {
  return {
    band: name,
    fromPercent: 0,
    toPercent: null,
    flowTimeS: 0,
    massKg: 0,
    standardVolumeM3: 0,
    flowTimeShare,
    massShare: standardVolumeShare,
    standardVolumeShare,
    uncertaintyPercent: null,
    uncertaintyContributionPercent: flowTimeShare,
  };
}

function month(name: string, shares: Partial<Record<BandShare['band'], number>>): MonthHealth {
  return {
    month: name,
    flowTimeS: 1,
    massKg: 1,
    standardVolumeM3: 1,
    uncertaintyPercent: null,
    bands: Object.fromEntries(
      Object.entries(shares).map(([b, s]) => [b, { flowTimeShare: s, massShare: s, standardVolumeShare: s }]),
    ),
  };
}

describe('bandInWords and percentText', () => {
  it('writes the DP bands as ranges of span, with an en dash', () => {
    expect(bandInWords('0-10')).toBe('0–10 %');
    expect(bandInWords('50-100')).toBe('50–100 %');
    expect(bandInWords('over')).toBe('Over range');
    expect(bandInWords('100-200')).toBe('100-200');
  });

  it('writes a share as a percentage', () => {
    expect(percentText(0.425)).toBe('42.5 %');
    expect(percentText(0.5, 0)).toBe('50 %');
  });
});

describe('bandSharesPlot', () => {
  const plot = bandSharesPlot([band('10-25', 0.3), band('0-10', 0.1), band('50-100', 0.5), band('over', 0.1)]);

  it('steps across the span from each band’s lower edge, over range drawn from 100 to 110 %', () => {
    expect(plot.x.values).toEqual([0, 10, 25, 50, 100, 110]);
    expect(plot.x.range).toEqual([0, 110]);
  });

  it('puts each band’s share in span order as a percent, a missing band as 0, the last repeated at the right end', () => {
    expect(plot.series[0].values).toEqual([10, 30, 0, 50, 10, 10]);
    expect(plot.series.every((s) => s.stepped)).toBe(true);
  });

  it('marks the band edges', () => {
    expect(plot.markers?.map((m) => m.x)).toEqual([10, 25, 50, 100]);
  });
});

describe('monthlyTrendPlot', () => {
  const months = [
    month('2026-01', { '0-10': 0.1, '10-25': 0.2, '25-50': 0.3, '50-100': 0.35, over: 0.05 }),
    month('2026-02', { '0-10': 0.4, '50-100': 0.6 }),
  ];
  const period = { from: '2026-01-10T07:00:00Z', to: '2026-03-01T07:00:00Z' };
  const plot = monthlyTrendPlot(months, 'America/Denver', period);

  it('stacks the shares below each edge of the span, as percents', () => {
    expect(plot.series.map((s) => s.values.map((v) => (v === null ? null : Math.round(v * 1e9) / 1e9)))).toEqual([
      [10, 40, 40],
      [30, 40, 40],
      [60, 40, 40],
      [95, 100, 100],
    ]);
  });

  it('draws a month from its first day on the site’s clock, or from the period’s start when that is later', () => {
    expect(plot.x.values).toEqual([
      Date.UTC(2026, 0, 10, 7) / 1000,
      Date.UTC(2026, 1, 1, 7) / 1000,
      Date.UTC(2026, 2, 1, 7) / 1000,
    ]);
    expect(plot.x.range).toEqual([Date.UTC(2026, 0, 10, 7) / 1000, Date.UTC(2026, 2, 1, 7) / 1000]);
  });

  it('draws nothing for a period with no flowing month', () => {
    const empty = monthlyTrendPlot([], 'America/Denver', period);
    expect(empty.x.values).toEqual([]);
    expect(empty.x.range).toBeUndefined();
    expect(empty.emptyText).toBe('No flowing time in this period.');
  });
});
