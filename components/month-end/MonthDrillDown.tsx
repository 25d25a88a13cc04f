/**
 * A meter run's month, drilled down: its contract days, then the hours of a chosen day, with the
 * same figures as the meter run screen's daily and hourly panels (which it links to).
 */
import { Link } from 'expo-router';
import { useState } from 'react';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { unitsFor, type DisplayUnits } from '@/constants/units-display';
import { useTotals, type Total } from '@/hooks/api/totals';
import { coverageTitle, totalCells, uncertaintyTitle } from '@/components/meter-runs/totalCells';
import { formatSiteTime } from '@/components/meter-runs/siteTime';
import { formatContractDay } from '@/shared/format/time';

interface Props {
  meterRunId: string;
  tag: string;
  from: string;
  to: string;
  timeZone: string;
  displayUnits: DisplayUnits;
  onClose: () => void;
}

/**
 * @param day a contract day's total (start and end instants)
 * @param timeZone the site's zone
 * @returns e.g. "Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST": the hour cells' clock times need its zone
 */
function dayLabel(day: Total, timeZone: string): string {
  const bounds = { startMs: Date.parse(day.start), endMs: Date.parse(day.end) };
  return formatContractDay(formatSiteTime(day.start, timeZone, 'yyyy-MM-dd'), bounds, timeZone);
}

export function MonthDrillDown({ meterRunId, tag, from, to, timeZone, displayUnits, onClose }: Props) {
  const [day, setDay] = useState<Total | null>(null);
  const days = useTotals(meterRunId, 'day', from, to);
  const hours = useTotals(meterRunId, 'hour', day?.start ?? from, day?.end ?? from);
  const set = unitsFor(displayUnits);
  const columns = (first: string): DataColumn[] => [
    { key: 'when', title: first, width: 128 },
    { key: 'volume', title: `Volume at base, ${set.standardVolume.label}`, width: 120 },
    { key: 'mass', title: `Mass, ${set.mass.label}`, width: 100 },
    { key: 'energy', title: `Energy, ${set.energy.label}`, width: 100 },
    { key: 'coverage', title: coverageTitle, width: 84 },
    { key: 'uncertainty', title: uncertaintyTitle, width: 84 },
    { key: 'status', title: 'Status', width: 96, align: 'left' },
  ];
  const row = (t: Total, index: number, prefix: string, format: string, open?: () => void) => ({
    key: t.start,
    testID: `${prefix}-${index}`,
    cells: {
      ...totalCells(t, set),
      when: open ? (
        <Button label={formatSiteTime(t.start, timeZone, format)} size="compact" variant="quiet" onPress={open} />
      ) : (
        formatSiteTime(t.start, timeZone, format)
      ),
    },
  });
  return (
    <Panel
      title={day ? `${tag}: hours of ${dayLabel(day, timeZone)}` : `${tag}: contract days`}
      testID="month-drill-down"
      actions={
        <Button
          label={day ? 'Back to days' : 'Close'}
          size="compact"
          onPress={() => (day ? setDay(null) : onClose())}
          testID="month-drill-down-back"
        />
      }
    >
      {day ? (
        <>
          <QueryState
            isPending={hours.isPending}
            error={hours.error}
            onRetry={() => void hours.refetch()}
            noun="hours"
          />
          {hours.data ? (
            <DataTable
              columns={columns('Hour')}
              rows={hours.data.map((t, i) => row(t, i, 'drill-hour', 'HH:mm'))}
              label="Hourly records of the day"
              emptyText="No hourly records in this day."
            />
          ) : null}
        </>
      ) : (
        <>
          <QueryState isPending={days.isPending} error={days.error} onRetry={() => void days.refetch()} noun="days" />
          {days.data ? (
            <DataTable
              columns={columns('Contract day')}
              rows={days.data.map((t, i) => row(t, i, 'drill-day', 'yyyy-MM-dd', () => setDay(t)))}
              label="Contract days of the month"
              emptyText="No contract days with a total in this month."
            />
          ) : null}
        </>
      )}
      <Link href={`/meter-runs/${meterRunId}`}>
        <AppText variant="label">Open the meter run screen (trends, daily and hourly panels)</AppText>
      </Link>
    </Panel>
  );
}
