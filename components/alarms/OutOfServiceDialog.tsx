/**
 * The confirmation step of taking an alarm out of service (maintenance, engineers and admins):
 * a reason is required, and the alarm stays out of service until someone returns it.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { TextField } from '@/components/ui/TextField';
import { colors, radius, space } from '@/constants/theme';

interface OutOfServiceDialogProps {
  subject: string;
  busy: boolean;
  serverError?: string | null;
  onConfirm: (reason: string) => void;
  onCancel: () => void;
}

export function OutOfServiceDialog({ subject, busy, serverError, onConfirm, onCancel }: OutOfServiceDialogProps) {
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const confirm = () => {
    if (!reason.trim()) {
      setProblem('Say why the alarm is taken out of service (for example "transmitter removed for repair").');
      return;
    }
    onConfirm(reason.trim());
  };
  return (
    <View style={styles.box} testID="out-of-service-dialog" role="group" aria-label="Take the alarm out of service">
      <AppText variant="bodyStrong">{`Take ${subject} out of service`}</AppText>
      <AppText variant="caption" tone="muted">
        Out of service is for maintenance: the alarm is not announced until it is returned to service, however long that takes.
      </AppText>
      <TextField
        label="Reason (required)"
        value={reason}
        onChangeText={(text) => {
          setReason(text);
          setProblem(null);
        }}
        error={problem ?? serverError ?? undefined}
        testID="out-of-service-reason"
        maxLength={500}
        onSubmitEditing={confirm}
      />
      <View style={styles.actions}>
        <Button label="Take out of service" variant="primary" busy={busy} onPress={confirm} testID="out-of-service-confirm" />
        <Button label="Cancel" variant="quiet" onPress={onCancel} testID="out-of-service-cancel" />
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
