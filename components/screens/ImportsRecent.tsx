/** The latest imports, newest first; choosing one shows its counts and rejected lines. */
import { Pressable, StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import type { WebPressableState } from '@/components/ui/pressableState';
import { colors, radius, space } from '@/constants/theme';
import type { Import } from '@/hooks/api/imports';
import { formatCount } from './ImportsFormat';

interface ImportsRecentProps {
  imports: Import[];
  selectedId: string | null;
  onSelect: (importId: string) => void;
}

const statusText: Record<Import['status'], string> = { running: '… running', done: '✓ done', failed: '⊗ stopped' };

export function ImportsRecent({ imports, selectedId, onSelect }: ImportsRecentProps) {
  if (imports.length === 0) return <AppText tone="muted">No imports yet.</AppText>;
  return (
    <View style={styles.list}>
      {imports.map((item) => {
        const selected = item.id === selectedId;
        return (
          <Pressable
            key={item.id}
            testID={`import-row-${item.id}`}
            role="button"
            aria-pressed={selected}
            onPress={() => onSelect(item.id)}
            style={({ hovered, focused }: WebPressableState) => [
              styles.row,
              selected && styles.rowSelected,
              hovered && !selected && styles.rowHovered,
              focused && styles.focused,
            ]}
          >
            <View style={styles.top}>
              <AppText variant="bodyStrong" numberOfLines={1} style={styles.name}>
                {selected ? `▸ ${item.filename}` : item.filename}
              </AppText>
              <AppText variant="label" tone={item.status === 'failed' ? 'error' : 'default'}>
                {statusText[item.status]}
              </AppText>
            </View>
            <AppText variant="caption" tone="muted" tabular>
              {`${item.kind === 'readings' ? 'Readings' : 'Field totals'} · ${formatTimestamp(item.createdAt)}`}
            </AppText>
            <AppText variant="caption" tabular>
              {`${formatCount(item.rowsRead)} read · ${formatCount(item.rowsImported)} imported · ${formatCount(item.duplicates)} duplicates · ${formatCount(item.rejected)} rejected`}
            </AppText>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs },
  row: {
    gap: space.xxs,
    padding: space.sm,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
    backgroundColor: colors.surfaceRaised,
  },
  rowSelected: { borderColor: colors.borderStrong, borderLeftWidth: 4, backgroundColor: colors.surfaceSunken },
  rowHovered: { backgroundColor: colors.surface },
  focused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: 2 },
  top: { flexDirection: 'row', gap: space.sm, alignItems: 'center' },
  name: { flex: 1 },
});
