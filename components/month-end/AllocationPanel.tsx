/**
 * Allocation beside the monthly volumes (issue 10 §4): for each balance group of the site whose
 * outlet is a sales meter, each well's factor (its own share of the inlets) and its allocated
 * volume and energy. Nothing is shown when the site has no such group.
 */
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { formatNumber, unitsFor, type DisplayUnits } from '@/constants/units-display';
import { useMonthAllocations } from '@/hooks/api/monthlyVolumes';
import { fromSI } from '@/shared/units';

export function AllocationPanel({
  siteId,
  month,
  displayUnits,
}: {
  siteId: string;
  month: string;
  displayUnits: DisplayUnits;
}) {
  const allocations = useMonthAllocations(siteId, month);
  const set = unitsFor(displayUnits);
  if (allocations.data && !allocations.data.length) return null;
  const columns: DataColumn[] = [
    { key: 'well', title: 'Well (inlet)', width: 120 },
    { key: 'own', title: `Own volume, ${set.standardVolume.label}`, width: 120 },
    { key: 'factor', title: 'Allocation factor', width: 96 },
    { key: 'volume', title: `Allocated volume, ${set.standardVolume.label}`, width: 128 },
    { key: 'energy', title: `Allocated energy, ${set.energy.label}`, width: 120 },
  ];
  return (
    <Panel title="Allocation" testID="monthly-allocation">
      <QueryState
        isPending={allocations.isPending}
        error={allocations.error}
        onRetry={() => void allocations.refetch()}
        noun="allocation"
      />
      {allocations.data?.map((a) => (
        <DataTable
          key={a.balanceGroupId}
          label={`Allocation of ${a.sales.tag}`}
          columns={columns}
          rows={a.wells.map((w) => ({
            key: w.meterRunId,
            cells: {
              well: w.tag,
              own: formatNumber(fromSI(w.standardVolumeM3, set.standardVolume.unit), 6),
              factor: formatNumber(w.factor, 5),
              volume:
                w.allocatedStandardVolumeM3 === null
                  ? '—'
                  : formatNumber(fromSI(w.allocatedStandardVolumeM3, set.standardVolume.unit), 6),
              energy: w.allocatedEnergyJ === null ? '—' : formatNumber(fromSI(w.allocatedEnergyJ, set.energy.unit), 6),
            },
          }))}
        />
      ))}
      {allocations.data?.map((a) => (
        <AppText key={`${a.balanceGroupId}-note`} variant="caption" tone="muted">
          {`${a.groupName}: the sales meter ${a.sales.tag} measured ${formatNumber(fromSI(a.sales.standardVolumeM3, set.standardVolume.unit), 6)} ${set.standardVolume.label}, shared out to the wells in proportion to their own volumes.`}
        </AppText>
      ))}
    </Panel>
  );
}
