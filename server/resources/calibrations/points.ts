import type { CalibrationPointInput } from './schema';

/** A calibration point as recorded: the error is computed here, never taken from the request. */
export interface CalibrationPoint {
  appliedValue: number;
  indicatedValue: number;
  /** (indicated − applied) / span × 100 */
  errorPercentOfSpan: number;
  tolerancePercentOfSpan: number;
  pass: boolean;
}

/**
 * The error of each point in percent of the calibrated span, and whether it lies within its
 * tolerance. Error as a percentage of span is the usual expression of a transmitter's
 * measured error (IEC 61298-2 §4, ISA-51.1 "accuracy … expressed in percent of span").
 * A point exactly at its tolerance passes; the comparison allows for binary rounding (1e-9 %).
 */
export function judgePoints(
  points: CalibrationPointInput[],
  range: { lowerRange: number; upperRange: number },
  defaultTolerancePercentOfSpan: number,
): CalibrationPoint[] {
  const span = range.upperRange - range.lowerRange;
  return points.map((p) => {
    const errorPercentOfSpan = ((p.indicatedValue - p.appliedValue) / span) * 100;
    const tolerancePercentOfSpan = p.tolerancePercentOfSpan ?? defaultTolerancePercentOfSpan;
    return {
      appliedValue: p.appliedValue,
      indicatedValue: p.indicatedValue,
      errorPercentOfSpan,
      tolerancePercentOfSpan,
      pass: Math.abs(errorPercentOfSpan) <= tolerancePercentOfSpan + 1e-9,
    };
  });
}

/**
 * The index of the first point whose applied value lies outside the range, or -1. A small
 * allowance (1e-9 of span) keeps a point typed at the very end of the range inside it.
 */
export function firstPointOutsideRange(
  points: CalibrationPointInput[],
  range: { lowerRange: number; upperRange: number },
): number {
  const slack = (range.upperRange - range.lowerRange) * 1e-9;
  return points.findIndex(
    (p) => p.appliedValue < range.lowerRange - slack || p.appliedValue > range.upperRange + slack,
  );
}
