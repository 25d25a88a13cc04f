/**
 * The recommendation (shared/range-health/range-advice.ts, from the range check at the period's
 * lowest, typical and highest hourly flow): what to change in plain words, and the numbers it
 * rests on in the site's units, with the usual caution about work on pressurised lines.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { colors, space } from '@/constants/theme';
import {
  differentialPressureForDisplay,
  flowRateForDisplay,
  flowRateUnit,
  formatNumber,
  formatPlain,
  unitLabel,
  type DisplayUnitSet,
  type DisplayUnits,
} from '@/constants/units-display';
import type { RangeHealth } from '@/hooks/api/rangeHealth';
import { rangeHealthTextInSiteUnits } from '@/components/meter-runs/rangeHealthText';

const headlines: Record<string, string> = {
  none: 'No change needed',
  're-range': 'Re-range the DP transmitter',
  'add-low-range-transmitter': 'Add a low-range DP transmitter',
  'resize-low-range-transmitter': 'Resize the low-range transmitter',
  'change-element': 'Change the primary element',
  unavailable: 'No recommendation for this period',
};

type Numbers = RangeHealth['recommendation']['numbers'];

interface NumberRow {
  key: string;
  label: string;
  value: string;
}

/** Each number the advice can carry: its words and how it is shown. */
function numberRows(
  numbers: Numbers,
  report: RangeHealth,
  set: DisplayUnitSet,
  displayUnits: DisplayUnits,
): NumberRow[] {
  const massUnit = flowRateUnit(displayUnits === 'us' ? 'lb/h' : 't/h');
  const flow = (v: number) =>
    `${formatNumber(flowRateForDisplay({ massKgPerS: v, standardVolumeM3PerS: null }, massUnit))} ${massUnit.label}`;
  const dp = (v: number) => `${formatNumber(differentialPressureForDisplay(v, set))} ${set.differentialPressure.label}`;
  const share = (v: number) => `${formatNumber(v * 100, 3)} %`;
  const percent = (v: number) => `${formatNumber(v, 3)} %`;
  const known: Record<string, { label: string; show: (v: number) => string }> = {
    minimumFlowKgPerS: { label: 'Lowest flow (5th percentile of the hourly rates)', show: flow },
    maximumFlowKgPerS: { label: 'Highest hourly flow', show: flow },
    dpAtMinimumFlowPa: { label: 'DP at the lowest flow', show: dp },
    dpAtMaximumFlowPa: { label: 'DP at the highest flow', show: dp },
    lowInRangeTimeShare: { label: 'Flowing time below 10 % of span', show: share },
    overRangeTimeShare: { label: 'Flowing time over range', show: share },
    flowUncertaintyAtMinimumPercent: { label: 'Flow uncertainty at the lowest flow (k = 2)', show: percent },
    uncertaintyLimitPercent: { label: 'Uncertainty limit', show: percent },
    lowestFlowShareOfNewSpan: { label: 'Lowest flow on the suggested span', show: share },
    suggestedSpanMinimumFlowKgPerS: { label: 'Lowest flow within the limit on the suggested span', show: flow },
  };
  const rows: NumberRow[] = [];
  for (const [key, value] of Object.entries(numbers)) {
    if (value === null || key === 'suggestedSpanUnit') continue;
    if (key === 'suggestedSpan') {
      const unit = typeof numbers.suggestedSpanUnit === 'string' ? unitLabel(numbers.suggestedSpanUnit) : '';
      rows.push({ key, label: 'Suggested span', value: `0 to ${formatPlain(Number(value))} ${unit}`.trim() });
    } else if (key === 'transmitterId') {
      const tag = report.transmitters.find((t) => t.transmitterId === String(value))?.tag ?? String(value);
      rows.push({ key, label: 'Transmitter', value: tag });
    } else if (known[key] && typeof value === 'number') {
      rows.push({ key, label: known[key].label, value: known[key].show(value) });
    } else {
      rows.push({ key, label: key, value: typeof value === 'number' ? formatNumber(value) : value });
    }
  }
  return rows;
}

interface RangeHealthAdviceProps {
  report: RangeHealth;
  set: DisplayUnitSet;
  displayUnits: DisplayUnits;
}

export function RangeHealthAdvice({ report, set, displayUnits }: RangeHealthAdviceProps) {
  const { recommendation } = report;
  const rows = numberRows(recommendation.numbers, report, set, displayUnits);
  const warnings = recommendation.rangeCheck?.warnings ?? [];
  return (
    <Panel title="Recommendation" testID="range-health-advice">
      <Notice title={headlines[recommendation.kind] ?? recommendation.kind} testID="range-health-recommendation">
        <AppText testID="range-health-recommendation-text">
          {rangeHealthTextInSiteUnits(recommendation.text, set, displayUnits)}
        </AppText>
      </Notice>
      {rows.length ? (
        <View
          style={styles.numbers}
          role="list"
          aria-label="The numbers behind the recommendation"
          testID="range-health-numbers"
        >
          <AppText variant="label">What it rests on</AppText>
          {rows.map((row) => (
            <View key={row.key} style={styles.number} role="listitem" testID={`range-health-number-${row.key}`}>
              <AppText style={styles.numberLabel}>{row.label}</AppText>
              <AppText variant="bodyStrong" tabular>
                {row.value}
              </AppText>
            </View>
          ))}
        </View>
      ) : null}
      {warnings.length ? (
        <View style={styles.warnings}>
          <AppText variant="label">From the standard’s limits at these flows</AppText>
          {warnings.map((w) => (
            <AppText
              key={`${w.code}-${w.message}`}
              variant="caption"
            >{`• ${rangeHealthTextInSiteUnits(w.message, set, displayUnits)}`}</AppText>
          ))}
        </View>
      ) : null}
      {recommendation.kind !== 'none' && recommendation.kind !== 'unavailable' ? (
        <Notice title="Caution">
          This supports, and does not replace, licensed measurement practice and the standards that apply to your meter.
          Re-ranging or adding a transmitter, or changing an element, means working on pressurised lines: follow your
          site procedures, local codes and the equipment maker’s instructions.
        </Notice>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  warnings: { gap: space.xs },
  numbers: { gap: space.xxs, maxWidth: 640 },
  number: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    columnGap: space.md,
    paddingVertical: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.divider,
  },
  numberLabel: { flexShrink: 1 },
});
