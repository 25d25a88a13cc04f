/**
 * One meter run (all roles): what it is (element, fluid, line, transmitters), its trends over a
 * chosen window, the hourly records of a contract day, the last 31 contract days' totals (each
 * record's versions on request) and the event log of its configuration and constants.
 */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';

// Alarm history and the range health link: a section owned by the alarms screens (components/alarms).
import { MeterRunAlarmsSection } from '@/components/alarms/MeterRunAlarmsSection';
import { DailyTotalsPanel } from '@/components/meter-runs/DailyTotalsPanel';
import { EventLogPanel } from '@/components/meter-runs/EventLogPanel';
import { HourlyRecordsPanel } from '@/components/meter-runs/HourlyRecordsPanel';
import { MeterRunHeader } from '@/components/meter-runs/MeterRunHeader';
import { formatSiteTime } from '@/components/meter-runs/siteTime';
import { TrendsPanel } from '@/components/meter-runs/TrendsPanel';
import { ReconciliationPanel } from '@/components/reconciliation/ReconciliationPanel';
import { recentMonthsWindow } from '@/components/reconciliation/reconciliationView';
import { useScreenTitle } from '@/components/shell/screenTitle';
import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { space } from '@/constants/theme';
import { isApiError } from '@/hooks/api/client';
import { useMeterRun } from '@/hooks/api/meterRuns';
import { useSite } from '@/hooks/api/sites';
import { useTransmitters } from '@/hooks/api/transmitters';

export function MeterRunScreen({ meterRunId }: { meterRunId: string }) {
  const run = useMeterRun(meterRunId);
  const site = useSite(run.data?.siteId);
  const transmitters = useTransmitters(meterRunId);
  // The header names this meter run, not the area ("Meter runs").
  useScreenTitle(run.data ? `${run.data.tag} · ${run.data.name}` : undefined);

  if (isApiError(run.error, 404)) {
    return (
      <Screen testID="meter-run-screen">
        <Notice tone="error" title="No such meter run">
          <AppText>{`There is no meter run ${meterRunId}. It may have been removed, or the address is wrong.`}</AppText>
        </Notice>
        <Link href="/meter-runs">
          <AppText style={styles.link}>Back to all meter runs</AppText>
        </Link>
      </Screen>
    );
  }

  const ready = run.data && site.data && transmitters.data;
  return (
    <Screen testID="meter-run-screen">
      <View style={styles.back}>
        <Link href="/meter-runs">
          <AppText style={styles.link}>‹ All meter runs</AppText>
        </Link>
      </View>
      <QueryState isPending={run.isPending} error={run.error} onRetry={() => void run.refetch()} noun="the meter run" />
      <QueryState
        isPending={run.isSuccess && site.isPending}
        error={site.error}
        onRetry={() => void site.refetch()}
        noun="its site"
      />
      <QueryState
        isPending={transmitters.isPending}
        error={transmitters.error}
        onRetry={() => void transmitters.refetch()}
        noun="its transmitters"
      />
      {ready ? (
        <>
          <MeterRunHeader
            run={run.data}
            site={site.data}
            transmitters={transmitters.data}
            today={formatSiteTime(Date.now(), site.data.timeZone, 'yyyy-MM-dd')}
          />
          <TrendsPanel
            run={run.data}
            transmitters={transmitters.data}
            displayUnits={site.data.displayUnits}
            atmosphericPressurePa={site.data.atmosphericPressurePa}
            timeZone={site.data.timeZone}
          />
          <HourlyRecordsPanel meterRunId={meterRunId} site={site.data} />
          <DailyTotalsPanel meterRunId={meterRunId} site={site.data} />
          <ReconciliationPanel
            meterRunId={meterRunId}
            timeZone={site.data.timeZone}
            {...recentMonthsWindow(Date.now(), site.data.timeZone)}
          />
          <EventLogPanel meterRunId={meterRunId} site={site.data} />
          {/* Alarm history and range health (components/alarms). */}
          <MeterRunAlarmsSection meterRunId={meterRunId} timeZone={site.data.timeZone} />
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  back: { flexDirection: 'row', marginBottom: -space.sm },
  link: { textDecorationLine: 'underline' },
});
