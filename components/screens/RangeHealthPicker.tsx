/**
 * What the range health report is for: a meter run (by site), a period (the last 7, 30, 90 or
 * 365 days, or dates on the site's clock) and the uncertainty limit the recommendation aims at.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { parseSiteTime } from '@/components/meter-runs/siteTime';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';

const hourMs = 3_600_000;
const dayMs = 86_400_000;
/** The server reads at most 400 days per request (server/resources/range-health/schema.ts). */
const maxDays = 400;

export const periodChoices = [
  { value: '7', label: 'Last 7 days' },
  { value: '30', label: 'Last 30 days' },
  { value: '90', label: 'Last 90 days' },
  { value: '365', label: 'Last 365 days' },
  { value: 'custom', label: 'Dates' },
] as const;
export type PeriodChoice = (typeof periodChoices)[number]['value'];

export interface Period {
  choice: PeriodChoice;
  from: string;
  to: string;
}

/**
 * @param days how many days back
 * @param nowMs the moment the choice was made
 * @returns the period ending at the end of the current hour (so the hour under way is in it)
 */
export function lastDays(days: number, nowMs: number): Period {
  const toMs = Math.ceil(nowMs / hourMs) * hourMs;
  return {
    choice: String(days) as PeriodChoice,
    from: new Date(toMs - days * dayMs).toISOString(),
    to: new Date(toMs).toISOString(),
  };
}

const limitChoices = [
  { value: '0.5', label: '±0.5 %' },
  { value: '1', label: '±1 %' },
  { value: '2', label: '±2 %' },
] as const;

interface RangeHealthPickerProps {
  sites: readonly Site[];
  meterRuns: readonly MeterRun[];
  meterRunId: string | null;
  onMeterRun: (meterRunId: string | null) => void;
  period: Period;
  onPeriod: (period: Period) => void;
  limitPercent: string;
  onLimit: (limitPercent: string) => void;
}

export function RangeHealthPicker({
  sites,
  meterRuns,
  meterRunId,
  onMeterRun,
  period,
  onPeriod,
  limitPercent,
  onLimit,
}: RangeHealthPickerProps) {
  const chosenRun = meterRuns.find((run) => run.id === meterRunId);
  const [siteId, setSiteId] = useState<string>(chosenRun?.siteId ?? (sites.length === 1 ? sites[0].id : ''));
  const shownSiteId = chosenRun?.siteId ?? siteId;
  const site = sites.find((s) => s.id === shownSiteId);
  const zone = site?.timeZone ?? 'UTC';
  const [fromText, setFromText] = useState('');
  const [toText, setToText] = useState('');
  const [problems, setProblems] = useState<{ from?: string; to?: string }>({});

  const applyDates = () => {
    const fromMs = parseSiteTime(fromText, zone);
    const toDayMs = parseSiteTime(toText, zone);
    const found: typeof problems = {};
    if (fromMs === null) found.from = 'Write the first day as YYYY-MM-DD.';
    if (toDayMs === null) found.to = 'Write the last day as YYYY-MM-DD.';
    // The last day is included: the period ends at the following midnight on the site's clock.
    const toMs = toDayMs === null ? null : toDayMs + dayMs;
    if (fromMs !== null && toMs !== null && toMs <= fromMs) found.to = 'The last day must not be before the first.';
    if (fromMs !== null && toMs !== null && toMs - fromMs > maxDays * dayMs)
      found.to = `At most ${maxDays} days at a time.`;
    setProblems(found);
    if (Object.keys(found).length === 0 && fromMs !== null && toMs !== null) {
      onPeriod({ choice: 'custom', from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString() });
    }
  };

  const inSite = meterRuns.filter((run) => run.siteId === shownSiteId);
  return (
    <Panel title="Meter run and period" testID="range-health-picker">
      <ChoiceGroup
        label="Site"
        options={sites.map((s) => ({ value: s.id, label: s.code }))}
        value={shownSiteId}
        onChange={(id) => {
          setSiteId(id);
          onMeterRun(null);
        }}
        testIDPrefix="range-health-site"
      />
      {shownSiteId ? (
        inSite.length ? (
          <ChoiceGroup
            label="Meter run"
            options={inSite.map((run) => ({ value: run.id, label: run.tag }))}
            value={meterRunId ?? ''}
            onChange={onMeterRun}
            testIDPrefix="range-health-meter-run"
          />
        ) : (
          <AppText tone="muted">This site has no meter runs yet.</AppText>
        )
      ) : null}
      <ChoiceGroup
        label="Period"
        options={periodChoices}
        value={period.choice}
        onChange={(choice) => {
          if (choice === 'custom') onPeriod({ ...period, choice });
          else onPeriod(lastDays(Number(choice), Date.now()));
        }}
        testIDPrefix="range-health-period"
      />
      {period.choice === 'custom' ? (
        <View style={styles.dates}>
          <View style={styles.date}>
            <TextField
              label="First day (site clock)"
              placeholder="YYYY-MM-DD"
              value={fromText}
              onChangeText={setFromText}
              error={problems.from}
              testID="range-health-from"
              autoCapitalize="none"
            />
          </View>
          <View style={styles.date}>
            <TextField
              label="Last day (included)"
              placeholder="YYYY-MM-DD"
              value={toText}
              onChangeText={setToText}
              error={problems.to}
              testID="range-health-to"
              autoCapitalize="none"
              onSubmitEditing={applyDates}
            />
          </View>
          <View style={styles.apply}>
            <Button label="Show" variant="primary" onPress={applyDates} testID="range-health-apply" />
          </View>
        </View>
      ) : null}
      <ChoiceGroup
        label="Uncertainty limit for the recommendation (k = 2)"
        options={limitChoices}
        value={limitPercent as (typeof limitChoices)[number]['value']}
        onChange={onLimit}
        testIDPrefix="range-health-limit"
      />
    </Panel>
  );
}

const styles = StyleSheet.create({
  dates: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.md },
  date: { minWidth: 160, flexGrow: 1, flexBasis: 160 },
  apply: { paddingBottom: 0 },
});
