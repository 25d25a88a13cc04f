/**
 * What a demo transmitter reports at an instant, in its own unit: the process quantity it
 * measures, plus its own noise, limited to the output a 4–20 mA transmitter can give, rounded to
 * its resolution; the scenario's events applied (a frozen output, a dropout gives no reading).
 */
import { fromSI } from '../../shared/units';
import { transmitterByTag, type ScenarioTimeline, type ScenarioTransmitter } from '../scenario';
import { processStateAt } from './process-state';
import { gaussianAt, seedOfText } from './seeded-noise';

/**
 * Output limits as shares of span: NAMUR NE 43 saturates a 4–20 mA signal at 3.8 mA and 20.5 mA
 * [mem], i.e. −1.25 % and +103.125 % of span. A low-range transmitter of a stacked pair sits at
 * the upper limit while the DP is above its range.
 */
const LOWER_SATURATION_SHARE = (3.8 - 4) / 16;
const UPPER_SATURATION_SHARE = (20.5 - 4) / 16;
/** Random noise of a transmitter's output, standard deviation as a share of its stated accuracy (invented). */
const NOISE_SHARE_OF_ACCURACY = 0.25;
/** Resolution of a reading: a hundred-thousandth of the span, in whole decimals (a 17-bit converter, common practice). */
const COUNTS_PER_SPAN = 1e5;

function decimalsFor(t: ScenarioTransmitter): number {
  return Math.max(0, Math.ceil(Math.log10(COUNTS_PER_SPAN / (t.upperRange - t.lowerRange))));
}

/**
 * @param tag transmitter tag, e.g. 'KFG-101-DPH'
 * @param timeMs instant, epoch ms (whole seconds)
 * @param timeline the scenario's instants
 * @returns the reading in the transmitter's unit, or null when the scenario has no reading then
 */
export function transmitterValueAt(tag: string, timeMs: number, timeline: ScenarioTimeline): number | null {
  const { transmitter, meterRun, site } = transmitterByTag(tag);
  if (
    meterRun.tag === timeline.dropout.meterRunTag &&
    timeMs >= timeline.dropout.fromMs &&
    timeMs < timeline.dropout.toMs
  )
    return null;
  // A frozen transmitter repeats the last value it had before it stuck, to the last digit.
  if (tag === timeline.frozen.tag && timeMs >= timeline.frozen.fromMs && timeMs < timeline.frozen.toMs) {
    return transmitterValueAt(tag, timeline.frozen.fromMs - 1000, timeline);
  }
  const state = processStateAt(meterRun, timeMs, timeline);
  let value: number;
  if (transmitter.measures === 'differential-pressure') value = fromSI(state.differentialPressurePa, transmitter.unit);
  else if (transmitter.measures === 'temperature') value = fromSI(state.temperatureK, transmitter.unit);
  else
    value = fromSI(
      state.staticPressurePa - (transmitter.pressureReference === 'gauge' ? site.atmosphericPressurePa : 0),
      transmitter.unit,
    );

  const span = transmitter.upperRange - transmitter.lowerRange;
  const sigma = (NOISE_SHARE_OF_ACCURACY * transmitter.accuracyPercentOfSpan * span) / 100;
  value += sigma * gaussianAt(seedOfText(tag), Math.floor(timeMs / 1000));
  value = Math.min(
    Math.max(value, transmitter.lowerRange + LOWER_SATURATION_SHARE * span),
    transmitter.lowerRange + UPPER_SATURATION_SHARE * span,
  );
  const scale = 10 ** decimalsFor(transmitter);
  return Math.round(value * scale) / scale;
}
