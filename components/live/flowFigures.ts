/**
 * The live rate and today's total of a meter run in the units its site shows: volume at base
 * conditions for gas (Mscf/d on US customary sites, m³/h otherwise), mass for steam (t/h, or
 * lb/h), volume at base conditions for water and other liquids (m³/h, or bbl/d), energy beside
 * the total where the server has it (GJ, or MMBtu). Every unit conversion goes through
 * shared/units; only the clock's own definitions (s per hour, s per day) are written here.
 */
import { fromSI } from '@/shared/units';

/** Seconds in an hour and in a (24 h) day: definitions of the hour and the day, not conversions of a unit. */
const secondsPerHour = 3600;
const secondsPerDay = 24 * secondsPerHour;

export type DisplayUnits = 'si' | 'us';
export type FluidFamily = 'gas' | 'steam' | 'liquid';

/**
 * @param fluidKind the meter run's fluid kind (natural-gas, ideal-gas, steam, water, liquid)
 * @returns how the meter run's flow is shown: as gas, steam or liquid
 */
export function fluidFamily(fluidKind: string | undefined): FluidFamily {
  if (fluidKind === 'steam') return 'steam';
  if (fluidKind === 'water' || fluidKind === 'liquid') return 'liquid';
  return 'gas';
}

export interface FlowFigures {
  /** Live rate in `rateUnit`, or null when the server could not compute one. */
  rate: number | null;
  rateUnit: string;
  /** Today's running total (contract day so far) in `totalUnit`. */
  total: number;
  totalUnit: string;
  /** What the figures measure, e.g. "volume at base conditions". */
  basis: string;
  /** Today's energy, when the server computes it for this fluid. */
  energy: { value: number; unit: string } | null;
}

interface LiveFlow {
  massFlowKgPerS: number | null;
  standardVolumeFlowM3PerS: number | null;
  todayMassKg: number;
  todayStandardVolumeM3: number;
  todayEnergyJ: number | null;
}

/**
 * @param flow the board's rates (SI: kg/s, m³/s at base conditions) and today's totals (kg, m³, J)
 * @param family gas, steam or liquid
 * @param units the site's display units
 * @returns the rate, today's total and energy in the site's units
 */
export function flowFigures(flow: LiveFlow, family: FluidFamily, units: DisplayUnits): FlowFigures {
  const us = units === 'us';
  const energy =
    flow.todayEnergyJ === null
      ? null
      : { value: fromSI(flow.todayEnergyJ, us ? 'MMBtu' : 'GJ'), unit: us ? 'MMBtu' : 'GJ' };

  if (family === 'steam') {
    const massUnit = us ? 'lb' : 't';
    return {
      rate: flow.massFlowKgPerS === null ? null : fromSI(flow.massFlowKgPerS * secondsPerHour, massUnit),
      rateUnit: `${massUnit}/h`,
      total: fromSI(flow.todayMassKg, massUnit),
      totalUnit: massUnit,
      basis: 'mass',
      energy,
    };
  }

  const standard = flow.standardVolumeFlowM3PerS;
  if (family === 'gas' && us) {
    return {
      rate: standard === null ? null : fromSI(standard * secondsPerDay, 'Mscf'),
      rateUnit: 'Mscf/d',
      total: fromSI(flow.todayStandardVolumeM3, 'Mscf'),
      totalUnit: 'Mscf',
      basis: 'volume at base conditions',
      energy,
    };
  }
  if (family === 'liquid' && us) {
    return {
      rate: standard === null ? null : fromSI(standard * secondsPerDay, 'bbl'),
      rateUnit: 'bbl/d',
      total: fromSI(flow.todayStandardVolumeM3, 'bbl'),
      totalUnit: 'bbl',
      basis: 'volume at base conditions',
      energy,
    };
  }
  return {
    rate: standard === null ? null : fromSI(standard * secondsPerHour, 'm3'),
    rateUnit: 'm³/h',
    total: fromSI(flow.todayStandardVolumeM3, 'm3'),
    totalUnit: 'm³',
    basis: 'volume at base conditions',
    energy,
  };
}

/** The live board's direction of a meter run (issue 13 §11): the rates are positive either way. */
export type FlowDirection = 'forward' | 'reverse' | null | undefined;

/**
 * The direction of flow in words with an arrow, never a bare sign: "→ Forward flow" or "← Reverse
 * flow". A one-way meter run says so only when it sees reverse flow (that is its alarm's matter).
 * @param direction the board row's direction
 * @param bidirectional whether the meter run is bi-directional now
 * @returns the words, or null when there is nothing to say
 */
export function directionWords(direction: FlowDirection, bidirectional: boolean): string | null {
  if (direction === 'reverse') return bidirectional ? '← Reverse flow' : '← Reverse flow on a one-way meter run';
  if (!bidirectional) return null;
  return direction === 'forward' ? '→ Forward flow' : 'No flow direction now (no flow or no fresh reading)';
}
