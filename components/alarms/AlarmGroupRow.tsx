/**
 * A consequential-alarm group as one row (ISA-18.2 first-out): the first-out alarm, and under it
 * "+N consequential" that opens the others. Someone who may respond is offered to acknowledge the
 * whole group: each alarm is still acknowledged on its own (its own state change and log line).
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { can, type Role } from '@/constants/roles';
import { space } from '@/constants/theme';
import { useAlarmAction, type Alarm } from '@/hooks/api/alarms';
import type { AlarmGroupRow as Group } from './alarmGroups';
import { AlarmRow } from './AlarmRow';
import { isUnacknowledged } from './alarmWords';

export function AlarmGroupRow({
  group,
  role,
  timeZoneOf,
  onActed,
}: {
  group: Group;
  role: Role;
  timeZoneOf: (siteId: string) => string;
  /** Told of each alarm an action changed, so the list keeps it shown under its new state. */
  onActed?: (alarmId: string, alarm: Alarm | null) => void;
}) {
  const [open, setOpen] = useState(false);
  const [outcome, setOutcome] = useState<string | null>(null);
  const action = useAlarmAction();
  const { firstOut, consequential } = group;
  const waiting = [firstOut, ...consequential].filter((a) => isUnacknowledged(a.state));
  const n = consequential.length;

  const acknowledgeGroup = async () => {
    setOutcome(null);
    let refused = 0;
    let done = 0;
    // One request per alarm, in turn: each gets its own transition and log line on the server.
    for (const alarm of waiting) onActed?.(alarm.id, alarm);
    for (const alarm of waiting) {
      try {
        onActed?.(alarm.id, await action.mutateAsync({ alarmId: alarm.id, action: { kind: 'acknowledge' } }));
        done += 1;
      } catch {
        onActed?.(alarm.id, null);
        refused += 1;
      }
    }
    setOutcome(
      refused
        ? `${done} acknowledged; ${refused} of ${waiting.length} could not be: they had moved on. The list is refreshed.`
        : `All ${done} acknowledged. They stay listed under their new state.`,
    );
  };

  return (
    // A group is one item of the alarm list; its rows are lists of their own (a row is a listitem,
    // and a listitem must sit directly in a list: axe "aria-required-children").
    <View style={styles.group} role="listitem" testID={`alarm-group-${firstOut.id}`}>
      <View role="list" aria-label={`First-out alarm ${firstOut.id}`}>
        <AlarmRow alarm={firstOut} role={role} timeZone={timeZoneOf(firstOut.siteId)} onActed={onActed} />
      </View>
      {n ? (
        <View style={styles.actions}>
          <Button
            label={`${open ? '▾' : '▸'} +${n} consequential`}
            size="compact"
            variant="quiet"
            onPress={() => setOpen(!open)}
            accessibilityLabel={`${open ? 'Hide' : 'Show'} ${n} consequential alarm${n === 1 ? '' : 's'} raised with this first-out`}
            testID={`alarm-group-toggle-${firstOut.id}`}
          />
          {can(role, 'respondToAlarms') && waiting.length > 1 ? (
            <Button
              label={`Acknowledge group (${waiting.length})`}
              size="compact"
              variant="secondary"
              busy={action.isPending}
              onPress={() => void acknowledgeGroup()}
              testID={`alarm-group-acknowledge-${firstOut.id}`}
            />
          ) : null}
        </View>
      ) : null}
      {outcome ? (
        <AppText tone="muted" role="status" testID={`alarm-group-outcome-${firstOut.id}`}>
          {outcome}
        </AppText>
      ) : null}
      {open ? (
        <View style={styles.under} role="list" aria-label={`Consequential alarms of ${firstOut.id}`}>
          {consequential.map((alarm) => (
            <AlarmRow key={alarm.id} alarm={alarm} role={role} timeZone={timeZoneOf(alarm.siteId)} onActed={onActed} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  under: { gap: space.sm, paddingLeft: space.lg },
});
