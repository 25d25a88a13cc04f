/**
 * A table of figures: fixed column widths so numbers line up, numbers right-aligned in equal-width
 * digits, and sideways scrolling on a phone rather than squeezed columns. Exposed to assistive
 * technology as a table with column headers.
 */
import { useState, type ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { colors, space } from '@/constants/theme';
import { AppText } from './AppText';

export interface DataColumn {
  key: string;
  title: string;
  /** Width in px. */
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

export function DataTable({ columns, rows, label, emptyText, testID }: DataTableProps) {
  const alignOf = (column: DataColumn, index: number) => column.align ?? (index === 0 ? 'left' : 'right');
  const [visibleWidth, setVisibleWidth] = useState<number | null>(null);
  const tableWidth = columns.reduce((sum, column) => sum + column.width, 0);
  const clipped = visibleWidth !== null && tableWidth > visibleWidth + 1;
  return (
    <View>
      {clipped ? (
        <AppText variant="caption" tone="muted">
          {`◂ ▸ ${columns.length} columns: scroll sideways for the rest.`}
        </AppText>
      ) : null}
      <ScrollView
        horizontal
        testID={testID}
        contentContainerStyle={styles.scroll}
        onLayout={(event) => setVisibleWidth(event.nativeEvent.layout.width)}
      >
        <View role="table" aria-label={label}>
          <View role="row" style={[styles.row, styles.header]}>
            {columns.map((column, index) => (
              <View key={column.key} role="columnheader" style={[styles.cell, { width: column.width }]}>
                <AppText variant="label" style={alignOf(column, index) === 'right' ? styles.right : null}>
                  {column.title}
                </AppText>
              </View>
            ))}
          </View>
          {rows.length === 0 && emptyText ? (
            <View style={styles.emptyRow}>
              <AppText tone="muted">{emptyText}</AppText>
            </View>
          ) : null}
          {rows.map((row) => (
            <View key={row.key} role="row" style={styles.row} testID={row.testID}>
              {columns.map((column, index) => {
                const content = row.cells[column.key];
                const right = alignOf(column, index) === 'right';
                return (
                  <View
                    key={column.key}
                    role="cell"
                    style={[styles.cell, { width: column.width }, right && styles.cellRight]}
                  >
                    {typeof content === 'string' || typeof content === 'number' ? (
                      <AppText tabular style={right ? styles.right : null}>
                        {content}
                      </AppText>
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

const styles = StyleSheet.create({
  scroll: { flexGrow: 0 },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.divider },
  header: { borderBottomColor: colors.borderStrong },
  cell: { paddingVertical: space.sm, paddingHorizontal: space.sm, justifyContent: 'center' },
  cellRight: { alignItems: 'flex-end' },
  right: { textAlign: 'right' },
  emptyRow: { paddingVertical: space.md, paddingHorizontal: space.sm },
});
