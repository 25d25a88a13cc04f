/**
 * An abnormal state in a few words, drawn with its priority's colour, tint and shape together
 * (constants/theme.ts alarmStyle), so the words and the shape carry it without the colour.
 */
import { StyleSheet, View } from 'react-native';

import { alarmStyle, radius, space } from '@/constants/theme';
import { AppText } from './AppText';

interface StateBadgeProps {
  priority: keyof typeof alarmStyle;
  label: string;
  testID?: string;
  /** `inline` is a line of text; `badge` adds the tinted box. */
  variant?: 'badge' | 'inline';
}

export function StateBadge({ priority, label, testID, variant = 'badge' }: StateBadgeProps) {
  const style = alarmStyle[priority];
  return (
    <View
      testID={testID}
      style={[
        styles.row,
        variant === 'badge' && [styles.badge, { backgroundColor: style.surface, borderColor: style.color }],
      ]}
    >
      <AppText variant="label" aria-hidden style={[styles.shape, { color: style.color }]}>
        {style.shape}
      </AppText>
      <AppText variant="label" style={[styles.text, { color: style.color }]}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, alignSelf: 'flex-start', maxWidth: '100%' },
  badge: { borderWidth: 1, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: space.xxs },
  shape: { width: 14, textAlign: 'center' },
  text: { flexShrink: 1 },
});
