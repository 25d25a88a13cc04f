/**
 * A meter run's own details that may change without a new configuration version: its name,
 * hold limit, longest gap and line data. (The element and fluid change only through a dated
 * configuration version.) Changing a limit recomputes the meter run's history.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useUpdateMeterRun, type MeterRunChange, type MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { lineSchema, meterRunSchema } from '@/shared/schemas/setup';
import { FieldRow } from './FieldRow';
import { FormErrorSummary } from './FormErrorSummary';
import { FormSection } from './FormSection';
import {
  fieldErrorFromServer,
  fieldErrorsFromZod,
  fieldTestID,
  numberText,
  parseNumberText,
  type FieldErrors,
} from './formFields';
import { draftFromLine, LineFields, lineFieldLabels, lineFromDraft, type LineDraft } from './LineFields';
import { NumberField } from './NumberField';

const labels: Record<string, string> = {
  name: 'Name',
  holdLimitS: 'Hold limit',
  maxGapS: 'Longest gap',
  ...lineFieldLabels,
};

/** The PATCH body's own fields, checked with the same rules as the meter run schema. */
const { name: nameRule, holdLimitS: holdLimitRule, maxGapS: maxGapRule } = meterRunSchema.shape;
const changeSchema = z.object({ name: nameRule, holdLimitS: holdLimitRule, maxGapS: maxGapRule, line: lineSchema });

interface MeterRunDetailsFormProps {
  meterRun: MeterRun;
  site: Site;
  onDone?: () => void;
  onCancel?: () => void;
}

export function MeterRunDetailsForm({ meterRun, site, onDone, onCancel }: MeterRunDetailsFormProps) {
  const update = useUpdateMeterRun();
  const prefix = 'run-edit';
  const [name, setName] = useState(meterRun.name);
  const [holdLimit, setHoldLimit] = useState(numberText(meterRun.holdLimitS));
  const [maxGap, setMaxGap] = useState(numberText(meterRun.maxGapS));
  const [line, setLine] = useState<LineDraft>(() =>
    draftFromLine(meterRun.line, site.displayUnits === 'us' ? 'in' : 'mm'),
  );
  const [errors, setErrors] = useState<FieldErrors>({});

  const limitsChanged =
    parseNumberText(holdLimit) !== meterRun.holdLimitS || parseNumberText(maxGap) !== meterRun.maxGapS;

  const submit = () => {
    const parsed = changeSchema.safeParse({
      name,
      holdLimitS: parseNumberText(holdLimit),
      maxGapS: parseNumberText(maxGap),
      line: lineFromDraft(line),
    });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    const change: MeterRunChange = parsed.data;
    update.mutate({ id: meterRun.id, change }, { onSuccess: () => onDone?.() });
  };

  const serverErrors = fieldErrorFromServer(update.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  const id = (key: string) => fieldTestID(prefix, key);

  return (
    <View style={styles.form} testID={prefix}>
      <FormErrorSummary
        errors={shown}
        labels={labels}
        general={update.error && !serverErrors ? update.error.message : null}
      />
      <TextField label="Name" value={name} onChangeText={setName} error={shown.name} testID={id('name')} />
      <FieldRow>
        <NumberField
          label="Hold limit (s)"
          value={holdLimit}
          onChangeText={setHoldLimit}
          error={shown.holdLimitS}
          testID={id('holdLimitS')}
        />
        <NumberField
          label="Longest gap (s)"
          value={maxGap}
          onChangeText={setMaxGap}
          error={shown.maxGapS}
          testID={id('maxGapS')}
        />
      </FieldRow>
      {limitsChanged ? (
        <Notice title="This recomputes the whole history">
          The hold limit and the longest gap decide which time counts as flow and which as missing: a change recomputes
          every hour of this meter run (closed months excepted).
        </Notice>
      ) : null}
      <FormSection title="Line data">
        <LineFields draft={line} onChange={setLine} errors={shown} testPrefix={prefix} />
      </FormSection>
      <View style={styles.actions}>
        <Button
          label="Save details"
          variant="primary"
          onPress={submit}
          busy={update.isPending}
          testID={`${prefix}-submit`}
        />
        {onCancel ? <Button label="Cancel" variant="quiet" onPress={onCancel} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
