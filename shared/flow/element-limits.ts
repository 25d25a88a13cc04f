/**
 * Limits of use of each primary element in its part of ISO 5167. A case outside them still
 * gets a number, always with a warning that names the limit and the value (never silently).
 */
import type { ElementSpec, FlowWarning } from './flow-types';

export interface ElementLimits {
  /** The clause that sets the limits, named in every warning. */
  clause: string;
  pipeDiameterM: readonly [number, number];
  beta: readonly [number, number];
  minimumBoreDiameterM: number | null;
  /** [minimum, maximum] Re_D at a β and D (maximum Infinity where the standard sets none). */
  reynoldsRange(beta: number, pipeDiameterM: number): readonly [number, number];
}

/** Lowest p2/p1 for which the expansibility equations of ISO 5167-2/-3/-4/-5 are given. */
export const MINIMUM_PRESSURE_RATIO = 0.75;

/**
 * The limits for an element specification.
 * @param element element specification (kind and its subtype)
 * @returns limits of use
 */
export function elementLimits(element: ElementSpec): ElementLimits {
  switch (element.kind) {
    case 'orifice':
      if (element.method === 'api-14.3') {
        // API MPMS 14.3 / AGA 3 Part 1 limits, from memory (D ≥ 2 in, d ≥ 0.45 in, 0.1 ≤ β ≤ 0.75,
        // Re_D ≥ 4000; no upper D): confirm against the standard's text.
        return {
          clause: 'API MPMS 14.3 / AGA Report No. 3 Part 1 (orifice, flange taps)',
          pipeDiameterM: [2 * 0.0254, Infinity],
          beta: [0.1, 0.75],
          minimumBoreDiameterM: 0.45 * 0.0254,
          reynoldsRange: () => [4000, Infinity],
        };
      }
      // ISO 5167-2:2003 §5.3.1 (TRADE.md §2).
      if (element.taps === 'flange') {
        return {
          clause: 'ISO 5167-2:2003 §5.3.1 (orifice, flange taps)',
          pipeDiameterM: [0.05, 1.0],
          beta: [0.1, 0.75],
          minimumBoreDiameterM: 0.0125,
          reynoldsRange: (beta, d) => [Math.max(5000, 170000 * beta * beta * d), Infinity],
        };
      }
      return {
        clause: `ISO 5167-2:2003 §5.3.1 (orifice, ${element.taps ?? 'corner'} taps)`,
        pipeDiameterM: [0.05, 1.0],
        beta: [0.1, 0.75],
        minimumBoreDiameterM: 0.0125,
        reynoldsRange: (beta) => [beta <= 0.56 ? 5000 : 16000 * beta * beta, Infinity],
      };
    case 'venturi':
      // ISO 5167-4:2003 §5.5.2–5.5.4: as-cast limits [lib, TRADE.md §2]; machined and rough-welded [mem].
      if (element.venturiType === 'machined') {
        return {
          clause: 'ISO 5167-4:2003 §5.5.3 (machined convergent)',
          pipeDiameterM: [0.05, 0.25],
          beta: [0.4, 0.75],
          minimumBoreDiameterM: null,
          reynoldsRange: () => [2e5, 1e6],
        };
      }
      if (element.venturiType === 'rough-welded') {
        return {
          clause: 'ISO 5167-4:2003 §5.5.4 (rough-welded convergent)',
          pipeDiameterM: [0.2, 1.2],
          beta: [0.4, 0.7],
          minimumBoreDiameterM: null,
          reynoldsRange: () => [2e5, 2e6],
        };
      }
      return {
        clause: 'ISO 5167-4:2003 §5.5.2 (as-cast convergent)',
        pipeDiameterM: [0.1, 0.8],
        beta: [0.3, 0.75],
        minimumBoreDiameterM: null,
        reynoldsRange: () => [2e5, 2e6],
      };
    case 'nozzle':
      // ISO 5167-3:2003 §5.1.6.1 and §5.2.6.1 [mem].
      if (element.nozzleType === 'long-radius') {
        return {
          clause: 'ISO 5167-3:2003 §5.2.6.1 (long-radius nozzle)',
          pipeDiameterM: [0.05, 0.63],
          beta: [0.2, 0.8],
          minimumBoreDiameterM: null,
          reynoldsRange: () => [1e4, 1e7],
        };
      }
      return {
        clause: 'ISO 5167-3:2003 §5.1.6.1 (ISA 1932 nozzle)',
        pipeDiameterM: [0.05, 0.5],
        beta: [0.3, 0.8],
        minimumBoreDiameterM: null,
        reynoldsRange: (beta) => (beta < 0.44 ? [7e4, 1e7] : [2e4, 1e7]),
      };
    case 'cone':
      // ISO 5167-5:2016 §6 [std, TRADE.md §2].
      return {
        clause: 'ISO 5167-5:2016 §6 (cone meter)',
        pipeDiameterM: [0.05, 0.5],
        beta: [0.45, 0.75],
        minimumBoreDiameterM: null,
        reynoldsRange: () => [8e4, 1.2e7],
      };
    default:
      throw new Error(
        `elementLimits: element.kind must be orifice, venturi, nozzle or cone (got ${String((element as ElementSpec).kind)})`,
      );
  }
}

/** Six significant digits, without trailing zeros: numbers in warning messages. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(6)));
}

/**
 * Warnings for the geometry (β, D, d) against the limits.
 * @param limits element limits
 * @param beta β at flowing temperature
 * @param pipeDiameterM D at flowing temperature, m
 * @param boreDiameterM d at flowing temperature, m (cone: not checked)
 * @returns warnings, empty when within limits
 */
export function geometryWarnings(
  limits: ElementLimits,
  beta: number,
  pipeDiameterM: number,
  boreDiameterM: number,
): FlowWarning[] {
  const warnings: FlowWarning[] = [];
  const [bMin, bMax] = limits.beta;
  if (beta < bMin || beta > bMax) {
    warnings.push({
      code: 'iso5167.betaOutOfRange',
      message: `beta = ${formatNumber(beta)} is outside ${bMin} ≤ β ≤ ${bMax} of ${limits.clause}`,
    });
  }
  const [dMin, dMax] = limits.pipeDiameterM;
  if (pipeDiameterM < dMin || pipeDiameterM > dMax) {
    warnings.push({
      code: 'iso5167.pipeDiameterOutOfRange',
      message: `pipe diameter D = ${formatNumber(pipeDiameterM * 1000)} mm is outside ${dMin * 1000} mm ≤ D ≤ ${dMax * 1000} mm of ${limits.clause}`,
    });
  }
  if (limits.minimumBoreDiameterM !== null && boreDiameterM < limits.minimumBoreDiameterM) {
    warnings.push({
      code: 'iso5167.boreDiameterBelowMinimum',
      message: `bore diameter d = ${formatNumber(boreDiameterM * 1000)} mm is below d ≥ ${limits.minimumBoreDiameterM * 1000} mm of ${limits.clause}`,
    });
  }
  return warnings;
}

/**
 * Warnings for one operating point: Re_D against its range and p2/p1 against 0.75.
 * @param limits element limits
 * @param beta β
 * @param pipeDiameterM D, m
 * @param reynoldsNumber Re_D at the operating point
 * @param pressureRatio p2/p1, or null for an incompressible fluid (ε = 1, no limit applies)
 * @returns warnings, empty when within limits
 */
export function operatingPointWarnings(
  limits: ElementLimits,
  beta: number,
  pipeDiameterM: number,
  reynoldsNumber: number,
  pressureRatio: number | null,
): FlowWarning[] {
  const warnings: FlowWarning[] = [];
  const [reMin, reMax] = limits.reynoldsRange(beta, pipeDiameterM);
  if (reynoldsNumber < reMin) {
    warnings.push({
      code: 'iso5167.reynoldsBelowMinimum',
      message: `Re_D = ${formatNumber(reynoldsNumber)} is below the minimum ${formatNumber(reMin)} of ${limits.clause} at β = ${formatNumber(beta)}`,
    });
  } else if (reynoldsNumber > reMax) {
    warnings.push({
      code: 'iso5167.reynoldsAboveMaximum',
      message: `Re_D = ${formatNumber(reynoldsNumber)} is above the maximum ${formatNumber(reMax)} of ${limits.clause}`,
    });
  }
  if (pressureRatio !== null && pressureRatio < MINIMUM_PRESSURE_RATIO) {
    warnings.push({
      code: 'iso5167.pressureRatioBelowLimit',
      message: `pressure ratio p2/p1 = ${formatNumber(pressureRatio)} is below ${MINIMUM_PRESSURE_RATIO}, the lowest for which ${limits.clause} gives the expansibility factor`,
    });
  }
  return warnings;
}
