/**
 * Care due (issue 11 §4): for one site, each transmitter's calibration and each meter run's
 * element calibration, gas analysis and inspection, with the date it was last done, the date it
 * is due and its state on the site's calendar, overdue first by default. The judging is the
 * server's (GET /api/sites/:id/care-due), with the same due-soon window as the alarms; a row
 * links to where the record is kept (the transmitter, or the meter run's set-up).
 */
import { Link, router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { SetupCaution } from '@/components/setup/SetupCaution';
import { AppText } from '@/components/ui/AppText';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { DataTable, type DataColumn, type DataRow } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { FlagMark } from '@/components/ui/StatusMark';
import { space } from '@/constants/theme';
import { useCareDue, type CareDueItem, type CareDueSort } from '@/hooks/api/careDue';
import { useSites } from '@/hooks/api/sites';
import { formatDate } from '@/shared/format/time';

const kindWords: Record<CareDueItem['kind'], string> = {
  'transmitter-calibration': 'Transmitter calibration',
  'element-calibration': 'Element calibration',
  'gas-analysis': 'Gas analysis',
  'element-inspection': 'Element inspection',
};

const sortChoices = [
  { value: 'due', label: 'Earliest due first' },
  { value: '-due', label: 'Latest due first' },
] as const;

const columns: readonly DataColumn[] = [
  { key: 'state', title: 'State', width: 150, align: 'left' },
  { key: 'subject', title: 'Item', width: 220, align: 'left' },
  { key: 'due', title: 'Due', width: 130, align: 'left' },
  { key: 'kind', title: 'Record', width: 180, align: 'left' },
  { key: 'last', title: 'Last done', width: 130, align: 'left' },
];

/** The state in words; overdue and due soon carry the flag mark (components/ui/marks.ts): ▲ ◆ ■ belong to alarm priorities. */
function StateCell({ item }: { item: CareDueItem }) {
  const days = item.daysLeft ?? 0;
  if (item.state === 'overdue')
    return <FlagMark label={`Overdue ${-days} d`} testID={`care-due-state-${item.state}`} />;
  if (item.state === 'due-soon')
    return (
      <FlagMark quiet label={days === 0 ? 'Due today' : `Due in ${days} d`} testID={`care-due-state-${item.state}`} />
    );
  return (
    <AppText tone="muted" testID={`care-due-state-${item.state}`}>
      {item.state === 'ok' ? `In date (${days} d)` : 'Not recorded'}
    </AppText>
  );
}

function rowOf(item: CareDueItem, index: number): DataRow {
  const href = item.transmitterId
    ? `/transmitters/${encodeURIComponent(item.transmitterId)}`
    : `/setup?meterRun=${encodeURIComponent(item.meterRunId)}`;
  return {
    key: `${item.kind}-${item.transmitterId ?? item.meterRunId}`,
    testID: `care-due-row-${index}`,
    cells: {
      state: <StateCell item={item} />,
      due: <AppText tabular>{item.dueOn ? formatDate(item.dueOn) : '—'}</AppText>,
      subject: (
        <Link href={href} testID={`care-due-link-${index}`}>
          <AppText style={styles.link}>{item.subject}</AppText>
        </Link>
      ),
      kind: kindWords[item.kind],
      last: <AppText tabular>{item.lastDoneOn ? formatDate(item.lastDoneOn) : '—'}</AppText>,
    },
  };
}

export function CareDueScreen({ siteId: initialSiteId }: { siteId?: string }) {
  const sites = useSites();
  // The link's site (?siteId=) until one is chosen here; the query parameters may arrive after the first render.
  const [chosen, setChosen] = useState<string | null>(null);
  const linked = initialSiteId && /^\d+$/.test(initialSiteId) ? initialSiteId : null;
  const [sort, setSort] = useState<CareDueSort>('due');
  const siteId = chosen ?? linked ?? (sites.data?.length ? sites.data[0].id : null);
  const list = useCareDue(siteId, sort);
  const data = list.data && list.data.site.id === siteId ? list.data : undefined;
  const overdue = data?.items.filter((i) => i.state === 'overdue').length ?? 0;
  const dueSoon = data?.items.filter((i) => i.state === 'due-soon').length ?? 0;

  return (
    <Screen
      lead="What is due in the care of a site's meters: transmitter calibrations, element calibrations, gas analyses and element inspections, each with the date it is due on the site's calendar."
      testID="care-due-screen"
    >
      <QueryState isPending={sites.isPending} error={sites.error} onRetry={() => void sites.refetch()} noun="sites" />
      {sites.data ? (
        <Panel title="Site and order" testID="care-due-picker">
          <ChoiceGroup
            label="Site"
            options={sites.data.map((s) => ({ value: s.id, label: s.code }))}
            value={siteId ?? ''}
            onChange={(id) => {
              setChosen(id);
              router.setParams({ siteId: id });
            }}
            testIDPrefix="care-due-site"
          />
          <ChoiceGroup
            label="Order by due date"
            options={sortChoices}
            value={sort}
            onChange={setSort}
            testIDPrefix="care-due-sort"
          />
        </Panel>
      ) : null}
      {siteId ? (
        <QueryState
          isPending={list.isPending}
          error={list.error}
          onRetry={() => void list.refetch()}
          noun="what is due"
        />
      ) : null}
      {data ? (
        <Panel title={data.site.name} testID="care-due-list">
          <View style={styles.summary}>
            <AppText testID="care-due-summary">{`Today at the site: ${formatDate(data.today)}. ${overdue} overdue, ${dueSoon} due within the alarm window.`}</AppText>
          </View>
          <DataTable
            label={`What is due at ${data.site.name}`}
            columns={columns}
            rows={data.items.map(rowOf)}
            emptyText="This site has no meter runs yet."
            testID="care-due-table"
          />
        </Panel>
      ) : null}
      {/* Calibrations and inspections are field work on pressurised lines. */}
      <SetupCaution />
    </Screen>
  );
}

const styles = StyleSheet.create({
  summary: { marginBottom: space.sm },
  link: { textDecorationLine: 'underline' },
});
