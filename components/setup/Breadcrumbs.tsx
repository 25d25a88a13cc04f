/** Where a set-up page sits: Set-up › site › meter run, each step a link back up. */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { space } from '@/constants/theme';

interface Crumb {
  label: string;
  href?: string;
}

export function Breadcrumbs({ crumbs }: { crumbs: Crumb[] }) {
  return (
    <View style={styles.row} role="navigation" aria-label="Breadcrumbs">
      {crumbs.map((crumb, index) => (
        <View key={`${crumb.label}-${index}`} style={styles.step}>
          {index > 0 ? (
            <AppText tone="muted" aria-hidden>
              ›
            </AppText>
          ) : null}
          {crumb.href ? (
            <Link href={crumb.href} style={styles.link}>
              <AppText variant="label" style={styles.linkText}>
                {crumb.label}
              </AppText>
            </Link>
          ) : (
            <AppText variant="label" aria-current="page">
              {crumb.label}
            </AppText>
          )}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs },
  step: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  link: { paddingVertical: space.xs },
  linkText: { textDecorationLine: 'underline' },
});
