/** The month as one table (tablet and wide): a row per meter run, then the site's total; units in the headers. */
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DataTable, type DataColumn, type DataRow } from '@/components/ui/DataTable';
import type { MonthlyVolumes } from '@/hooks/api/monthlyVolumes';
import { directionHeaders, directionMonthCells, forwardHeader } from './directionFigures';
import { monthCells, monthHeaders } from './monthFormat';

export function MonthlyVolumesTable({
  volumes,
  onOpenDays,
}: {
  volumes: MonthlyVolumes;
  onOpenDays: (meterRunId: string) => void;
}) {
  const units = volumes.site.displayUnits;
  const h = monthHeaders(units);
  // Forward, reverse and net as separate columns once a meter run of the month flowed in reverse.
  const bidirectional = volumes.meterRuns.some((r) => r.reverse);
  const d = directionHeaders(units);
  const columns: DataColumn[] = [
    { key: 'run', title: 'Meter run', width: 104 },
    {
      key: 'standardVolume',
      title: bidirectional ? forwardHeader(h.standardVolume) : h.standardVolume,
      width: 108,
    },
    { key: 'mass', title: bidirectional ? forwardHeader(h.mass) : h.mass, width: 92 },
    ...(bidirectional
      ? [
          { key: 'reverseStandardVolume', title: d.reverseStandardVolume, width: 108 },
          { key: 'reverseMass', title: d.reverseMass, width: 92 },
          { key: 'netStandardVolume', title: d.netStandardVolume, width: 124 },
          { key: 'netMass', title: d.netMass, width: 104 },
        ]
      : []),
    { key: 'volume', title: h.volume, width: 92 },
    { key: 'energy', title: h.energy, width: 92 },
    { key: 'coverage', title: h.coverage, width: 84 },
    { key: 'uncertainty', title: h.uncertainty, width: 76 },
    { key: 'previous', title: h.previous, width: 84 },
    { key: 'yearEarlier', title: h.yearEarlier, width: 84 },
    { key: 'corrections', title: 'Corrections in force', width: 92 },
    { key: 'flags', title: 'Flags', width: 104, align: 'left' },
    { key: 'status', title: 'Status', width: 84, align: 'left' },
    { key: 'days', title: 'Drill down', width: 84, align: 'left' },
  ];
  const rows: DataRow[] = volumes.meterRuns.map((r, index) => ({
    key: r.meterRunId,
    testID: `monthly-row-${index}`,
    cells: {
      run: r.tag,
      ...monthCells(r, units),
      ...(bidirectional ? directionMonthCells(r, units) : {}),
      days: (
        <Button
          label="Days"
          size="compact"
          accessibilityLabel={`Contract days of ${r.tag}`}
          onPress={() => onOpenDays(r.meterRunId)}
          testID={`monthly-row-${index}-days`}
        />
      ),
    },
  }));
  rows.push({
    key: 'total',
    testID: 'monthly-row-total',
    cells: {
      run: <AppText variant="bodyStrong">Site total</AppText>,
      ...monthCells(volumes.totals, units),
      // The server's site reverse (sum of the runs' reverse) and net (site forward − site reverse), never summed here.
      ...(bidirectional ? directionMonthCells(volumes.totals, units) : {}),
      days: null,
    },
  });
  return <DataTable columns={columns} rows={rows} label="Monthly volumes by meter run" testID="monthly-table" />;
}
