/**
 * The reconciliation panel's content, worked out without React so it can be tested: the days table
 * (numbers grouped in thousands, units in the column headers, one table per quantity and unit),
 * the month's sums, and the daily chart of the percent difference with the tolerance either side.
 */
import { DateTime } from 'luxon';

import type { ChartProps } from '@/components/charts/chartTypes';
import { formatSiteTime } from '@/components/meter-runs/siteTime';
import type { DataColumn, DataRow } from '@/components/ui/DataTable';
import { formatNumber, unitLabel } from '@/constants/units-display';

/** One row of GET /api/reconciliations. */
export interface ReconciliationDay {
  start: string;
  end: string;
  quantity: string;
  unit: string;
  tallyrunValue: number | null;
  fieldValue: number;
  difference: number | null;
  differencePercent: number | null;
  tolerancePercent: number;
  withinTolerance: boolean | null;
}

/** One row of GET /api/reconciliations/summary. */
export interface ReconciliationSum extends Omit<ReconciliationDay, 'start' | 'end'> {
  from: string;
  to: string;
  days: number;
  daysOutsideTolerance: number;
  daysWithoutTallyrunFigure: number;
}

const quantityWords: Record<string, string> = {
  'standard-volume': 'Volume at base conditions',
  mass: 'Mass',
  energy: 'Energy',
};

/** "Volume at base conditions" for 'standard-volume'; an unknown quantity is shown as sent. */
export const quantityName = (quantity: string) => quantityWords[quantity] ?? quantity;

/** A signed percent with two decimals: "+0.50 %", "−0.20 %", "—". */
export function formatPercent(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const text = Math.abs(value).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  if (text === '0.00') return '0.00 %';
  return `${value < 0 ? '−' : '+'}${text} %`;
}

/**
 * Decimals for a whole table: six significant figures of its largest field total (finer than any
 * field device's or Tallyrun's uncertainty), the same for every row so the figures line up.
 */
export function tableDecimals(values: readonly number[]): number {
  const largest = Math.max(0, ...values.map((v) => Math.abs(v)).filter(Number.isFinite));
  if (largest === 0) return 0;
  return Math.max(0, Math.min(3, 5 - Math.floor(Math.log10(largest))));
}

/** A figure with grouped thousands and fixed decimals; a difference carries its sign (a true minus). */
function formatFigure(value: number | null, decimals: number, signed = false): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const text = Math.abs(value).toLocaleString('en-US', {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  });
  if (Number(text.replace(/,/g, '')) === 0) return text;
  if (value < 0) return `−${text}`;
  return signed ? `+${text}` : text;
}

const verdict = (within: boolean | null) => (within === null ? 'No Tallyrun figure' : within ? 'Within' : 'Outside');

/** The columns of one quantity's table, the unit in each header of a figure. */
export function reconciliationColumns(unit: string): DataColumn[] {
  const u = unitLabel(unit);
  return [
    { key: 'day', title: 'Contract day', width: 120 },
    { key: 'tallyrun', title: `Tallyrun, ${u}`, width: 120 },
    { key: 'field', title: `Field, ${u}`, width: 120 },
    { key: 'difference', title: `Difference, ${u}`, width: 120 },
    { key: 'percent', title: 'Difference, % of field', width: 112 },
    { key: 'tolerance', title: 'Tolerance, %', width: 92 },
    { key: 'verdict', title: 'Verdict', width: 132, align: 'left' },
  ];
}

export interface ReconciliationGroup {
  key: string;
  quantity: string;
  unit: string;
  title: string;
  columns: DataColumn[];
  rows: DataRow[];
  /** The sum row of the window (the month's sum), when the summary is given. */
  sumRow: DataRow | null;
  outsideDays: number;
}

/**
 * Splits the days into one table per quantity and unit, oldest day first, with the sum row.
 * @param timeZone the site's zone: a contract day is named by its start on the site's clock
 */
export function reconciliationGroups(
  days: readonly ReconciliationDay[],
  sums: readonly ReconciliationSum[],
  timeZone: string,
): ReconciliationGroup[] {
  const groups = new Map<string, ReconciliationDay[]>();
  for (const d of days) groups.set(`${d.quantity}|${d.unit}`, [...(groups.get(`${d.quantity}|${d.unit}`) ?? []), d]);
  return [...groups.entries()].map(([key, list]) => {
    const { quantity, unit } = list[0];
    const sum = sums.find((s) => s.quantity === quantity && s.unit === unit) ?? null;
    const decimals = tableDecimals(list.map((d) => d.fieldValue));
    return {
      key,
      quantity,
      unit,
      title: `${quantityName(quantity)}, ${unitLabel(unit)}`,
      columns: reconciliationColumns(unit),
      rows: list.map((d, index) => ({
        key: `${key}|${d.start}`,
        testID: `reconciliation-row-${quantity}-${index}`,
        cells: {
          day: formatSiteTime(d.start, timeZone, 'yyyy-MM-dd'),
          tallyrun: formatFigure(d.tallyrunValue, decimals),
          field: formatFigure(d.fieldValue, decimals),
          difference: formatFigure(d.difference, decimals, true),
          percent: formatPercent(d.differencePercent),
          tolerance: formatNumber(d.tolerancePercent, 3),
          verdict: verdict(d.withinTolerance),
        },
      })),
      sumRow: sum
        ? {
            key: `${key}|sum`,
            testID: `reconciliation-sum-${quantity}`,
            cells: {
              day: `Sum, ${sum.days} d`,
              tallyrun: formatFigure(sum.tallyrunValue, decimals),
              field: formatFigure(sum.fieldValue, decimals),
              difference: formatFigure(sum.difference, decimals, true),
              percent: formatPercent(sum.differencePercent),
              tolerance: formatNumber(sum.tolerancePercent, 3),
              verdict: `${verdict(sum.withinTolerance)} (${sum.daysOutsideTolerance} d outside)`,
            },
          }
        : null,
      outsideDays: list.filter((d) => d.withinTolerance === false).length,
    };
  });
}

/**
 * The daily chart of percent difference: one stepped line per quantity and unit (percent has no
 * unit, so they share an axis), the tolerance drawn as dashed lines above and below zero.
 */
export function percentChart(
  days: readonly ReconciliationDay[],
  timeZone: string,
  window?: { from: string; to: string },
): ChartProps {
  const starts = [...new Set(days.map((d) => Date.parse(d.start)))].sort((a, b) => a - b);
  // The chosen window as the x range (plain dates on the site's clock): with a single day the
  // plot would otherwise have no width and label its axis from 1970.
  const windowMs = window
    ? [
        DateTime.fromISO(window.from, { zone: timeZone }).toMillis(),
        DateTime.fromISO(window.to, { zone: timeZone }).toMillis(),
      ]
    : null;
  const range: [number, number] | undefined =
    windowMs && windowMs.every(Number.isFinite) && windowMs[1] > windowMs[0]
      ? [windowMs[0] / 1000, windowMs[1] / 1000]
      : starts.length
        ? [starts[0] / 1000, Math.max(starts[starts.length - 1], starts[0] + 86_400_000) / 1000]
        : undefined;
  const keys = [...new Set(days.map((d) => `${d.quantity}|${d.unit}`))];
  const tolerance = days.length ? days[days.length - 1].tolerancePercent : null;
  return {
    title: 'Daily difference from the field totals, percent of the field total',
    x: { values: starts.map((ms) => ms / 1000), kind: 'time', label: 'Contract day', timeZone, range },
    axes: [{ scale: 'pct', label: 'Difference, % of field', side: 'left' }],
    series: keys.map((key, rank) => {
      const [quantity, unit] = key.split('|');
      const byStart = new Map(
        days.filter((d) => `${d.quantity}|${d.unit}` === key).map((d) => [Date.parse(d.start), d.differencePercent]),
      );
      return {
        label: `${quantityName(quantity)} (${unitLabel(unit)})`,
        values: starts.map((ms) => byStart.get(ms) ?? null),
        scale: 'pct',
        rank,
        stepped: true,
      };
    }),
    lines:
      tolerance === null
        ? []
        : [
            { scale: 'pct', value: tolerance, label: `+${formatNumber(tolerance, 3)} % tolerance` },
            { scale: 'pct', value: -tolerance, label: `−${formatNumber(tolerance, 3)} % tolerance` },
          ],
    emptyText: 'No field totals for contract days in this window.',
  };
}

/**
 * A window of last month and this one, as plain dates the server reads on the site's clock
 * (the meter run screen's default: the month the accountant reviews and the one running).
 */
export function recentMonthsWindow(nowMs: number, timeZone: string): { from: string; to: string } {
  const month = DateTime.fromMillis(nowMs, { zone: timeZone }).startOf('month');
  return { from: month.minus({ months: 1 }).toISODate()!, to: month.plus({ months: 1 }).toISODate()! };
}
