/**
 * A site's alarm performance for one month beside the ISA-18.2 benchmarks (issue 13 item 9):
 * how many alarms one operator was given per 10 minutes, how much of the month was in flood,
 * which alarm points chattered or stayed in alarm over a day, and the ten most frequent points.
 * Every role reads it; it shows for the site chosen in the alarm list's filter.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatInstant } from '@/shared/format/time';
import { AppText } from '@/components/ui/AppText';
import { DataTable } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useAlarmPerformance, type AlarmPerformance } from '@/hooks/api/alarmPerformance';
import { conditionInWords } from './alarmWords';

/** The month before this one, YYYY-MM: the last whole month. */
function lastMonth(now = new Date()): string {
  const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1));
  return d.toISOString().slice(0, 7);
}

type Point = AlarmPerformance['topTen'][number];
const pointName = (p: Pick<Point, 'condition' | 'transmitterTag' | 'meterRunTag'>) =>
  `${conditionInWords(p.condition ?? '')} on ${p.transmitterTag ?? p.meterRunTag ?? '—'}`;

/** "within" / "over", in words and a mark, never colour alone. */
const verdict = (ok: boolean) => (ok ? '✓ within' : '✗ over');

export function AlarmPerformanceSection({ siteId, siteName }: { siteId: string; siteName: string }) {
  const [month, setMonth] = useState(lastMonth);
  const monthOk = /^\d{4}-(0[1-9]|1[0-2])$/.test(month);
  const report = useAlarmPerformance(siteId, month);
  const r = report.data;
  const b = r?.benchmarks;
  const rows =
    r && b
      ? [
          {
            key: 'average',
            cells: {
              measure: 'Average alarms per operator per 10 min',
              ours: r.averagePer10MinPerOperator.toFixed(3),
              benchmark: `≈${b.averagePer10MinVeryLikelyAcceptable} very likely acceptable; ≈${b.averagePer10MinMaximumManageable} maximum manageable`,
              verdict: verdict(r.averagePer10MinPerOperator <= b.averagePer10MinMaximumManageable),
            },
          },
          {
            key: 'peak',
            cells: {
              measure: 'Peak alarms per operator in one 10 min',
              ours: String(r.peakPer10MinPerOperator),
              benchmark: 'a flood above 10',
              verdict: verdict(r.peakPer10MinPerOperator <= 10),
            },
          },
          {
            key: 'flood',
            cells: {
              measure: 'Time in flood (> 10 per 10 min)',
              ours: `${r.floodPercentOfTime.toFixed(2)} % (${r.floodPeriods} of ${r.periods})`,
              benchmark: `≤ ≈${b.floodPercentOfTimeAtMost} %`,
              verdict: verdict(r.floodPercentOfTime <= b.floodPercentOfTimeAtMost),
            },
          },
          {
            key: 'chattering',
            cells: {
              measure: 'Chattering alarm points (≥ 3 in 1 min)',
              ours: String(r.chattering.length),
              benchmark: String(b.chatteringAlarms),
              verdict: verdict(r.chattering.length <= b.chatteringAlarms),
            },
          },
          {
            key: 'stale',
            cells: {
              measure: 'Stale alarms (in alarm > 24 h)',
              ours: String(r.stale.length),
              benchmark: String(b.staleAlarms),
              verdict: verdict(r.stale.length <= b.staleAlarms),
            },
          },
        ]
      : [];

  return (
    <Panel title={`Alarm performance — ${siteName}`} testID="alarm-performance">
      <TextField
        label="Month (YYYY-MM)"
        value={month}
        onChangeText={setMonth}
        error={monthOk ? undefined : 'Write the month as YYYY-MM, for example 2026-11.'}
        autoCapitalize="none"
        testID="alarm-performance-month"
      />
      <QueryState
        isPending={monthOk && report.isPending}
        error={report.error}
        onRetry={() => void report.refetch()}
        noun="alarm performance"
      />
      {r ? (
        <View style={styles.body}>
          <AppText tone="muted" variant="caption">
            {`${r.annunciations} alarms raised from ${formatInstant(r.from, r.timeZone)} to ${formatInstant(r.to, r.timeZone)} (site clock). One operator position per site is assumed: Tallyrun has no setting for more.`}
          </AppText>
          <DataTable
            label="Alarm performance against the benchmarks"
            columns={[
              // Measure, ours and the verdict first: on a phone they fit without scrolling.
              { key: 'measure', title: 'Measure', width: 170 },
              { key: 'ours', title: 'This month', width: 110 },
              { key: 'verdict', title: '', width: 80, align: 'left' },
              { key: 'benchmark', title: 'Benchmark (ISA-18.2)', width: 300, align: 'left' },
            ]}
            rows={rows}
            testID="alarm-performance-table"
          />
          <AppText variant="caption" tone="muted">{`Benchmarks: ${b!.source}.`}</AppText>
          <AppText variant="label" role="heading" aria-level={3}>
            Ten most frequent alarm points
          </AppText>
          <DataTable
            label="Ten most frequent alarm points"
            emptyText="No alarms this month."
            columns={[
              { key: 'point', title: 'Alarm point', width: 300 },
              { key: 'raises', title: 'Raised', width: 90 },
              { key: 'share', title: 'Share', width: 90 },
            ]}
            rows={r.topTen.map((p, i) => ({
              key: String(i),
              cells: { point: pointName(p), raises: String(p.raises), share: `${p.sharePercent.toFixed(1)} %` },
            }))}
            testID="alarm-performance-top-ten"
          />
          {r.chattering.length ? (
            <AppText testID="alarm-performance-chattering">
              {`Chattering: ${r.chattering.map((c) => `${pointName(c)} (${c.mostInOneMinute} in one minute)`).join('; ')}.`}
            </AppText>
          ) : null}
          {r.stale.length ? (
            <AppText testID="alarm-performance-stale">
              {`Stale: ${r.stale.map((s) => `${pointName(s)} (${s.activeHours} h)`).join('; ')}.`}
            </AppText>
          ) : null}
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.sm },
});
