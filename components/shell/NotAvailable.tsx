/**
 * Shown in place of a screen the user's role may not open, when its address was typed or
 * followed from a link. The server refuses the data anyway; this says so plainly.
 */
import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Screen } from '@/components/ui/Screen';
import type { Area } from '@/constants/areas';
import { roleLabel, type Role } from '@/constants/roles';
import { colors, radius, space } from '@/constants/theme';

export function NotAvailable({ area, role }: { area: Area; role: Role }) {
  return (
    <Screen>
      <View style={styles.box} testID="not-available" role="status">
        <AppText variant="title">{`${area.title} is not available for your role`}</AppText>
        <AppText tone="muted">
          {`You are signed in as ${roleLabel[role].toLowerCase()}. If your work needs this area, ask an administrator to change your role.`}
        </AppText>
        <View style={styles.actions}>
          <Button label="Go to the live board" variant="primary" onPress={() => router.replace('/')} />
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.md,
    padding: space.xl,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.md,
    maxWidth: 560,
  },
  actions: { flexDirection: 'row', marginTop: space.sm },
});
