/**
 * Disable or enable an account (a person, a field device) from its row in an admin list.
 * Disabling asks once more, in words that say what it does; enabling does not. Other actions
 * of the row may sit before the Disable/Enable button, and give way to the question while it
 * is asked.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { space } from '@/constants/theme';
import { AppText } from './AppText';
import { Button } from './Button';

interface DisableEnableActionsProps {
  /** Whether the account is disabled now (then Enable is offered). */
  disabled: boolean;
  /** Whether the "Disable …?" question is being asked. */
  confirming: boolean;
  /** The question, e.g. "Disable Pad 4 RTU? It is refused the next time it signs in …". */
  question: string;
  busy: boolean;
  onAskToDisable: () => void;
  onConfirmDisable: () => void;
  onCancel: () => void;
  onEnable: () => void;
  testIDs: { disable: string; confirm: string; enable: string };
  /** Further actions of the row, drawn before the Disable/Enable button. */
  children?: ReactNode;
}

export function DisableEnableActions({
  disabled,
  confirming,
  question,
  busy,
  onAskToDisable,
  onConfirmDisable,
  onCancel,
  onEnable,
  testIDs,
  children,
}: DisableEnableActionsProps) {
  if (confirming) {
    return (
      <View style={styles.editor}>
        <AppText>{question}</AppText>
        <View style={styles.actions}>
          <Button
            label="Disable"
            size="compact"
            variant="primary"
            busy={busy}
            onPress={onConfirmDisable}
            testID={testIDs.confirm}
          />
          <Button label="Cancel" size="compact" variant="quiet" onPress={onCancel} />
        </View>
      </View>
    );
  }
  return (
    <View style={styles.actions}>
      {children}
      {disabled ? (
        <Button label="Enable" size="compact" busy={busy} onPress={onEnable} testID={testIDs.enable} />
      ) : (
        <Button label="Disable" size="compact" onPress={onAskToDisable} testID={testIDs.disable} />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  editor: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
