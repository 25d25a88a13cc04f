/** Lays fields side by side where there is room and under each other on a phone. */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { space } from '@/constants/theme';

export function FieldRow({ children }: { children: ReactNode }) {
  return <View style={styles.row}>{children}</View>;
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-start' },
});
