/**
 * The confirmation step of an action that must say why (shelving an alarm, taking it out of
 * service): a title, what the action does, any choices of its own, and a required reason.
 * Nothing is sent until a reason is given and the confirm button is pressed; a missing reason
 * is named under the field, as is a refusal of the reason by the server.
 */
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { colors, radius, space } from '@/constants/theme';
import { AppText } from './AppText';
import { Button } from './Button';
import { TextField } from './TextField';

interface ReasonDialogProps {
  title: string;
  /** What the action does, in a sentence or two. */
  explanation: string;
  /** The dialog's accessible name. */
  ariaLabel: string;
  /** Test ids are `${testIDPrefix}-dialog`, `-reason`, `-error`, `-confirm` and `-cancel`. */
  testIDPrefix: string;
  /** Shown under the reason when it is left empty. */
  missingReason: string;
  /** A refusal of the reason by the server. */
  reasonError?: string;
  /** A refusal by the server about anything else, shown above the buttons. */
  otherError?: string;
  confirmLabel: string;
  busy: boolean;
  onConfirm: (reason: string) => void;
  onCancel: () => void;
  /** Choices of the action itself, drawn before the reason. */
  children?: ReactNode;
}

export function ReasonDialog({
  title,
  explanation,
  ariaLabel,
  testIDPrefix,
  missingReason,
  reasonError,
  otherError,
  confirmLabel,
  busy,
  onConfirm,
  onCancel,
  children,
}: ReasonDialogProps) {
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  const confirm = () => {
    if (!reason.trim()) {
      setProblem(missingReason);
      return;
    }
    onConfirm(reason.trim());
  };

  return (
    <View style={styles.box} testID={`${testIDPrefix}-dialog`} role="group" aria-label={ariaLabel}>
      <AppText variant="bodyStrong">{title}</AppText>
      <AppText variant="caption" tone="muted">
        {explanation}
      </AppText>
      {children}
      <TextField
        label="Reason (required)"
        value={reason}
        onChangeText={(text) => {
          setReason(text);
          setProblem(null);
        }}
        error={problem ?? reasonError}
        testID={`${testIDPrefix}-reason`}
        maxLength={500}
        onSubmitEditing={confirm}
      />
      {otherError ? (
        <AppText variant="caption" tone="error" testID={`${testIDPrefix}-error`}>
          {`⊗ ${otherError}`}
        </AppText>
      ) : null}
      <View style={styles.actions}>
        <Button
          label={confirmLabel}
          variant="primary"
          busy={busy}
          onPress={confirm}
          testID={`${testIDPrefix}-confirm`}
        />
        <Button label="Cancel" variant="quiet" onPress={onCancel} testID={`${testIDPrefix}-cancel`} />
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
