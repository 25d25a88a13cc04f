/**
 * The alarm list (every role reads; operators, engineers and admins respond): open alarms by
 * default, newest first, filtered by state, priority, site and meter run. The filters live in
 * the address too (/alarms?meterRunId=…&state=all), so the meter run screen links to a run's
 * alarm history and a reload keeps the view.
 */
import { router } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AlarmGroupRow } from '@/components/alarms/AlarmGroupRow';
import { alarmGroupRows } from '@/components/alarms/alarmGroups';
import { AlarmPerformanceSection } from '@/components/alarms/AlarmPerformanceSection';
import { withKeptAlarms, type KeptAlarm } from '@/components/alarms/keptAlarms';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { can } from '@/constants/roles';
import { space } from '@/constants/theme';
import { useAlarms, type Alarm, type AlarmFilters } from '@/hooks/api/alarms';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites } from '@/hooks/api/sites';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { describeFilters, filtersFromParams, type AlarmsScreenParams } from './alarmFilterParams';
import { AlarmsFilters } from './AlarmsFilters';

export { filtersFromParams, type AlarmsScreenParams };

/** Newest first, this many at most: more than a shift's worth for an operator (TRADE.md §7). */
const listLimit = 300;

export function AlarmsScreen({ params }: { params: AlarmsScreenParams }) {
  const user = useSignedInUser();
  const phone = useBreakpoint() === 'phone';
  const [filters, setFilters] = useState<AlarmFilters>(() => filtersFromParams(params));
  // A link to another view of the list (the banner, a meter run's history) changes the address only.
  const { state, siteId, meterRunId, priority } = params;
  useEffect(
    () => setFilters(filtersFromParams({ state, siteId, meterRunId, priority })),
    [state, siteId, meterRunId, priority],
  );
  const alarms = useAlarms({ ...filters, limit: listLimit });
  // Alarms acted on since the filter last changed stay listed under their new state (keptAlarms.ts).
  const [kept, setKept] = useState<ReadonlyMap<string, KeptAlarm>>(new Map());
  const filterKey = JSON.stringify(filters);
  useEffect(() => setKept(new Map()), [filterKey]);
  const shownRef = useRef<Alarm[]>([]);
  const acted = (alarmId: string, alarm: Alarm | null) =>
    setKept((before) => {
      const next = new Map(before);
      if (!alarm) {
        next.delete(alarmId);
        return next;
      }
      const shown = shownRef.current.findIndex((item) => item.id === alarmId);
      const index = before.get(alarmId)?.index ?? (shown < 0 ? shownRef.current.length : shown);
      return next.set(alarmId, { alarm, index });
    });
  const sites = useSites();
  const meterRuns = useMeterRuns();
  const siteById = new Map((sites.data ?? []).map((site) => [site.id, site]));
  const list = withKeptAlarms(alarms.data ?? [], kept);
  shownRef.current = list;
  // One row per consequential-alarm group: the first-out, with "+N consequential" under it.
  const groups = alarmGroupRows(list);
  const timeZoneOf = (id: string) => siteById.get(id)?.timeZone ?? 'UTC';
  const site = filters.siteId ? siteById.get(filters.siteId) : undefined;

  const change = (next: AlarmFilters) => {
    setFilters(next);
    router.setParams({ state: next.state, priority: next.priority, siteId: next.siteId, meterRunId: next.meterRunId });
  };

  const lead = can(user.role, 'respondToAlarms')
    ? 'Alarms newest first. Acknowledge with one tap; shelving asks how long and why. Open an alarm’s log to see who did what, and when.'
    : 'Alarms newest first, with their log. Your role reads alarms; acknowledging and shelving them is for operators, engineers and administrators.';

  return (
    <Screen lead={lead} testID="alarms-screen">
      <AlarmsFilters
        filters={filters}
        sites={sites.data ?? []}
        meterRuns={meterRuns.data ?? []}
        onChange={change}
        folded={phone}
      />
      <QueryState
        isPending={alarms.isPending}
        error={alarms.error}
        onRetry={() => void alarms.refetch()}
        noun="alarms"
      />
      {alarms.data ? (
        <View style={styles.head}>
          <AppText variant="title" role="heading" aria-level={2} style={styles.count} testID="alarm-count">
            {list.length === 0
              ? 'No alarms'
              : `${list.length}${list.length >= listLimit ? '+' : ''} alarm${list.length === 1 ? '' : 's'}`}
          </AppText>
          <Button
            label="Refresh"
            size="compact"
            busy={alarms.isFetching && !alarms.isPending}
            onPress={() => void alarms.refetch()}
            testID="alarm-refresh"
          />
        </View>
      ) : null}
      {alarms.data && list.length === 0 ? (
        <AppText tone="muted" testID="alarm-empty">
          {`Nothing matches: ${describeFilters(filters, sites.data ?? [], meterRuns.data ?? [])}.`}
        </AppText>
      ) : null}
      <View style={styles.list} role="list" aria-label="Alarms" testID="alarm-list">
        {/* Times are on each site's clock, so rows wait for the sites. */}
        {(sites.data || sites.error ? groups : []).map((group) => (
          <AlarmGroupRow
            key={group.firstOut.id}
            group={group}
            role={user.role}
            timeZoneOf={timeZoneOf}
            onActed={acted}
          />
        ))}
      </View>
      {list.length >= listLimit ? (
        <AppText
          variant="caption"
          tone="muted"
        >{`Only the newest ${listLimit} are listed: narrow the filter to see older ones.`}</AppText>
      ) : null}
      {filters.siteId ? (
        <AlarmPerformanceSection siteId={filters.siteId} siteName={site?.name ?? `site ${filters.siteId}`} />
      ) : (
        <AppText variant="caption" tone="muted" testID="alarm-performance-hint">
          Choose a site in the filter to see its monthly alarm performance against the ISA-18.2 benchmarks.
        </AppText>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  count: { flex: 1 },
  list: { gap: space.sm },
});
