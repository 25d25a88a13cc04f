/**
 * The neutral frame shown while the session is read from storage: it is also what the static
 * export renders for every page, since who is signed in is only known in the browser.
 */
import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { colors, space } from '@/constants/theme';
import { BrandMark } from './BrandMark';

export function Splash() {
  return (
    <View style={styles.splash} testID="splash" role="status" aria-label="Loading Tallyrun">
      <BrandMark />
      <ActivityIndicator color={colors.textMuted} />
    </View>
  );
}

const styles = StyleSheet.create({
  splash: {
    flex: 1,
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.lg,
    backgroundColor: colors.background,
  },
});
