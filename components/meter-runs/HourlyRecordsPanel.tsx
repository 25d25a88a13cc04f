/**
 * The hourly records of one contract day (the standard's quantity transaction records): start,
 * flow time, quantities, flow-dependent averages, coverage, flags, uncertainty and status, and
 * the integral value and integral multiplier value from which a third party recomputes the mass
 * (mass = IMV × IV × flow time, API MPMS 21.1). An hour in which a dated setting took effect is
 * two records (or more), each shown with its start and end. An hour's U opens its uncertainty
 * budget: each term with its share and source (issue 13).
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { space } from '@/constants/theme';
import {
  differentialPressureForDisplay,
  formatNumber,
  staticPressureForDisplay,
  temperatureForDisplay,
  unitsFor,
} from '@/constants/units-display';
import { useMeterRun } from '@/hooks/api/meterRuns';
import { useHourlyRecords } from '@/hooks/api/totals';
import type { Site } from '@/hooks/api/sites';
import { formatContractDay } from '@/shared/format/time';
import { contractDayBounds, contractDayOf } from '@/shared/history/contract-day';
import { FlagList } from './FlagList';
import { RecordVersionsView, VersionMarker, versionColumn } from './RecordVersionsView';
import { formatSiteTime } from './siteTime';
import {
  coverageTitle,
  directionCells,
  directionColumns,
  forwardTitle,
  totalCells,
  uncertaintyTitle,
} from './totalCells';
import { UncertaintyBudgetView } from './UncertaintyBudgetView';

interface HourlyRecordsPanelProps {
  meterRunId: string;
  site: Site;
}

export function HourlyRecordsPanel({ meterRunId, site }: HourlyRecordsPanelProps) {
  const [day, setDay] = useState(() => contractDayOf(Date.now(), site.timeZone, site.contractHour));
  const bounds = contractDayBounds(day, site.timeZone, site.contractHour);
  const records = useHourlyRecords(
    meterRunId,
    new Date(bounds.startMs).toISOString(),
    new Date(bounds.endMs).toISOString(),
  );
  const today = contractDayOf(Date.now(), site.timeZone, site.contractHour);
  const [openedHour, setOpenedHour] = useState<string | null>(null);
  const [budgetHour, setBudgetHour] = useState<string | null>(null);
  const budgetRecord = budgetHour ? records.data?.find((r) => r.start === budgetHour) : undefined;
  const set = unitsFor(site.displayUnits);
  // A bi-directional meter run's records keep forward and reverse apart: separate columns, net as its own.
  const run = useMeterRun(meterRunId);
  const bidirectional = run.data?.reverseElement !== undefined || (records.data ?? []).some((r) => r.reverse);
  const forward = (title: string) => (bidirectional ? forwardTitle(title) : title);

  const columns: DataColumn[] = [
    { key: 'start', title: 'Start', width: 60 },
    { key: 'flowTime', title: forward('Flow time, min'), width: 72 },
    { key: 'mass', title: forward(`Mass, ${set.mass.label}`), width: 92 },
    { key: 'volume', title: forward(`Volume at base, ${set.standardVolume.label}`), width: 104 },
    { key: 'energy', title: forward(`Energy, ${set.energy.label}`), width: 92 },
    ...(bidirectional ? directionColumns(set, 'min') : []),
    { key: 'dp', title: `DP avg, ${set.differentialPressure.label}`, width: 100 },
    { key: 'pressure', title: `P avg, ${set.staticPressure.label}`, width: 84 },
    { key: 'temperature', title: `T avg, ${set.temperature.label}`, width: 68 },
    // SI whatever the display units: they are the record's own constants, to recompute its mass.
    { key: 'integral', title: 'IV, √(Pa·kg/m³)', width: 96 },
    { key: 'multiplier', title: 'IMV, m²', width: 96 },
    { key: 'coverage', title: coverageTitle, width: 80 },
    { key: 'flags', title: 'Flags', width: 160, align: 'left' },
    { key: 'uncertainty', title: uncertaintyTitle, width: 80 },
    { key: 'status', title: 'Status', width: 96, align: 'left' },
    versionColumn,
  ];

  const rows = (records.data ?? []).map((record, index) => {
    const cells = totalCells(record, set);
    return {
      key: record.start,
      testID: `hourly-row-${index}`,
      cells: {
        start: wholeHour(record)
          ? formatSiteTime(record.start, site.timeZone, 'HH:mm')
          : `${formatSiteTime(record.start, site.timeZone, 'HH:mm')}–${formatSiteTime(record.end, site.timeZone, 'HH:mm')}`,
        flowTime: formatNumber(record.flowTimeS / 60, 3),
        ...cells,
        ...(bidirectional ? directionCells(record, set, 'min') : {}),
        uncertainty: record.uncertaintyBudget?.length ? (
          <Button
            label={`${cells.uncertainty} ▸`}
            size="compact"
            variant="quiet"
            accessibilityLabel="Uncertainty budget of this record"
            onPress={() => setBudgetHour(record.start)}
            testID={`hourly-budget-${index}`}
          />
        ) : (
          cells.uncertainty
        ),
        dp: record.averageDpPa === null ? '—' : formatNumber(differentialPressureForDisplay(record.averageDpPa, set)),
        pressure:
          record.averagePressurePa === null
            ? '—'
            : formatNumber(staticPressureForDisplay(record.averagePressurePa, set, site.atmosphericPressurePa)),
        temperature:
          record.averageTemperatureK === null
            ? '—'
            : formatNumber(temperatureForDisplay(record.averageTemperatureK, set), 3),
        integral: formatNumber(record.integralValue, 6),
        multiplier: formatNumber(record.integralMultiplierValue, 6),
        flags: <FlagList flags={record.flags} />,
        versions: (
          <VersionMarker
            version={record.version}
            onOpen={() => setOpenedHour(record.start)}
            testID={`hourly-versions-${index}`}
          />
        ),
      },
    };
  });

  return (
    <Panel title="Hourly records" testID="hourly-records">
      <View style={styles.dayRow}>
        <Button
          label="‹ Previous day"
          size="compact"
          onPress={() => setDay(contractDayOf(bounds.startMs - 1, site.timeZone, site.contractHour))}
          testID="hourly-previous-day"
        />
        <AppText variant="bodyStrong" testID="hourly-day" style={styles.day}>
          {formatContractDay(day, bounds, site.timeZone)}
        </AppText>
        <Button
          label="Next day ›"
          size="compact"
          disabled={day >= today}
          onPress={() => setDay(contractDayOf(bounds.endMs, site.timeZone, site.contractHour))}
          testID="hourly-next-day"
        />
      </View>
      <QueryState
        isPending={records.isPending}
        error={records.error}
        onRetry={() => void records.refetch()}
        noun="hourly records"
      />
      {records.data ? (
        <DataTable
          columns={columns}
          rows={rows}
          label={`Hourly records of contract day ${day}`}
          emptyText="No hourly records for this contract day yet."
          testID="hourly-table"
        />
      ) : null}
      {budgetRecord ? (
        <UncertaintyBudgetView
          title={`record from ${formatSiteTime(budgetRecord.start, site.timeZone, 'HH:mm')}`}
          budget={budgetRecord.uncertaintyBudget}
          onClose={() => setBudgetHour(null)}
        />
      ) : null}
      {openedHour ? (
        <RecordVersionsView
          meterRunId={meterRunId}
          site={site}
          record={{ kind: 'hour', start: openedHour }}
          onClose={() => setOpenedHour(null)}
        />
      ) : null}
      <AppText variant="caption" tone="muted">
        Averages are flow-dependent: taken over the flowing time, with no-flow time left out. U: expanded uncertainty (k
        = 2) of the hour's quantity; open it for its budget. Provisional: the hour is not over yet; closed: its month is
        locked. Times on the site's clock.
        {bidirectional
          ? ' Bi-directional meter run: averages, IV, IMV and U are of forward flow; reverse flow is kept apart, and net (forward − reverse) is its own figure.'
          : ''}
      </AppText>
    </Panel>
  );
}

const styles = StyleSheet.create({
  dayRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  day: { flexShrink: 1 },
});

/** A record of a whole hour, rather than a part of one split where a dated setting took effect. */
const wholeHour = (record: { start: string; end: string }) =>
  Date.parse(record.end) - Date.parse(record.start) === 3_600_000;
