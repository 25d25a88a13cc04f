/**
 * The as-found error chart of a transmitter's calibration history: for each calibration in force,
 * the as-found point with the largest error (signed, % of span) at its calibration date, with the
 * latest calibration's tolerance drawn as limits above and below. Drift shows as a line moving
 * towards a limit from one calibration to the next.
 */
import type { ChartProps } from '@/components/charts/chartTypes';
import type { Calibration, CalibrationPoint } from './api';

/** The point of largest error, or null for none. */
export function worstPoint(points: readonly CalibrationPoint[]): CalibrationPoint | null {
  return points.reduce<CalibrationPoint | null>(
    (worst, p) => (!worst || Math.abs(p.errorPercentOfSpan) > Math.abs(worst.errorPercentOfSpan) ? p : worst),
    null,
  );
}

/** Epoch seconds of a date YYYY-MM-DD at 00:00 UTC. */
const dateSeconds = (date: string) => Date.parse(`${date}T00:00:00Z`) / 1000;

/** @param calibrations a transmitter's calibrations in any order; corrected ones are left out */
export function asFoundPlot(calibrations: readonly Calibration[]): ChartProps {
  const inForce = calibrations.filter((c) => c.current).sort((a, b) => a.calibratedOn.localeCompare(b.calibratedOn));
  const latest = inForce[inForce.length - 1];
  const tolerance = latest ? Math.max(...latest.asFound.map((p) => p.tolerancePercentOfSpan)) : null;
  return {
    title: 'Largest as-found and as-left error of each calibration, % of span',
    x: {
      values: inForce.map((c) => dateSeconds(c.calibratedOn)),
      kind: 'time',
      label: 'Calibration date',
      timeZone: 'UTC',
    },
    axes: [{ scale: 'error', label: 'Error, % of span', side: 'left' }],
    series: [
      {
        label: 'As found',
        values: inForce.map((c) => worstPoint(c.asFound)?.errorPercentOfSpan ?? null),
        scale: 'error',
        rank: 0,
        significant: 3,
      },
      {
        label: 'As left',
        values: inForce.map((c) => worstPoint(c.asLeft)?.errorPercentOfSpan ?? null),
        scale: 'error',
        rank: 1,
        significant: 3,
      },
    ],
    lines:
      tolerance === null
        ? []
        : [
            { scale: 'error', value: tolerance, label: `+${tolerance} % tolerance` },
            { scale: 'error', value: -tolerance, label: `−${tolerance} % tolerance` },
          ],
    height: 200,
    emptyText: 'No calibration recorded yet.',
    testID: 'calibration-error-chart',
  };
}
