/**
 * The station balance of a site's balance groups for a window: per group a table of contract days
 * (or months) with inlet, outlet, allowance, imbalance in volume and in percent of the inlet, its
 * expanded uncertainty, the verdict on the tolerance, and whether the imbalance is larger than its
 * own uncertainty (an imbalance inside its uncertainty may be measurement, not loss).
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { DataTable } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { space } from '@/constants/theme';
import type { DisplayUnits } from '@/constants/units-display';
import { balanceColumns, balanceRows, balanceSummary, formatFigure } from './balanceView';
import { useBalance, useBalanceGroups, type BalanceGroup } from './useBalanceGroups';

export interface BalancePanelProps {
  siteId: string;
  /** The site's IANA zone: periods are named on its clock, plain dates read in it. */
  timeZone: string;
  /** The site's display units (volumes at base conditions in m³ or Mscf). */
  displayUnits: DisplayUnits;
  /** 'day' for contract days, 'month' for contract months. */
  interval: 'day' | 'month';
  /** The window: plain dates YYYY-MM-DD on the site's clock (or instants); `to` is exclusive. */
  from: string;
  to: string;
  /** Default "Station balance". */
  title?: string;
  testID?: string;
}

export function BalancePanel({ siteId, timeZone, displayUnits, interval, from, to, title, testID }: BalancePanelProps) {
  const groups = useBalanceGroups(siteId);
  return (
    <Panel title={title ?? 'Station balance'} testID={testID ?? 'balance-panel'}>
      <AppText tone="muted">
        Imbalance = inlet − outlet − allowance, in percent of the inlet. U is the expanded uncertainty (k = 2) of the
        imbalance from its members&apos; uncertainties, combined as uncorrelated (GUM, JCGM 100:2008 §5.1).
      </AppText>
      <QueryState
        isPending={groups.isPending}
        error={groups.error}
        onRetry={() => void groups.refetch()}
        noun="the balance groups"
      />
      {groups.data && groups.data.length === 0 ? <AppText>This site has no balance group.</AppText> : null}
      {groups.data?.map((group) => (
        <GroupBalance
          key={group.id}
          group={group}
          timeZone={timeZone}
          displayUnits={displayUnits}
          interval={interval}
          from={from}
          to={to}
        />
      ))}
    </Panel>
  );
}

function GroupBalance({
  group,
  timeZone,
  displayUnits,
  interval,
  from,
  to,
}: { group: BalanceGroup } & Omit<BalancePanelProps, 'siteId' | 'title' | 'testID'>) {
  const balance = useBalance({ groupId: group.id, interval, from, to });
  const allowance =
    group.allowancePercent !== null
      ? `${formatFigure(group.allowancePercent, 2)} % of the inlet`
      : `${formatFigure(group.allowanceDailyM3, 0)} m³ a day`;
  const tags = (side: 'inlet' | 'outlet') =>
    group.members
      .filter((m) => m.side === side)
      .map((m) => m.tag)
      .join(', ');
  const outside = balance.data?.some((p) => !p.withinTolerance) ?? false;
  return (
    <View style={styles.group} testID={`balance-group-${group.id}`}>
      <AppText variant="label">{group.name}</AppText>
      <AppText tone="muted">
        {`In: ${tags('inlet')}. Out: ${tags('outlet')}. Allowance ${allowance}; tolerance ±${formatFigure(group.tolerancePercent, 2)} %.`}
      </AppText>
      <QueryState
        isPending={balance.isPending}
        error={balance.error}
        onRetry={() => void balance.refetch()}
        noun="the balance"
      />
      {balance.data ? (
        <>
          <AppText tone={outside ? 'error' : 'default'} testID={`balance-summary-${group.id}`}>
            {balanceSummary(balance.data, group.tolerancePercent)}
          </AppText>
          <DataTable
            label={`Station balance, ${group.name}`}
            columns={balanceColumns(displayUnits)}
            rows={balanceRows(balance.data, { displayUnits, timeZone, interval }).map((row) => ({
              ...row,
              cells: {
                ...row.cells,
                verdict: row.cells.verdict === 'Outside' ? <AppText tone="error">Outside</AppText> : row.cells.verdict,
              },
            }))}
          />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
});
