/**
 * A bi-directional meter run's month (issue 13 §11): its reverse flow and its net (forward −
 * reverse) beside the forward figures, each its own figure, in the site's units. One-way meter
 * runs have neither, and their month keeps its shape.
 */
import { formatNumber, unitsFor, type DisplayUnits } from '@/constants/units-display';
import type { MeterRunMonth } from '@/hooks/api/monthlyVolumes';
import { fromSI } from '@/shared/units';

export type DirectionParts = Pick<MeterRunMonth, 'reverse' | 'net'>;

/** @returns the headers of the reverse and net columns, with their units */
export function directionHeaders(displayUnits: DisplayUnits) {
  const set = unitsFor(displayUnits);
  return {
    reverseStandardVolume: `Reverse volume at base, ${set.standardVolume.label}`,
    reverseMass: `Reverse mass, ${set.mass.label}`,
    netStandardVolume: `Net volume at base (forward − reverse), ${set.standardVolume.label}`,
    netMass: `Net mass (forward − reverse), ${set.mass.label}`,
  };
}

/** @returns the text of the reverse and net figures ("—" for a meter run with no reverse flow this month) */
export function directionMonthCells(parts: DirectionParts, displayUnits: DisplayUnits) {
  const set = unitsFor(displayUnits);
  const conv = (v: number | undefined, unit: string) => (v === undefined ? '—' : formatNumber(fromSI(v, unit), 6));
  return {
    reverseStandardVolume: conv(parts.reverse?.standardVolumeM3, set.standardVolume.unit),
    reverseMass: conv(parts.reverse?.massKg, set.mass.unit),
    netStandardVolume: conv(parts.net?.standardVolumeM3, set.standardVolume.unit),
    netMass: conv(parts.net?.massKg, set.mass.unit),
  };
}

/** @returns a forward figure's header named as forward flow: "Mass, t" → "Forward mass, t" */
export function forwardHeader(header: string): string {
  return `Forward ${header.charAt(0).toLowerCase()}${header.slice(1)}`;
}
