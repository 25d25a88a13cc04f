/**
 * The month's figures in a site's display units: the screen's units (constants/units-display)
 * for mass, volume at base conditions and energy, and m³ or ft³ for the actual volume (the
 * screen set has no actual volume). Conversions go through shared/units.
 */
import { formatNumber, unitsFor, type DisplayUnits } from '@/constants/units-display';
import type { MonthFigures } from '@/hooks/api/monthlyVolumes';
import { fromSI } from '@/shared/units';

const actualVolume = { si: { unit: 'm3', label: 'm³' }, us: { unit: 'ft3', label: 'ft³' } } as const;

/** The column headers of the month, each with its unit. */
export function monthHeaders(displayUnits: DisplayUnits) {
  const set = unitsFor(displayUnits);
  return {
    mass: `Mass, ${set.mass.label}`,
    volume: `Volume, ${actualVolume[displayUnits].label}`,
    standardVolume: `Volume at base, ${set.standardVolume.label}`,
    energy: `Energy, ${set.energy.label}`,
    coverage: 'Coverage, %',
    uncertainty: 'U (k = 2), %',
    previous: 'vs previous month, %',
    yearEarlier: 'vs a year earlier, %',
  };
}

const signed = (v: number | null) => (v === null ? '—' : `${v > 0 ? '+' : ''}${formatNumber(v, 3)}`);

/** Text for each figure of a meter run's or the site's month, in the site's units. */
export function monthCells(f: MonthFigures, displayUnits: DisplayUnits) {
  const set = unitsFor(displayUnits);
  const conv = (v: number | null, unit: string) => (v === null ? '—' : formatNumber(fromSI(v, unit), 6));
  return {
    mass: conv(f.massKg, set.mass.unit),
    volume: conv(f.volumeM3, actualVolume[displayUnits].unit),
    standardVolume: conv(f.standardVolumeM3, set.standardVolume.unit),
    energy: conv(f.energyJ, set.energy.unit),
    coverage: f.coverage === null ? '—' : formatNumber(f.coverage * 100, 4),
    uncertainty: f.uncertaintyPercent === null ? '—' : `±${formatNumber(f.uncertaintyPercent, 2)}`,
    previous: signed(f.changeFromPreviousMonthPercent),
    yearEarlier: signed(f.changeFromYearEarlierPercent),
    flags: f.flags.length ? f.flags.join(', ') : 'none',
    status: f.status,
    corrections: String(f.correctionsInForce),
  };
}

/** YYYY-MM of the month `offset` months from `month`. */
export function shiftMonth(month: string, offset: number): string {
  const [y, m] = month.split('-').map(Number);
  const index = y * 12 + (m - 1) + offset;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
}

/** The month before the one `nowMs` falls in (UTC): the month an accountant reviews. */
export function lastMonth(nowMs: number): string {
  const d = new Date(nowMs);
  return shiftMonth(`${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, '0')}`, -1);
}
