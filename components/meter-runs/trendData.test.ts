import { alignBuckets, hourlySteps, type BucketSeries } from './trendData';

const series = (label: string, xs: number[]): BucketSeries => ({
  label,
  scale: 'dp',
  rank: 0,
  points: xs.map((x) => ({ x, mean: x + 1, min: x, max: x + 2 })),
});

describe('alignBuckets', () => {
  it('puts several series on one time axis, drawing through a missing bucket inside the gap limit', () => {
    const aligned = alignBuckets([series('A', [0, 10, 20]), series('B', [0, 20])], 100);
    expect(aligned.x).toEqual([0, 10, 20]);
    expect(aligned.series[0].values).toEqual([1, 11, 21]);
    expect(aligned.series[1].values).toEqual([1, undefined, 21]);
    expect(aligned.series[1].band).toEqual({ min: [0, undefined, 20], max: [2, undefined, 22] });
  });

  it('breaks the line across a gap longer than the limit, at an x of its own in the middle', () => {
    const aligned = alignBuckets([series('A', [0, 300])], 100);
    expect(aligned.x).toEqual([0, 150, 300]);
    expect(aligned.series[0].values).toEqual([1, null, 301]);
  });

  it('breaks a series before its first bucket and after its last, where it has no neighbour', () => {
    const aligned = alignBuckets([series('A', [0, 10, 20]), series('B', [10])], 100);
    expect(aligned.series[1].values).toEqual([null, 11, null]);
  });

  it('keeps each series’ label, scale and rank', () => {
    const [only] = alignBuckets([{ ...series('DP-1 high range', [0]), rank: 1 }], 60).series;
    expect(only).toMatchObject({ label: 'DP-1 high range', scale: 'dp', rank: 1 });
  });

  it('gives an empty chart for no buckets', () => {
    expect(alignBuckets([series('A', [])], 60)).toEqual({
      x: [],
      series: [{ label: 'A', scale: 'dp', rank: 0, values: [], band: { min: [], max: [] } }],
    });
  });
});

describe('hourlySteps', () => {
  it('holds each hour’s value to the hour’s end', () => {
    expect(
      hourlySteps([
        { x: 0, value: 1 },
        { x: 3600, value: 2 },
      ]),
    ).toEqual({ x: [0, 3600, 7200], values: [1, 2, 2] });
  });

  it('closes the step before missing hours, then breaks the line', () => {
    expect(
      hourlySteps([
        { x: 0, value: 1 },
        { x: 10_800, value: 3 },
      ]),
    ).toEqual({ x: [0, 3600, 3601, 10_800, 14_400], values: [1, 1, null, 3, 3] });
  });

  it('gives nothing for no hours', () => {
    expect(hourlySteps([])).toEqual({ x: [], values: [] });
  });
});
