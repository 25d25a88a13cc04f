/**
 * A meter run's alarm history on its own screen: its latest alarms in every state (priority,
 * condition, state, raised and cleared on the site's clock), a link to all of them in the alarm
 * list, and for engineers and admins a link to the run's range health report.
 */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { formatInstant } from '@/shared/format/time';
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { can } from '@/constants/roles';
import { space } from '@/constants/theme';
import { useAlarms } from '@/hooks/api/alarms';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { conditionInWords, isAnnunciated, isUnacknowledged, stateInWords } from './alarmWords';
import { PriorityBadge } from './PriorityBadge';

/** The latest this many; the alarm list holds the rest. */
const shown = 10;

// Priority and state first, so a phone shows them without scrolling sideways.
const columns: DataColumn[] = [
  { key: 'priority', title: 'Priority', width: 108 },
  { key: 'state', title: 'State', width: 190, align: 'left' },
  { key: 'condition', title: 'Condition', width: 200, align: 'left' },
  { key: 'raised', title: 'Raised', width: 150 },
  { key: 'cleared', title: 'Cleared', width: 150 },
  { key: 'transmitter', title: 'Transmitter', width: 160, align: 'left' },
];

export function MeterRunAlarmsSection({ meterRunId, timeZone }: { meterRunId: string; timeZone: string }) {
  const user = useSignedInUser();
  const engineering = can(user.role, 'configure');
  const alarms = useAlarms({ state: 'all', meterRunId, limit: shown });
  const at = (iso: string | null) => (iso ? formatInstant(iso, timeZone) : '—');
  const rows = (alarms.data ?? []).map((alarm) => ({
    key: alarm.id,
    testID: `meter-run-alarm-${alarm.id}`,
    cells: {
      priority: (
        <PriorityBadge
          priority={alarm.priority}
          emphasis={
            isUnacknowledged(alarm.state) ? 'unacknowledged' : isAnnunciated(alarm.state) ? 'acknowledged' : 'quiet'
          }
        />
      ),
      condition: conditionInWords(alarm.condition),
      transmitter: alarm.transmitterTag ?? '—',
      state: stateInWords(alarm.state),
      raised: at(alarm.raisedAt),
      cleared: at(alarm.clearedAt),
    },
  }));

  return (
    <Panel title={engineering ? 'Alarm history and range health' : 'Alarm history'} testID="meter-run-alarms">
      <QueryState
        isPending={alarms.isPending}
        error={alarms.error}
        onRetry={() => void alarms.refetch()}
        noun="its alarms"
      />
      {alarms.data ? (
        <DataTable
          columns={columns}
          rows={rows}
          label="Latest alarms of this meter run"
          emptyText="No alarm has been raised on this meter run."
          testID="meter-run-alarm-table"
        />
      ) : null}
      <View style={styles.links}>
        <Link href={{ pathname: '/alarms', params: { meterRunId, state: 'all' } }} testID="meter-run-alarms-link">
          <AppText style={styles.link}>All alarms of this meter run ›</AppText>
        </Link>
        {engineering ? (
          <Link href={{ pathname: '/range-health', params: { meterRunId } }} testID="meter-run-range-health-link">
            <AppText style={styles.link}>Range health report ›</AppText>
          </Link>
        ) : null}
      </View>
      <AppText
        variant="caption"
        tone="muted"
      >{`The latest ${shown} in every state; times on the site's clock.`}</AppText>
    </Panel>
  );
}

const styles = StyleSheet.create({
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  link: { textDecorationLine: 'underline' },
});
