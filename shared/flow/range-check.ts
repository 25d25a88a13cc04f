/**
 * Range check of a meter run: for a flow range (minimum, normal, maximum) and one or two DP
 * transmitters, the DP at each flow, its share of each span, where each transmitter drops below
 * 10 % of span, the turndown each covers within a flow uncertainty limit, and a suggested
 * low-range span when one transmitter is not enough. Flow goes as √Δp: a 10:1 flow turndown
 * is a 100:1 DP turndown (TRADE.md §6).
 */
import { fluidState, type FluidSpec } from '../fluids';
import { fromSI, toSI } from '../units/convert-units';
import {
  dischargeCoefficientUncertaintyPercent,
  expansibilityUncertaintyPercent,
} from '../uncertainty/element-uncertainty';
import { diameterSensitivities } from '../uncertainty/flow-rate-uncertainty';
import { expandedAccuracyPercent, type AccuracyKind } from '../uncertainty/transmitter-uncertainty';
import {
  DENSITY_MODEL_UNCERTAINTY_PERCENT,
  ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
  PIPE_DIAMETER_UNCERTAINTY_PERCENT,
  sampleUncertaintyBreakdown,
  type PointTransmitter,
} from '../history/sample-uncertainty';
import { differentialPressureForMassFlow } from './differential-pressure-for-flow';
import { operatingPointWarnings } from './element-limits';
import { evaluateFlow, type FlowFluidProperties } from './evaluate-flow';
import type { ElementSpec, FlowWarning } from './flow-types';
import { prepareElement, type PreparedElement } from './prepare-element';
import { standardSpanAtOrBelow } from './standard-span';

export interface RangeCheckTransmitter {
  /** Upper range value (span from zero), Pa. */
  spanPa: number;
  /** Stated accuracy, percent of span (e.g. 0.075). */
  accuracyPercentOfSpan: number;
  /** Unit the transmitter is ranged in, for the suggested span (default kPa). */
  unit?: string;
  /** What kind of figure the accuracy is (hourly budget only; 'expanded-k2' when not given). */
  accuracyKind?: AccuracyKind;
}

export interface RangeCheckInput {
  element: ElementSpec;
  fluid: FluidSpec;
  conditions: { staticPressurePa: number; temperatureK: number };
  flowRange: { minimumKgPerS: number; normalKgPerS: number; maximumKgPerS: number };
  transmitters: RangeCheckTransmitter[];
  /** Expanded (k = 2) flow uncertainty the meter run must meet, percent (default 1). */
  uncertaintyLimitPercent?: number;
  /** Expanded uncertainties of the other inputs, percent (defaults 0: give the real ones). */
  pipeDiameterPercent?: number;
  elementDiameterPercent?: number;
  densityPercent?: number;
  /**
   * Work every flow uncertainty with the hourly records' budget (shared/history/sample-uncertainty.ts
   * sampleUncertaintyBreakdown): its diameter and density allowances (the three percents above are then
   * ignored), the transmitters' accuracy kinds, the static pressure and temperature transmitters given
   * here, and the widening of U(C) outside a calibrated cone's Re_D range. The range check screen and
   * range health both use it, so at the same flow they give what an hourly record gives.
   */
  hourlyBudget?: { staticPressureTransmitter?: PointTransmitter; temperatureTransmitter?: PointTransmitter };
}

export interface TransmitterAtFlow {
  shareOfSpanPercent: number;
  overRange: boolean;
  /** Below 10 % of span: the DP error as a share of the reading grows (DESIGN.md). */
  lowInRange: boolean;
  readingUncertaintyPercent: number;
  /** Expanded flow uncertainty with this transmitter, percent. */
  flowUncertaintyPercent: number;
}

export interface RangeCheckFlow {
  label: 'minimum' | 'normal' | 'maximum';
  massFlowKgPerS: number;
  differentialPressurePa: number;
  reynoldsNumber: number;
  dischargeCoefficient: number;
  expansibility: number;
  transmitters: TransmitterAtFlow[];
}

export interface TransmitterCoverage {
  spanPa: number;
  flowAtFullSpanKgPerS: number;
  flowAtTenPercentSpanKgPerS: number;
  /** Lowest flow at which the flow uncertainty stays within the limit; null if never. */
  minimumFlowWithinLimitKgPerS: number | null;
  /** flowAtFullSpan / minimumFlowWithinLimit; null if the limit is never met. */
  turndown: number | null;
  coversMinimumFlow: boolean;
  coversMaximumFlow: boolean;
}

export interface RangeCheckResult {
  beta: number;
  densityKgPerM3: number;
  uncertaintyLimitPercent: number;
  flows: RangeCheckFlow[];
  transmitters: TransmitterCoverage[];
  /** One transmitter (or the pair) covers minimum to maximum within the limit. */
  rangeCovered: boolean;
  suggestedLowRangeSpan: { value: number; unit: string; spanPa: number; minimumFlowWithinLimitKgPerS: number } | null;
  warnings: FlowWarning[];
}

/** Context shared by the range-check helpers. */
interface Context {
  element: PreparedElement;
  fluid: FlowFluidProperties;
  input: RangeCheckInput;
  limit: number;
}

/** Expanded flow uncertainty (percent) from everything except the DP transmitter, at a DP. */
function otherUncertaintyPercent(ctx: Context, dp: number, reynoldsNumber: number): number {
  const { element, input, fluid } = ctx;
  if (input.hourlyBudget) {
    // The hourly budget without its DP term (the DP term is added per transmitter).
    const budget = hourlyBudget(ctx, dp, reynoldsNumber, { spanPa: 1, accuracyPercentOfSpan: 0 });
    const rest = budget.contributions.filter((c) => c.name !== 'differentialPressure');
    return Math.sqrt(rest.reduce((a, c) => a + c.percent * c.percent, 0));
  }
  const uC = dischargeCoefficientUncertaintyPercent({
    kind: element.kind,
    beta: element.beta,
    pipeDiameterM: element.pipeDiameterM,
    reynoldsNumber,
    venturiType: input.element.venturiType,
    nozzleType: input.element.nozzleType,
    // The same rule as the hourly budget (shared/history/sample-uncertainty.ts): a curve or a fixed C
    // from a calibration takes the certificate's U(C) when it is given.
    calibrated: input.element.calibration !== undefined || input.element.dischargeCoefficientCalibrated === true,
    certificateUncertaintyPercent:
      input.element.calibration !== undefined || input.element.dischargeCoefficientCalibrated === true
        ? input.element.calibrationUncertaintyPercent
        : undefined,
  });
  const uEps = expansibilityUncertaintyPercent(
    element.kind,
    element.beta,
    dp,
    input.conditions.staticPressurePa,
    fluid.isentropicExponent,
    fluid.compressible,
  );
  const s = diameterSensitivities(element.kind, element.beta);
  const uD = s.pipe * (input.pipeDiameterPercent ?? 0);
  const ud = s.element * (input.elementDiameterPercent ?? 0);
  const uRho = 0.5 * (input.densityPercent ?? 0);
  return Math.sqrt(uC * uC + uEps * uEps + uD * uD + ud * ud + uRho * uRho);
}

/** The hourly records' budget (sample-uncertainty.ts) at a DP with one transmitter. */
function hourlyBudget(ctx: Context, dp: number, reynoldsNumber: number, t: RangeCheckTransmitter) {
  const { element, input, fluid } = ctx;
  return sampleUncertaintyBreakdown({
    element,
    spec: input.element,
    fluidKind: input.fluid.kind,
    reynoldsNumber,
    differentialPressurePa: dp,
    staticPressurePa: input.conditions.staticPressurePa,
    isentropicExponent: fluid.isentropicExponent,
    compressible: fluid.compressible,
    accuracyPercentOfSpan: t.accuracyPercentOfSpan,
    spanPa: t.spanPa,
    accuracyKind: t.accuracyKind,
    staticPressureTransmitter: input.hourlyBudget?.staticPressureTransmitter,
    temperatureTransmitter: input.hourlyBudget?.temperatureTransmitter,
    temperatureK: input.conditions.temperatureK,
  });
}

/** The hourly budget's allowances, for callers that show them (the same constants the hourly records use). */
export const HOURLY_BUDGET_ALLOWANCES_PERCENT = Object.freeze({
  pipeDiameter: PIPE_DIAMETER_UNCERTAINTY_PERCENT,
  elementDiameter: ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
  density: DENSITY_MODEL_UNCERTAINTY_PERCENT,
});

/** Flow uncertainty with one transmitter at a DP: the other inputs plus ½ × the reading uncertainty. */
function flowUncertaintyPercent(
  ctx: Context,
  t: RangeCheckTransmitter,
  dp: number,
  reynoldsNumber: number,
): { reading: number; flow: number } {
  if (ctx.input.hourlyBudget && dp > 0) {
    const budget = hourlyBudget(ctx, dp, reynoldsNumber, t);
    const dpTerm = budget.contributions.find((c) => c.name === 'differentialPressure');
    return { reading: dpTerm ? dpTerm.percent / dpTerm.sensitivity : 0, flow: budget.expandedPercent };
  }
  const reading = dp > 0 ? (t.accuracyPercentOfSpan * t.spanPa) / dp : Infinity;
  const other = otherUncertaintyPercent(ctx, dp, reynoldsNumber);
  return { reading, flow: Math.hypot(other, 0.5 * reading) };
}

/** The transmitter's accuracy as an expanded (k = 2) figure: converted by its kind in the hourly budget only. */
function expandedAccuracy(ctx: Context, t: RangeCheckTransmitter): number {
  return ctx.input.hourlyBudget
    ? expandedAccuracyPercent(t.accuracyPercentOfSpan, t.accuracyKind ?? 'expanded-k2')
    : t.accuracyPercentOfSpan;
}

/** Lowest DP at which a transmitter keeps the flow within the limit, or null (fixed-point on the other uncertainties). */
function minimumDpWithinLimit(ctx: Context, accuracyPercentOfSpan: number, spanPa: number): number | null {
  let dp = spanPa;
  for (let i = 0; i < 50; i++) {
    const re = evaluateFlow(ctx.element, dp, ctx.input.conditions.staticPressurePa, ctx.fluid).reynoldsNumber;
    const other = otherUncertaintyPercent(ctx, dp, re);
    if (other >= ctx.limit) return null;
    const next = (0.5 * accuracyPercentOfSpan * spanPa) / Math.sqrt(ctx.limit * ctx.limit - other * other);
    if (Math.abs(next - dp) <= 1e-10 * next) return next;
    dp = next;
  }
  return dp;
}

/**
 * Range check with the fluid properties already known at the line conditions.
 * @param input meter run, flow range, transmitters and the uncertainty limit
 * @param fluid density, viscosity, κ and compressibility at the line conditions
 * @returns DPs, shares of span, coverage, turndown and a suggested low-range span
 */
export function rangeCheckWithFluid(
  input: RangeCheckInput,
  fluid: FlowFluidProperties & { warnings?: FlowWarning[] },
): RangeCheckResult {
  const { minimumKgPerS, normalKgPerS, maximumKgPerS } = input.flowRange;
  if (!(minimumKgPerS > 0 && minimumKgPerS <= normalKgPerS && normalKgPerS <= maximumKgPerS)) {
    throw new Error(
      `rangeCheck: flowRange needs 0 < minimumKgPerS ≤ normalKgPerS ≤ maximumKgPerS (got ${minimumKgPerS}, ${normalKgPerS}, ${maximumKgPerS})`,
    );
  }
  if (!(input.transmitters.length >= 1 && input.transmitters.length <= 2))
    throw new Error(`rangeCheck: transmitters must hold one or two DP transmitters (got ${input.transmitters.length})`);
  input.transmitters.forEach((t, i) => {
    if (!(t.spanPa > 0) || !(t.accuracyPercentOfSpan > 0))
      throw new Error(`rangeCheck: transmitters.${i} needs spanPa > 0 and accuracyPercentOfSpan > 0`);
  });
  const limit = input.uncertaintyLimitPercent ?? 1;
  if (!(limit > 0)) throw new Error(`rangeCheck: uncertaintyLimitPercent must be > 0 (got ${limit})`);
  const p1 = input.conditions.staticPressurePa;
  const element = prepareElement(input.element, input.conditions.temperatureK);
  const ctx: Context = { element, fluid, input, limit };
  const warnings: FlowWarning[] = [...(fluid.warnings ?? []), ...element.warnings];

  const flows: RangeCheckFlow[] = (['minimum', 'normal', 'maximum'] as const).map((label) => {
    const qm = input.flowRange[`${label}KgPerS` as const];
    const s = differentialPressureForMassFlow(element, qm, p1, fluid);
    for (const w of operatingPointWarnings(
      element.limits,
      element.beta,
      element.pipeDiameterM,
      s.reynoldsNumber,
      fluid.compressible ? (p1 - s.differentialPressurePa) / p1 : null,
    )) {
      warnings.push({ code: w.code, message: `at the ${label} flow: ${w.message}` });
    }
    return {
      label,
      massFlowKgPerS: qm,
      differentialPressurePa: s.differentialPressurePa,
      reynoldsNumber: s.reynoldsNumber,
      dischargeCoefficient: s.dischargeCoefficient,
      expansibility: s.expansibility,
      transmitters: input.transmitters.map((t) => {
        const u = flowUncertaintyPercent(ctx, t, s.differentialPressurePa, s.reynoldsNumber);
        const share = (s.differentialPressurePa / t.spanPa) * 100;
        return {
          shareOfSpanPercent: share,
          overRange: share > 100,
          lowInRange: share < 10,
          readingUncertaintyPercent: u.reading,
          flowUncertaintyPercent: u.flow,
        };
      }),
    };
  });

  const flowAt = (dp: number) => evaluateFlow(element, Math.min(dp, p1 * 0.999999), p1, fluid).massFlowKgPerS;
  const transmitters: TransmitterCoverage[] = input.transmitters.map((t) => {
    const dpMin = minimumDpWithinLimit(ctx, expandedAccuracy(ctx, t), t.spanPa);
    const flowAtFullSpanKgPerS = flowAt(t.spanPa);
    const minimumFlowWithinLimitKgPerS = dpMin !== null && dpMin <= t.spanPa ? flowAt(dpMin) : null;
    return {
      spanPa: t.spanPa,
      flowAtFullSpanKgPerS,
      flowAtTenPercentSpanKgPerS: flowAt(0.1 * t.spanPa),
      minimumFlowWithinLimitKgPerS,
      turndown: minimumFlowWithinLimitKgPerS ? flowAtFullSpanKgPerS / minimumFlowWithinLimitKgPerS : null,
      coversMinimumFlow:
        minimumFlowWithinLimitKgPerS !== null && minimumFlowWithinLimitKgPerS <= minimumKgPerS * (1 + 1e-12),
      coversMaximumFlow: flowAtFullSpanKgPerS >= maximumKgPerS * (1 - 1e-12),
    };
  });

  // Covered when some transmitter reaches the maximum flow and, going down, each one's lower
  // limit is picked up by another until the minimum flow is reached.
  const byRange = [...transmitters].sort((a, b) => b.spanPa - a.spanPa);
  let reach = Infinity; // lowest flow covered so far, starting from the top
  let rangeCovered = byRange.length > 0 && byRange[0].coversMaximumFlow;
  for (const t of byRange) {
    if (!rangeCovered || t.minimumFlowWithinLimitKgPerS === null) continue;
    if (t.flowAtFullSpanKgPerS >= Math.min(reach, maximumKgPerS) * (1 - 1e-12))
      reach = Math.min(reach, t.minimumFlowWithinLimitKgPerS);
  }
  rangeCovered = rangeCovered && reach <= minimumKgPerS * (1 + 1e-12);

  let suggestedLowRangeSpan: RangeCheckResult['suggestedLowRangeSpan'] = null;
  if (!rangeCovered) {
    // The largest span whose lower limit (within the uncertainty limit) is at or below the DP of
    // the minimum flow: ½·acc·span/dp(min) = sqrt(limit² − other²).
    const high = [...input.transmitters].sort((a, b) => b.spanPa - a.spanPa)[0];
    const dpAtMinimum = flows[0].differentialPressurePa;
    const other = otherUncertaintyPercent(ctx, dpAtMinimum, flows[0].reynoldsNumber);
    if (other < limit) {
      const spanLimitPa =
        (dpAtMinimum * Math.sqrt(limit * limit - other * other)) / (0.5 * expandedAccuracy(ctx, high));
      const unit = high.unit ?? 'kPa';
      const value = standardSpanAtOrBelow(fromSI(Math.min(spanLimitPa, high.spanPa), unit));
      const spanPa = toSI(value, unit);
      const dpMin = minimumDpWithinLimit(ctx, expandedAccuracy(ctx, high), spanPa);
      suggestedLowRangeSpan = {
        value,
        unit,
        spanPa,
        minimumFlowWithinLimitKgPerS: dpMin !== null ? flowAt(dpMin) : NaN,
      };
    }
  }
  return {
    beta: element.beta,
    densityKgPerM3: fluid.densityKgPerM3,
    uncertaintyLimitPercent: limit,
    flows,
    transmitters,
    rangeCovered,
    suggestedLowRangeSpan,
    warnings,
  };
}

/**
 * Range check of a meter run (fluid properties from shared/fluids at the line conditions).
 * @param input meter run, flow range, transmitters and the uncertainty limit
 * @returns see rangeCheckWithFluid
 */
export function rangeCheck(input: RangeCheckInput): RangeCheckResult {
  const state = fluidState(input.fluid, input.conditions.staticPressurePa, input.conditions.temperatureK);
  return rangeCheckWithFluid(input, state);
}

/**
 * Points (flow, DP, flow uncertainty per transmitter) for a plot, log-spaced in flow from
 * maximum/fromTurndown to the maximum flow.
 * @param input as for rangeCheckWithFluid
 * @param fluid fluid properties
 * @param count number of points (≥ 2, default 50)
 * @param fromTurndown lowest flow as a fraction of the maximum, as maximum/fromTurndown (default 20)
 * @returns points; a transmitter's uncertainty is null where it is over range
 */
export function rangeCheckCurve(
  input: RangeCheckInput,
  fluid: FlowFluidProperties,
  count = 50,
  fromTurndown = 20,
): { massFlowKgPerS: number; differentialPressurePa: number; flowUncertaintyPercent: (number | null)[] }[] {
  if (!(count >= 2)) throw new Error(`rangeCheckCurve: count must be ≥ 2 (got ${count})`);
  const element = prepareElement(input.element, input.conditions.temperatureK);
  const ctx: Context = { element, fluid, input, limit: input.uncertaintyLimitPercent ?? 1 };
  const top = input.flowRange.maximumKgPerS;
  const points = [];
  for (let i = 0; i < count; i++) {
    const qm = top * Math.pow(fromTurndown, i / (count - 1) - 1);
    const s = differentialPressureForMassFlow(element, qm, input.conditions.staticPressurePa, fluid);
    points.push({
      massFlowKgPerS: qm,
      differentialPressurePa: s.differentialPressurePa,
      flowUncertaintyPercent: input.transmitters.map((t) =>
        s.differentialPressurePa > t.spanPa
          ? null
          : flowUncertaintyPercent(ctx, t, s.differentialPressurePa, s.reynoldsNumber).flow,
      ),
    });
  }
  return points;
}
