/** The left navigation on wide screens: the brand, the role's areas by group, server health. */
import { ScrollView, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import type { Area } from '@/constants/areas';
import { colors, layout, space } from '@/constants/theme';
import { BrandMark } from './BrandMark';
import { HealthLine } from './HealthLine';
import { NavItem } from './NavItem';
import { groupAreas } from './navGroups';

interface SideNavProps {
  areas: readonly Area[];
  currentKey: string | undefined;
}

export function SideNav({ areas, currentKey }: SideNavProps) {
  return (
    <View style={styles.nav} role="navigation" aria-label="Areas">
      <View style={styles.brand}>
        <BrandMark onDark />
      </View>
      <ScrollView style={styles.scroll} contentContainerStyle={styles.groups}>
        {groupAreas(areas).map((group) => (
          <View key={group.title} style={styles.group}>
            <AppText variant="caption" tone="onDarkMuted" style={styles.groupTitle}>
              {group.title.toUpperCase()}
            </AppText>
            {group.areas.map((area) => (
              <NavItem key={area.key} area={area} current={area.key === currentKey} placement="side" />
            ))}
          </View>
        ))}
      </ScrollView>
      <View style={styles.footer}>
        <HealthLine onDark />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  nav: { width: layout.sideNavWidth, backgroundColor: colors.navBackground },
  brand: { height: layout.headerHeight + space.sm, justifyContent: 'center', paddingHorizontal: space.lg },
  scroll: { flex: 1 },
  groups: { paddingHorizontal: space.sm, paddingBottom: space.lg, gap: space.lg },
  group: { gap: space.xxs },
  groupTitle: { paddingHorizontal: space.md, paddingVertical: space.xs, letterSpacing: 0.6 },
  footer: { padding: space.lg, borderTopWidth: 1, borderTopColor: colors.navSelected },
});
