/**
 * Turns the trend endpoint's buckets into chart data. The server returns only the buckets that
 * hold readings; between two of them the line is drawn through unless they are further apart
 * than the meter run's gap limit (DESIGN.md: a gap longer than the limit is missing time, not
 * flow), where the chart shows a break.
 */
import type { ChartSeries } from '@/components/charts/chartTypes';

export interface BucketPoint {
  /** Epoch seconds. */
  x: number;
  mean: number;
  min: number;
  max: number;
}

export interface BucketSeries {
  label: string;
  scale: string;
  rank: number;
  points: BucketPoint[];
}

/**
 * Aligns several bucket series on one time axis. A series with no bucket at an x gets
 * `undefined` (uPlot joins across it) unless its neighbours are more than `gapS` apart, where
 * it gets `null` (uPlot breaks the line).
 * @param series each series' buckets, oldest first
 * @param gapS the longest stretch drawn as continuous, s
 * @returns the shared x values (epoch s) and the chart's series with their min/max bands
 */
export function alignBuckets(series: readonly BucketSeries[], gapS: number): { x: number[]; series: ChartSeries[] } {
  const xs = [...new Set(series.flatMap((s) => s.points.map((p) => p.x)))].sort((a, b) => a - b);
  // A break needs an x of its own between the two sides, so add one in the middle of each long gap.
  const withBreaks: number[] = [];
  xs.forEach((x, i) => {
    if (i > 0 && x - xs[i - 1] > gapS) withBreaks.push((x + xs[i - 1]) / 2);
    withBreaks.push(x);
  });
  const out: ChartSeries[] = series.map((s) => {
    const byX = new Map(s.points.map((p) => [p.x, p]));
    const values: (number | null)[] = [];
    const min: (number | null)[] = [];
    const max: (number | null)[] = [];
    let previous: number | null = null;
    let nextIndex = 0;
    for (const x of withBreaks) {
      const point = byX.get(x);
      while (nextIndex < s.points.length && s.points[nextIndex].x <= x) nextIndex++;
      if (point) {
        values.push(point.mean);
        min.push(point.min);
        max.push(point.max);
        previous = x;
        continue;
      }
      const next = nextIndex < s.points.length ? s.points[nextIndex].x : null;
      const joined = previous !== null && next !== null && next - previous <= gapS;
      // undefined: no bucket here, draw through; null: a break.
      const empty = (joined ? undefined : null) as number | null;
      values.push(empty);
      min.push(empty);
      max.push(empty);
    }
    return { label: s.label, scale: s.scale, rank: s.rank, values, band: { min, max } };
  });
  return { x: withBreaks, series: out };
}

/**
 * Hourly figures as a stepped series: each hour's value held to the hour's end, a break where
 * hours are missing.
 * @param hours hour starts (epoch s) and values, oldest first
 * @param hourS length of a step, s (3600)
 * @returns x values and y values for a stepped series
 */
export function hourlySteps(
  hours: readonly { x: number; value: number }[],
  hourS = 3600,
): { x: number[]; values: (number | null)[] } {
  const x: number[] = [];
  const values: (number | null)[] = [];
  hours.forEach((hour, i) => {
    const previous = hours[i - 1];
    if (previous && hour.x - previous.x > hourS * 1.5) {
      // Close the previous step, then break the line.
      x.push(previous.x + hourS);
      values.push(previous.value);
      x.push(previous.x + hourS + 1);
      values.push(null);
    }
    x.push(hour.x);
    values.push(hour.value);
  });
  const last = hours[hours.length - 1];
  if (last) {
    x.push(last.x + hourS);
    values.push(last.value);
  }
  return { x, values };
}
