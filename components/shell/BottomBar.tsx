/**
 * The phone's bottom bar: the everyday areas one tap away, and "More" for the rest of the
 * role's areas when there are any.
 */
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';

import { AppText } from '@/components/ui/AppText';
import type { Area } from '@/constants/areas';
import { colors, layout, space } from '@/constants/theme';
import { NavItem } from './NavItem';

interface BottomBarProps {
  primary: readonly Area[];
  hasMore: boolean;
  moreOpen: boolean;
  /** The current area is one of those under More. */
  moreCurrent: boolean;
  currentKey: string | undefined;
  onToggleMore: () => void;
  onNavigate: () => void;
}

export function BottomBar({
  primary,
  hasMore,
  moreOpen,
  moreCurrent,
  currentKey,
  onToggleMore,
  onNavigate,
}: BottomBarProps) {
  const insets = useSafeAreaInsets();
  const moreMarked = moreOpen || moreCurrent;
  return (
    <View style={[styles.bar, { paddingBottom: insets.bottom }]} role="navigation" aria-label="Areas">
      {primary.map((area) => (
        <NavItem
          key={area.key}
          area={area}
          current={!moreOpen && area.key === currentKey}
          placement="bar"
          onNavigate={onNavigate}
        />
      ))}
      {hasMore ? (
        <Pressable
          testID="nav-more"
          role="button"
          aria-expanded={moreOpen}
          aria-label="More areas"
          onPress={onToggleMore}
          style={[styles.more, moreMarked && styles.moreMarked]}
        >
          <View style={[styles.marker, moreMarked && styles.markerOn]} />
          <AppText
            variant={moreMarked ? 'bodyStrong' : 'body'}
            tone={moreMarked ? 'onDark' : 'onDarkMuted'}
            style={styles.moreText}
          >
            {moreOpen ? 'Close' : 'More'}
          </AppText>
        </Pressable>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    backgroundColor: colors.navBackground,
    borderTopWidth: 1,
    borderTopColor: colors.navSelected,
  },
  more: {
    flex: 1,
    minHeight: layout.bottomBarHeight,
    alignItems: 'center',
    justifyContent: 'center',
    paddingHorizontal: space.xs,
  },
  moreMarked: { backgroundColor: colors.navSelected },
  moreText: { fontSize: 13, textAlign: 'center' },
  marker: { position: 'absolute', top: 0, left: space.md, right: space.md, height: 3 },
  markerOn: { backgroundColor: colors.navSelectedMarker },
});
