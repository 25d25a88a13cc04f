import { rangeCheckPlot } from './rangeCheckPlot';
import { runRangeCheck } from './rangeCheckInput';
import { defaultValues } from './rangeCheckValues';

/** A 1–2–5 value times a power of ten, as a log axis ends on. */
function isOneTwoFive(value: number): boolean {
  const mantissa = value / Math.pow(10, Math.floor(Math.log10(value) + 1e-12));
  return [1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9);
}

describe('rangeCheckPlot', () => {
  const transmitters = [
    { span: '50', accuracy: '0.075' },
    { span: '5', accuracy: '0.075' },
  ];
  const { run } = runRangeCheck({ ...defaultValues('si'), transmitters });
  if (!run) throw new Error('the default case should run');
  const plot = rangeCheckPlot(run);

  it('plots flow in the form’s unit on a log axis whose ends are 1–2–5 values around the curve', () => {
    expect(plot.x.kind).toBe('log');
    expect(plot.x.label).toBe('Flow, m³/h (base)');
    const [low, high] = plot.x.range as [number, number];
    expect(isOneTwoFive(low) && isOneTwoFive(high)).toBe(true);
    expect(low).toBeLessThanOrEqual(plot.x.values[0]);
    expect(high).toBeGreaterThanOrEqual(plot.x.values[plot.x.values.length - 1]);
  });

  it('draws DP as a share of span and the uncertainty with each transmitter', () => {
    expect(plot.series.map((s) => s.label)).toEqual([
      'DP 1, % of span',
      'U with 1, %',
      'DP 2, % of span',
      'U with 2, %',
    ]);
  });

  it('makes DP grow as the square of flow, so its share of span at the top of the curve is 100 times that at a tenth of the flow', () => {
    // The square-root law of a DP meter: q ∝ √Δp (ISO 5167-1), with C and ε nearly constant.
    const x = plot.x.values;
    const dp = plot.series[0].values as number[];
    const top = x.length - 1;
    const tenth = x.findIndex((q) => q >= x[top] / 10);
    expect((dp[top] / dp[tenth]) * Math.pow(x[tenth] / x[top], 2)).toBeCloseTo(1, 1);
  });

  it('hatches the bottom tenth of span, draws the limit and marks the minimum, normal and maximum flows', () => {
    expect(plot.zones).toEqual([{ scale: 'share', from: 0, to: 10, label: 'bottom 10 % of span' }]);
    expect(plot.lines).toEqual([{ scale: 'u', value: 1, label: 'limit ±1 %' }]);
    expect(plot.markers?.map((m) => Math.round(m.x))).toEqual([2000, 10_000, 20_000]);
  });
});
