/**
 * DP as a share of the active transmitter's span: a bar whose bottom tenth is marked (a
 * shaded band and a tick), with the share in words beside it. In the bottom tenth the bar
 * turns to the colour and shape of the DP-low-in-range alarm's priority (medium) and the words
 * say so; over the span, the high one.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { alarmStyle, colors, radius, space } from '@/constants/theme';
import { formatShare } from './formatFigure';
import { isLowInRange, lowInRangePriority, lowInRangeShare } from './runStates';

interface DpShareBarProps {
  /** DP as a share of span (0..1, more when over range), or null when no DP is in use. */
  share: number | null;
  testID?: string;
}

export function DpShareBar({ share, testID }: DpShareBarProps) {
  const low = isLowInRange(share);
  const over = share !== null && share > 1;
  const fill = share === null ? 0 : Math.min(Math.max(share, 0), 1);
  const abnormal = low ? alarmStyle[lowInRangePriority] : over ? alarmStyle.high : null;
  const words =
    share === null
      ? 'DP: no reading in use'
      : `DP ${formatShare(share)} of span${low ? ' — low in range' : over ? ' — over range' : ''}`;

  return (
    <View style={styles.wrap} testID={testID}>
      <View style={[styles.track, abnormal && { borderColor: abnormal.color }]} {...meterProps(share, words)}>
        <View style={[styles.lowBand, { width: `${lowInRangeShare * 100}%` }]} />
        <View
          style={[styles.fill, { width: `${fill * 100}%` }, abnormal && { backgroundColor: abnormal.color }]}
          testID={testID ? `${testID}-fill` : undefined}
        />
        <View style={[styles.tick, { left: `${lowInRangeShare * 100}%` }]} />
      </View>
      <View style={styles.labelRow}>
        {abnormal ? (
          <AppText variant="label" aria-hidden style={{ color: abnormal.color }}>
            {abnormal.shape}
          </AppText>
        ) : null}
        <AppText
          variant="label"
          tabular
          style={abnormal ? { color: abnormal.color } : undefined}
          testID={testID ? `${testID}-label` : undefined}
        >
          {words}
        </AppText>
      </View>
    </View>
  );
}

/**
 * A meter only while a DP reading is in use (a meter without a value is no meter); with none the empty bar is
 * decoration and the words beside it say so. Past the span (or below zero) the value runs out, and so does the bound.
 */
function meterProps(share: number | null, words: string) {
  if (share === null) return { 'aria-hidden': true } as const;
  const percent = Math.round(share * 100);
  return {
    role: 'meter',
    'aria-label': 'DP share of span',
    'aria-valuemin': Math.min(0, percent),
    'aria-valuemax': Math.max(100, percent),
    'aria-valuenow': percent,
    'aria-valuetext': words,
  } as const;
}

const barHeightPx = 14;

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  track: {
    height: barHeightPx,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    backgroundColor: colors.surfaceRaised,
    overflow: 'hidden',
    position: 'relative',
  },
  // The bottom tenth: a darker band, so the reader sees where "low in range" begins even when normal.
  lowBand: { position: 'absolute', left: 0, top: 0, bottom: 0, backgroundColor: colors.surfaceSunken },
  fill: { position: 'absolute', left: 0, top: 0, bottom: 0, backgroundColor: colors.textMuted },
  tick: { position: 'absolute', top: 0, bottom: 0, width: 2, marginLeft: -1, backgroundColor: colors.text },
  labelRow: { flexDirection: 'row', gap: space.xs, alignItems: 'center' },
});
