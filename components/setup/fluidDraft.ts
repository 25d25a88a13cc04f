/**
 * A meter run's fluid as typed in a form and back: the draft becomes the fluid of a
 * calculation case (shared/schemas/flow-case.ts fluidSpecSchema), which the shared schema then
 * checks (for natural gas: known components, fractions 0–1 adding up to 1 within 0.01).
 */
import type { FluidSpec } from '@/shared/fluids/fluid-types';
import { DETAIL_COMPONENTS, type DetailComponent } from '@/shared/fluids/aga8/detail-constants';
import { convertNumberText, numberText, parseNumberText } from './formFields';
import { fromSI, optionalToSI } from './unitChoices';

export type FluidKind = FluidSpec['kind'];

export interface FluidDraft {
  kind: FluidKind;
  /** Natural gas: amount of each component as typed, as a mole fraction or in mol %. */
  composition: Partial<Record<DetailComponent, string>>;
  compositionUnit: 'fraction' | 'percent';
  /** Ideal gas. */
  molarMassGPerMol: string;
  compressibility: string;
  /** Liquid. */
  densityKgPerM3: string;
  referenceTemperatureC: string;
  expansionPerK: string;
  /** Optional overrides of computed properties. */
  isentropicExponent: string;
  viscosityPaS: string;
}

export const emptyFluidDraft: FluidDraft = {
  kind: 'natural-gas',
  composition: {},
  compositionUnit: 'fraction',
  molarMassGPerMol: '',
  compressibility: '',
  densityKgPerM3: '',
  referenceTemperatureC: '15',
  expansionPerK: '',
  isentropicExponent: '',
  viscosityPaS: '',
};

/** The components most gas analyses report, shown first; the other DETAIL components on request. */
export const commonComponents: readonly DetailComponent[] = [
  'methane',
  'ethane',
  'propane',
  'isobutane',
  'n-butane',
  'isopentane',
  'n-pentane',
  'n-hexane',
  'nitrogen',
  'carbon-dioxide',
  'hydrogen-sulfide',
];
export const otherComponents: readonly DetailComponent[] = DETAIL_COMPONENTS.filter(
  (name) => !commonComponents.includes(name),
);

/** 1 mol % = 0.01 mole fraction; 1 g/mol = 1e-3 kg/mol (the SI prefix milli). */
const fractionPerPercent = 0.01;
const kilogramsPerGram = 1e-3;

/**
 * @param draft the form's fluid
 * @returns the mole fractions typed, by component (NaN where the text is not a number)
 */
export function compositionFromDraft(draft: FluidDraft): Record<string, number> {
  const composition: Record<string, number> = {};
  for (const [name, text] of Object.entries(draft.composition)) {
    const value = parseNumberText(text ?? '');
    if (value === undefined) continue;
    composition[name] = draft.compositionUnit === 'percent' ? value * fractionPerPercent : value;
  }
  return composition;
}

/** How far a typed composition's sum may be from a whole (1 or 100) and still be read as one. */
const wholeTolerance = 0.05;

/**
 * The unit the numbers typed add up in: about 1 as mole fractions, about 100 in mol %; undefined
 * when they add up to neither (a composition still being typed).
 * @param draft the form's fluid
 */
export function compositionUnitOfSum(draft: FluidDraft): FluidDraft['compositionUnit'] | undefined {
  let sum = 0;
  for (const text of Object.values(draft.composition)) {
    const value = parseNumberText(text ?? '');
    if (value !== undefined && Number.isFinite(value)) sum += value;
  }
  if (Math.abs(sum - 1) <= wholeTolerance) return 'fraction';
  if (Math.abs(sum - 100) <= 100 * wholeTolerance) return 'percent';
  return undefined;
}

/**
 * A new unit for the composition, converted once: each amount keeps its meaning (mol % =
 * 100 × mole fraction). When the numbers typed already add up to about 100 and mol % is chosen
 * (or to about 1 and mole fraction), they were typed in that unit before it was chosen: only
 * the unit changes, the numbers stay as typed.
 * @param draft the form's fluid
 * @param unit the unit chosen
 * @returns the draft in that unit
 */
export function switchCompositionUnit(draft: FluidDraft, unit: FluidDraft['compositionUnit']): FluidDraft {
  if (unit === draft.compositionUnit) return draft;
  if (compositionUnitOfSum(draft) === unit) return { ...draft, compositionUnit: unit };
  const toUnit = (value: number) => (unit === 'percent' ? value / fractionPerPercent : value * fractionPerPercent);
  const composition = Object.fromEntries(
    Object.entries(draft.composition).map(([name, text]) => [name, convertNumberText(text ?? '', toUnit)]),
  );
  return { ...draft, compositionUnit: unit, composition };
}

/**
 * @param draft the form's fluid
 * @returns the fluid spec to validate and send
 */
export function fluidFromDraft(draft: FluidDraft): Record<string, unknown> {
  const overrides: Record<string, number> = {};
  const kappa = parseNumberText(draft.isentropicExponent);
  if (kappa !== undefined) overrides.isentropicExponent = kappa;
  const viscosity = parseNumberText(draft.viscosityPaS);
  if (viscosity !== undefined) overrides.viscosityPaS = viscosity;

  switch (draft.kind) {
    case 'natural-gas':
      return { kind: 'natural-gas', composition: compositionFromDraft(draft), ...overrides };
    case 'ideal-gas': {
      const molarMass = parseNumberText(draft.molarMassGPerMol);
      const compressibility = parseNumberText(draft.compressibility);
      return {
        kind: 'ideal-gas',
        molarMassKgPerMol: molarMass === undefined ? undefined : molarMass * kilogramsPerGram,
        ...(compressibility === undefined ? {} : { compressibility }),
        ...overrides,
      };
    }
    case 'liquid':
      return {
        kind: 'liquid',
        densityKgPerM3: parseNumberText(draft.densityKgPerM3),
        referenceTemperatureK: optionalToSI(parseNumberText(draft.referenceTemperatureC), 'degC'),
        expansionPerK: parseNumberText(draft.expansionPerK),
        ...overrides,
      };
    default:
      return { kind: draft.kind, ...overrides };
  }
}

/**
 * @param fluid a fluid as the server stores it
 * @returns the form's draft of it
 */
export function draftFromFluid(fluid: FluidSpec): FluidDraft {
  const draft: FluidDraft = {
    ...emptyFluidDraft,
    kind: fluid.kind,
    isentropicExponent: numberText(fluid.isentropicExponent),
    viscosityPaS: numberText(fluid.viscosityPaS),
  };
  if (fluid.kind === 'natural-gas') {
    draft.composition = Object.fromEntries(
      Object.entries(fluid.composition).map(([name, fraction]) => [name, numberText(fraction)]),
    );
  } else if (fluid.kind === 'ideal-gas') {
    draft.molarMassGPerMol = numberText(fluid.molarMassKgPerMol / kilogramsPerGram);
    draft.compressibility = numberText(fluid.compressibility);
  } else if (fluid.kind === 'liquid') {
    draft.densityKgPerM3 = numberText(fluid.densityKgPerM3);
    draft.referenceTemperatureC = numberText(fromSI(fluid.referenceTemperatureK, 'degC'));
    draft.expansionPerK = numberText(fluid.expansionPerK);
  }
  return draft;
}

const kindWords: Record<FluidKind, string> = {
  'natural-gas': 'natural gas',
  'ideal-gas': 'ideal gas',
  steam: 'steam',
  water: 'water',
  liquid: 'liquid',
};

/** @returns a line such as "natural gas, 10 components" for lists */
export function describeFluid(fluid: FluidSpec | undefined): string {
  if (!fluid) return 'no fluid';
  if (fluid.kind === 'natural-gas')
    return `${kindWords[fluid.kind]}, ${Object.keys(fluid.composition).length} components`;
  if (fluid.kind === 'ideal-gas')
    return `${kindWords[fluid.kind]}, M ${numberText(fluid.molarMassKgPerMol / kilogramsPerGram)} g/mol`;
  if (fluid.kind === 'liquid') return `${kindWords[fluid.kind]}, ${numberText(fluid.densityKgPerM3)} kg/m³`;
  return kindWords[fluid.kind];
}
