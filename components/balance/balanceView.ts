/**
 * The balance panel's and the allocation table's content, worked out without React so it can be
 * tested: columns with the unit in each header of a figure, numbers grouped in thousands with the
 * same decimals down a column, one row per contract day or month, and the allocation's total row
 * (which equals the sales meter's).
 */
import type { DataColumn, DataRow } from '@/components/ui/DataTable';
import { unitsFor, type DisplayUnits } from '@/constants/units-display';
import { formatDate } from '@/shared/format/time';
import { fromSI } from '@/shared/units';
import type { Allocation, BalancePeriod } from './useBalanceGroups';

/** Grouped thousands and fixed decimals; a negative number with a true minus, a signed one with +. */
export function formatFigure(value: number | null, decimals: number, signed = false): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const text = Math.abs(value).toLocaleString('en-US', {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  });
  if (Number(text.replace(/,/g, '')) === 0) return text;
  if (value < 0) return `−${text}`;
  return signed ? `+${text}` : text;
}

/**
 * Decimals for a column: six significant figures of its largest value, at most three decimals,
 * the same for every row so the figures line up.
 */
export function columnDecimals(values: readonly (number | null)[]): number {
  const largest = Math.max(0, ...values.map((v) => Math.abs(v ?? 0)).filter(Number.isFinite));
  if (largest === 0) return 0;
  return Math.max(0, Math.min(3, 5 - Math.floor(Math.log10(largest))));
}

/** The columns of the balance table, each figure's unit in its header. */
export function balanceColumns(displayUnits: DisplayUnits): DataColumn[] {
  const v = unitsFor(displayUnits).standardVolume.label;
  return [
    { key: 'period', title: 'Period', width: 110 },
    { key: 'inlet', title: `Inlet, ${v}`, width: 130 },
    { key: 'outlet', title: `Outlet, ${v}`, width: 130 },
    { key: 'allowance', title: `Allowance, ${v}`, width: 120 },
    { key: 'imbalance', title: `Imbalance, ${v}`, width: 130 },
    { key: 'percent', title: 'Imbalance, % of inlet', width: 110 },
    { key: 'uncertainty', title: `U (k = 2), ${v}`, width: 120 },
    { key: 'verdict', title: 'Tolerance', width: 100, align: 'left' },
    { key: 'beyondUncertainty', title: 'Beyond its U?', width: 110, align: 'left' },
  ];
}

/** "Within" or "Outside" the group's tolerance. */
export const toleranceVerdict = (p: Pick<BalancePeriod, 'withinTolerance'>) =>
  p.withinTolerance ? 'Within' : 'Outside';

/** Whether |imbalance| is larger than its own expanded uncertainty, in words. */
export function uncertaintyVerdict(p: Pick<BalancePeriod, 'exceedsUncertainty'>): string {
  if (p.exceedsUncertainty === null) return 'Unknown';
  return p.exceedsUncertainty ? 'Yes' : 'No';
}

/**
 * @param start the period's start
 * @param timeZone the site's zone
 * @param interval a contract day ("10 Sep 2026") or a month ("Sep 2026"): the shared date's words
 */
function periodName(start: string, timeZone: string, interval: 'day' | 'month'): string {
  const date = formatDate(start, timeZone);
  return interval === 'day' ? date : date.replace(/^\d+ /, '');
}

/**
 * @param periods the balance as the API sends it (SI)
 * @param options the site's units and zone; the interval names each row (a contract day or month)
 */
export function balanceRows(
  periods: readonly BalancePeriod[],
  options: { displayUnits: DisplayUnits; timeZone: string; interval: 'day' | 'month' },
): DataRow[] {
  const unit = unitsFor(options.displayUnits).standardVolume.unit;
  const conv = (m3: number | null) => (m3 === null ? null : fromSI(m3, unit));
  const decimals = columnDecimals(periods.map((p) => conv(p.inletStandardVolumeM3)));
  return periods.map((p) => ({
    key: p.start,
    testID: `balance-row-${p.start.slice(0, 10)}`,
    cells: {
      period: periodName(p.start, options.timeZone, options.interval),
      inlet: formatFigure(conv(p.inletStandardVolumeM3), decimals),
      outlet: formatFigure(conv(p.outletStandardVolumeM3), decimals),
      allowance: formatFigure(conv(p.allowanceM3), decimals),
      imbalance: formatFigure(conv(p.imbalanceM3), decimals, true),
      percent: formatFigure(p.imbalancePercent, 2, true),
      uncertainty: p.uncertaintyM3 === null ? '—' : `±${formatFigure(conv(p.uncertaintyM3), decimals)}`,
      verdict: toleranceVerdict(p),
      beyondUncertainty: uncertaintyVerdict(p),
    },
  }));
}

/** One sentence for the screen: how many periods are outside, and whether those exceed their own uncertainty. */
export function balanceSummary(periods: readonly BalancePeriod[], tolerancePercent: number): string {
  if (!periods.length) return 'No totals for this window yet.';
  const outside = periods.filter((p) => !p.withinTolerance);
  if (!outside.length) {
    // Said even when all is within tolerance: on a phone the per-row column sits off to the side.
    const beyondU = periods.filter((p) => p.exceedsUncertainty === true).length;
    const uncertainty =
      beyondU === 0
        ? ' No imbalance is larger than its own uncertainty.'
        : ` ${beyondU} ${beyondU === 1 ? 'imbalance is' : 'imbalances are'} larger than ${beyondU === 1 ? 'its' : 'their'} own uncertainty.`;
    return `Every period is within the tolerance of ±${formatFigure(tolerancePercent, 2)} % of the inlet.${uncertainty}`;
  }
  const beyond = outside.filter((p) => p.exceedsUncertainty === true).length;
  const n = outside.length;
  return (
    `${n} ${n === 1 ? 'period is' : 'periods are'} outside the tolerance of ±${formatFigure(tolerancePercent, 2)} % of the inlet; ` +
    `${beyond} of them ${beyond === 1 ? 'is' : 'are'} larger than ${beyond === 1 ? 'its' : 'their'} own uncertainty.`
  );
}

/** The columns of the allocation table. */
export function allocationColumns(displayUnits: DisplayUnits): DataColumn[] {
  const set = unitsFor(displayUnits);
  return [
    { key: 'well', title: 'Meter run', width: 120 },
    { key: 'own', title: `Own volume, ${set.standardVolume.label}`, width: 140 },
    { key: 'ownEnergy', title: `Own energy, ${set.energy.label}`, width: 130 },
    { key: 'factor', title: 'Factor', width: 90 },
    { key: 'allocated', title: `Allocated volume, ${set.standardVolume.label}`, width: 160 },
    { key: 'allocatedEnergy', title: `Allocated energy, ${set.energy.label}`, width: 160 },
  ];
}

/**
 * One row per well and a total row; the total's allocated figures equal the sales meter's.
 * Factors show six decimals (a factor of a large field is read to the m³).
 */
export function allocationRows(allocation: Allocation, displayUnits: DisplayUnits): DataRow[] {
  const set = unitsFor(displayUnits);
  const volume = (m3: number | null) => (m3 === null ? null : fromSI(m3, set.standardVolume.unit));
  const energy = (j: number | null) => (j === null ? null : fromSI(j, set.energy.unit));
  const { wells, sales } = allocation;
  const vDec = columnDecimals([volume(sales.standardVolumeM3), ...wells.map((w) => volume(w.standardVolumeM3))]);
  const eDec = columnDecimals([energy(sales.energyJ), ...wells.map((w) => energy(w.energyJ))]);
  const sum = (pick: (w: Allocation['wells'][number]) => number | null) =>
    wells.some((w) => pick(w) === null) ? null : wells.reduce((a, w) => a + (pick(w) as number), 0);
  const rows: DataRow[] = wells.map((w) => ({
    key: w.meterRunId,
    testID: `allocation-row-${w.meterRunId}`,
    cells: {
      well: w.tag,
      own: formatFigure(volume(w.standardVolumeM3), vDec),
      ownEnergy: formatFigure(energy(w.energyJ), eDec),
      factor: formatFigure(w.factor, 6),
      allocated: formatFigure(volume(w.allocatedStandardVolumeM3), vDec),
      allocatedEnergy: formatFigure(energy(w.allocatedEnergyJ), eDec),
    },
  }));
  rows.push({
    key: 'total',
    testID: 'allocation-row-total',
    cells: {
      well: `Total (sales ${sales.tag})`,
      own: formatFigure(volume(sum((w) => w.standardVolumeM3)), vDec),
      ownEnergy: formatFigure(energy(sum((w) => w.energyJ)), eDec),
      factor: formatFigure(
        sum((w) => w.factor),
        6,
      ),
      allocated: formatFigure(volume(sum((w) => w.allocatedStandardVolumeM3)), vDec),
      allocatedEnergy: formatFigure(energy(sum((w) => w.allocatedEnergyJ)), eDec),
    },
  });
  return rows;
}
