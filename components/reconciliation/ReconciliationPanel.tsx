/**
 * Reconciliation against field totals for one meter run and a window (a month on the month
 * screen; last month and this one on the meter run screen): per quantity a table of the contract
 * days with a field total and the window's sum, and a daily chart of the percent difference with
 * the tolerance either side. Difference = Tallyrun − field, in percent of the field total.
 */
import { View, StyleSheet } from 'react-native';

import { Chart } from '@/components/charts/Chart';
import { AppText } from '@/components/ui/AppText';
import { DataTable } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { space } from '@/constants/theme';
import { formatDate } from '@/shared/format/time';
import { percentChart, reconciliationGroups } from './reconciliationView';
import { useReconciliationSummary, useReconciliations } from './useReconciliations';

export interface ReconciliationPanelProps {
  meterRunId: string;
  /** The site's IANA zone: contract days are named on its clock, plain dates read in it. */
  timeZone: string;
  /** The window: instants (ISO 8601 with an offset) or plain dates YYYY-MM-DD on the site's clock; `to` is exclusive. */
  from: string;
  to: string;
  /** Default "Reconciliation against field totals". */
  title?: string;
  testID?: string;
}

export function ReconciliationPanel({ meterRunId, timeZone, from, to, title, testID }: ReconciliationPanelProps) {
  const request = { meterRunId, from, to };
  const days = useReconciliations(request);
  const sums = useReconciliationSummary(request);
  const groups = days.data ? reconciliationGroups(days.data, sums.data ?? [], timeZone) : [];
  const outside = groups.reduce((a, g) => a + g.outsideDays, 0);

  return (
    <Panel title={title ?? 'Reconciliation against field totals'} testID={testID ?? 'reconciliation-panel'}>
      <AppText tone="muted">
        {`Contract days from ${formatDate(from, timeZone)} to before ${formatDate(to, timeZone)} with a field total. Difference = Tallyrun − field, in percent of the field total; figures in the field total's unit.`}
      </AppText>
      <QueryState
        isPending={days.isPending}
        error={days.error}
        onRetry={() => void days.refetch()}
        noun="the reconciliation"
      />
      {days.data ? (
        <View style={styles.body}>
          {days.data.length === 0 ? (
            <AppText>No field totals for contract days in this window.</AppText>
          ) : (
            <AppText tone={outside ? 'error' : 'default'} testID="reconciliation-outside-count">
              {outside
                ? `${outside} ${outside === 1 ? 'day is' : 'days are'} outside the tolerance.`
                : 'Every day is within the tolerance.'}
            </AppText>
          )}
          {groups.map((group) => (
            <View key={group.key} style={styles.group}>
              <AppText variant="label">{group.title}</AppText>
              <DataTable
                label={`Reconciliation, ${group.title}`}
                columns={group.columns}
                rows={[
                  ...group.rows.map((row) => ({
                    ...row,
                    cells: {
                      ...row.cells,
                      verdict:
                        row.cells.verdict === 'Outside' ? <AppText tone="error">Outside</AppText> : row.cells.verdict,
                    },
                  })),
                  ...(group.sumRow ? [group.sumRow] : []),
                ]}
              />
            </View>
          ))}
          {days.data.length ? (
            <Chart {...percentChart(days.data, timeZone, { from, to })} testID="reconciliation-chart" />
          ) : null}
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.md },
  group: { gap: space.xs },
});
