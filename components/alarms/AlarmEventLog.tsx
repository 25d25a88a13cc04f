/**
 * An alarm's log (ISA-18.2 asks for every transition with its time and who made it): when, what,
 * who, the states before and after, and the note (a shelving reason, the message when raised).
 * Times on the site's clock.
 */
import { StyleSheet, View } from 'react-native';

import { formatInstant } from '@/shared/format/time';
import { AppText } from '@/components/ui/AppText';
import { QueryState } from '@/components/ui/QueryState';
import { colors, radius, space } from '@/constants/theme';
import { useAlarmEvents } from '@/hooks/api/alarms';
import { actionInWords, stateInWords } from './alarmWords';

interface AlarmEventLogProps {
  alarmId: string;
  timeZone: string;
}

export function AlarmEventLog({ alarmId, timeZone }: AlarmEventLogProps) {
  const events = useAlarmEvents(alarmId, true);
  return (
    <View style={styles.log} testID={`alarm-log-${alarmId}`} role="list" aria-label="Alarm log">
      <QueryState
        isPending={events.isPending}
        error={events.error}
        onRetry={() => void events.refetch()}
        noun="the alarm log"
      />
      {events.data?.length === 0 ? <AppText tone="muted">Nothing logged yet.</AppText> : null}
      {events.data?.map((event) => (
        <View key={event.id} style={styles.event} role="listitem">
          <AppText variant="label" tabular style={styles.when}>
            {event.occurredAt ? formatInstant(event.occurredAt, timeZone, { seconds: true }) : '—'}
          </AppText>
          <View style={styles.what}>
            <AppText variant="bodyStrong">{`${actionInWords(event.action)} · by ${event.userEmail ?? 'Tallyrun'}`}</AppText>
            <AppText variant="caption" tone="muted">
              {event.fromState
                ? `${stateInWords(event.fromState)} → ${stateInWords(event.toState)}`
                : stateInWords(event.toState)}
            </AppText>
            {event.note ? <AppText variant="caption">{event.note}</AppText> : null}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  log: {
    gap: space.sm,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  event: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xxs },
  when: { width: 176 },
  what: { flex: 1, minWidth: 200, gap: space.xxs },
});
