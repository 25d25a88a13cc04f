/**
 * The range check's plot: DP as a share of each span and the expanded flow uncertainty with
 * each transmitter, against flow on a logarithmic axis (a turndown reads as a distance, and the
 * √Δp law makes the DP curves straight lines of slope 2 on log–log). The bottom tenth of span is
 * hatched, the uncertainty limit drawn as a line and the minimum, normal and maximum flows
 * marked.
 */
import type { ChartProps, ChartSeries } from '@/components/charts/chartTypes';
import { flowRateForDisplay, formatPlain } from '@/constants/units-display';
import type { RangeCheckRun } from './rangeCheckInput';

/** The 1–2–5 value at or below (`down`) or at or above a positive number, for log-axis ends. */
function roundLogEnd(value: number, down: boolean): number {
  const decade = Math.pow(10, Math.floor(Math.log10(value)));
  const steps = [1, 2, 5, 10].map((s) => s * decade);
  return down
    ? ([...steps].reverse().find((s) => s <= value * (1 + 1e-12)) ?? decade)
    : (steps.find((s) => s >= value * (1 - 1e-12)) ?? 10 * decade);
}

/** The DP axis shows a little over full span, so an over-range curve is seen to leave it. */
const shareAxisTopPercent = 120;

/**
 * @param run the computed range check
 * @returns the chart's props
 */
export function rangeCheckPlot(run: RangeCheckRun): ChartProps {
  const { curve, input, flowUnit, baseDensityKgPerM3, result } = run;
  const flowOf = (massKgPerS: number) =>
    flowRateForDisplay(
      { massKgPerS, standardVolumeM3PerS: baseDensityKgPerM3 ? massKgPerS / baseDensityKgPerM3 : null },
      flowUnit,
    ) ?? massKgPerS;
  const x = curve.map((point) => flowOf(point.massFlowKgPerS));
  const limit = result.uncertaintyLimitPercent;
  const series: ChartSeries[] = input.transmitters.flatMap((t, i) => {
    // Short legend names; the plot's note says which span each number is.
    return [
      {
        label: `DP ${i + 1}, % of span`,
        values: curve.map((point) => (point.differentialPressurePa / t.spanPa) * 100),
        scale: 'share',
        rank: i * 2,
        significant: 3,
      },
      {
        label: `U with ${i + 1}, %`,
        values: curve.map((point) => point.flowUncertaintyPercent[i]),
        scale: 'u',
        rank: i * 2 + 1,
        significant: 3,
      },
    ];
  });
  return {
    title: 'DP as a share of span and flow uncertainty against flow',
    x: {
      values: x,
      kind: 'log',
      label: `Flow, ${flowUnit.label}`,
      range: [roundLogEnd(x[0], true), roundLogEnd(x[x.length - 1], false)],
    },
    axes: [
      { scale: 'share', label: 'DP, % of span', side: 'left', range: [0, shareAxisTopPercent] },
      { scale: 'u', label: 'Flow uncertainty, % (k = 2)', side: 'right', range: [0, Math.max(4 * limit, 2)] },
    ],
    series,
    zones: [{ scale: 'share', from: 0, to: 10, label: 'bottom 10 % of span' }],
    lines: [{ scale: 'u', value: limit, label: `limit ±${formatPlain(limit)} %` }],
    markers: result.flows.map((flow) => ({ x: flowOf(flow.massFlowKgPerS), label: flow.label })),
    height: 300,
  };
}
