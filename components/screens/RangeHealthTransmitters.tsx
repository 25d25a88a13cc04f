/**
 * Range health per DP transmitter (each of a stacked pair): how long each was the DP in use and
 * how its own flowing time and volume spread over the bands of its span, as a stacked bar and
 * in figures. Hours in which the pair switched are shared out by time in use (the server says
 * how much flowing time that was).
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { colors, radius, space } from '@/constants/theme';
import { formatNumber, formatPlain, unitLabel } from '@/constants/units-display';
import { dpBandNames, type RangeHealth, type TransmitterHealth } from '@/hooks/api/rangeHealth';
import { bandInWords, percentText } from './RangeHealthPlots';

/** Greys from dark (bottom of the span) to light (top), with a dashed outline for over range: no hue (ISA-101). */
const bandFill: Record<(typeof dpBandNames)[number], string> = {
  '0-10': colors.navSelected,
  '10-25': colors.borderStrong,
  '25-50': colors.textDisabled,
  '50-100': colors.divider,
  over: colors.surfaceRaised,
};

const roleWords: Record<TransmitterHealth['stackRole'], string> = {
  single: 'single',
  low: 'low range',
  high: 'high range',
};

function StackedShareBar({ transmitter }: { transmitter: TransmitterHealth }) {
  return (
    <View style={styles.barBlock}>
      <View
        style={styles.bar}
        role="img"
        aria-label={`${transmitter.tag}: ${transmitter.bands.map((b) => `${bandInWords(b.band)} ${percentText(b.flowTimeShare)}`).join(', ')} of its flowing time`}
      >
        {transmitter.bands
          .filter((b) => b.flowTimeShare > 0)
          .map((b) => (
            <View
              key={b.band}
              style={[
                styles.segment,
                { flexGrow: b.flowTimeShare, backgroundColor: bandFill[b.band] },
                b.band === 'over' && styles.over,
              ]}
            />
          ))}
      </View>
    </View>
  );
}

export function RangeHealthTransmitters({ report }: { report: RangeHealth }) {
  const columns: DataColumn[] = [
    { key: 'what', title: 'Transmitter', width: 150 },
    ...dpBandNames.map((band) => ({ key: band, title: bandInWords(band), width: 76 })),
  ];
  const rows = report.transmitters.flatMap((t) =>
    (['time', 'volume'] as const).map((measure) => ({
      key: `${t.transmitterId}-${measure}`,
      testID: `range-health-transmitter-${t.tag}-${measure}`,
      cells: {
        what: measure === 'time' ? `${t.tag}, flowing time` : `${t.tag}, volume`,
        ...Object.fromEntries(
          t.bands.map((b) => [b.band, percentText(measure === 'time' ? b.flowTimeShare : b.standardVolumeShare)]),
        ),
      },
    })),
  );

  return (
    <Panel title="Per DP transmitter" testID="range-health-transmitters">
      {report.transmitters.map((t) => (
        <View key={t.transmitterId} style={styles.transmitter} testID={`range-health-transmitter-${t.tag}`}>
          <AppText variant="bodyStrong">
            {`${t.tag} · ${roleWords[t.stackRole]} · ${formatPlain(t.lowerRange)} to ${formatPlain(t.upperRange)} ${unitLabel(t.unit)} · ±${formatPlain(t.accuracyPercentOfSpan)} % of span`}
          </AppText>
          <AppText tone="muted">
            {`In use ${formatNumber(t.activeTimeS / 3600, 4)} h: ${percentText(t.flowTimeShare)} of the meter run's flowing time, ${percentText(t.massShare)} of its mass.`}
          </AppText>
          <StackedShareBar transmitter={t} />
        </View>
      ))}
      <View style={styles.legend}>
        {dpBandNames.map((band) => (
          <View key={band} style={styles.legendItem}>
            <View style={[styles.swatch, { backgroundColor: bandFill[band] }, band === 'over' && styles.over]} />
            <AppText variant="caption">{bandInWords(band)}</AppText>
          </View>
        ))}
      </View>
      <DataTable
        columns={columns}
        rows={rows}
        label="Shares by band of each DP transmitter's span"
        testID="range-health-transmitter-table"
      />
      {report.attribution.apportionedFlowTimeS > 0 ? (
        <AppText variant="caption" tone="muted">
          {`${formatNumber(report.attribution.apportionedFlowTimeS / 3600, 3)} h of flowing time fell in hours when the pair switched; those hours are shared out by each transmitter's time in use.`}
        </AppText>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  transmitter: { gap: space.xs },
  barBlock: { paddingVertical: space.xs },
  bar: {
    flexDirection: 'row',
    height: 20,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.sm,
    overflow: 'hidden',
    backgroundColor: colors.surfaceRaised,
  },
  segment: { height: '100%', borderRightWidth: 1, borderRightColor: colors.surfaceRaised },
  over: { borderWidth: 1, borderColor: colors.text, borderStyle: 'dashed' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  swatch: { width: 14, height: 14, borderRadius: 2, borderWidth: 1, borderColor: colors.borderStrong },
});
