/** What the CSV of each kind must hold, column by column, with a short example. */
import { Platform, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { colors, radius, space } from '@/constants/theme';
import type { ImportKind } from '@/hooks/api/imports';
import { CUBIC_METRES_PER_UNIT, JOULES_PER_UNIT, KILOGRAMS_PER_UNIT } from '@/shared/units';

interface Column {
  name: string;
  required: boolean;
  meaning: string;
}

const readingColumns: Column[] = [
  {
    name: 'time',
    required: true,
    meaning:
      'ISO 8601 with an offset or Z, e.g. 2026-11-01T09:00:00-07:00 or 2026-11-01T16:00:00Z. A time without an offset is refused: the site clock would be a guess.',
  },
  { name: 'tag', required: true, meaning: 'the transmitter’s tag as set up, e.g. KFG-101-DPL.' },
  {
    name: 'value',
    required: true,
    meaning: 'the reading in the transmitter’s own unit (gauge or absolute as the transmitter is set up).',
  },
  { name: 'quality', required: false, meaning: 'good, uncertain, bad or substituted; good when left empty.' },
  {
    name: 'unit',
    required: false,
    meaning: 'if given, it must be the transmitter’s unit; a row in another unit is refused, not converted.',
  },
];

const totalColumns: Column[] = [
  { name: 'start', required: true, meaning: 'start of the period, ISO 8601 with an offset or Z.' },
  { name: 'end', required: true, meaning: 'end of the period, after start, with an offset or Z.' },
  { name: 'meterRun', required: true, meaning: 'the meter run’s tag, e.g. BPM-EF1.' },
  { name: 'quantity', required: true, meaning: 'standard-volume, mass or energy.' },
  { name: 'value', required: true, meaning: 'the field device’s total for the period, ≥ 0.' },
  {
    name: 'unit',
    required: true,
    meaning: `a unit of that quantity: ${Object.keys(CUBIC_METRES_PER_UNIT).join(', ')} (volume at base conditions); ${Object.keys(KILOGRAMS_PER_UNIT).join(', ')} (mass); ${Object.keys(JOULES_PER_UNIT).join(', ')} (energy).`,
  },
];

const examples: Record<ImportKind, string> = {
  readings:
    'time,tag,value,quality\n2026-11-01T09:00:00-07:00,KFG-101-DPL,18.4,good\n2026-11-01T09:00:00-07:00,KFG-101-PT,812.5,\n2026-11-01T09:00:05-07:00,KFG-101-DPL,18.6,good',
  'field-totals':
    'start,end,meterRun,quantity,value,unit\n2026-11-01T06:00:00+01:00,2026-11-02T06:00:00+01:00,BPM-EF1,standard-volume,4210.5,m3',
};

export function ImportsColumns({ kind }: { kind: ImportKind }) {
  const columns = kind === 'readings' ? readingColumns : totalColumns;
  return (
    <View style={styles.wrap} testID="import-columns">
      <AppText variant="label">{`Columns, in a header row: ${columns.map((c) => (c.required ? c.name : `[${c.name}]`)).join(',')}`}</AppText>
      {columns.map((column) => (
        <View key={column.name} style={styles.column}>
          <AppText variant="bodyStrong" style={styles.columnName}>
            {column.name}
          </AppText>
          <AppText style={styles.columnMeaning}>
            {column.required ? column.meaning : `optional: ${column.meaning}`}
          </AppText>
        </View>
      ))}
      <AppText variant="caption" tone="muted">
        {kind === 'readings'
          ? 'A row already imported (same tag and time) counts as a duplicate, not a second reading. Good rows are kept even when others are rejected; each rejected line is listed with its number and reason.'
          : 'A repeated period for the same meter run and quantity replaces the earlier value. Field totals are compared with Tallyrun’s own totals in reconciliation.'}
      </AppText>
      <AppText variant="caption" tone="muted">
        Example
      </AppText>
      <AppText style={styles.example} selectable {...exampleScrollProps}>
        {examples[kind]}
      </AppText>
    </View>
  );
}

/** The example scrolls sideways on a phone; a region that scrolls must be reachable by keyboard and named (WCAG 2.1.1). */
const exampleScrollProps: object =
  Platform.OS === 'web' ? { tabIndex: 0, role: 'group', 'aria-label': 'Example, scrolls sideways' } : {};

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  column: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  columnName: { width: 80 },
  columnMeaning: { flex: 1, minWidth: 200 },
  example: {
    fontFamily: Platform.OS === 'web' ? 'ui-monospace, SFMono-Regular, Menlo, Consolas, monospace' : undefined,
    fontSize: 13,
    padding: space.sm,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
    ...(Platform.OS === 'web' ? { whiteSpace: 'pre' as const, overflowX: 'auto' as const } : null),
  } as object,
});
