/**
 * The meter run's line data as typed in a form and back: the draft becomes the `line` of the
 * meter run (shared/schemas/setup.ts), with empty fields left out and the inside diameter in
 * metres.
 */
import type { MeterRunInput } from '@/shared/schemas/setup';
import { numberText, optionalText, parseNumberText } from './formFields';
import { lengthFromMetres, lengthToMetres, type LengthUnit } from './unitChoices';

export interface LineDraft {
  lengthUnit: LengthUnit;
  insideDiameter: string;
  nominalSize: string;
  schedule: string;
  flangeClass: string;
  pipeMaterial: string;
  elementMaterial: string;
  upstreamStraightLengthD: string;
  downstreamStraightLengthD: string;
  approvals: string;
  installDate: string;
  expectedServiceLifeYears: string;
  bidirectional: 'yes' | 'no';
}

export const emptyLineDraft: LineDraft = {
  lengthUnit: 'mm',
  insideDiameter: '',
  nominalSize: '',
  schedule: '',
  flangeClass: '',
  pipeMaterial: '',
  elementMaterial: '',
  upstreamStraightLengthD: '',
  downstreamStraightLengthD: '',
  approvals: '',
  installDate: '',
  expectedServiceLifeYears: '',
  bidirectional: 'no',
};

/** Labels of the line's field paths, for the form's summary of problems. */
export const lineFieldLabels: Record<string, string> = {
  'line.insideDiameterM': 'Line inside diameter',
  'line.nominalSize': 'Nominal size',
  'line.schedule': 'Schedule',
  'line.flangeClass': 'Flange class',
  'line.pipeMaterial': 'Pipe material',
  'line.elementMaterial': 'Element material',
  'line.upstreamStraightLengthD': 'Straight length upstream',
  'line.downstreamStraightLengthD': 'Straight length downstream',
  'line.approvals': 'Approvals',
  'line.installDate': 'Install date',
  'line.expectedServiceLifeYears': 'Expected service life',
  'line.bidirectional': 'Flow in both directions',
};

type Line = MeterRunInput['line'];

/**
 * @param draft the form's line data
 * @returns the line object to validate and send (empty fields left out)
 */
export function lineFromDraft(draft: LineDraft): Partial<Record<keyof Line, unknown>> {
  const line: Partial<Record<keyof Line, unknown>> = {
    insideDiameterM: lengthToMetres(parseNumberText(draft.insideDiameter), draft.lengthUnit),
    nominalSize: optionalText(draft.nominalSize),
    schedule: optionalText(draft.schedule),
    flangeClass: optionalText(draft.flangeClass),
    pipeMaterial: optionalText(draft.pipeMaterial),
    elementMaterial: optionalText(draft.elementMaterial),
    upstreamStraightLengthD: parseNumberText(draft.upstreamStraightLengthD),
    downstreamStraightLengthD: parseNumberText(draft.downstreamStraightLengthD),
    approvals: optionalText(draft.approvals),
    installDate: optionalText(draft.installDate),
    expectedServiceLifeYears: parseNumberText(draft.expectedServiceLifeYears),
    bidirectional: draft.bidirectional === 'yes',
  };
  // Left-out keys, not undefined ones, so the JSON sent is what was typed.
  for (const key of Object.keys(line) as (keyof Line)[]) if (line[key] === undefined) delete line[key];
  return line;
}

/**
 * @param line line data as the server stores it
 * @param lengthUnit the unit to show the inside diameter in
 * @returns the form's draft of it
 */
export function draftFromLine(line: Record<string, unknown>, lengthUnit: LengthUnit): LineDraft {
  const text = (key: string) => (typeof line[key] === 'string' ? (line[key] as string) : '');
  const number = (key: string) => (typeof line[key] === 'number' ? numberText(line[key] as number) : '');
  return {
    lengthUnit,
    insideDiameter:
      typeof line.insideDiameterM === 'number' ? numberText(lengthFromMetres(line.insideDiameterM, lengthUnit)) : '',
    nominalSize: text('nominalSize'),
    schedule: text('schedule'),
    flangeClass: text('flangeClass'),
    pipeMaterial: text('pipeMaterial'),
    elementMaterial: text('elementMaterial'),
    upstreamStraightLengthD: number('upstreamStraightLengthD'),
    downstreamStraightLengthD: number('downstreamStraightLengthD'),
    approvals: text('approvals'),
    installDate: text('installDate'),
    expectedServiceLifeYears: number('expectedServiceLifeYears'),
    bidirectional: line.bidirectional === true ? 'yes' : 'no',
  };
}
