/**
 * The chart off the web (uPlot needs a browser's canvas): a plain summary of each series, its
 * lowest, highest and latest value, so the numbers are there even without the drawing.
 * Same props as Chart.web.tsx.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { space } from '@/constants/theme';
import { formatNumber } from '@/constants/units-display';
import type { ChartProps } from './chartTypes';

function summary(values: (number | null)[]) {
  const present = values.filter((v): v is number => v !== null && Number.isFinite(v));
  if (present.length === 0) return null;
  return { low: Math.min(...present), high: Math.max(...present), last: present[present.length - 1] };
}

export function Chart({ title, x, axes, series, zones = [], emptyText, testID }: ChartProps) {
  if (x.values.length === 0) {
    return (
      <View testID={testID}>
        <AppText tone="muted">{emptyText ?? 'Nothing to show in this window.'}</AppText>
      </View>
    );
  }
  const unitOf = (scale: string) => axes.find((axis) => axis.scale === scale)?.label ?? '';
  return (
    <View style={styles.box} testID={testID} aria-label={title}>
      {series.map((s) => {
        const found = summary(s.values);
        return (
          <AppText key={s.label} tabular>
            {found
              ? `${s.label} (${unitOf(s.scale)}): lowest ${formatNumber(found.low)}, highest ${formatNumber(found.high)}, last ${formatNumber(found.last)}`
              : `${s.label}: no values`}
          </AppText>
        );
      })}
      {zones.map((zone) => (
        <AppText key={zone.label} variant="caption" tone="muted">
          {`${zone.label}: ${formatNumber(zone.from)} to ${formatNumber(zone.to)}`}
        </AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs },
});
