/**
 * The range health report's charts, as props for components/charts: the shares of each band
 * drawn as steps across the DP span (a bar chart whose bars are the bands), and the monthly
 * shares stacked (below 10 %, below 25 %, ... of span), so a well drifting down its span shows
 * as the lower lines rising month by month.
 */
import { DateTime } from 'luxon';

import type { ChartProps } from '@/components/charts/chartTypes';
import type { BandShare, MonthHealth } from '@/hooks/api/rangeHealth';
import { type dpBandNames } from '@/hooks/api/rangeHealth';
import { DP_BANDS } from '@/shared/range-health/band-shares';

/** Where the over-range band is drawn on the span axis (it has no upper end). */
const overRangeDrawnToPercent = 110;

const bandWords: Record<(typeof dpBandNames)[number], string> = {
  '0-10': '0–10 %',
  '10-25': '10–25 %',
  '25-50': '25–50 %',
  '50-100': '50–100 %',
  over: 'Over range',
};

/**
 * @param band a band code such as '0-10'
 * @returns how it is written, e.g. "0–10 %" or "Over range"
 */
export function bandInWords(band: string): string {
  return bandWords[band as keyof typeof bandWords] ?? band;
}

/**
 * @param share a share, 0..1
 * @param digits decimals of the percentage
 * @returns e.g. "42.5 %"
 */
export function percentText(share: number, digits = 1): string {
  return `${(share * 100).toFixed(digits)} %`;
}

/**
 * Steps across the span: each band's share held from its lower edge to its upper edge (uPlot
 * "step after"), the last value repeated at the right end so the over-range step is drawn.
 * @param bands the period's bands, in span order
 * @returns the chart's props
 */
export function bandSharesPlot(bands: readonly BandShare[]): ChartProps {
  const ordered = DP_BANDS.map(({ band }) => bands.find((b) => b.band === band));
  const edges = [...DP_BANDS.map((b) => b.fromPercent), overRangeDrawnToPercent];
  const steps = (pick: (b: BandShare) => number) => {
    const values = ordered.map((b) => (b ? pick(b) : 0));
    return [...values, values[values.length - 1]];
  };
  return {
    title: 'Share of flowing time and of volume in each band of the DP span, with each band’s part of the uncertainty',
    x: {
      values: edges,
      kind: 'linear',
      label: 'DP, % of span in use (over range: 100–110)',
      range: [0, overRangeDrawnToPercent],
    },
    axes: [
      { scale: 'share', label: 'Share, %', side: 'left', range: [0, null] },
      { scale: 'u', label: 'Part of U, %', side: 'right', range: [0, null] },
    ],
    series: [
      {
        label: 'Flowing time',
        values: steps((b) => b.flowTimeShare * 100),
        scale: 'share',
        rank: 0,
        stepped: true,
        significant: 3,
      },
      {
        label: 'Volume at base',
        values: steps((b) => b.standardVolumeShare * 100),
        scale: 'share',
        rank: 1,
        stepped: true,
        significant: 3,
      },
      {
        label: 'Part of U (k = 2)',
        values: steps((b) => b.uncertaintyContributionPercent),
        scale: 'u',
        rank: 2,
        stepped: true,
        significant: 3,
      },
    ],
    markers: [10, 25, 50, 100].map((x) => ({ x, label: `${x} %` })),
    height: 240,
  };
}

/** Cumulative bands of the trend: each line is the share of flowing time below an edge of the span. */
const cumulative = [
  { label: 'Below 10 % of span', bands: ['0-10'] },
  { label: 'Below 25 %', bands: ['0-10', '10-25'] },
  { label: 'Below 50 %', bands: ['0-10', '10-25', '25-50'] },
  { label: 'Within span (the rest over range)', bands: ['0-10', '10-25', '25-50', '50-100'] },
] as const;

/**
 * @param months the contract months of the period, oldest first
 * @param timeZone the site's zone (a contract month is drawn from its first day)
 * @param period the report's period, ISO, for the chart's x range
 * @returns the stacked trend chart's props
 */
export function monthlyTrendPlot(
  months: readonly MonthHealth[],
  timeZone: string,
  period: { from: string; to: string },
): ChartProps {
  const startS = (month: string) => DateTime.fromFormat(month, 'yyyy-MM', { zone: timeZone }).toSeconds();
  const fromS = Date.parse(period.from) / 1000;
  const toS = Date.parse(period.to) / 1000;
  // A month is drawn from the later of its first day and the period's start, to the next one.
  const x = months.map((m) => Math.max(startS(m.month), fromS));
  const series = cumulative.map((line, rank) => {
    const values = months.map(
      (m) => line.bands.reduce((sum, band) => sum + (m.bands[band]?.flowTimeShare ?? 0), 0) * 100,
    );
    return {
      label: line.label,
      values: [...values, values[values.length - 1] ?? null],
      scale: 'share',
      rank,
      stepped: true,
      significant: 3,
    };
  });
  return {
    title: 'Monthly shares of flowing time below each edge of the DP span',
    // From the first month with flow, so a single month is not a sliver at the edge of the period.
    x: {
      values: months.length ? [...x, toS] : [],
      kind: 'time',
      label: 'Contract month',
      timeZone,
      range: months.length ? [x[0], toS] : undefined,
    },
    axes: [{ scale: 'share', label: 'Share of flowing time, %', side: 'left', range: [0, 100] }],
    series,
    height: 240,
    emptyText: 'No flowing time in this period.',
  };
}
