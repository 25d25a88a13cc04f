/** A neutral progress bar (a share done, 0..1) with its label; progress is normal, so no colour. */
import { StyleSheet, View } from 'react-native';

import { colors, radius, space } from '@/constants/theme';
import { AppText } from './AppText';

interface ProgressBarProps {
  /** Share done, 0..1; null when unknown (the bar is drawn empty). */
  share: number | null;
  label: string;
  testID?: string;
}

export function ProgressBar({ share, label, testID }: ProgressBarProps) {
  const done = share === null ? 0 : Math.min(Math.max(share, 0), 1);
  return (
    <View style={styles.wrap} testID={testID}>
      <View
        style={styles.track}
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={share === null ? undefined : Math.round(done * 100)}
      >
        <View style={[styles.fill, { width: `${done * 100}%` }]} />
      </View>
      <AppText variant="label" tabular testID={testID ? `${testID}-label` : undefined}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  track: {
    height: 10,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    backgroundColor: colors.surfaceRaised,
    overflow: 'hidden',
  },
  fill: { height: '100%', backgroundColor: colors.actionFill },
});
