/**
 * The period's bands of the active DP span: shares of flowing time and of volume at base
 * conditions, each band's expanded uncertainty and its part of the period's (table and chart),
 * with the DP-low-in-range alarm limit in force for comparison.
 */
import { useMemo } from 'react';

import { Chart } from '@/components/charts/Chart';
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn, type DataRow } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { formatNumber, formatPlain, type DisplayUnitSet } from '@/constants/units-display';
import { useAlarmLimits } from '@/hooks/api/alarmLimits';
import type { RangeHealth } from '@/hooks/api/rangeHealth';
import { fromSI } from '@/shared/units';
import { bandInWords, bandSharesPlot, percentText } from './RangeHealthPlots';

interface RangeHealthBandsProps {
  report: RangeHealth;
  set: DisplayUnitSet;
}

/** @returns the DP-low-in-range limit in force on the run's first DP transmitter, in words */
function useLowInRangeLimitText(meterRunId: string): string | null {
  const limits = useAlarmLimits(meterRunId);
  const low = limits.data?.effective.find((e) => e.condition === 'dp-low-in-range');
  if (!low) return null;
  const { thresholdShareOfSpan, onDelayS, enabled } = low.limits;
  if (!enabled) return 'The DP-low-in-range alarm is switched off on this meter run.';
  const source =
    low.source === 'default'
      ? 'the default'
      : `set for this ${low.source === 'transmitter' ? 'transmitter' : 'meter run'}`;
  return `The DP-low-in-range alarm is raised below ${percentText(thresholdShareOfSpan ?? 0.1, 0)} of span held for ${formatPlain(onDelayS / 60)} min while there is flow (${source}).`;
}

export function RangeHealthBands({ report, set }: RangeHealthBandsProps) {
  const limitText = useLowInRangeLimitText(report.meterRunId);
  // The chart is rebuilt only when the bands change (Chart.web.tsx compares its props by identity).
  const plot = useMemo(() => bandSharesPlot(report.bands), [report.bands]);
  const volume = (m3: number) => formatNumber(fromSI(m3, set.standardVolume.unit));
  const columns: DataColumn[] = [
    // The shares first, so a phone shows them without scrolling sideways.
    { key: 'band', title: 'Band of span', width: 96 },
    { key: 'timeShare', title: 'Share of time', width: 80 },
    { key: 'volumeShare', title: 'Share of volume', width: 80 },
    { key: 'part', title: 'Part of U', width: 72 },
    { key: 'time', title: 'Flowing time, h', width: 100 },
    { key: 'volume', title: `Volume at base, ${set.standardVolume.label}`, width: 120 },
    { key: 'u', title: 'U of band (k = 2)', width: 120 },
  ];
  const share = (value: number, testID: string) => (
    <AppText tabular style={{ textAlign: 'right' }} testID={testID}>
      {percentText(value)}
    </AppText>
  );
  const rows: DataRow[] = report.bands.map((band) => ({
    key: band.band,
    testID: `range-health-band-${band.band}`,
    cells: {
      band: bandInWords(band.band),
      time: formatNumber(band.flowTimeS / 3600, 4),
      timeShare: share(band.flowTimeShare, `range-health-time-share-${band.band}`),
      volume: volume(band.standardVolumeM3),
      volumeShare: share(band.standardVolumeShare, `range-health-volume-share-${band.band}`),
      u: band.uncertaintyPercent === null ? '—' : `±${formatNumber(band.uncertaintyPercent, 3)} %`,
      part: `${band.uncertaintyContributionPercent.toFixed(2)} %`,
    },
  }));
  const sum = (pick: (b: RangeHealth['bands'][number]) => number) =>
    report.bands.reduce((total, b) => total + pick(b), 0);
  rows.push({
    key: 'total',
    testID: 'range-health-band-total',
    cells: {
      band: 'Period',
      time: formatNumber(report.flowTimeS / 3600, 4),
      timeShare: share(
        sum((b) => b.flowTimeShare),
        'range-health-time-share-total',
      ),
      volume: volume(report.standardVolumeM3),
      volumeShare: share(
        sum((b) => b.standardVolumeShare),
        'range-health-volume-share-total',
      ),
      u: report.uncertaintyPercent === null ? '—' : `±${formatNumber(report.uncertaintyPercent, 3)} %`,
      part: `${sum((b) => b.uncertaintyContributionPercent).toFixed(2)} %`,
    },
  });

  return (
    <Panel title="Where the flow sat in the DP span" testID="range-health-bands">
      <AppText variant="caption" tone="muted">
        Bands of the span of the DP transmitter in use at each moment. A band’s U is the mass-weighted expanded
        uncertainty of the flow measured in it; its part of U is its share of mass × its U, and the parts add up to the
        period’s U.
      </AppText>
      <Chart {...plot} testID="range-health-band-chart" />
      <DataTable
        columns={columns}
        rows={rows}
        label="Shares of flowing time and volume by band of the DP span"
        testID="range-health-band-table"
      />
      {limitText ? (
        <AppText variant="caption" tone="muted" testID="range-health-alarm-limit">
          {limitText}
        </AppText>
      ) : null}
    </Panel>
  );
}
