/**
 * The alarm banner above every signed-in screen: how many alarms wait for acknowledgement, by
 * priority (shape, word and colour together), the newest one's message, and a flood warning
 * (TRADE.md §7: more than 10 alarms in 10 minutes). A tap opens the alarm list. When everything
 * is acknowledged the line turns grey and says how many are still open; with no open alarm it
 * is not drawn at all (ISA-101: a normal display stays quiet). The counts are polled every 10 s
 * and again when the window regains focus (hooks/api/alarms.ts). On a phone it is one line (the
 * counts by priority, the count, then as much of the newest message as fits) so the screen's own
 * content keeps most of the height.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { alarmStyle, colors, layout, space } from '@/constants/theme';
import { useAlarmCounts, useNewestUnacknowledgedAlarm } from '@/hooks/api/alarms';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { ALARM_PRIORITIES } from '@/shared/alarms/alarm-codes';
import { PriorityBadge } from './PriorityBadge';
import { conditionInWords } from './alarmWords';

export function AlarmBanner() {
  const counts = useAlarmCounts();
  const unacknowledged = counts.data?.unacknowledged ?? 0;
  const newest = useNewestUnacknowledgedAlarm(unacknowledged > 0);
  const [hovered, setHovered] = useState(false);
  const [focused, setFocused] = useState(false);
  const compact = useBreakpoint() === 'phone';

  if (!counts.data || counts.data.open === 0) return null;
  const { unacknowledgedByPriority: byPriority, open, flood, raisedLast10Minutes } = counts.data;
  const top = ALARM_PRIORITIES.find((priority) => byPriority[priority] > 0);
  const topStyle = top ? alarmStyle[top] : null;
  const latest = unacknowledged > 0 ? newest.data : null;
  const summary =
    unacknowledged > 0
      ? `${unacknowledged} unacknowledged alarm${unacknowledged === 1 ? '' : 's'}`
      : `No unacknowledged alarms · ${open} open`;
  const shortSummary = unacknowledged > 0 ? `${unacknowledged} unacknowledged` : `${open} open, all acknowledged`;
  const newestWords = latest
    ? `Newest, ${conditionInWords(latest.condition)}: ${latest.message}${latest.consequentialCount ? ` (+${latest.consequentialCount} consequential)` : ''}`
    : null;

  return (
    <Link href="/alarms" asChild>
      <Pressable
        testID="alarm-banner"
        role="link"
        aria-live="polite"
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        style={StyleSheet.flatten([
          styles.banner,
          topStyle ? { backgroundColor: topStyle.surface, borderLeftColor: topStyle.color } : styles.quiet,
          hovered && styles.hovered,
          focused && styles.focused,
        ])}
      >
        <View style={styles.content}>
          <View style={compact ? styles.oneLine : styles.line}>
            {ALARM_PRIORITIES.filter((priority) => byPriority[priority] > 0).map((priority) => (
              <PriorityBadge
                key={priority}
                priority={priority}
                emphasis="unacknowledged"
                suffix={String(byPriority[priority])}
                testID={`alarm-banner-${priority}`}
              />
            ))}
            <AppText
              variant="bodyStrong"
              tone={unacknowledged > 0 ? 'default' : 'muted'}
              numberOfLines={1}
              style={compact && styles.keep}
              testID="alarm-banner-count"
            >
              {compact ? shortSummary : summary}
            </AppText>
            {flood ? (
              <AppText
                variant="label"
                tone="error"
                numberOfLines={1}
                style={compact && styles.keep}
                testID="alarm-banner-flood"
              >
                {compact
                  ? `Flood: ${raisedLast10Minutes} in 10 min`
                  : `Alarm flood: ${raisedLast10Minutes} raised in 10 min`}
              </AppText>
            ) : null}
          </View>
          {/* Phone: the newest message on a line of its own, cut to one line, so the badges never squeeze it away. */}
          {compact && newestWords ? (
            <AppText variant="caption" numberOfLines={1} tone="muted" testID="alarm-banner-message">
              {newestWords}
            </AppText>
          ) : null}
          {!compact && newestWords ? (
            <AppText numberOfLines={2} testID="alarm-banner-message">
              {newestWords}
            </AppText>
          ) : null}
        </View>
        <AppText tone="muted" aria-hidden style={styles.chevron}>
          ›
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  banner: {
    minHeight: layout.touchTarget,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.lg,
    paddingVertical: space.xs,
    borderLeftWidth: 4,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  quiet: { backgroundColor: colors.surface, borderLeftColor: colors.borderStrong },
  hovered: { opacity: 0.92 },
  focused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: -2 },
  content: { flex: 1, minWidth: 0, gap: space.xxs },
  /** Phone: badges and count on one line that never wraps; the newest message goes on the line below. */
  oneLine: { flexDirection: 'row', flexWrap: 'nowrap', alignItems: 'center', gap: space.sm, overflow: 'hidden' },
  keep: { flexShrink: 0 },
  line: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.sm, rowGap: space.xxs },
  chevron: { fontSize: 22 },
});
