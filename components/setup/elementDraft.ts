/**
 * A primary element as typed in a form (text, diameters in mm or inches) and back: the draft
 * becomes the element of a calculation case (shared/schemas/flow-case.ts elementSpecSchema,
 * diameters in metres), which the shared schema then checks.
 */
import type {
  ElementKind,
  ElementSpec,
  ExpansionReference,
  MaterialName,
  NozzleType,
  OrificeMethod,
  OrificeTaps,
  VenturiType,
} from '@/shared/flow/flow-types';
import { numberText, parseNumberText } from './formFields';
import { fromSI, lengthFromMetres, lengthToMetres, optionalToSI, type LengthUnit } from './unitChoices';

export interface ElementDraft {
  kind: ElementKind;
  taps: OrificeTaps;
  /** Orifice only: ISO 5167-2 (the default, left out of the spec) or API MPMS 14.3 (flange taps). */
  method: OrificeMethod;
  /** API 14.3 only: the static tap the expansion factor is referred to, as installed. */
  expansionReference: ExpansionReference;
  venturiType: VenturiType;
  nozzleType: NozzleType;
  lengthUnit: LengthUnit;
  pipeDiameter: string;
  boreDiameter: string;
  coneDiameter: string;
  /** Optional fixed C; empty for the standard's equation (or a cone's calibration). */
  dischargeCoefficient: string;
  /** Optional calibration curve, one "Re_D, C" pair per line. */
  calibration: string;
  /** Whether a fixed C comes from a calibration ('calibration') or not ('none': the standard's default U(C)). */
  fixedCoefficientSource: 'none' | 'calibration';
  /** The calibration's stated expanded uncertainty of C (k = 2), percent; empty when not calibrated. */
  calibrationUncertaintyPercent: string;
  /** The calibrating laboratory and certificate (reference text). */
  calibrationLaboratory: string;
  pipeMaterial: MaterialName | '';
  elementMaterial: MaterialName | '';
  /** Temperature the diameters were measured at, °C; empty for 20 °C. */
  referenceTemperatureC: string;
}

export const emptyElementDraft: ElementDraft = {
  kind: 'orifice',
  taps: 'flange',
  method: 'iso-5167-2',
  expansionReference: 'upstream',
  venturiType: 'machined',
  nozzleType: 'isa-1932',
  lengthUnit: 'mm',
  pipeDiameter: '',
  boreDiameter: '',
  coneDiameter: '',
  dischargeCoefficient: '',
  calibration: '',
  fixedCoefficientSource: 'none',
  calibrationUncertaintyPercent: '',
  calibrationLaboratory: '',
  pipeMaterial: '',
  elementMaterial: '',
  referenceTemperatureC: '',
};

/**
 * @param text one "Re_D, C" pair per line (commas, semicolons, tabs or spaces between)
 * @returns the points, with NaN where a line does not hold two numbers (the schema names it)
 */
export function parseCalibration(text: string): { reynoldsNumber: number; dischargeCoefficient: number }[] | undefined {
  const lines = text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter(Boolean);
  if (lines.length === 0) return undefined;
  return lines.map((line) => {
    const [re, c, extra] = line.split(/[\s,;]+/);
    const reynoldsNumber = parseNumberText(re ?? '');
    const dischargeCoefficient = parseNumberText(c ?? '');
    return {
      reynoldsNumber: extra === undefined && reynoldsNumber !== undefined ? reynoldsNumber : Number.NaN,
      dischargeCoefficient:
        extra === undefined && dischargeCoefficient !== undefined ? dischargeCoefficient : Number.NaN,
    };
  });
}

/**
 * @param draft the form's element
 * @returns the element spec to validate and send (diameters in metres)
 */
export function elementFromDraft(draft: ElementDraft): Partial<ElementSpec> {
  const length = (text: string) => lengthToMetres(parseNumberText(text), draft.lengthUnit);
  const spec: Partial<ElementSpec> = { kind: draft.kind, pipeDiameterM: length(draft.pipeDiameter) };
  if (draft.kind === 'orifice') spec.taps = draft.taps;
  // ISO 5167-2 stays implicit so configurations saved before the choice existed read the same.
  if (draft.kind === 'orifice' && draft.method === 'api-14.3') {
    spec.method = 'api-14.3';
    spec.expansionReference = draft.expansionReference;
  }
  if (draft.kind === 'venturi') spec.venturiType = draft.venturiType;
  if (draft.kind === 'nozzle') spec.nozzleType = draft.nozzleType;
  if (draft.kind === 'cone') spec.coneDiameterM = length(draft.coneDiameter);
  else spec.boreDiameterM = length(draft.boreDiameter);
  const fixedC = parseNumberText(draft.dischargeCoefficient);
  if (fixedC !== undefined) spec.dischargeCoefficient = fixedC;
  const calibration = parseCalibration(draft.calibration);
  if (calibration) spec.calibration = calibration;
  if (draft.fixedCoefficientSource === 'calibration' && draft.dischargeCoefficient.trim() !== '')
    spec.dischargeCoefficientCalibrated = true;
  const certificatePercent = parseNumberText(draft.calibrationUncertaintyPercent);
  if (certificatePercent !== undefined) spec.calibrationUncertaintyPercent = certificatePercent;
  if (draft.calibrationLaboratory.trim() !== '') spec.calibrationLaboratory = draft.calibrationLaboratory.trim();
  if (draft.pipeMaterial) spec.pipeMaterial = draft.pipeMaterial;
  if (draft.elementMaterial) spec.elementMaterial = draft.elementMaterial;
  const referenceK = optionalToSI(parseNumberText(draft.referenceTemperatureC), 'degC');
  if (referenceK !== undefined) spec.referenceTemperatureK = referenceK;
  return spec;
}

/**
 * @param element an element as the server stores it
 * @param lengthUnit the unit to show its diameters in
 * @returns the form's draft of it
 */
export function draftFromElement(element: ElementSpec, lengthUnit: LengthUnit): ElementDraft {
  const length = (metres: number | undefined) =>
    metres === undefined ? '' : numberText(lengthFromMetres(metres, lengthUnit));
  return {
    ...emptyElementDraft,
    kind: element.kind,
    taps: element.taps ?? emptyElementDraft.taps,
    method: element.method ?? emptyElementDraft.method,
    expansionReference: element.expansionReference ?? emptyElementDraft.expansionReference,
    venturiType: element.venturiType ?? emptyElementDraft.venturiType,
    nozzleType: element.nozzleType ?? emptyElementDraft.nozzleType,
    lengthUnit,
    pipeDiameter: length(element.pipeDiameterM),
    boreDiameter: length(element.boreDiameterM),
    coneDiameter: length(element.coneDiameterM),
    dischargeCoefficient: numberText(element.dischargeCoefficient),
    calibration: (element.calibration ?? [])
      .map((point) => `${point.reynoldsNumber}, ${point.dischargeCoefficient}`)
      .join('\n'),
    fixedCoefficientSource: element.dischargeCoefficientCalibrated ? 'calibration' : 'none',
    calibrationUncertaintyPercent: numberText(element.calibrationUncertaintyPercent),
    calibrationLaboratory: element.calibrationLaboratory ?? '',
    pipeMaterial: element.pipeMaterial ?? '',
    elementMaterial: element.elementMaterial ?? '',
    referenceTemperatureC:
      element.referenceTemperatureK === undefined ? '' : numberText(fromSI(element.referenceTemperatureK, 'degC')),
  };
}

/** @returns a line such as "orifice, flange taps, D 102.3 mm, d 51.1 mm" for lists */
export function describeElement(element: ElementSpec | undefined, lengthUnit: LengthUnit): string {
  if (!element) return 'no element';
  const length = (metres: number | undefined) =>
    metres === undefined
      ? '?'
      : `${numberText(Number(lengthFromMetres(metres, lengthUnit).toPrecision(5)))} ${lengthUnit}`;
  const taps = element.taps ? `${element.taps} taps${element.method === 'api-14.3' ? ', API 14.3' : ''}` : undefined;
  const subtype = taps ?? element.venturiType ?? element.nozzleType;
  const inner =
    element.kind === 'cone' ? `cone ${length(element.coneDiameterM)}` : `d ${length(element.boreDiameterM)}`;
  return [element.kind, subtype, `D ${length(element.pipeDiameterM)}`, inner].filter(Boolean).join(', ');
}

/** How a bi-directional meter run knows the direction of flow (shared/schemas/setup.ts directionSources). */
export type DirectionSource = 'dp-sign' | 'direction-input';

/**
 * A bi-directional meter run's reverse flow as typed: the element's constants in reverse flow
 * (null until the person starts them), whether they were copied from the forward element and not
 * yet confirmed, and where the direction comes from.
 */
export interface ReverseDraft {
  element: ElementDraft | null;
  copiedUnconfirmed: boolean;
  directionSource: DirectionSource;
}

export const emptyReverseDraft: ReverseDraft = { element: null, copiedUnconfirmed: false, directionSource: 'dp-sign' };

/** The message when copied reverse constants are sent without the person confirming them. */
export const REVERSE_COPY_UNCONFIRMED =
  'copied from the forward element and not confirmed yet: check them against the reverse-flow data sheet or certificate, then press "Confirm reverse constants"';

/**
 * @param bidirectional whether "Flow in both directions" is yes
 * @param reverse the reverse-flow draft
 * @returns the body fields reverseElement and directionSource (none on a one-way meter run; no
 * reverseElement while none was started, so the schema names the missing field)
 */
export function reverseFromDraft(
  bidirectional: boolean,
  reverse: ReverseDraft,
): { reverseElement?: Partial<ElementSpec>; directionSource?: DirectionSource } {
  if (!bidirectional) return {};
  if (reverse.element === null) return {};
  return { reverseElement: elementFromDraft(reverse.element), directionSource: reverse.directionSource };
}
