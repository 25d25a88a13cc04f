/**
 * What a screen shows while its data loads or after it failed to, so each screen only draws
 * the success case.
 */
import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { colors, space } from '@/constants/theme';
import { AppText } from './AppText';
import { Button } from './Button';
import { Notice } from './Notice';

interface QueryStateProps {
  isPending: boolean;
  error: Error | null;
  onRetry: () => void;
  /** What is being loaded, e.g. "users". */
  noun: string;
}

/** @returns the loading or error view, or null once data is there */
export function QueryState({ isPending, error, onRetry, noun }: QueryStateProps) {
  if (error) {
    return (
      <Notice tone="error" title={`Could not load ${noun}`}>
        <AppText>{error.message}</AppText>
        <View style={styles.retry}>
          <Button label="Try again" size="compact" onPress={onRetry} />
        </View>
      </Notice>
    );
  }
  if (isPending) {
    return (
      <View style={styles.loading} role="status" aria-live="polite">
        <ActivityIndicator color={colors.textMuted} />
        <AppText tone="muted">{`Loading ${noun}…`}</AppText>
      </View>
    );
  }
  return null;
}

const styles = StyleSheet.create({
  retry: { flexDirection: 'row', marginTop: space.sm },
  loading: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: space.lg },
});
