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
import { convertNumberText, errorFor, fieldTestID, type FieldErrors } from './formFields';
import type { LineDraft } from './lineDraft';
import { NumberField } from './NumberField';
import { lengthFromMetres, lengthToMetres, lengthUnits } from './unitChoices';

export { draftFromLine, emptyLineDraft, lineFieldLabels, lineFromDraft, type LineDraft } from './lineDraft';

type Line = MeterRunInput['line'];

interface LineFieldsProps {
  draft: LineDraft;
  onChange: (draft: LineDraft) => void;
  errors: FieldErrors;
  testPrefix: string;
  /** False where the form asks it in its own "Flow direction" section, with the reverse element. */
  showBidirectional?: boolean;
}

export function LineFields({ draft, onChange, errors, testPrefix, showBidirectional = true }: LineFieldsProps) {
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
      {showBidirectional ? (
        <ChoiceGroup
          label="Flow in both directions (bi-directional)"
          options={[
            { value: 'no', label: 'No' },
            { value: 'yes', label: 'Yes' },
          ]}
          value={draft.bidirectional}
          onChange={set('bidirectional')}
          testIDPrefix={id('bidirectional')}
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.md },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
});
