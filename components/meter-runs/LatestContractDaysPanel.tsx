/**
 * Each meter run's latest contract days, yesterday's and today's so far, at the site's base
 * conditions, each day labelled with its date, start and end; every meter run links on to its own
 * page, where its daily totals are (the Totals tab is no dead end for an operator).
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { colors, radius, space } from '@/constants/theme';
import { formatNumber, unitsFor } from '@/constants/units-display';
import { useMeterRuns, type MeterRun } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';
import { useTotals, type Total } from '@/hooks/api/totals';
import { contractDayBounds } from '@/shared/history/contract-day';
import { fromSI } from '@/shared/units';
import { latestContractDays } from './contractDayLabels';

/** A day's volume at base conditions in the site's units, with its coverage when not whole. */
function dayFigure(total: Total | undefined, site: Site): string {
  if (!total) return 'not totalled yet';
  const set = unitsFor(site.displayUnits);
  const volume = `${formatNumber(fromSI(total.standardVolumeM3, set.standardVolume.unit))} ${set.standardVolume.label} at base`;
  return total.coverage < 1 ? `${volume} (${formatNumber(total.coverage * 100, 3)} % covered)` : volume;
}

function MeterRunLatestDays({ run, site, nowMs }: { run: MeterRun; site: Site; nowMs: number }) {
  const days = latestContractDays(site, nowMs);
  const from = new Date(contractDayBounds(days.yesterday.day, site.timeZone, site.contractHour).startMs).toISOString();
  const to = new Date(contractDayBounds(days.today.day, site.timeZone, site.contractHour).endMs).toISOString();
  const totals = useTotals(run.id, 'day', from, to);
  const at = (startMs: number) => totals.data?.find((t) => Date.parse(t.start) === startMs);
  const yesterday = at(contractDayBounds(days.yesterday.day, site.timeZone, site.contractHour).startMs);
  const today = at(contractDayBounds(days.today.day, site.timeZone, site.contractHour).startMs);
  const testID = `latest-days-${run.tag}`;
  return (
    <View style={styles.run} testID={testID}>
      <AppText variant="bodyStrong">{`${run.tag} · ${run.name}`}</AppText>
      {totals.error ? (
        <AppText variant="caption" tone="error">{`⊗ ${totals.error.message}`}</AppText>
      ) : totals.isPending ? (
        <AppText variant="caption" tone="muted">
          Loading…
        </AppText>
      ) : (
        <>
          <AppText tabular testID={`${testID}-yesterday`}>{`Yesterday: ${dayFigure(yesterday, site)}`}</AppText>
          <AppText variant="caption" tone="muted">
            {days.yesterday.label}
          </AppText>
          <AppText tabular testID={`${testID}-today`}>{`Today so far: ${dayFigure(today, site)}`}</AppText>
          <AppText variant="caption" tone="muted">
            {days.today.label}
          </AppText>
        </>
      )}
      <Link href={`/meter-runs/${encodeURIComponent(run.id)}`} testID={`${testID}-link`} style={styles.link}>
        <AppText style={styles.linkText}>{`Daily totals of ${run.tag}`}</AppText>
      </Link>
    </View>
  );
}

/** @param siteId the site whose meter runs are shown */
export function LatestContractDaysPanel({ siteId }: { siteId: string }) {
  const sites = useSites();
  const runs = useMeterRuns(siteId);
  // One clock for the whole panel, so every meter run's "yesterday" is the same day of its site.
  const [nowMs] = useState(() => Date.now());
  const siteOf = new Map((sites.data ?? []).map((s) => [s.id, s]));
  const listed = (runs.data ?? []).filter((r) => siteOf.has(r.siteId));
  return (
    <Panel title="Latest contract days" testID="latest-contract-days">
      <QueryState
        isPending={sites.isPending || runs.isPending}
        error={sites.error ?? runs.error}
        onRetry={() => void Promise.all([sites.refetch(), runs.refetch()])}
        noun="the meter runs"
      />
      {runs.data && listed.length === 0 ? (
        <AppText tone="muted">No meter runs yet.</AppText>
      ) : (
        <View style={styles.list}>
          {listed.map((run) => (
            <MeterRunLatestDays key={run.id} run={run} site={siteOf.get(run.siteId)!} nowMs={nowMs} />
          ))}
        </View>
      )}
    </Panel>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  run: {
    gap: space.xxs,
    padding: space.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.border,
  },
  // At least 44 px high: a comfortable touch target on a phone.
  link: { minHeight: 44, justifyContent: 'center', alignSelf: 'flex-start' },
  linkText: { textDecorationLine: 'underline' },
});
