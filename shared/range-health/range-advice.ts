/**
 * A plain recommendation for a meter run's DP range from what its flow did in a period: the
 * range check of shared/flow (rangeCheck) at the period's flows (lowest, typical, highest hourly
 * rate) and conditions, read together with the share of flowing time spent low in range and
 * over range. Kinds: none, re-range (down to fit the highest flow, or up when over range),
 * add-low-range-transmitter, resize-low-range-transmitter, change-element.
 */
import { rangeCheck, type RangeCheckInput, type RangeCheckResult } from '../flow/range-check';
import { standardSpanAtOrBelow } from '../flow/standard-span';
import { fromSI, toSI } from '../units/convert-units';

export type RangeAdviceKind =
  'none' | 're-range' | 'add-low-range-transmitter' | 'resize-low-range-transmitter' | 'change-element';

export interface RangeAdviceTransmitter {
  id: string;
  tag: string;
  stackRole: 'single' | 'low' | 'high';
  spanPa: number;
  accuracyPercentOfSpan: number;
  unit: string;
  /** What kind of figure the accuracy is (k = 2, or a ± limit), as the hourly records take it. */
  accuracyKind?: RangeCheckInput['transmitters'][number]['accuracyKind'];
}

export interface RangeAdviceInput {
  element: RangeCheckInput['element'];
  fluid: RangeCheckInput['fluid'];
  conditions: RangeCheckInput['conditions'];
  flowRange: RangeCheckInput['flowRange'];
  transmitters: RangeAdviceTransmitter[];
  /** Share of flowing time below 10 % of the active span, and over range (0..1). */
  lowInRangeTimeShare: number;
  overRangeTimeShare: number;
  uncertaintyLimitPercent: number;
  /** Allowances for the other inputs (the hourly records use the same), percent. */
  pipeDiameterPercent: number;
  elementDiameterPercent: number;
  densityPercent: number;
  /** Work the range check with the hourly records' budget (see RangeCheckInput.hourlyBudget). */
  hourlyBudget?: RangeCheckInput['hourlyBudget'];
}

export interface RangeAdvice {
  kind: RangeAdviceKind;
  text: string;
  numbers: Record<string, number | string | null>;
}

/** Low-in-range time above this share calls for a change (a few percent is the normal tail of a load curve [mem]). */
export const LOW_IN_RANGE_TIME_LIMIT = 0.05;
/** Over-range time above this share calls for a change. */
export const OVER_RANGE_TIME_LIMIT = 0.01;
/** Headroom above the highest flow's DP when re-ranging (common practice: keep the top flow below ~90 % of span [mem]). */
export const RERANGE_HEADROOM = 1.1;

/** The smallest standard span (shared/flow's 1–1.25–1.5–2–2.5–3–4–5–6–7.5 series) at or above a value. */
function standardSpanAtOrAbove(value: number): number {
  let s = standardSpanAtOrBelow(value);
  for (let i = 0; i < 5 && s < value * (1 - 1e-12); i++) s = standardSpanAtOrBelow(s * 1.34);
  return s;
}

const pct = (x: number, d = 0) => `${(x * 100).toFixed(d)} %`;

/**
 * @param input element, fluid, conditions, the period's flow range, the DP transmitters and the band shares
 * @returns the recommendation with the numbers behind it, and the range check it rests on
 */
export function rangeAdvice(input: RangeAdviceInput): RangeAdvice & { rangeCheck: RangeCheckResult } {
  const dps = [...input.transmitters].sort((a, b) => b.spanPa - a.spanPa);
  if (!dps.length) throw new Error('rangeAdvice: transmitters must hold at least one DP transmitter');
  const rc = rangeCheck({
    element: input.element,
    fluid: input.fluid,
    conditions: input.conditions,
    flowRange: input.flowRange,
    transmitters: dps.map((t) => ({
      spanPa: t.spanPa,
      accuracyPercentOfSpan: t.accuracyPercentOfSpan,
      unit: t.unit,
      ...(t.accuracyKind ? { accuracyKind: t.accuracyKind } : {}),
    })),
    uncertaintyLimitPercent: input.uncertaintyLimitPercent,
    pipeDiameterPercent: input.pipeDiameterPercent,
    elementDiameterPercent: input.elementDiameterPercent,
    densityPercent: input.densityPercent,
    ...(input.hourlyBudget ? { hourlyBudget: input.hourlyBudget } : {}),
  });
  const [minimum, , maximum] = rc.flows;
  const top = dps[0];
  const low = dps.length > 1 ? dps[dps.length - 1] : null;
  const numbers: Record<string, number | string | null> = {
    minimumFlowKgPerS: minimum.massFlowKgPerS,
    maximumFlowKgPerS: maximum.massFlowKgPerS,
    dpAtMinimumFlowPa: minimum.differentialPressurePa,
    dpAtMaximumFlowPa: maximum.differentialPressurePa,
    lowInRangeTimeShare: input.lowInRangeTimeShare,
    overRangeTimeShare: input.overRangeTimeShare,
    flowUncertaintyAtMinimumPercent: Math.min(...minimum.transmitters.map((t) => t.flowUncertaintyPercent)),
    uncertaintyLimitPercent: rc.uncertaintyLimitPercent,
  };
  const inUnit = (pa: number, unit: string) => `${Number(fromSI(pa, unit).toPrecision(3))} ${unit}`;
  const out = (kind: RangeAdviceKind, text: string, extra: Record<string, number | string | null> = {}) => ({
    kind,
    text,
    numbers: { ...numbers, ...extra },
    rangeCheck: rc,
  });

  // Over range: the top of the flow does not fit the largest span.
  if (input.overRangeTimeShare > OVER_RANGE_TIME_LIMIT || maximum.differentialPressurePa > top.spanPa) {
    const spanValue = standardSpanAtOrAbove(fromSI(maximum.differentialPressurePa * RERANGE_HEADROOM, top.unit));
    return out(
      're-range',
      `Re-range ${top.tag} up to 0–${spanValue} ${top.unit}: ${pct(input.overRangeTimeShare, 1)} of flowing time was over range, and the highest flow (${maximum.massFlowKgPerS.toPrecision(3)} kg/s) gives ${inUnit(maximum.differentialPressurePa, top.unit)}. If the transmitter cannot be ranged that high, change the element for a larger bore.`,
      { transmitterId: top.id, suggestedSpan: spanValue, suggestedSpanUnit: top.unit },
    );
  }
  const lowTime = input.lowInRangeTimeShare > LOW_IN_RANGE_TIME_LIMIT;
  if (rc.rangeCovered && !lowTime) {
    return out(
      'none',
      `No change needed: ${pct(1 - input.lowInRangeTimeShare)} of flowing time was above 10 % of span and the range check covers the period's flows within ${rc.uncertaintyLimitPercent} %.`,
    );
  }
  // A single transmitter ranged far above the highest flow: re-range it down first.
  if (!low && maximum.differentialPressurePa * RERANGE_HEADROOM < 0.5 * top.spanPa) {
    const spanValue = standardSpanAtOrAbove(fromSI(maximum.differentialPressurePa * RERANGE_HEADROOM, top.unit));
    const newSpanPa = toSI(spanValue, top.unit);
    return out(
      're-range',
      `Re-range ${top.tag} from 0–${inUnit(top.spanPa, top.unit).replace(` ${top.unit}`, '')} to 0–${spanValue} ${top.unit}: the highest flow gives only ${pct(maximum.differentialPressurePa / top.spanPa)} of the present span, and ${pct(input.lowInRangeTimeShare)} of flowing time was below 10 % of span. On the new span the lowest flow reads ${pct(minimum.differentialPressurePa / newSpanPa)}.`,
      {
        transmitterId: top.id,
        suggestedSpan: spanValue,
        suggestedSpanUnit: top.unit,
        lowestFlowShareOfNewSpan: minimum.differentialPressurePa / newSpanPa,
      },
    );
  }
  const suggestion = rc.suggestedLowRangeSpan;
  if (suggestion && !low) {
    return out(
      'add-low-range-transmitter',
      `Add a low-range DP transmitter of 0–${suggestion.value} ${suggestion.unit} beside ${top.tag} (a stacked pair): ${pct(input.lowInRangeTimeShare)} of flowing time was below 10 % of span, where the flow uncertainty reached ${numbers.flowUncertaintyAtMinimumPercent !== null ? Number(numbers.flowUncertaintyAtMinimumPercent).toFixed(2) : '?'} % against a limit of ${rc.uncertaintyLimitPercent} %.`,
      {
        suggestedSpan: suggestion.value,
        suggestedSpanUnit: suggestion.unit,
        suggestedSpanMinimumFlowKgPerS: suggestion.minimumFlowWithinLimitKgPerS,
      },
    );
  }
  if (suggestion && low && suggestion.spanPa < low.spanPa * (1 - 1e-9)) {
    return out(
      'resize-low-range-transmitter',
      `Resize the low-range transmitter ${low.tag} from 0–${inUnit(low.spanPa, low.unit)} to 0–${suggestion.value} ${suggestion.unit}: the lowest flow gives ${inUnit(minimum.differentialPressurePa, low.unit)}, ${pct(minimum.differentialPressurePa / low.spanPa, 1)} of its span.`,
      { transmitterId: low.id, suggestedSpan: suggestion.value, suggestedSpanUnit: suggestion.unit },
    );
  }
  // No span meets the limit even at full scale: the other terms of the budget (C, the diameters, the
  // density) already exceed it, so neither a transmitter nor a smaller bore helps; say so plainly.
  if (rc.transmitters.every((t) => t.minimumFlowWithinLimitKgPerS === null)) {
    return out(
      'change-element',
      `No DP span can meet ${rc.uncertaintyLimitPercent} %: at the lowest flow the uncertainty is ${numbers.flowUncertaintyAtMinimumPercent !== null ? Number(numbers.flowUncertaintyAtMinimumPercent).toFixed(2) : '?'} %, and the terms other than the DP transmitter (discharge coefficient, diameters, density; see the hourly budget) already exceed the limit. A calibrated element with a stated uncertainty, a measured bore, or a wider limit is needed; changing the DP range will not do it.`,
    );
  }
  return out(
    'change-element',
    `Change the element for a smaller bore (lower β) so the low flows give more DP: at the lowest flow the DP is ${inUnit(minimum.differentialPressurePa, (low ?? top).unit)}, too little for any span to keep the flow within ${rc.uncertaintyLimitPercent} %. Check the pressure loss and the standard's β limits for the new element.`,
  );
}
