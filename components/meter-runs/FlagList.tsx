/** The flags of a record as shapes and words; only abnormal ones in colour. */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { colors, fontFamily, space } from '@/constants/theme';
import { recordFlag } from './recordFlags';

export function FlagList({ flags }: { flags: readonly string[] }) {
  if (flags.length === 0) {
    return (
      <AppText variant="caption" tone="muted">
        none
      </AppText>
    );
  }
  return (
    <View style={styles.list}>
      {flags.map((code) => {
        const flag = recordFlag(code);
        const attention = flag.level === 'attention';
        return (
          <AppText
            key={code}
            variant="caption"
            tone={attention ? 'default' : 'muted'}
            style={attention ? styles.attention : null}
            aria-label={`${flag.label}: ${flag.meaning}`}
          >
            {`${flag.shape} ${flag.label}`}
          </AppText>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xxs, alignItems: 'flex-start' },
  attention: { color: colors.alarmMedium, fontFamily: fontFamily.semibold },
});
