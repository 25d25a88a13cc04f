/**
 * The cells every hourly record and every total share (quantities, coverage, uncertainty,
 * status), converted to the site's display units. Units go in the column headers (`coverageTitle`,
 * `uncertaintyTitle`), not in each cell.
 */
import { formatNumber, type DisplayUnitSet } from '@/constants/units-display';
import type { Total } from '@/hooks/api/totals';
import { fromSI } from '@/shared/units';

const statusWords: Record<string, string> = {
  provisional: 'provisional',
  complete: 'complete',
  missing: 'missing',
  closed: 'closed',
};

/** The headers of the coverage and uncertainty columns, with their unit. */
export const coverageTitle = 'Coverage, %';
export const uncertaintyTitle = 'U (k = 2), %';

/**
 * @param total an hourly record or a total
 * @param set the site's display units
 * @returns text for the mass, standard volume, energy, coverage, uncertainty and status columns
 */
export function totalCells(
  total: Total,
  set: DisplayUnitSet,
): Record<'mass' | 'volume' | 'energy' | 'coverage' | 'uncertainty' | 'status', string> {
  return {
    mass: formatNumber(fromSI(total.massKg, set.mass.unit)),
    volume: formatNumber(fromSI(total.standardVolumeM3, set.standardVolume.unit)),
    energy: total.energyJ === null ? '—' : formatNumber(fromSI(total.energyJ, set.energy.unit)),
    coverage: formatNumber(total.coverage * 100, 3),
    uncertainty: total.uncertaintyPercent === null ? '—' : `±${formatNumber(total.uncertaintyPercent, 2)}`,
    status: statusWords[total.status] ?? total.status,
  };
}
