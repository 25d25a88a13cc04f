/**
 * The marks that are not alarm priorities (components/ui/marks.ts), one component each:
 * `ErrorMark` for a form error or a failed action, `FlagMark` for a flag on a record or a date
 * (the same "calibration overdue" mark on every screen). Neither uses ▲ ◆ ■, which belong to the
 * alarm priorities.
 */
import { StyleSheet, View } from 'react-native';

import { colors, radius, space } from '@/constants/theme';
import { AppText } from './AppText';
import { marks } from './marks';

interface MarkProps {
  label: string;
  testID?: string;
}

/** A form error or a failed action, in words after the error mark. */
export function ErrorMark({ label, testID }: MarkProps) {
  return (
    <View testID={testID} style={styles.row}>
      <AppText variant="label" tone="error" aria-hidden style={styles.mark}>
        {marks.error}
      </AppText>
      <AppText variant="label" tone="error" style={styles.text}>
        {label}
      </AppText>
    </View>
  );
}

/** A flag on a record or a date (overdue, due soon, over range in an hour), outlined, in words after the flag mark. */
export function FlagMark({ label, testID, quiet = false }: MarkProps & { quiet?: boolean }) {
  return (
    <View testID={testID} style={[styles.row, styles.flag, quiet && styles.quiet]}>
      <AppText variant="label" aria-hidden style={styles.mark}>
        {marks.flag}
      </AppText>
      <AppText variant="label" tone={quiet ? 'muted' : 'default'} style={styles.text}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, alignSelf: 'flex-start', maxWidth: '100%' },
  flag: {
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.sm,
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
  },
  quiet: { borderColor: colors.border },
  mark: { width: 14, textAlign: 'center' },
  text: { flexShrink: 1 },
});
