/**
 * One meter run's month as a stacked card (the phone layout): each figure on its own line with
 * its unit, the number right-aligned, and a button that opens the month's contract days.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { space } from '@/constants/theme';
import type { DisplayUnits } from '@/constants/units-display';
import type { MonthFigures } from '@/hooks/api/monthlyVolumes';
import { directionHeaders, directionMonthCells, forwardHeader, type DirectionParts } from './directionFigures';
import { monthCells, monthHeaders } from './monthFormat';

interface Props {
  title: string;
  /** A bi-directional meter run's month also carries its reverse and net figures. */
  figures: MonthFigures & DirectionParts;
  displayUnits: DisplayUnits;
  onOpenDays?: () => void;
  testID?: string;
}

export function MeterRunMonthCard({ title, figures, displayUnits, onOpenDays, testID }: Props) {
  const h = monthHeaders(displayUnits);
  const c = monthCells(figures, displayUnits);
  const bidirectional = figures.reverse !== undefined;
  const d = directionHeaders(displayUnits);
  const r = directionMonthCells(figures, displayUnits);
  const lines: [string, string][] = [
    [bidirectional ? forwardHeader(h.standardVolume) : h.standardVolume, c.standardVolume],
    [bidirectional ? forwardHeader(h.mass) : h.mass, c.mass],
    ...(bidirectional
      ? ([
          [d.reverseStandardVolume, r.reverseStandardVolume],
          [d.reverseMass, r.reverseMass],
          [d.netStandardVolume, r.netStandardVolume],
          [d.netMass, r.netMass],
        ] as [string, string][])
      : []),
    [h.volume, c.volume],
    [h.energy, c.energy],
    [h.coverage, c.coverage],
    [h.uncertainty, c.uncertainty],
    [h.previous, c.previous],
    [h.yearEarlier, c.yearEarlier],
    ['Corrections in force', c.corrections],
    ['Flags', c.flags],
  ];
  return (
    <Panel
      title={title}
      testID={testID}
      actions={
        <AppText variant="label" testID={testID ? `${testID}-status` : undefined}>
          {c.status}
        </AppText>
      }
    >
      {lines.map(([label, value]) => (
        <View key={label} style={styles.line}>
          <AppText variant="caption" tone="muted" style={styles.label}>
            {label}
          </AppText>
          <AppText tabular style={styles.value}>
            {value}
          </AppText>
        </View>
      ))}
      {onOpenDays ? (
        <Button
          label="Contract days"
          size="compact"
          onPress={onOpenDays}
          testID={testID ? `${testID}-days` : undefined}
        />
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.md },
  label: { flexShrink: 1 },
  value: { textAlign: 'right' },
});
