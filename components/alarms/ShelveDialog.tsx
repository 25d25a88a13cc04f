/**
 * The confirmation step of shelving (ISA-18.2: shelving is time-limited and has a reason): how
 * long, and why. Nothing is sent until the reason is given and "Shelve" is pressed; a problem is
 * named under its field, whether this form or the server found it.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { TextField } from '@/components/ui/TextField';
import { colors, radius, space } from '@/constants/theme';

/** Choices up to the server's limit of a day (server/routes/alarms/schema.ts MAX_SHELVE_MINUTES). */
const durations = [
  { value: '15', label: '15 min' },
  { value: '30', label: '30 min' },
  { value: '60', label: '1 h' },
  { value: '120', label: '2 h' },
  { value: '240', label: '4 h' },
  { value: '480', label: '8 h' },
  { value: '1440', label: '24 h' },
] as const;
type Duration = (typeof durations)[number]['value'];

interface ShelveDialogProps {
  /** What is shelved, e.g. "DP low in range on MR-1-DP". */
  subject: string;
  busy: boolean;
  /** A refusal from the server that names a field. */
  fieldError?: { field?: string; message: string } | null;
  onConfirm: (minutes: number, reason: string) => void;
  onCancel: () => void;
}

export function ShelveDialog({ subject, busy, fieldError, onConfirm, onCancel }: ShelveDialogProps) {
  const [minutes, setMinutes] = useState<Duration>('60');
  const [reason, setReason] = useState('');
  const [reasonProblem, setReasonProblem] = useState<string | null>(null);
  const chosen = durations.find((d) => d.value === minutes)!;

  const confirm = () => {
    if (!reason.trim()) {
      setReasonProblem('Say why the alarm is shelved (for example "transmitter being calibrated").');
      return;
    }
    onConfirm(Number(minutes), reason.trim());
  };

  const serverReason = fieldError?.field === 'reason' ? fieldError.message : undefined;
  const serverOther = fieldError && fieldError.field !== 'reason' ? fieldError.message : undefined;
  return (
    <View style={styles.box} testID="shelve-dialog" role="group" aria-label="Shelve the alarm">
      <AppText variant="bodyStrong">{`Shelve ${subject}`}</AppText>
      <AppText variant="caption" tone="muted">
        A shelved alarm is not announced for the time chosen; its condition is still tracked, and it comes back by itself when the time is over.
      </AppText>
      <ChoiceGroup label="For how long" options={durations} value={minutes} onChange={setMinutes} testIDPrefix="shelve-minutes" />
      <TextField
        label="Reason (required)"
        value={reason}
        onChangeText={(text) => {
          setReason(text);
          setReasonProblem(null);
        }}
        error={reasonProblem ?? serverReason}
        testID="shelve-reason"
        maxLength={500}
        onSubmitEditing={confirm}
      />
      {serverOther ? (
        <AppText variant="caption" tone="alarm" testID="shelve-error">
          {`▲ ${serverOther}`}
        </AppText>
      ) : null}
      <View style={styles.actions}>
        <Button label={`Shelve for ${chosen.label}`} variant="primary" busy={busy} onPress={confirm} testID="shelve-confirm" />
        <Button label="Cancel" variant="quiet" onPress={onCancel} testID="shelve-cancel" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.md,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.sm,
  },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
