/**
 * The header above every signed-in screen (the page's banner landmark): the area's title, the page's one
 * level-one heading, then who is signed in.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { colors, layout, space } from '@/constants/theme';
import type { SessionUser } from '@/hooks/session/storedSession';
import { UserBadge } from './UserBadge';

interface AppHeaderProps {
  title: string;
  user: SessionUser;
  onSignOut: () => void;
  compact: boolean;
}

export function AppHeader({ title, user, onSignOut, compact }: AppHeaderProps) {
  return (
    <View style={[styles.header, compact && styles.headerCompact]} role="banner">
      <AppText
        variant={compact ? 'title' : 'heading'}
        role="heading"
        aria-level={1}
        numberOfLines={1}
        style={styles.title}
        testID="area-title"
      >
        {title}
      </AppText>
      <UserBadge user={user} onSignOut={onSignOut} compact={compact} />
    </View>
  );
}

const styles = StyleSheet.create({
  header: {
    minHeight: layout.headerHeight + space.sm,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.lg,
    paddingHorizontal: space.xl,
    paddingVertical: space.sm,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  headerCompact: { minHeight: layout.headerHeight, paddingHorizontal: space.lg, gap: space.sm },
  title: { flex: 1, minWidth: 0 },
});
