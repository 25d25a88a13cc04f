/**
 * The range check's answer: in plain words first (does one transmitter, or the pair, cover the
 * flow range within the limit, and what low-range span would), then the figures at the
 * minimum, normal and maximum flow, each transmitter's coverage, and the plot.
 */
import { rangeHealthTextInSiteUnits } from '@/components/meter-runs/rangeHealthText';
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';

import { Chart } from '@/components/charts/Chart';
import { rangeCheckPlot } from '@/components/meter-runs/rangeCheckPlot';
import type { RangeCheckRun } from '@/components/meter-runs/rangeCheckInput';
import { densityForDisplay, densityLabel } from '@/components/meter-runs/rangeCheckUnits';
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn, type DataRow } from '@/components/ui/DataTable';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { colors, fontFamily, space } from '@/constants/theme';
import {
  differentialPressureForDisplay,
  flowRateForDisplay,
  formatNumber,
  formatPlain,
  unitLabel,
  unitsFor,
  type DisplayUnits,
} from '@/constants/units-display';

interface RangeCheckResultsProps {
  run: RangeCheckRun;
  displayUnits: DisplayUnits;
}

/** A cell that is abnormal (low in range, over range, over the limit): shape, words and colour. */
function Marked({ text, abnormal, testID }: { text: string; abnormal: boolean; testID?: string }) {
  return (
    <AppText tabular testID={testID} style={[styles.right, abnormal && styles.abnormal]}>
      {text}
    </AppText>
  );
}

export function RangeCheckResults({ run, displayUnits }: RangeCheckResultsProps) {
  const set = unitsFor(displayUnits);
  const { result, input, flowUnit, baseDensityKgPerM3 } = run;
  const limit = result.uncertaintyLimitPercent;
  const flowText = (massKgPerS: number | null) =>
    massKgPerS === null
      ? '—'
      : formatNumber(
          flowRateForDisplay(
            { massKgPerS, standardVolumeM3PerS: baseDensityKgPerM3 ? massKgPerS / baseDensityKgPerM3 : null },
            flowUnit,
          ),
        );
  const flowWithUnit = (massKgPerS: number) => `${flowText(massKgPerS)} ${flowUnit.label}`;
  const dpText = (pa: number) => formatNumber(differentialPressureForDisplay(pa, set));
  const spanText = (pa: number) => formatPlain(Number(differentialPressureForDisplay(pa, set).toPrecision(4)));
  const spanName = (spanPa: number, i: number) =>
    `transmitter ${i + 1} (0–${spanText(spanPa)} ${set.differentialPressure.label})`;
  const plot = useMemo(() => rangeCheckPlot(run), [run]);
  const minimum = result.flows[0];
  const maximum = result.flows[2];

  // In plain words, one sentence per finding.
  const sentences = result.transmitters.map((t, i) => {
    const parts = [
      `${spanName(t.spanPa, i)[0].toUpperCase()}${spanName(t.spanPa, i).slice(1)} reaches full span at ${flowWithUnit(t.flowAtFullSpanKgPerS)}; its DP falls below 10 % of span below ${flowWithUnit(t.flowAtTenPercentSpanKgPerS)}.`,
    ];
    if (t.minimumFlowWithinLimitKgPerS === null || t.turndown === null)
      parts.push(`At no flow within its span does it keep the flow within ±${formatPlain(limit)} %.`);
    else
      parts.push(
        `It keeps the flow within ±${formatPlain(limit)} % down to ${flowWithUnit(t.minimumFlowWithinLimitKgPerS)}: a turndown of ${formatNumber(t.turndown, 3)} : 1 from full span.`,
      );
    if (!t.coversMaximumFlow) parts.push(`It does not reach the maximum flow (over range there).`);
    return parts.join(' ');
  });
  const suggestion = result.suggestedLowRangeSpan;
  const headline = result.rangeCovered
    ? input.transmitters.length > 1
      ? `The pair covers ${flowWithUnit(minimum.massFlowKgPerS)} to ${flowWithUnit(maximum.massFlowKgPerS)} within ±${formatPlain(limit)} %.`
      : `One transmitter covers ${flowWithUnit(minimum.massFlowKgPerS)} to ${flowWithUnit(maximum.massFlowKgPerS)} within ±${formatPlain(limit)} %.`
    : `The range ${flowWithUnit(minimum.massFlowKgPerS)} to ${flowWithUnit(maximum.massFlowKgPerS)} is not covered within ±${formatPlain(limit)} %.`;
  const advice = !result.rangeCovered
    ? !result.transmitters.some((t) => t.coversMaximumFlow)
      ? `The DP at the maximum flow (${dpText(maximum.differentialPressurePa)} ${set.differentialPressure.label}) is above every span: re-range up, or consider a smaller β.`
      : suggestion
        ? `Suggested low-range span: 0–${formatPlain(suggestion.value)} ${unitLabel(suggestion.unit)}, which keeps the flow within ±${formatPlain(limit)} % down to ${flowWithUnit(suggestion.minimumFlowWithinLimitKgPerS)} (stacked with the highest-range transmitter above it).`
        : `Even a perfect DP transmitter would not meet ±${formatPlain(limit)} % at the minimum flow: the discharge coefficient and the other uncertainties alone exceed it.`
    : null;

  const flowColumns: DataColumn[] = [
    { key: 'label', title: 'Flow', width: 88 },
    { key: 'flow', title: flowUnit.label, width: 110 },
    { key: 'dp', title: `DP, ${set.differentialPressure.label}`, width: 110 },
    ...input.transmitters.flatMap((_t, i): DataColumn[] => [
      { key: `share${i}`, title: `% of span ${i + 1}`, width: 118 },
      { key: `u${i}`, title: `Flow U with ${i + 1}, %`, width: 124 },
    ]),
  ];
  const flowRows: DataRow[] = result.flows.map((flow) => ({
    key: flow.label,
    testID: `range-check-row-${flow.label}`,
    cells: {
      label: flow.label,
      flow: flowText(flow.massFlowKgPerS),
      dp: dpText(flow.differentialPressurePa),
      ...Object.fromEntries(
        flow.transmitters.flatMap((t, i) => [
          [
            `share${i}`,
            <Marked
              key="share"
              text={`${t.lowInRange ? '▼ ' : t.overRange ? '↑ ' : ''}${formatNumber(t.shareOfSpanPercent, 3)} %${t.lowInRange ? ' low' : t.overRange ? ' over' : ''}`}
              abnormal={t.lowInRange || t.overRange}
            />,
          ],
          [
            `u${i}`,
            t.overRange ? (
              <Marked key="u" text="over range" abnormal />
            ) : (
              <Marked
                key="u"
                text={`${t.flowUncertaintyPercent > limit ? '⚑ ' : ''}±${formatNumber(t.flowUncertaintyPercent, 3)}`}
                abnormal={t.flowUncertaintyPercent > limit}
              />
            ),
          ],
        ]),
      ),
    },
  }));

  const coverageColumns: DataColumn[] = [
    { key: 'name', title: 'Transmitter', width: 150 },
    { key: 'full', title: `Flow at full span, ${flowUnit.label}`, width: 150 },
    { key: 'tenth', title: `Flow at 10 % of span, ${flowUnit.label}`, width: 160 },
    { key: 'lowest', title: `Lowest flow within ±${formatPlain(limit)} %`, width: 150 },
    { key: 'turndown', title: 'Turndown within the limit', width: 130 },
  ];
  const coverageRows: DataRow[] = result.transmitters.map((t, i) => ({
    key: String(i),
    testID: `range-check-transmitter-row-${i}`,
    cells: {
      name: `${i + 1}: 0–${spanText(t.spanPa)} ${set.differentialPressure.label}`,
      full: (
        <Marked text={flowText(t.flowAtFullSpanKgPerS)} abnormal={false} testID={`range-check-flow-at-full-${i}`} />
      ),
      tenth: (
        <Marked text={flowText(t.flowAtTenPercentSpanKgPerS)} abnormal={false} testID={`range-check-flow-at-10-${i}`} />
      ),
      lowest:
        t.minimumFlowWithinLimitKgPerS === null ? (
          <Marked text="⚑ never" abnormal />
        ) : (
          flowText(t.minimumFlowWithinLimitKgPerS)
        ),
      turndown: t.turndown === null ? '—' : `${formatNumber(t.turndown, 3)} : 1`,
    },
  }));

  return (
    <View style={styles.results} testID="range-check-result">
      {result.rangeCovered ? (
        <Notice title={headline} testID="range-check-headline">
          {sentences.map((s) => (
            <AppText key={s}>{s}</AppText>
          ))}
        </Notice>
      ) : (
        <Notice tone="error" title={headline} testID="range-check-headline">
          {sentences.map((s) => (
            <AppText key={s}>{s}</AppText>
          ))}
          {advice ? (
            <AppText variant="bodyStrong" testID="range-check-advice">
              {advice}
            </AppText>
          ) : null}
        </Notice>
      )}
      <Panel title="At the minimum, normal and maximum flow">
        <DataTable
          columns={flowColumns}
          rows={flowRows}
          label="DP, share of span and flow uncertainty at each flow"
          testID="range-check-flows"
        />
        <AppText variant="caption" tone="muted">
          {`β ${result.beta.toFixed(4)}, density ${formatNumber(densityForDisplay(result.densityKgPerM3, displayUnits))} ${densityLabel(displayUnits)} at the operating conditions${input.element.kind === 'orifice' ? `, ${input.element.method === 'api-14.3' ? `API MPMS 14.3 (expansion factor at the ${input.element.expansionReference ?? 'upstream'} tap)` : 'ISO 5167-2:2003'}` : ''}. ▼ low: below 10 % of span. ↑ over: above the upper range value. ⚑: above the ±${formatPlain(limit)} % limit. Flow uncertainty is expanded (k = 2) and worked with the same budget as the hourly records (ISO 5167-1 §8): C and ε, the pipe and element diameters, the density model, the DP transmitter's accuracy as a share of the reading and, for a meter run picked above, its pressure and temperature transmitters.`}
        </AppText>
        <AppText variant="caption" tone="muted" testID="range-check-scope">
          This check looks at the design range typed above; range health looks at the flow the meter run actually saw in
          a period. At the same flow both give the same uncertainty.
        </AppText>
      </Panel>
      <Panel title="What each transmitter covers">
        <DataTable
          columns={coverageColumns}
          rows={coverageRows}
          label="Coverage of each transmitter"
          testID="range-check-coverage"
        />
      </Panel>
      <Panel title="DP and flow uncertainty against flow" testID="range-check-plot">
        <AppText variant="caption" tone="muted">
          {`DP n: the DP as a share of transmitter n's span (left axis; ${input.transmitters.map((t, i) => `${i + 1}: 0–${spanText(t.spanPa)} ${set.differentialPressure.label}`).join(', ')}). U with n: the flow uncertainty (k = 2) with transmitter n (right axis). Hatched: the bottom 10 % of span. Flow on a logarithmic axis.`}
        </AppText>
        <Chart {...plot} testID="range-check-chart" />
      </Panel>
      {result.warnings.length > 0 ? (
        <Panel title="Warnings from the standard's limits" testID="range-check-warnings">
          {result.warnings.map((w, i) => (
            <AppText
              key={`${w.code}-${i}`}
              style={styles.abnormal}
            >{`⚑ ${rangeHealthTextInSiteUnits(w.message, set, displayUnits)}`}</AppText>
          ))}
        </Panel>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  results: { gap: space.lg },
  right: { textAlign: 'right' },
  abnormal: { color: colors.alarmMedium, fontFamily: fontFamily.semibold },
});
