/** A bordered surface that groups related content on a screen. */
import type { ReactNode } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';

import { colors, radius, space } from '@/constants/theme';
import { AppText } from './AppText';

interface PanelProps {
  title?: string;
  /** Controls drawn at the right of the title row. */
  actions?: ReactNode;
  children: ReactNode;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

export function Panel({ title, actions, children, style, testID }: PanelProps) {
  return (
    <View style={[styles.panel, style]} testID={testID}>
      {title || actions ? (
        <View style={styles.titleRow}>
          {title ? (
            <AppText variant="title" role="heading" aria-level={2} style={styles.title}>
              {title}
            </AppText>
          ) : null}
          {actions}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.lg,
    gap: space.md,
  },
  titleRow: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
  title: { flex: 1 },
});
