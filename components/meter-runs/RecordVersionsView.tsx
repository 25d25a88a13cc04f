/**
 * The versions of one hourly record or contract-day total: a marker in the record's row (shown
 * only when the record was recomputed, i.e. has a version after the first) and, once opened, the
 * first and the current figures side by side with their difference, then every version with
 * what made it and when.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { colors, space } from '@/constants/theme';
import { formatNumber, unitsFor } from '@/constants/units-display';
import type { Site } from '@/hooks/api/sites';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { fromSI } from '@/shared/units';
import { formatSiteTime } from './siteTime';
import { causeWords, compareFirstAndCurrent, useRecordVersions, type RecordRef } from './recordVersions';

/** The table column that holds the marker. */
export const versionColumn = { key: 'versions', title: 'Versions', width: 84, align: 'left' } as const;

/**
 * @param version the record's version (1 for a record never recomputed; null or undefined when unknown)
 * @param onOpen shows the record's versions
 */
export function VersionMarker({
  version,
  onOpen,
  testID,
}: {
  version: number | null | undefined;
  onOpen: () => void;
  testID?: string;
}) {
  if (!version || version < 2) return null;
  return (
    <Button
      label={`v${version} ▸`}
      size="compact"
      variant="quiet"
      accessibilityLabel={`Version ${version}: compare with the first`}
      onPress={onOpen}
      testID={testID}
    />
  );
}

interface RecordVersionsViewProps {
  meterRunId: string;
  site: Site;
  record: RecordRef;
  onClose: () => void;
}

export function RecordVersionsView({ meterRunId, site, record, onClose }: RecordVersionsViewProps) {
  const history = useRecordVersions(meterRunId, record);
  // On a phone a five-column table would hide "current" off screen: each quantity gets a block instead.
  const phone = useBreakpoint() === 'phone';
  const set = unitsFor(site.displayUnits);
  const period =
    record.kind === 'hour'
      ? `Hour from ${formatSiteTime(record.start, site.timeZone, 'yyyy-MM-dd HH:mm')}`
      : `Contract day ${formatSiteTime(record.start, site.timeZone, 'yyyy-MM-dd')}`;

  const comparisonColumns: DataColumn[] = [
    { key: 'label', title: 'Quantity', width: 150 },
    { key: 'first', title: 'First', width: 104 },
    { key: 'current', title: 'Current', width: 104 },
    { key: 'difference', title: 'Difference', width: 96 },
    { key: 'percent', title: '% of first', width: 96 },
  ];
  const versionColumns: DataColumn[] = [
    { key: 'version', title: 'Version', width: 64 },
    { key: 'cause', title: 'Cause', width: 150, align: 'left' },
    { key: 'computed', title: 'Computed', width: 150, align: 'left' },
    // A phone shows what made each version and when; the figures are in the comparison above.
    ...(phone
      ? []
      : [
          { key: 'mass', title: `Mass, ${set.mass.label}`, width: 104 },
          { key: 'coverage', title: 'Coverage, %', width: 80 },
          { key: 'state', title: 'State', width: 120, align: 'left' as const },
        ]),
  ];

  return (
    <Panel
      title={`Versions · ${period}`}
      testID="record-versions"
      actions={<Button label="Close" size="compact" onPress={onClose} testID="record-versions-close" />}
    >
      <QueryState
        isPending={history.isPending}
        error={history.error}
        onRetry={() => void history.refetch()}
        noun="the record's versions"
      />
      {history.data ? (
        <View style={styles.body}>
          {phone ? (
            <View testID="record-versions-comparison">
              {compareFirstAndCurrent(history.data, set).map((row) => (
                <View key={row.key} style={styles.block} testID={`record-versions-${row.key}`}>
                  <AppText variant="bodyStrong">{row.label}</AppText>
                  <View style={styles.pairs}>
                    {(
                      [
                        ['First', row.first],
                        ['Current', row.current],
                        ['Difference', row.difference],
                        ['% of first', row.percent],
                      ] as const
                    ).map(([name, value]) => (
                      <View key={name} style={styles.pair}>
                        <AppText variant="caption" tone="muted">
                          {name}
                        </AppText>
                        <AppText tabular>{value}</AppText>
                      </View>
                    ))}
                  </View>
                </View>
              ))}
            </View>
          ) : (
            <DataTable
              columns={comparisonColumns}
              rows={compareFirstAndCurrent(history.data, set).map((row) => ({
                key: row.key,
                testID: `record-versions-${row.key}`,
                cells: {
                  label: row.label,
                  first: row.first,
                  current: row.current,
                  difference: row.difference,
                  percent: row.percent,
                },
              }))}
              label="First and current figures"
              testID="record-versions-comparison"
            />
          )}
          <DataTable
            columns={versionColumns}
            rows={[...history.data.versions].reverse().map((v) => ({
              key: String(v.version),
              testID: `record-version-${v.version}`,
              cells: {
                version: String(v.version),
                cause: `${causeWords[v.cause] ?? v.cause}${v.causeReference ? ` (${v.causeReference})` : ''}`,
                computed: formatSiteTime(v.computedAt, site.timeZone, 'yyyy-MM-dd HH:mm'),
                mass: formatNumber(fromSI(v.massKg, set.mass.unit), 6),
                coverage: formatNumber(v.coverage * 100, 3),
                state: v.supersededAt
                  ? `replaced ${formatSiteTime(v.supersededAt, site.timeZone, 'MM-dd HH:mm')}`
                  : 'in force',
              },
            }))}
            label="Every version, newest first"
            testID="record-versions-list"
          />
          <AppText variant="caption" tone="muted">
            Every version is kept; none is overwritten. Difference: current minus first. Times on the site&apos;s clock.
          </AppText>
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.md },
  block: { paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: colors.divider, gap: space.xxs },
  pairs: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xxs },
  pair: { minWidth: 130 },
});
