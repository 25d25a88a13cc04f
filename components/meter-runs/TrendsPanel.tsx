/**
 * The meter run's trends over a chosen window (last 24 h, 7 d, 30 d, or from–to on the site's
 * clock): DP with each transmitter's span, static pressure, temperature and hourly flow, each
 * line the bucket mean with the bucket's min–max band behind it.
 */
import { useMemo, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { Chart } from '@/components/charts/Chart';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import type { DisplayUnits } from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Transmitter } from '@/hooks/api/transmitters';
import { useTrend } from '@/hooks/api/trends';
import { formatInstant } from '@/shared/format/time';
import { formatSiteTime, parseSiteTime } from './siteTime';
import { trendCharts } from './trendCharts';

type WindowChoice = '24h' | '7d' | '30d' | 'custom';
const hourMs = 3_600_000;
const windowLengthMs: Record<Exclude<WindowChoice, 'custom'>, number> = {
  '24h': 24 * hourMs,
  '7d': 7 * 24 * hourMs,
  '30d': 30 * 24 * hourMs,
};
const windowOptions: { value: WindowChoice; label: string }[] = [
  { value: '24h', label: 'Last 24 h' },
  { value: '7d', label: '7 days' },
  { value: '30d', label: '30 days' },
  { value: 'custom', label: 'From–to' },
];
/** The server's longest trend window is not limited, but a year of buckets says little on a phone. */
const longestCustomMs = 366 * 24 * hourMs;

interface TrendWindow {
  fromMs: number;
  toMs: number;
}

/** Whole minutes, so the cache key does not change with every render. */
function lastWindow(lengthMs: number): TrendWindow {
  const toMs = Math.ceil(Date.now() / 60_000) * 60_000;
  return { fromMs: toMs - lengthMs, toMs };
}

interface TrendsPanelProps {
  run: MeterRun;
  transmitters: readonly Transmitter[];
  displayUnits: DisplayUnits;
  atmosphericPressurePa: number;
  timeZone: string;
}

export function TrendsPanel({ run, transmitters, displayUnits, atmosphericPressurePa, timeZone }: TrendsPanelProps) {
  const [choice, setChoice] = useState<WindowChoice>('24h');
  const [trendWindow, setTrendWindow] = useState<TrendWindow>(() => lastWindow(windowLengthMs['24h']));
  const [fromText, setFromText] = useState(() => formatSiteTime(trendWindow.fromMs, timeZone, 'yyyy-MM-dd HH:mm'));
  const [toText, setToText] = useState(() => formatSiteTime(trendWindow.toMs, timeZone, 'yyyy-MM-dd HH:mm'));
  const [problems, setProblems] = useState<{ from?: string; to?: string }>({});

  const from = new Date(trendWindow.fromMs).toISOString();
  const to = new Date(trendWindow.toMs).toISOString();
  const trend = useTrend(run.id, from, to);

  const charts = useMemo(
    () =>
      trend.data ? trendCharts(trend.data, { run, transmitters, displayUnits, atmosphericPressurePa, timeZone }) : null,
    [trend.data, run, transmitters, displayUnits, atmosphericPressurePa, timeZone],
  );

  const choose = (next: WindowChoice) => {
    setChoice(next);
    setProblems({});
    if (next !== 'custom') {
      const w = lastWindow(windowLengthMs[next]);
      setTrendWindow(w);
      setFromText(formatSiteTime(w.fromMs, timeZone, 'yyyy-MM-dd HH:mm'));
      setToText(formatSiteTime(w.toMs, timeZone, 'yyyy-MM-dd HH:mm'));
    }
  };

  const applyCustom = () => {
    const fromMs = parseSiteTime(fromText, timeZone);
    const toMs = parseSiteTime(toText, timeZone);
    const found: { from?: string; to?: string } = {};
    if (fromMs === null) found.from = 'Enter a time as YYYY-MM-DD HH:mm (site time).';
    if (toMs === null) found.to = 'Enter a time as YYYY-MM-DD HH:mm (site time).';
    if (fromMs !== null && toMs !== null && toMs <= fromMs) found.to = 'Must be after the start.';
    if (fromMs !== null && toMs !== null && toMs - fromMs > longestCustomMs)
      found.to = 'Choose a window of at most a year.';
    setProblems(found);
    if (found.from || found.to || fromMs === null || toMs === null) return;
    setTrendWindow({ fromMs, toMs });
  };

  const refresh = () => {
    if (choice === 'custom') void trend.refetch();
    else setTrendWindow(lastWindow(windowLengthMs[choice]));
  };

  return (
    <Panel
      title="Trends"
      testID="meter-run-trends"
      actions={
        <Button
          label="Refresh"
          size="compact"
          busy={trend.isFetching && !trend.isPending}
          onPress={refresh}
          testID="trend-refresh"
        />
      }
    >
      <ChoiceGroup
        label="Window"
        options={windowOptions}
        value={choice}
        onChange={choose}
        testIDPrefix="trend-window"
      />
      {choice === 'custom' ? (
        <View style={styles.custom}>
          <View style={styles.customField}>
            <TextField
              label="From (site time)"
              value={fromText}
              onChangeText={setFromText}
              error={problems.from}
              testID="trend-from"
              autoCapitalize="none"
            />
          </View>
          <View style={styles.customField}>
            <TextField
              label="To (site time)"
              value={toText}
              onChangeText={setToText}
              error={problems.to}
              testID="trend-to"
              autoCapitalize="none"
              onSubmitEditing={applyCustom}
            />
          </View>
          <View style={styles.customAction}>
            <Button label="Show" variant="primary" onPress={applyCustom} testID="trend-apply" />
          </View>
        </View>
      ) : null}
      <AppText variant="caption" tone="muted" testID="trend-window-text">
        {`${formatInstant(trendWindow.fromMs, timeZone)} to ${formatInstant(trendWindow.toMs, timeZone)}. Lines are the mean of each time slice; the grey band behind a line spans its lowest and highest reading.`}
      </AppText>
      <QueryState isPending={trend.isPending} error={trend.error} onRetry={() => void trend.refetch()} noun="trends" />
      {charts ? (
        <View style={styles.charts}>
          <TrendBlock
            heading="Differential pressure"
            note="Hatched: the bottom 10 % of each transmitter's span, where its error as a share of the reading grows. Dashed lines: each span's upper range value."
          >
            <Chart {...charts.dp} testID="trend-chart-dp" />
          </TrendBlock>
          <TrendBlock heading="Static pressure">
            <Chart {...charts.staticPressure} testID="trend-chart-static-pressure" />
          </TrendBlock>
          <TrendBlock heading="Temperature">
            <Chart {...charts.temperature} testID="trend-chart-temperature" />
          </TrendBlock>
          <TrendBlock
            heading="Flow"
            note="Each hour's flow from its hourly record (total over the hour divided by the hour's length)."
          >
            <Chart {...charts.flow} testID="trend-chart-flow" />
          </TrendBlock>
        </View>
      ) : null}
    </Panel>
  );
}

function TrendBlock({ heading, note, children }: { heading: string; note?: string; children: ReactNode }) {
  return (
    <View style={styles.block}>
      <AppText variant="bodyStrong" role="heading" aria-level={3}>
        {heading}
      </AppText>
      {note ? (
        <AppText variant="caption" tone="muted">
          {note}
        </AppText>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  custom: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.md },
  customField: { flexGrow: 1, flexBasis: 200 },
  customAction: { paddingBottom: 2 },
  charts: { gap: space.xl },
  block: { gap: space.xs },
});
