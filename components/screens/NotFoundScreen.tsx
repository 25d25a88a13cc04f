/** An address that matches no screen. Signed-out visitors never see it: the guard sends them to sign in. */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { BrandMark } from '@/components/shell/BrandMark';
import { AppText } from '@/components/ui/AppText';
import { colors, radius, space } from '@/constants/theme';

export function NotFoundScreen() {
  return (
    <View style={styles.page} testID="not-found">
      <View style={styles.box}>
        <BrandMark />
        <AppText variant="title">There is no page at this address</AppText>
        <AppText tone="muted">The link may be mistyped, or the page may have moved.</AppText>
        <Link href="/" style={styles.link}>
          <AppText variant="bodyStrong" style={styles.linkText}>
            Go to the live board
          </AppText>
        </Link>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: {
    flex: 1,
    alignItems: 'center',
    justifyContent: 'center',
    padding: space.lg,
    backgroundColor: colors.background,
  },
  box: {
    gap: space.md,
    padding: space.xl,
    maxWidth: 480,
    width: '100%',
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.md,
  },
  link: { marginTop: space.sm },
  linkText: { textDecorationLine: 'underline' },
});
