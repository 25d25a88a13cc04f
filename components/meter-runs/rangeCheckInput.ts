/**
 * Turns the range check form into shared/flow's RangeCheckInput, checking it with the shared
 * zod schemas (shared/schemas/flow-case.ts and setup.ts) so a field is refused for the same
 * reason the server would refuse it, and naming the form field at fault. Then runs the check
 * in the browser (shared/flow rangeCheck and rangeCheckCurve).
 */
import {
  differentialPressureFromDisplay,
  flowRateUnit,
  massFlowFromDisplay,
  staticPressureFromDisplay,
  temperatureFromDisplay,
  unitsFor,
  type FlowRateUnit,
} from '@/constants/units-display';
import { fluidState, type FluidSpec, type FluidState } from '@/shared/fluids';
import {
  rangeCheck,
  rangeCheckCurve,
  type ElementSpec,
  type RangeCheckInput,
  type RangeCheckResult,
} from '@/shared/flow';
import {
  elementSpecSchema,
  flowCaseErrorFromEngine,
  flowConditionsSchema,
  fluidSpecSchema,
} from '@/shared/schemas/flow-case';
import { transmitterSchema } from '@/shared/schemas/setup';
import type { RangeCheckValues } from './rangeCheckValues';
import { densityFromDisplay, expansionFromDisplay } from './rangeCheckUnits';

/** Form fields that can carry a problem; `span0`/`accuracy1` are the transmitters' fields. */
export type RangeCheckField =
  | 'elementKind'
  | 'pipeDiameter'
  | 'boreDiameter'
  | 'coneDiameter'
  | 'dischargeCoefficient'
  | 'composition'
  | 'molarMass'
  | 'compressibility'
  | 'isentropicExponent'
  | 'viscosity'
  | 'liquidDensity'
  | 'liquidReferenceTemperature'
  | 'liquidExpansion'
  | 'staticPressure'
  | 'temperature'
  | 'minimumFlow'
  | 'normalFlow'
  | 'maximumFlow'
  | 'uncertaintyLimit'
  | `span${number}`
  | `accuracy${number}`
  | 'form';

export type Problems = Partial<Record<RangeCheckField, string>>;

export interface RangeCheckRun {
  input: RangeCheckInput;
  result: RangeCheckResult;
  curve: ReturnType<typeof rangeCheckCurve>;
  flowUnit: FlowRateUnit;
  /** Density at the site's base conditions, to show flows as volumes; null if unknown. */
  baseDensityKgPerM3: number | null;
}

/** Where a path of the element or fluid schema lands on the form. */
const elementFields: Record<string, RangeCheckField> = {
  pipeDiameterM: 'pipeDiameter',
  boreDiameterM: 'boreDiameter',
  coneDiameterM: 'coneDiameter',
  dischargeCoefficient: 'dischargeCoefficient',
  calibration: 'dischargeCoefficient',
  taps: 'elementKind',
  method: 'elementKind',
  expansionReference: 'elementKind',
  venturiType: 'elementKind',
  nozzleType: 'elementKind',
};
const fluidFields: Record<string, RangeCheckField> = {
  composition: 'composition',
  molarMassKgPerMol: 'molarMass',
  compressibility: 'compressibility',
  isentropicExponent: 'isentropicExponent',
  viscosityPaS: 'viscosity',
  densityKgPerM3: 'liquidDensity',
  referenceTemperatureK: 'liquidReferenceTemperature',
  expansionPerK: 'liquidExpansion',
};

/** Thousands grouped by commas ("4,000", "12,500.5"); any other comma is not read as a number. */
const commaGrouped = /^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/;

/**
 * Reads a typed number; blank is `undefined` (optional fields), anything else not a number is NaN.
 * A comma counts only as a thousands separator in whole groups of three: "4,5" is refused rather
 * than silently read as 45 (a decimal comma typed out of habit would be off by a factor of ten).
 */
function numberOf(text: string): number | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return undefined;
  if (trimmed.includes(',')) return commaGrouped.test(trimmed) ? Number(trimmed.replace(/,/g, '')) : NaN;
  return Number(trimmed);
}

/** "methane 0.965222" per line (also "methane: 0.965222", "CO2=0.02" or "Carbon Dioxide 0.02"). */
function parseComposition(text: string): Record<string, number> | string {
  const composition: Record<string, number> = {};
  for (const line of text
    .split(/\n|;/)
    .map((l) => l.trim())
    .filter(Boolean)) {
    const match = /^([A-Za-z0-9 _-]+?)\s*[:=\s]\s*([0-9.eE+-]+)$/.exec(line);
    if (!match) return `Write one component per line, e.g. "methane 0.965222" (not "${line}").`;
    // Names go to the flow case's schema as typed: it reads every spelling the fluids module accepts.
    const name = match[1].trim();
    if (name in composition) return `${name} is given twice.`;
    composition[name] = Number(match[2]);
  }
  return composition;
}

/**
 * @param values the form
 * @returns the problems found (empty when the check can run) and, when none, the run
 */
export function runRangeCheck(values: RangeCheckValues): { problems: Problems; run: RangeCheckRun | null } {
  const problems: Problems = {};
  const set = unitsFor(values.displayUnits);
  const need = (field: RangeCheckField, text: string, optional = false): number | undefined => {
    const value = numberOf(text);
    if (value === undefined && !optional) problems[field] = 'Enter a number.';
    else if (value !== undefined && !Number.isFinite(value)) problems[field] = `“${text}” is not a number.`;
    return value !== undefined && Number.isFinite(value) ? value : undefined;
  };
  const mm = set.length.metresPerUnit;

  // Element: the flow case's own schema.
  const pipe = need('pipeDiameter', values.pipeDiameter);
  const bore = values.elementKind === 'cone' ? undefined : need('boreDiameter', values.boreDiameter);
  const cone = values.elementKind === 'cone' ? need('coneDiameter', values.coneDiameter) : undefined;
  const fixedC = need('dischargeCoefficient', values.dischargeCoefficient, true);
  const elementDraft: Record<string, unknown> = {
    ...values.elementExtras,
    kind: values.elementKind,
    pipeDiameterM: pipe === undefined ? undefined : pipe * mm,
    ...(values.elementKind === 'orifice' ? { taps: values.taps } : {}),
    // The method of a prefilled meter run, or the what-if's choice (ISO 5167-2 is the schema's default).
    ...(values.elementKind === 'orifice' && values.orificeMethod === 'api-14.3'
      ? { method: 'api-14.3', expansionReference: values.expansionReference }
      : {}),
    ...(values.elementKind === 'venturi' ? { venturiType: values.venturiType } : {}),
    ...(values.elementKind === 'nozzle' ? { nozzleType: values.nozzleType } : {}),
    ...(bore !== undefined ? { boreDiameterM: bore * mm } : {}),
    ...(cone !== undefined ? { coneDiameterM: cone * mm } : {}),
    ...(fixedC !== undefined ? { dischargeCoefficient: fixedC } : {}),
  };
  if (values.elementKind !== 'cone') delete elementDraft.calibration;
  let element: ElementSpec | null = null;
  if (pipe !== undefined && (bore !== undefined || cone !== undefined)) {
    const parsed = elementSpecSchema.safeParse(elementDraft);
    if (parsed.success) element = parsed.data as ElementSpec;
    else {
      for (const issue of parsed.error.issues) {
        const field = elementFields[String(issue.path[0])] ?? 'elementKind';
        // The schema says it in metres; the form is in mm or in.
        const message = /must be below pipeDiameterM/.test(issue.message)
          ? `Must be smaller than the pipe diameter D (${values.pipeDiameter} ${set.length.label}).`
          : issue.message;
        problems[field] ??= message;
      }
    }
  }

  // Fluid: the flow case's own schema.
  let fluidDraft: Record<string, unknown> = { kind: values.fluidKind };
  const kappa = need('isentropicExponent', values.isentropicExponent, true);
  const viscosityMilli = need('viscosity', values.viscosity, true);
  const overrides = {
    ...(kappa !== undefined ? { isentropicExponent: kappa } : {}),
    ...(viscosityMilli !== undefined ? { viscosityPaS: viscosityMilli / 1000 } : {}),
  };
  if (values.fluidKind === 'natural-gas') {
    const composition = parseComposition(values.composition);
    if (typeof composition === 'string') problems.composition = composition;
    else fluidDraft = { ...fluidDraft, composition };
  } else if (values.fluidKind === 'ideal-gas') {
    const molarMass = need('molarMass', values.molarMass);
    fluidDraft = {
      ...fluidDraft,
      molarMassKgPerMol: molarMass === undefined ? undefined : molarMass / 1000,
      compressibility: need('compressibility', values.compressibility, true),
    };
  } else if (values.fluidKind === 'liquid') {
    const referenceTemperature = need('liquidReferenceTemperature', values.liquidReferenceTemperature);
    const density = need('liquidDensity', values.liquidDensity);
    const expansion = need('liquidExpansion', values.liquidExpansion);
    fluidDraft = {
      ...fluidDraft,
      densityKgPerM3: density === undefined ? undefined : densityFromDisplay(density, values.displayUnits),
      referenceTemperatureK:
        referenceTemperature === undefined ? undefined : temperatureFromDisplay(referenceTemperature, set),
      expansionPerK: expansion === undefined ? 0 : expansionFromDisplay(expansion, values.displayUnits),
    };
  }
  let fluid: FluidSpec | null = null;
  const parsedFluid = fluidSpecSchema.safeParse({ ...fluidDraft, ...overrides });
  if (parsedFluid.success) fluid = parsedFluid.data as FluidSpec;
  else
    for (const issue of parsedFluid.error.issues)
      problems[fluidFields[String(issue.path[0])] ?? 'composition'] ??= issue.message;

  // Transmitters: the set-up schema, as if each were a DP transmitter ranged from zero.
  const transmitters = values.transmitters.map((t, i) => {
    const span = need(`span${i}`, t.span);
    const accuracy = need(`accuracy${i}`, t.accuracy);
    if (span === undefined || accuracy === undefined) return null;
    const parsed = transmitterSchema.safeParse({
      meterRunId: '1',
      tag: 'RANGE-CHECK',
      measures: 'differential-pressure',
      unit: set.differentialPressure.unit,
      lowerRange: 0,
      upperRange: span,
      accuracyPercentOfSpan: accuracy,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] === 'accuracyPercentOfSpan' ? `accuracy${i}` : `span${i}`;
        problems[field as RangeCheckField] ??=
          issue.path[0] === 'upperRange' ? 'The span must be above zero.' : issue.message;
      }
      return null;
    }
    return {
      spanPa: differentialPressureFromDisplay(span, set),
      accuracyPercentOfSpan: accuracy,
      unit: set.differentialPressure.unit,
    };
  });

  // Conditions: the flow case's schema, with the largest span as the DP it must stay below.
  const pressure = need('staticPressure', values.staticPressure);
  const temperature = need('temperature', values.temperature);
  const staticPressurePa =
    pressure === undefined ? undefined : staticPressureFromDisplay(pressure, set, values.atmosphericPressurePa);
  const temperatureK = temperature === undefined ? undefined : temperatureFromDisplay(temperature, set);
  const largest = transmitters.reduce<{ i: number; spanPa: number } | null>(
    (best, t, i) => (t && (!best || t.spanPa > best.spanPa) ? { i, spanPa: t.spanPa } : best),
    null,
  );
  if (staticPressurePa !== undefined && temperatureK !== undefined) {
    const parsed = flowConditionsSchema.safeParse({
      differentialPressurePa: largest?.spanPa ?? 1,
      staticPressurePa,
      temperatureK,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const path = String(issue.path[0]);
        if (path === 'staticPressurePa') problems.staticPressure ??= 'The absolute pressure must be above zero.';
        else if (path === 'temperatureK') problems.temperature ??= 'Below absolute zero.';
        else if (largest) problems[`span${largest.i}`] ??= 'The span must be below the absolute static pressure.';
      }
    }
  }

  const limit = need('uncertaintyLimit', values.uncertaintyLimit);
  if (limit !== undefined && !(limit > 0 && limit < 100))
    problems.uncertaintyLimit = 'Give a limit between 0 and 100 %.';

  // Flows: in the chosen unit; a volume at base conditions needs the fluid's base density.
  const flowUnit = flowRateUnit(values.flowUnitKey);
  const flows = (['minimumFlow', 'normalFlow', 'maximumFlow'] as const).map((field) => {
    const value = need(field, values[field]);
    if (value !== undefined && !(value > 0)) problems[field] = 'The flow must be above zero.';
    return value;
  });
  if (flows.every((f) => f !== undefined && f > 0)) {
    const [minimum, normal, maximum] = flows as number[];
    if (normal < minimum) problems.normalFlow ??= 'The normal flow must not be below the minimum.';
    if (maximum < normal) problems.maximumFlow ??= 'The maximum flow must not be below the normal flow.';
  }

  if (
    Object.keys(problems).length > 0 ||
    !element ||
    !fluid ||
    staticPressurePa === undefined ||
    temperatureK === undefined ||
    limit === undefined
  ) {
    return { problems, run: null };
  }

  let state: FluidState;
  let baseDensityKgPerM3: number | null = null;
  try {
    state = fluidState(fluid, staticPressurePa, temperatureK, {
      pressurePa: values.basePressurePa,
      temperatureK: values.baseTemperatureK,
    });
    baseDensityKgPerM3 = state.baseDensityKgPerM3;
  } catch (error) {
    return { problems: { [fieldOfEngineError(error)]: messageOf(error) }, run: null };
  }
  let massFlows: number[];
  try {
    massFlows = (flows as number[]).map((value) => massFlowFromDisplay(value, flowUnit, baseDensityKgPerM3));
  } catch (error) {
    return { problems: { minimumFlow: messageOf(error) }, run: null };
  }

  const input: RangeCheckInput = {
    element,
    fluid,
    conditions: { staticPressurePa, temperatureK },
    flowRange: { minimumKgPerS: massFlows[0], normalKgPerS: massFlows[1], maximumKgPerS: massFlows[2] },
    transmitters: transmitters.filter((t): t is NonNullable<typeof t> => t !== null),
    uncertaintyLimitPercent: limit,
    // The hourly records' budget (diameters, density model, U(C) rules), so the U at a flow here is
    // the U range health and an hourly record give at that flow, with the meter run's P and T
    // transmitters when the form was prefilled from one.
    hourlyBudget: {
      staticPressureTransmitter: values.budgetTransmitters?.staticPressure,
      temperatureTransmitter: values.budgetTransmitters?.temperature,
    },
  };
  try {
    const result = rangeCheck(input);
    // Plot from a little below the minimum flow, so the low end of the range is in view.
    const fromTurndown = Math.min(1000, Math.max(10, (1.6 * massFlows[2]) / massFlows[0]));
    const curve = rangeCheckCurve(input, state, 80, fromTurndown);
    return { problems: {}, run: { input, result, curve, flowUnit, baseDensityKgPerM3 } };
  } catch (error) {
    return { problems: { [fieldOfEngineError(error)]: messageOf(error) }, run: null };
  }
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** The form field an engine error is about (its message names the case's field). */
function fieldOfEngineError(error: unknown): RangeCheckField {
  const { field, message } = flowCaseErrorFromEngine(error);
  if (/massFlowKgPerS/.test(message)) return 'maximumFlow';
  if (!field) return 'form';
  const [head, name] = field.split('.');
  if (head === 'element') return elementFields[name] ?? 'elementKind';
  if (head === 'fluid') return fluidFields[name] ?? 'composition';
  if (name === 'staticPressurePa') return 'staticPressure';
  if (name === 'temperatureK') return 'temperature';
  return 'form';
}
