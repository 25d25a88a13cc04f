/**
 * Pro-rata allocation of a balance group's sales meter for one contract month: per well its own
 * volume and energy, its allocation factor (own / sum of the wells), and its allocated volume and
 * energy; the total row equals the sales meter's figures.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { DataTable } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { space } from '@/constants/theme';
import type { DisplayUnits } from '@/constants/units-display';
import { isApiError } from '@/hooks/api/client';
import { allocationColumns, allocationRows } from './balanceView';
import { useAllocation } from './useBalanceGroups';

export interface AllocationTableProps {
  /** A balance group whose one outlet is the sales meter. */
  balanceGroupId: string;
  /** Its name, for the title. */
  name: string;
  /** The contract month, YYYY-MM. */
  month: string;
  /** The site's display units (m³ and GJ, or Mscf and MMBtu). */
  displayUnits: DisplayUnits;
  testID?: string;
}

export function AllocationTable({ balanceGroupId, name, month, displayUnits, testID }: AllocationTableProps) {
  const allocation = useAllocation(balanceGroupId, month);
  // A month without the sales meter's total (404) or a group with more than one outlet (400) is said plainly.
  const refused = isApiError(allocation.error, 404) || isApiError(allocation.error, 400);
  return (
    <Panel title={`Allocation, ${name}`} testID={testID ?? `allocation-${balanceGroupId}`}>
      <AppText tone="muted">
        Each well gets the sales meter&apos;s month in proportion to its own: factor = own volume / sum of the wells;
        energy likewise by the wells&apos; own energies.
      </AppText>
      {refused ? (
        <AppText>{allocation.error?.message}</AppText>
      ) : (
        <QueryState
          isPending={allocation.isPending}
          error={allocation.error}
          onRetry={() => void allocation.refetch()}
          noun="the allocation"
        />
      )}
      {allocation.data && !refused ? (
        <View style={styles.body}>
          <DataTable
            label={`Allocation, ${name}, ${month}`}
            columns={allocationColumns(displayUnits)}
            rows={allocationRows(allocation.data, displayUnits)}
          />
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.sm },
});
