/**
 * Discharge coefficient of a cone meter. ISO 5167-5:2016 expects each cone meter to be
 * calibrated; 0.82 is the value used without a calibration (TRADE.md §2, u(C) ≈ 5 % [mem]).
 * A laboratory calibration is a table of C against Re_D, interpolated here linearly in log Re_D.
 */
import type { CalibrationPoint } from './flow-types';

/** C of an uncalibrated cone meter (ISO 5167-5:2016, TRADE.md §2). */
export const UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT = 0.82;

/** A calibration curve ready for repeated evaluation. */
export interface PreparedCalibration {
  /** C at a Reynolds number, clamped to the end points outside the calibrated range. */
  dischargeCoefficientAt(reynoldsNumber: number): number;
  minimumReynoldsNumber: number;
  maximumReynoldsNumber: number;
  /** A C near the middle of the curve, a start for the Re_D iteration. */
  typicalDischargeCoefficient: number;
}

/**
 * Sorts and checks a calibration curve and returns its interpolator.
 * @param points calibration points (any order, at least one, distinct Re_D > 0, 0 < C ≤ 1.2)
 * @returns interpolator linear in log10 Re_D, clamped at the ends
 */
export function prepareCalibration(points: readonly CalibrationPoint[]): PreparedCalibration {
  if (!Array.isArray(points) || points.length === 0) {
    throw new Error('prepareCalibration: element.calibration must hold at least one point');
  }
  points.forEach((p, i) => {
    if (!(p.reynoldsNumber > 0))
      throw new Error(
        `prepareCalibration: element.calibration.${i}.reynoldsNumber must be > 0 (got ${p.reynoldsNumber})`,
      );
    if (!(p.dischargeCoefficient > 0 && p.dischargeCoefficient <= 1.2)) {
      throw new Error(
        `prepareCalibration: element.calibration.${i}.dischargeCoefficient must be in (0, 1.2] (got ${p.dischargeCoefficient})`,
      );
    }
  });
  const sorted = [...points].sort((a, b) => a.reynoldsNumber - b.reynoldsNumber);
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i].reynoldsNumber === sorted[i - 1].reynoldsNumber) {
      throw new Error(`prepareCalibration: element.calibration has two points at Re_D = ${sorted[i].reynoldsNumber}`);
    }
  }
  const logRe = sorted.map((p) => Math.log10(p.reynoldsNumber));
  const c = sorted.map((p) => p.dischargeCoefficient);
  const n = sorted.length;
  return {
    minimumReynoldsNumber: sorted[0].reynoldsNumber,
    maximumReynoldsNumber: sorted[n - 1].reynoldsNumber,
    typicalDischargeCoefficient: c[Math.floor((n - 1) / 2)],
    dischargeCoefficientAt(reynoldsNumber: number): number {
      if (n === 1) return c[0];
      const x = Math.log10(reynoldsNumber);
      if (!(x > logRe[0])) return c[0];
      if (x >= logRe[n - 1]) return c[n - 1];
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (logRe[mid] <= x) lo = mid;
        else hi = mid;
      }
      const f = (x - logRe[lo]) / (logRe[hi] - logRe[lo]);
      return c[lo] + f * (c[hi] - c[lo]);
    },
  };
}
