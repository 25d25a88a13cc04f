/**
 * One alarm in the list, phone-first: priority (shape, word, colour while annunciated), state in
 * ISA-18.2 words, condition, meter run and transmitter, raised time on the site's clock and the
 * message; then the actions the role may take. Acknowledging is one tap; shelving and taking out
 * of service ask for a reason first. The log opens under the row. After an action the row shows
 * its new state and, for a while, a notice in place saying what happened.
 */
import { useEffect, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { formatInstant } from '@/shared/format/time';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { can, type Role } from '@/constants/roles';
import { alarmStyle, colors, radius, space } from '@/constants/theme';
import { useAlarmAction, type Alarm, type AlarmAction } from '@/hooks/api/alarms';
import { actionOutcome } from './actionOutcome';
import { actionProblem, type ActionProblem } from './actionProblem';
import { AlarmEventLog } from './AlarmEventLog';
import { conditionInWords, isAnnunciated, isUnacknowledged, stateInWords } from './alarmWords';
import { OutOfServiceDialog } from './OutOfServiceDialog';
import { PriorityBadge } from './PriorityBadge';
import { ShelveDialog } from './ShelveDialog';

interface AlarmRowProps {
  alarm: Alarm;
  role: Role;
  /** The site's IANA zone: times are shown on its clock. */
  timeZone: string;
  /**
   * Told when an action starts (the alarm as shown), when the server accepts it (the alarm as it now
   * stands) and when it is refused (null), so the list keeps the row while the refresh would drop it.
   */
  onActed?: (alarmId: string, alarm: Alarm | null) => void;
}

/** How long the "Acknowledged at …" notice stays: long enough to read twice. */
const outcomeShownMs = 10_000;

const shelvable = new Set(['active-unacknowledged', 'active-acknowledged', 'returned-unacknowledged']);

export function AlarmRow({ alarm, role, timeZone, onActed }: AlarmRowProps) {
  const action = useAlarmAction();
  const [dialog, setDialog] = useState<'shelve' | 'out-of-service' | null>(null);
  const [problem, setProblem] = useState<ActionProblem | null>(null);
  const [logOpen, setLogOpen] = useState(false);
  const [outcome, setOutcome] = useState<string | null>(null);
  useEffect(() => {
    if (!outcome) return;
    const timer = setTimeout(() => setOutcome(null), outcomeShownMs);
    return () => clearTimeout(timer);
  }, [outcome]);
  const respond = can(role, 'respondToAlarms');
  const maintain = can(role, 'configure');
  const at = (iso: string | null) => (iso ? formatInstant(iso, timeZone) : '—');
  const subject = `${conditionInWords(alarm.condition)} on ${alarm.transmitterTag ?? alarm.meterRunTag}`;
  const annunciated = isAnnunciated(alarm.state);

  const run = (next: AlarmAction) => {
    setProblem(null);
    setOutcome(null);
    onActed?.(alarm.id, alarm);
    action.mutate(
      { alarmId: alarm.id, action: next },
      {
        onSuccess: (changed) => {
          setDialog(null);
          setOutcome(actionOutcome(next.kind, changed.state, formatInstant(Date.now(), timeZone)));
          onActed?.(alarm.id, changed);
        },
        onError: (error) => {
          onActed?.(alarm.id, null);
          const found = actionProblem(error);
          setProblem(found);
          // The alarm moved on: the dialog has nothing left to confirm.
          if (found.tone === 'info') setDialog(null);
        },
      },
    );
  };

  const stateText =
    alarm.state === 'shelved' && alarm.shelvedUntil
      ? `Shelved until ${at(alarm.shelvedUntil)}`
      : stateInWords(alarm.state);
  const priorityStyle = alarmStyle[alarm.priority];

  return (
    <View
      style={[styles.row, annunciated && { borderLeftColor: priorityStyle.color }]}
      testID={`alarm-row-${alarm.id}`}
      role="listitem"
      aria-label={`${alarm.priority} priority, ${conditionInWords(alarm.condition)}, ${stateText}`}
    >
      <View style={styles.top}>
        <PriorityBadge
          priority={alarm.priority}
          emphasis={isUnacknowledged(alarm.state) ? 'unacknowledged' : annunciated ? 'acknowledged' : 'quiet'}
        />
        <AppText variant="bodyStrong" style={styles.state} testID={`alarm-state-${alarm.id}`}>
          {stateText}
        </AppText>
        <AppText variant="label" tone="muted" tabular>
          {`Raised ${at(alarm.raisedAt)}`}
        </AppText>
      </View>
      <AppText variant="bodyStrong">{conditionInWords(alarm.condition)}</AppText>
      <AppText tone="muted">
        {alarm.transmitterTag ? `${alarm.meterRunTag} · ${alarm.transmitterTag}` : alarm.meterRunTag}
      </AppText>
      <AppText testID={`alarm-message-${alarm.id}`}>{alarm.message}</AppText>
      {alarm.clearedAt || alarm.acknowledgedAt || alarm.shelveReason ? (
        <AppText variant="caption" tone="muted">
          {[
            alarm.clearedAt ? `Condition cleared ${at(alarm.clearedAt)}` : null,
            alarm.acknowledgedAt
              ? `Acknowledged ${at(alarm.acknowledgedAt)}${alarm.acknowledgedBy ? ` by ${alarm.acknowledgedBy}` : ''}`
              : null,
            alarm.state === 'shelved' && alarm.shelveReason ? `Shelved: ${alarm.shelveReason}` : null,
          ]
            .filter(Boolean)
            .join(' · ')}
        </AppText>
      ) : null}

      <View style={styles.actions}>
        {respond && isUnacknowledged(alarm.state) ? (
          <Button
            label="Acknowledge"
            variant="primary"
            busy={action.isPending && action.variables?.action.kind === 'acknowledge'}
            onPress={() => run({ kind: 'acknowledge' })}
            testID={`alarm-ack-${alarm.id}`}
            accessibilityLabel={`Acknowledge ${subject}`}
          />
        ) : null}
        {respond && shelvable.has(alarm.state) && dialog !== 'shelve' ? (
          <Button
            label="Shelve…"
            onPress={() => setDialog('shelve')}
            testID={`alarm-shelve-${alarm.id}`}
            accessibilityLabel={`Shelve ${subject}`}
          />
        ) : null}
        {respond && alarm.state === 'shelved' ? (
          <Button
            label="Unshelve"
            busy={action.isPending}
            onPress={() => run({ kind: 'unshelve' })}
            testID={`alarm-unshelve-${alarm.id}`}
          />
        ) : null}
        {maintain && alarm.state !== 'out-of-service' && alarm.state !== 'normal' && dialog !== 'out-of-service' ? (
          <Button
            label="Out of service…"
            variant="quiet"
            onPress={() => setDialog('out-of-service')}
            testID={`alarm-oos-${alarm.id}`}
          />
        ) : null}
        {maintain && alarm.state === 'out-of-service' ? (
          <Button
            label="Return to service"
            busy={action.isPending}
            onPress={() => run({ kind: 'return-to-service' })}
            testID={`alarm-rts-${alarm.id}`}
          />
        ) : null}
        <Pressable
          role="button"
          aria-expanded={logOpen}
          onPress={() => setLogOpen(!logOpen)}
          style={styles.logToggle}
          testID={`alarm-log-toggle-${alarm.id}`}
        >
          <AppText variant="label" style={styles.logText}>{`${logOpen ? '▾' : '▸'} Log`}</AppText>
        </Pressable>
      </View>

      {dialog === 'shelve' ? (
        <ShelveDialog
          subject={subject}
          busy={action.isPending}
          fieldError={problem?.tone === 'error' ? problem : null}
          onConfirm={(minutes, reason) => run({ kind: 'shelve', minutes, reason })}
          onCancel={() => {
            setDialog(null);
            setProblem(null);
          }}
        />
      ) : null}
      {dialog === 'out-of-service' ? (
        <OutOfServiceDialog
          subject={subject}
          busy={action.isPending}
          serverError={problem?.tone === 'error' ? problem.message : null}
          onConfirm={(reason) => run({ kind: 'out-of-service', reason })}
          onCancel={() => {
            setDialog(null);
            setProblem(null);
          }}
        />
      ) : null}
      {problem && dialog === null ? (
        <Notice tone={problem.tone} testID={`alarm-notice-${alarm.id}`}>
          {problem.message}
        </Notice>
      ) : null}
      {outcome && !problem ? <Notice testID={`alarm-done-${alarm.id}`}>{outcome}</Notice> : null}
      {logOpen ? <AlarmEventLog alarmId={alarm.id} timeZone={timeZone} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    gap: space.xs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.border,
    borderLeftWidth: 4,
    borderLeftColor: colors.border,
    borderRadius: radius.sm,
  },
  top: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.sm, rowGap: space.xs },
  state: { flexGrow: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, marginTop: space.xs },
  logToggle: { minHeight: 44, justifyContent: 'center', paddingHorizontal: space.sm, marginLeft: 'auto' },
  logText: { textDecorationLine: 'underline' },
});
