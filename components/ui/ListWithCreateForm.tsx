/**
 * An admin list with the form that adds to it: side by side on a wide screen (list first, the
 * larger share), and the form above the list where there is no room.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';

import { space } from '@/constants/theme';
import { useBreakpoint } from '@/hooks/useBreakpoint';

interface ListWithCreateFormProps {
  /** Draws the list, given the style that sizes it beside the form (false when under it). */
  list: (style: StyleProp<ViewStyle>) => ReactNode;
  form: ReactNode;
}

export function ListWithCreateForm({ list, form }: ListWithCreateFormProps) {
  const wide = useBreakpoint() === 'wide';
  if (wide) {
    return (
      <View style={styles.columns}>
        {list(styles.listWide)}
        <View style={styles.formWide}>{form}</View>
      </View>
    );
  }
  return (
    <>
      {form}
      {list(false)}
    </>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  listWide: { flex: 3 },
  formWide: { flex: 2, minWidth: 320 },
});
