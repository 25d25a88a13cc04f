import { toSI } from '../../../shared/units';
import type { CalibrationPoint } from './points';

export type Measure = 'differential-pressure' | 'static-pressure' | 'temperature';

/** One as-found point as the factor used it: its error as a fraction of the (absolute) reading. */
export interface FactorPoint {
  appliedValue: number;
  indicatedValue: number;
  /** (indicated − applied) / applied, with pressures absolute and temperatures in kelvin */
  errorFractionOfReading: number;
}

export interface SuggestedFactor {
  factor: number;
  /** The mean error of reading e over the points used. */
  meanErrorFractionOfReading: number;
  points: FactorPoint[];
  basis: string;
}

/**
 * A flow factor from a failed as-found calibration: what the meter run's flow should be multiplied
 * by over the period the transmitter read wrong. An approximation, stated as one in `basis`:
 *
 * - DP and static pressure enter the flow under a square root (ISO 5167-1:2022 eq. 1,
 *   qm = C/√(1−β⁴)·ε·π/4·d²·√(2·Δp·ρ1), with ρ1 ∝ p1 for a gas at fixed Z and T). A transmitter that
 *   reads x(1+e) instead of x made the flow √(1+e) times too large, so the correction is 1/√(1+e).
 *   The static pressure's e is a fraction of the absolute pressure (a gauge transmitter's reading
 *   plus the site's atmospheric pressure), since ρ1 is proportional to absolute pressure.
 * - Temperature: ρ1 ∝ 1/T (absolute), so qm ∝ 1/√T; a reading T(1+e) in kelvin made the flow
 *   1/√(1+e) times too small, so the correction is √(1+e).
 * - e is the mean of the as-found points' errors of reading over the points whose absolute value
 *   is not zero (a DP point at 0 has no error of reading); the flow's dependence on Z, the
 *   expansibility ε and C through Re_D is left out, and the operating point is taken as the
 *   mean of the calibration points rather than the hours' own readings.
 * @returns null when no point gives an error of reading (every point at zero)
 */
export function suggestedFactor(
  measure: Measure,
  unit: string,
  asFound: CalibrationPoint[],
  options: { gauge: boolean; atmosphericPressurePa: number },
): SuggestedFactor | null {
  const absolute = (value: number) => {
    if (measure === 'temperature') return toSI(value, unit);
    if (measure === 'static-pressure' && options.gauge) return toSI(value, unit) + options.atmosphericPressurePa;
    return toSI(value, unit);
  };
  const points: FactorPoint[] = [];
  for (const p of asFound) {
    const applied = absolute(p.appliedValue);
    if (Math.abs(applied) < 1e-12) continue;
    points.push({
      appliedValue: p.appliedValue,
      indicatedValue: p.indicatedValue,
      errorFractionOfReading: (absolute(p.indicatedValue) - applied) / applied,
    });
  }
  if (!points.length) return null;
  const e = points.reduce((sum, p) => sum + p.errorFractionOfReading, 0) / points.length;
  const factor = measure === 'temperature' ? Math.sqrt(1 + e) : 1 / Math.sqrt(1 + e);
  const law =
    measure === 'temperature'
      ? 'flow ∝ 1/√T (absolute temperature), so the factor is √(1+e)'
      : measure === 'static-pressure'
        ? 'flow ∝ √p (absolute static pressure), so the factor is 1/√(1+e)'
        : 'flow ∝ √Δp, so the factor is 1/√(1+e)';
  const used = points
    .map(
      (p) => `${p.appliedValue} → ${p.indicatedValue} ${unit} (e = ${(p.errorFractionOfReading * 100).toFixed(4)} %)`,
    )
    .join('; ');
  const basis =
    `Approximation: e = ${(e * 100).toFixed(4)} % of reading, the mean error of reading of the as-found points ` +
    `${used}; ${law} = ${factor.toFixed(6)}. ` +
    'It leaves out the effect on Z, expansibility and C, and takes the calibration points as the operating point.';
  return { factor, meanErrorFractionOfReading: e, points, basis };
}
