/**
 * The monthly trend of the shares (contract months of the site): the share of flowing time
 * below each edge of the span, stacked, so a declining well shows as the lower lines rising;
 * with the figures month by month beneath.
 */
import { useMemo } from 'react';

import { Chart } from '@/components/charts/Chart';
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { formatNumber } from '@/constants/units-display';
import { dpBandNames, type RangeHealth } from '@/hooks/api/rangeHealth';
import { bandInWords, monthlyTrendPlot, percentText } from './RangeHealthPlots';

export function RangeHealthTrend({ report, timeZone }: { report: RangeHealth; timeZone: string }) {
  const plot = useMemo(
    () => monthlyTrendPlot(report.months, timeZone, { from: report.from, to: report.to }),
    [report.months, report.from, report.to, timeZone],
  );
  const columns: DataColumn[] = [
    // The bands first, so a phone shows the lower ones without scrolling sideways.
    { key: 'month', title: 'Contract month', width: 96 },
    ...dpBandNames.map((band) => ({ key: band, title: bandInWords(band), width: 76 })),
    { key: 'time', title: 'Flowing time, h', width: 100 },
    { key: 'u', title: 'U (k = 2)', width: 88 },
  ];
  const rows = report.months.map((month) => ({
    key: month.month,
    testID: `range-health-month-${month.month}`,
    cells: {
      month: month.month,
      time: formatNumber(month.flowTimeS / 3600, 4),
      ...Object.fromEntries(dpBandNames.map((band) => [band, percentText(month.bands[band]?.flowTimeShare ?? 0)])),
      u: month.uncertaintyPercent === null ? '—' : `±${formatNumber(month.uncertaintyPercent, 3)} %`,
    },
  }));

  return (
    <Panel title="Month by month" testID="range-health-trend">
      <AppText variant="caption" tone="muted">
        Each line is the share of the month’s flowing time below an edge of the span; the gaps between lines are the
        bands. Lines rising from month to month mean the flow is drifting down the span.
      </AppText>
      <Chart {...plot} testID="range-health-trend-chart" />
      <DataTable
        columns={columns}
        rows={rows}
        label="Shares of flowing time by band, month by month"
        emptyText="No month in this period has flowing time."
        testID="range-health-month-table"
      />
    </Panel>
  );
}
