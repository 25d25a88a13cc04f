/** The signed-in user's name and role, and the sign-out button, for the header. */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { roleLabel } from '@/constants/roles';
import { space } from '@/constants/theme';
import type { SessionUser } from '@/hooks/session/storedSession';

interface UserBadgeProps {
  user: SessionUser;
  onSignOut: () => void;
  compact?: boolean;
}

export function UserBadge({ user, onSignOut, compact }: UserBadgeProps) {
  return (
    <View style={styles.row}>
      <View
        testID="current-user"
        style={[styles.who, compact && styles.whoCompact]}
        aria-label={`Signed in as ${user.name}, ${roleLabel[user.role]}`}
      >
        <AppText variant={compact ? 'label' : 'bodyStrong'} numberOfLines={1}>
          {user.name}
        </AppText>
        <AppText variant="caption" tone="muted" numberOfLines={1}>
          {roleLabel[user.role]}
        </AppText>
      </View>
      <Button testID="sign-out" label="Sign out" size="compact" onPress={onSignOut} />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexShrink: 0 },
  who: { alignItems: 'flex-end', maxWidth: 220 },
  whoCompact: { maxWidth: 112 },
});
