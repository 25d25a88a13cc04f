/**
 * The last 31 contract days of a meter run, newest first: quantities, coverage, flags, uncertainty,
 * status, and a marker on a day recomputed since it was first totalled, opening its versions.
 */
import { useState } from 'react';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { formatNumber, unitsFor } from '@/constants/units-display';
import { useMeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { useTotals } from '@/hooks/api/totals';
import { contractDayBounds, contractDayOf } from '@/shared/history/contract-day';
import { latestContractDays } from './contractDayLabels';
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

const days = 31;
const dayMs = 86_400_000;

/** The window from the start of the contract day `days − 1` days ago to the end of today's. */
function lastDaysWindow(site: Site): { from: string; to: string } {
  const now = Date.now();
  const today = contractDayBounds(
    contractDayOf(now, site.timeZone, site.contractHour),
    site.timeZone,
    site.contractHour,
  );
  const first = contractDayBounds(
    contractDayOf(today.startMs - (days - 1) * dayMs + dayMs / 2, site.timeZone, site.contractHour),
    site.timeZone,
    site.contractHour,
  );
  return { from: new Date(first.startMs).toISOString(), to: new Date(today.endMs).toISOString() };
}

export function DailyTotalsPanel({ meterRunId, site }: { meterRunId: string; site: Site }) {
  const [period] = useState(() => lastDaysWindow(site));
  // Today's and yesterday's contract days said with their start and end (issue 14): "yesterday" is unambiguous.
  const [latest] = useState(() => latestContractDays(site, Date.now()));
  const totals = useTotals(meterRunId, 'day', period.from, period.to);
  const [opened, setOpened] = useState<string | null>(null);
  const set = unitsFor(site.displayUnits);
  // A bi-directional meter run (now, or on any day shown) gets forward, reverse and net as separate columns.
  const run = useMeterRun(meterRunId);
  const bidirectional = run.data?.reverseElement !== undefined || (totals.data ?? []).some((t) => t.reverse);
  const forward = (title: string) => (bidirectional ? forwardTitle(title) : title);

  const columns: DataColumn[] = [
    { key: 'day', title: 'Contract day', width: 120 },
    { key: 'hours', title: 'Hours', width: 56 },
    { key: 'flowTime', title: forward('Flow time, h'), width: 80 },
    { key: 'mass', title: forward(`Mass, ${set.mass.label}`), width: 104 },
    { key: 'volume', title: forward(`Volume at base, ${set.standardVolume.label}`), width: 112 },
    { key: 'energy', title: forward(`Energy, ${set.energy.label}`), width: 100 },
    ...(bidirectional ? directionColumns(set, 'h') : []),
    { key: 'coverage', title: coverageTitle, width: 80 },
    { key: 'flags', title: 'Flags', width: 150, align: 'left' },
    { key: 'uncertainty', title: uncertaintyTitle, width: 88 },
    { key: 'status', title: 'Status', width: 100, align: 'left' },
    versionColumn,
  ];

  const rows = [...(totals.data ?? [])].reverse().map((total, index) => ({
    key: total.start,
    testID: `daily-row-${index}`,
    cells: {
      day: formatSiteTime(total.start, site.timeZone, 'yyyy-MM-dd'),
      hours: String(total.hours),
      flowTime: formatNumber(total.flowTimeS / 3600, 3),
      ...totalCells(total, set),
      ...(bidirectional ? directionCells(total, set, 'h') : {}),
      flags: <FlagList flags={total.flags} />,
      versions: (
        <VersionMarker
          version={total.version}
          onOpen={() => setOpened(total.start)}
          testID={`daily-versions-${index}`}
        />
      ),
    },
  }));

  return (
    <Panel
      title={`Daily totals (last ${days} contract days)`}
      testID="daily-totals"
      actions={
        <Button
          label="Refresh"
          size="compact"
          busy={totals.isFetching && !totals.isPending}
          onPress={() => void totals.refetch()}
        />
      }
    >
      <QueryState
        isPending={totals.isPending}
        error={totals.error}
        onRetry={() => void totals.refetch()}
        noun="daily totals"
      />
      <AppText variant="caption" testID="daily-contract-days">
        {`Today: ${latest.today.label}. Yesterday: ${latest.yesterday.label}.`}
      </AppText>
      {totals.data ? (
        <DataTable
          columns={columns}
          rows={rows}
          label="Daily totals by contract day"
          emptyText="No contract days in this window."
          testID="daily-table"
        />
      ) : null}
      {opened ? (
        <RecordVersionsView
          meterRunId={meterRunId}
          site={site}
          record={{ kind: 'day', start: opened }}
          onClose={() => setOpened(null)}
        />
      ) : null}
      <AppText variant="caption" tone="muted">
        {`Each contract day starts at ${String(site.contractHour).padStart(2, '0')}:00 site time (23 or 25 hours on clock-change days). Volume at base conditions. A day with nothing recorded shows zero with coverage 0. U: expanded uncertainty (k = 2). A version marker (v2, v3…) shows a day recomputed since it was first totalled: open it to compare the first and current figures.${bidirectional ? ' Bi-directional meter run: forward and reverse flow are totalled apart; net is forward − reverse, shown as its own figure.' : ''}`}
      </AppText>
    </Panel>
  );
}
