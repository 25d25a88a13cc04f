/**
 * The phone's "More" sheet: the role's remaining areas, grouped as on wide screens, above the
 * bottom bar. A press outside it, or Escape on a keyboard, closes it.
 */
import { useEffect } from 'react';
import { Platform, Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import type { Area } from '@/constants/areas';
import { colors, radius, space } from '@/constants/theme';
import { HealthLine } from './HealthLine';
import { NavItem } from './NavItem';
import { groupAreas } from './navGroups';

interface MoreMenuProps {
  areas: readonly Area[];
  currentKey: string | undefined;
  onClose: () => void;
}

export function MoreMenu({ areas, currentKey, onClose }: MoreMenuProps) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') onClose();
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [onClose]);

  return (
    <View style={StyleSheet.absoluteFill} testID="more-menu">
      <Pressable style={styles.backdrop} onPress={onClose} aria-label="Close menu" />
      <View style={styles.sheet} role="navigation" aria-label="More areas">
        <ScrollView contentContainerStyle={styles.content}>
          {groupAreas(areas).map((group) => (
            <View key={group.title} style={styles.group}>
              <AppText variant="caption" tone="onDarkMuted" style={styles.groupTitle}>
                {group.title.toUpperCase()}
              </AppText>
              {group.areas.map((area) => (
                <NavItem
                  key={area.key}
                  area={area}
                  current={area.key === currentKey}
                  placement="side"
                  onNavigate={onClose}
                />
              ))}
            </View>
          ))}
          <View style={styles.health}>
            <HealthLine onDark />
          </View>
        </ScrollView>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  backdrop: { position: 'absolute', top: 0, right: 0, bottom: 0, left: 0, backgroundColor: 'rgba(22, 25, 28, 0.45)' },
  sheet: {
    position: 'absolute',
    left: 0,
    right: 0,
    bottom: 0,
    maxHeight: '80%',
    backgroundColor: colors.navBackground,
    borderTopLeftRadius: radius.lg,
    borderTopRightRadius: radius.lg,
  },
  content: { padding: space.md, gap: space.lg },
  group: { gap: space.xxs },
  health: { paddingHorizontal: space.md },
  groupTitle: { paddingHorizontal: space.md, paddingVertical: space.xs, letterSpacing: 0.6 },
});
