/**
 * One link in the navigation. The current area is marked by a bar, a fill and bold text, and
 * announced as the current page: no colour is spent on it.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import type { Area } from '@/constants/areas';
import { colors, layout, radius, space } from '@/constants/theme';

interface NavItemProps {
  area: Area;
  current: boolean;
  /** `side`: a row in the wide navigation or the phone's More menu; `bar`: a bottom-bar tab. */
  placement: 'side' | 'bar';
  onNavigate?: () => void;
}

export function NavItem({ area, current, placement, onNavigate }: NavItemProps) {
  const bar = placement === 'bar';
  // Link hands its props to the Pressable (asChild) and merges only a flat style object, so
  // hover and focus are tracked here and the style is flattened.
  const [hovered, setHovered] = useState(false);
  const [focused, setFocused] = useState(false);
  return (
    <Link href={area.href} asChild onPress={onNavigate}>
      <Pressable
        testID={`nav-${area.key}`}
        aria-current={current ? 'page' : undefined}
        aria-label={area.title}
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        style={StyleSheet.flatten([
          bar ? styles.tab : styles.row,
          current && (bar ? styles.tabCurrent : styles.rowCurrent),
          !current && hovered && styles.hovered,
          focused && styles.focused,
        ])}
      >
        <View style={[bar ? styles.tabMarker : styles.rowMarker, current && styles.markerCurrent]} />
        <AppText
          variant={current ? 'bodyStrong' : 'body'}
          tone={current ? 'onDark' : 'onDarkMuted'}
          numberOfLines={1}
          style={bar ? styles.tabText : styles.rowText}
        >
          {bar ? area.shortTitle : area.title}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    minHeight: layout.touchTarget,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingRight: space.md,
    borderRadius: radius.sm,
  },
  rowCurrent: { backgroundColor: colors.navSelected },
  rowMarker: { width: 4, alignSelf: 'stretch', borderRadius: 2, backgroundColor: 'transparent' },
  rowText: { flex: 1 },
  tab: {
    flex: 1,
    minHeight: layout.bottomBarHeight,
    alignItems: 'center',
    justifyContent: 'center',
    paddingHorizontal: space.xs,
  },
  tabCurrent: { backgroundColor: colors.navSelected },
  tabMarker: {
    position: 'absolute',
    top: 0,
    left: space.md,
    right: space.md,
    height: 3,
    backgroundColor: 'transparent',
  },
  tabText: { textAlign: 'center', fontSize: 13 },
  markerCurrent: { backgroundColor: colors.navSelectedMarker },
  hovered: { backgroundColor: colors.navSelected },
  focused: { outlineColor: colors.navSelectedMarker, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: -2 },
});
