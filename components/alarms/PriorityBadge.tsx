/**
 * An alarm's priority as shape, word and (only while the alarm is annunciated) colour
 * (constants/theme.ts alarmStyle; ISA-101: colour for abnormal states only, never alone).
 * Unacknowledged: tinted box with a coloured border; acknowledged but active: coloured shape and
 * word on an outline; returned to normal, shelved or out of service: the same shape and word in
 * grey.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { alarmStyle, colors, radius, space } from '@/constants/theme';
import type { AlarmPriority } from '@/shared/alarms/alarm-codes';
import { priorityWords } from './alarmWords';

interface PriorityBadgeProps {
  priority: AlarmPriority;
  emphasis: 'unacknowledged' | 'acknowledged' | 'quiet';
  /** Shown after the priority, e.g. a count: "▲ High 3". */
  suffix?: string;
  testID?: string;
}

export function PriorityBadge({ priority, emphasis, suffix, testID }: PriorityBadgeProps) {
  const style = alarmStyle[priority];
  const ink = emphasis === 'quiet' ? colors.textMuted : style.color;
  return (
    <View
      testID={testID}
      aria-label={`${priorityWords[priority]} priority${suffix ? ` ${suffix}` : ''}`}
      style={[
        styles.badge,
        emphasis === 'unacknowledged' && { backgroundColor: style.surface, borderColor: style.color },
        emphasis === 'acknowledged' && { borderColor: style.color },
        emphasis === 'quiet' && styles.quiet,
      ]}
    >
      <AppText variant="label" aria-hidden style={[styles.shape, { color: ink }]}>
        {style.shape}
      </AppText>
      <AppText variant="label" style={{ color: ink }}>
        {suffix ? `${priorityWords[priority]} ${suffix}` : priorityWords[priority]}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    alignSelf: 'flex-start',
    borderWidth: 1,
    borderColor: 'transparent',
    borderRadius: radius.sm,
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
  },
  quiet: { borderColor: colors.border },
  shape: { width: 14, textAlign: 'center' },
});
