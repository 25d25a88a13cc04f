/**
 * A table of figures: fixed column widths so numbers line up, numbers right-aligned in equal-width
 * digits with their unit in the column header (never repeated in each cell), exposed to assistive
 * technology as a table with column headers.
 *
 * On a phone a table wider than the screen scrolls sideways with its key column (the first: the
 * contract day, the hour, the meter run's tag) pinned at the left edge, so a row still reads as a
 * row wherever one has scrolled to. Chosen over a stacked card per row because these tables are
 * compared down a column (31 days of volume, 24 hours of DP): cards would put one day's volume a
 * screen away from the next day's, and a card per row would make two layouts of every table for
 * assistive technology and the tests to keep in step. Pinning keeps one table, one reading order,
 * at every width.
 *
 * A cell's text breaks only at spaces: a date broken as "2026-12-" / "02" reads as two values, so
 * each word is kept whole (give a column a width that holds its longest word); phrases still wrap
 * between words. On the web the scrolling region can be reached with the keyboard and is named
 * after the table, so arrow keys scroll it.
 */
import { useState, type ReactNode } from 'react';
import { Platform, ScrollView, StyleSheet, Text, View } from 'react-native';

import { colors, space } from '@/constants/theme';
import { AppText } from './AppText';

export interface DataColumn {
  key: string;
  title: string;
  /** Width in px: at least the longest word of the column (words are never broken). */
  width: number;
  /** Numbers go right (default for every column but the first). */
  align?: 'left' | 'right';
}

export interface DataRow {
  key: string;
  /** Text, or a node for a cell that needs more (a flag with its shape). */
  cells: Record<string, ReactNode>;
  testID?: string;
}

interface DataTableProps {
  columns: readonly DataColumn[];
  rows: readonly DataRow[];
  /** Names the table for assistive technology. */
  label: string;
  /** Shown in place of rows when there are none. */
  emptyText?: string;
  testID?: string;
}

const web = Platform.OS === 'web';

export function DataTable({ columns, rows, label, emptyText, testID }: DataTableProps) {
  const alignOf = (column: DataColumn, index: number) => column.align ?? (index === 0 ? 'left' : 'right');
  const [visibleWidth, setVisibleWidth] = useState<number | null>(null);
  const tableWidth = columns.reduce((sum, column) => sum + column.width, 0);
  const clipped = visibleWidth !== null && tableWidth > visibleWidth + 1;
  /** Width, and on the web the pinned key column (CSS sticky inside the scrolling region). */
  const cellStyle = (column: DataColumn, index: number) => [
    styles.cell,
    { width: column.width },
    index === 0 && clipped && web && styles.pinned,
  ];
  return (
    <View>
      {clipped ? (
        <AppText variant="caption" tone="muted">
          {`◂ ▸ ${columns.length} columns: scroll sideways for the rest; ${columns[0]?.title ?? 'the first'} stays in place.`}
        </AppText>
      ) : null}
      <ScrollView
        horizontal
        testID={testID}
        contentContainerStyle={styles.scroll}
        onLayout={(event) => setVisibleWidth(event.nativeEvent.layout.width)}
        // A region that scrolls must be reachable by keyboard and say what it holds (WCAG 2.1.1).
        {...(clipped && web
          ? { tabIndex: 0 as const, role: 'group' as const, 'aria-label': `${label}, scrolls sideways` }
          : {})}
      >
        <View role="table" aria-label={label}>
          <View role="row" style={[styles.row, styles.header]}>
            {columns.map((column, index) => (
              <View key={column.key} role="columnheader" style={cellStyle(column, index)}>
                <AppText variant="label" style={alignOf(column, index) === 'right' ? styles.right : null}>
                  {column.title}
                </AppText>
              </View>
            ))}
          </View>
          {rows.length === 0 && emptyText ? (
            // A table holds only rows (axe "aria-required-children"): the empty note is a row of one cell.
            <View role="row" style={styles.emptyRow}>
              <View role="cell">
                <AppText tone="muted">{emptyText}</AppText>
              </View>
            </View>
          ) : null}
          {rows.map((row) => (
            <View key={row.key} role="row" style={styles.row} testID={row.testID}>
              {columns.map((column, index) => {
                const content = row.cells[column.key];
                const right = alignOf(column, index) === 'right';
                return (
                  <View key={column.key} role="cell" style={[cellStyle(column, index), right && styles.cellRight]}>
                    {typeof content === 'string' || typeof content === 'number' ? (
                      <CellText text={String(content)} right={right} />
                    ) : (
                      (content ?? null)
                    )}
                  </View>
                );
              })}
            </View>
          ))}
        </View>
      </ScrollView>
    </View>
  );
}

/**
 * A cell's text, broken only at spaces: each word is held whole, so "2026-12-02", "−1,234.5" or a
 * tag never splits at its hyphen or comma, while a phrase still wraps between its words.
 */
function CellText({ text, right }: { text: string; right: boolean }) {
  const words = text.split(' ');
  return (
    <AppText tabular style={[right && styles.right, words.length === 1 && styles.noWrap]}>
      {words.length === 1
        ? text
        : words.flatMap((word, i) => [
            i > 0 ? ' ' : null,
            <Text key={i} style={styles.noWrap}>
              {word}
            </Text>,
          ])}
    </AppText>
  );
}

const styles = StyleSheet.create({
  scroll: { flexGrow: 0 },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.divider },
  header: { borderBottomColor: colors.borderStrong },
  cell: { paddingVertical: space.sm, paddingHorizontal: space.sm, justifyContent: 'center' },
  cellRight: { alignItems: 'flex-end' },
  right: { textAlign: 'right' },
  emptyRow: { paddingVertical: space.md, paddingHorizontal: space.sm },
  // Web-only CSS (react-native-web passes it through): one line, and the key column held in view.
  noWrap: (web ? { whiteSpace: 'nowrap' } : {}) as object,
  pinned: (web
    ? {
        position: 'sticky',
        left: 0,
        zIndex: 1,
        backgroundColor: colors.surface,
        borderRightWidth: 1,
        borderRightColor: colors.divider,
      }
    : {}) as object,
});
