/**
 * The meter run's line data: inside diameter, nominal size, schedule, flange class, materials,
 * straight lengths upstream and downstream (in pipe diameters), approvals, install date and
 * expected service life, and whether flow may run both ways. All optional; kept for the
 * record, the audit and the uncertainty budget.
 */
import { StyleSheet, View } from 'react-native';

import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import type { MeterRunInput } from '@/shared/schemas/setup';
import { FieldRow } from './FieldRow';
import {
  convertNumberText,
  errorFor,
  fieldTestID,
  numberText,
  optionalText,
  parseNumberText,
  type FieldErrors,
} from './formFields';
import { NumberField } from './NumberField';
import { lengthFromMetres, lengthToMetres, lengthUnits, type LengthUnit } from './unitChoices';

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
  'line.bidirectional': 'Bidirectional',
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

interface LineFieldsProps {
  draft: LineDraft;
  onChange: (draft: LineDraft) => void;
  errors: FieldErrors;
  testPrefix: string;
}

export function LineFields({ draft, onChange, errors, testPrefix }: LineFieldsProps) {
  const set =
    <K extends keyof LineDraft>(key: K) =>
    (value: LineDraft[K]) =>
      onChange({ ...draft, [key]: value });
  const id = (key: string) => fieldTestID(testPrefix, `line.${key}`);
  const error = (key: string) => errorFor(errors, `line.${key}`);
  const text = (key: keyof LineDraft & keyof Line, label: string, hint?: string) => (
    <View style={styles.field}>
      <TextField
        label={label}
        value={draft[key] as string}
        onChangeText={set(key) as (text: string) => void}
        error={error(key)}
        hint={hint}
        testID={id(key)}
        autoCorrect={false}
      />
    </View>
  );

  return (
    <View style={styles.group}>
      <FieldRow>
        <NumberField
          label="Inside diameter"
          value={draft.insideDiameter}
          onChangeText={set('insideDiameter')}
          units={lengthUnits}
          unit={draft.lengthUnit}
          onChangeUnit={(unit) =>
            onChange({
              ...draft,
              lengthUnit: unit,
              insideDiameter: convertNumberText(draft.insideDiameter, (value) =>
                lengthFromMetres(lengthToMetres(value, draft.lengthUnit), unit),
              ),
            })
          }
          error={error('insideDiameterM')}
          hint="As measured; the element’s D is what the flow equation uses."
          testID={id('insideDiameterM')}
        />
        {text('nominalSize', 'Nominal size', 'e.g. 4 in, DN 100')}
        {text('schedule', 'Schedule', 'e.g. 40, 80, STD')}
        {text('flangeClass', 'Flange class', 'e.g. ASME 600, PN 40')}
      </FieldRow>
      <FieldRow>
        {text('pipeMaterial', 'Pipe material')}
        {text('elementMaterial', 'Element material')}
      </FieldRow>
      <FieldRow>
        <NumberField
          label="Straight length upstream (× D)"
          value={draft.upstreamStraightLengthD}
          onChangeText={set('upstreamStraightLengthD')}
          error={error('upstreamStraightLengthD')}
          testID={id('upstreamStraightLengthD')}
        />
        <NumberField
          label="Straight length downstream (× D)"
          value={draft.downstreamStraightLengthD}
          onChangeText={set('downstreamStraightLengthD')}
          error={error('downstreamStraightLengthD')}
          testID={id('downstreamStraightLengthD')}
        />
      </FieldRow>
      <FieldRow>
        {text('installDate', 'Install date', 'YYYY-MM-DD')}
        <NumberField
          label="Expected service life (years)"
          value={draft.expectedServiceLifeYears}
          onChangeText={set('expectedServiceLifeYears')}
          error={error('expectedServiceLifeYears')}
          testID={id('expectedServiceLifeYears')}
        />
      </FieldRow>
      <TextField
        label="Approvals"
        value={draft.approvals}
        onChangeText={set('approvals')}
        error={error('approvals')}
        hint="Pattern approvals, certificates, the authority that accepted the installation."
        testID={id('approvals')}
        multiline
        numberOfLines={2}
      />
      <ChoiceGroup
        label="Flow in both directions (bidirectional)"
        options={[
          { value: 'no', label: 'No' },
          { value: 'yes', label: 'Yes' },
        ]}
        value={draft.bidirectional}
        onChange={set('bidirectional')}
        testIDPrefix={id('bidirectional')}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.md },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
});
