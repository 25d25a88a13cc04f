/**
 * A new transmitter of a meter run: tag, what it measures, its unit (one of the fixed codes),
 * absolute or gauge for a static pressure, range, role in a stacked DP pair, accuracy as a
 * share of span and when its calibration falls due. Checked with the server's transmitterSchema.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { AppText } from '@/components/ui/AppText';
import { space } from '@/constants/theme';
import type { MeterRun } from '@/hooks/api/meterRuns';
import { useCreateTransmitter, type Transmitter } from '@/hooks/api/transmitters';
import { transmitterSchema } from '@/shared/schemas/setup';
import { FieldRow } from './FieldRow';
import { FormErrorSummary } from './FormErrorSummary';
import {
  fieldErrorFromServer,
  fieldErrorsFromZod,
  fieldTestID,
  optionalText,
  parseNumberText,
  type FieldErrors,
} from './formFields';
import { NumberField } from './NumberField';
import { defaultUnit, dpRoleProblem, emptyDraft, type TransmitterDraft } from './transmitterDraft';
import { measuresLabel, unitLabel, unitsFor, type Measures } from './transmitterUnits';

const measuresOptions = (Object.keys(measuresLabel) as Measures[]).map((value) => ({
  value,
  label: measuresLabel[value],
}));
const referenceOptions = [
  { value: 'absolute' as const, label: 'Absolute' },
  { value: 'gauge' as const, label: 'Gauge (adds the site’s atmosphere)' },
];
const stackOptions = [
  { value: 'single' as const, label: 'Single' },
  { value: 'low' as const, label: 'Low range of a stacked pair' },
  { value: 'high' as const, label: 'High range of a stacked pair' },
];

/** How a data sheet states its accuracy (GUM JCGM 100:2008 §6.2 and §4.3.7). */
const accuracyKindOptions = [
  { value: 'expanded-k2' as const, label: 'Uncertainty, k = 2' },
  { value: 'rectangular-limit' as const, label: '± limit' },
];

const labels: Record<string, string> = {
  meterRunId: 'Meter run',
  tag: 'Tag',
  measures: 'Measures',
  unit: 'Unit',
  pressureReference: 'Reference',
  lowerRange: 'Lower range value',
  upperRange: 'Upper range value',
  stackRole: 'Stacked pair',
  accuracyPercentOfSpan: 'Accuracy',
  accuracyKind: 'Accuracy stated as',
  calibrationDue: 'Calibration due',
};

interface TransmitterFormProps {
  meterRun: MeterRun;
  /** The meter run's transmitters so far. */
  existing: Transmitter[];
  us: boolean;
  onDone?: (transmitter: Transmitter) => void;
}

export function TransmitterForm({ meterRun, existing, us, onDone }: TransmitterFormProps) {
  const create = useCreateTransmitter();
  const prefix = 'tx-create';
  const [draft, setDraft] = useState<TransmitterDraft>(() => emptyDraft(us));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [added, setAdded] = useState<string | null>(null);

  const edit = <K extends keyof TransmitterDraft>(key: K, value: TransmitterDraft[K]) => {
    setDraft((current) => {
      const next = { ...current, [key]: value };
      if (key === 'measures') {
        const what = value as Measures;
        next.unit = defaultUnit(what, us);
        if (what !== 'differential-pressure') next.stackRole = 'single';
        if (what !== 'static-pressure') next.pressureReference = 'absolute';
      }
      return next;
    });
    setAdded(null);
    if (create.error) create.reset();
  };

  const submit = () => {
    const body = {
      meterRunId: meterRun.id,
      tag: draft.tag,
      measures: draft.measures,
      unit: draft.unit,
      pressureReference: draft.pressureReference,
      lowerRange: parseNumberText(draft.lowerRange),
      upperRange: parseNumberText(draft.upperRange),
      stackRole: draft.stackRole,
      accuracyPercentOfSpan: parseNumberText(draft.accuracyPercentOfSpan),
      accuracyKind: draft.accuracyKind,
      calibrationDue: optionalText(draft.calibrationDue),
    };
    const parsed = transmitterSchema.safeParse(body);
    const roleProblem = draft.measures === 'differential-pressure' ? dpRoleProblem(draft.stackRole, existing) : null;
    if (!parsed.success || roleProblem) {
      setErrors({
        ...(parsed.success ? {} : fieldErrorsFromZod(parsed.error)),
        ...(roleProblem ? { stackRole: roleProblem } : {}),
      });
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (created) => {
        setAdded(`Added ${created.tag}.`);
        setDraft((current) => ({ ...emptyDraft(us), measures: current.measures, unit: current.unit }));
        onDone?.(created);
      },
    });
  };

  const serverErrors = fieldErrorFromServer(create.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  const general = create.error && !serverErrors ? create.error.message : null;
  const id = (key: string) => fieldTestID(prefix, key);
  const unitOptions = unitsFor(draft.measures).map((value) => ({ value, label: unitLabel[value] }));

  return (
    <View style={styles.form} testID={prefix}>
      {added ? <Notice testID={`${prefix}-done`}>{added}</Notice> : null}
      <FormErrorSummary
        errors={shown}
        labels={labels}
        general={general}
        testID={`${prefix}-errors`}
        fieldPrefix={prefix}
      />
      <TextField
        label="Tag"
        value={draft.tag}
        onChangeText={(text) => edit('tag', text)}
        error={shown.tag}
        hint={`It is the MQTT topic’s last part and the CSV’s tag, e.g. ${meterRun.tag}-DP.`}
        testID={id('tag')}
        autoCapitalize="characters"
        autoCorrect={false}
      />
      <ChoiceGroup
        label="Measures"
        options={measuresOptions}
        value={draft.measures}
        onChange={(value) => edit('measures', value)}
        testIDPrefix={id('measures')}
      />
      <View style={styles.group}>
        <ChoiceGroup
          label="Unit"
          options={unitOptions}
          value={draft.unit}
          onChange={(value) => edit('unit', value)}
          testIDPrefix={id('unit')}
        />
        {shown.unit ? (
          <AppText variant="caption" tone="error" testID={`${id('unit')}-error`}>{`⊗ ${shown.unit}`}</AppText>
        ) : null}
      </View>
      {draft.measures === 'static-pressure' ? (
        <ChoiceGroup
          label="Reference"
          options={referenceOptions}
          value={draft.pressureReference}
          onChange={(value) => edit('pressureReference', value)}
          testIDPrefix={id('pressureReference')}
        />
      ) : null}
      <FieldRow>
        <NumberField
          label={`Lower range value (${unitLabel[draft.unit]})`}
          value={draft.lowerRange}
          onChangeText={(text) => edit('lowerRange', text)}
          error={shown.lowerRange}
          testID={id('lowerRange')}
        />
        <NumberField
          label={`Upper range value (${unitLabel[draft.unit]})`}
          value={draft.upperRange}
          onChangeText={(text) => edit('upperRange', text)}
          error={shown.upperRange}
          testID={id('upperRange')}
        />
      </FieldRow>
      {draft.measures === 'differential-pressure' ? (
        <View style={styles.group}>
          <ChoiceGroup
            label="Stacked pair"
            options={stackOptions}
            value={draft.stackRole}
            onChange={(value) => edit('stackRole', value)}
            testIDPrefix={id('stackRole')}
          />
          {shown.stackRole ? (
            <AppText
              variant="caption"
              tone="error"
              testID={`${id('stackRole')}-error`}
            >{`⊗ ${shown.stackRole}`}</AppText>
          ) : null}
        </View>
      ) : null}
      <FieldRow>
        <NumberField
          label="Accuracy (% of span)"
          value={draft.accuracyPercentOfSpan}
          onChangeText={(text) => edit('accuracyPercentOfSpan', text)}
          error={shown.accuracyPercentOfSpan}
          hint="From the data sheet, for the uncertainty budget."
          testID={id('accuracyPercentOfSpan')}
        />
        <View style={styles.field}>
          <ChoiceGroup
            label="Accuracy stated as"
            options={accuracyKindOptions}
            value={draft.accuracyKind}
            onChange={(value) => edit('accuracyKind', value)}
            testIDPrefix={id('accuracyKind')}
          />
          <AppText variant="caption" tone="muted">
            A ± limit is taken as rectangular and divided by √3 (GUM §4.3.7); an uncertainty with k = 2 is used as
            stated.
          </AppText>
        </View>
        <View style={styles.field}>
          <TextField
            label="Calibration due"
            value={draft.calibrationDue}
            onChangeText={(text) => edit('calibrationDue', text)}
            error={shown.calibrationDue}
            hint="YYYY-MM-DD (optional)"
            testID={id('calibrationDue')}
          />
        </View>
      </FieldRow>
      <View style={styles.actions}>
        <Button
          label="Add transmitter"
          variant="primary"
          onPress={submit}
          busy={create.isPending}
          testID={`${prefix}-submit`}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  group: { gap: space.xs },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', gap: space.sm },
});
