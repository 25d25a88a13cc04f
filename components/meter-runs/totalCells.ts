/**
 * The cells every hourly record and every total share (quantities, coverage, uncertainty,
 * status), converted to the site's display units. Units go in the column headers (`coverageTitle`,
 * `uncertaintyTitle`), not in each cell.
 */
import type { DataColumn } from '@/components/ui/DataTable';
import { formatNumber, type DisplayUnitSet } from '@/constants/units-display';
import type { NetFlow, ReverseTotal, Total } from '@/hooks/api/totals';
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
  total: Omit<Total, 'reverse' | 'net'>,
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

/** A period's reverse flow and net as the API gives them: absent (or null) where nothing was kept in reverse. */
export interface DirectionFigures {
  reverse?: ReverseTotal | null;
  net?: NetFlow | null;
}

export type DirectionCellKey =
  'reverseFlowTime' | 'reverseMass' | 'reverseVolume' | 'reverseEnergy' | 'netMass' | 'netVolume' | 'netEnergy';

/**
 * The columns of a bi-directional meter run's reverse flow and net, after the forward ones. Net is
 * forward − reverse, its own column: never shown in place of forward.
 * @param set the site's display units
 * @param flowTimeUnit 'h' (days) or 'min' (hours)
 */
export function directionColumns(set: DisplayUnitSet, flowTimeUnit: 'h' | 'min'): DataColumn[] {
  return [
    { key: 'reverseFlowTime', title: `Reverse flow time, ${flowTimeUnit}`, width: 80 },
    { key: 'reverseMass', title: `Reverse mass, ${set.mass.label}`, width: 104 },
    { key: 'reverseVolume', title: `Reverse volume at base, ${set.standardVolume.label}`, width: 112 },
    { key: 'reverseEnergy', title: `Reverse energy, ${set.energy.label}`, width: 100 },
    { key: 'netMass', title: `Net mass (forward − reverse), ${set.mass.label}`, width: 120 },
    { key: 'netVolume', title: `Net volume at base (forward − reverse), ${set.standardVolume.label}`, width: 128 },
    { key: 'netEnergy', title: `Net energy, ${set.energy.label}`, width: 100 },
  ];
}

/**
 * @param title a forward column's title ("Mass, t")
 * @returns it named as forward flow ("Forward mass, t"), for a bi-directional meter run
 */
export function forwardTitle(title: string): string {
  return `Forward ${title.charAt(0).toLowerCase()}${title.slice(1)}`;
}

/**
 * @param total a period's reverse and net parts (absent before the meter run was bi-directional: "—")
 * @param set the site's display units
 * @param flowTimeUnit 'h' or 'min', as the column says
 * @returns text for the reverse and net columns
 */
export function directionCells(
  total: DirectionFigures,
  set: DisplayUnitSet,
  flowTimeUnit: 'h' | 'min',
): Record<DirectionCellKey, string> {
  const { reverse, net } = total;
  const mass = (kg: number | undefined) => (kg === undefined ? '—' : formatNumber(fromSI(kg, set.mass.unit)));
  const volume = (m3: number | undefined) =>
    m3 === undefined ? '—' : formatNumber(fromSI(m3, set.standardVolume.unit));
  const energy = (j: number | null | undefined) =>
    j === undefined || j === null ? '—' : formatNumber(fromSI(j, set.energy.unit));
  return {
    reverseFlowTime: reverse ? formatNumber(reverse.flowTimeS / (flowTimeUnit === 'h' ? 3600 : 60), 3) : '—',
    reverseMass: mass(reverse?.massKg),
    reverseVolume: volume(reverse?.standardVolumeM3),
    reverseEnergy: energy(reverse?.energyJ),
    netMass: mass(net?.massKg),
    netVolume: volume(net?.standardVolumeM3),
    netEnergy: energy(net?.energyJ),
  };
}
