/**
 * A meter run's own details that may change without a new configuration version: its name,
 * hold limit, gap limit, no-flow cutoff and line data. (The element and fluid change only
 * through a dated configuration version.) The hold limit, gap limit and no-flow cutoff are
 * dated settings: a change takes effect from a time on the site's clock (default now), with a
 * reason, and recomputes the meter run's history from then on only.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { StateBadge } from '@/components/ui/StateBadge';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useUpdateMeterRun, type MeterRunChange, type MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { lineSchema, meterRunSchema } from '@/shared/schemas/setup';
import { DatedChangeFields } from './DatedChangeFields';
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
import { formatOnSiteClock, siteClockNow, zonedIso } from './zonedTime';

/** An effective time this little in the past is taken as now, not as a back-dating (as for configuration versions). */
const backDatingGraceMs = 5 * 60 * 1000;

const labels: Record<string, string> = {
  name: 'Name',
  holdLimitS: 'Hold limit',
  maxGapS: 'Gap limit',
  noFlowCutoffPercentOfSpan: 'No-flow cutoff',
  effectiveFrom: 'Effective from',
  reason: 'Reason',
  ...lineFieldLabels,
};

/** The PATCH body's own fields, checked with the same rules as the meter run schema (the server's for the cutoff). */
const { name: nameRule, holdLimitS: holdLimitRule, maxGapS: maxGapRule } = meterRunSchema.shape;
const changeSchema = z.object({
  name: nameRule,
  holdLimitS: holdLimitRule,
  maxGapS: maxGapRule,
  noFlowCutoffPercentOfSpan: z
    .number({ error: 'must be a number' })
    .refine((v) => Number.isFinite(v) && v >= 0 && v <= 10, 'must be between 0 and 10 % of span'),
  line: lineSchema,
});

/** The cutoff a meter run shows: the server's, or the 0.5 % default of a server that does not send it. */
const cutoffOf = (meterRun: MeterRun) => meterRun.noFlowCutoffPercentOfSpan ?? 0.5;

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
  const [cutoff, setCutoff] = useState(numberText(cutoffOf(meterRun)));
  const [effective, setEffective] = useState(() => siteClockNow(site.timeZone, Date.now()));
  const [reason, setReason] = useState('');
  const [line, setLine] = useState<LineDraft>(() =>
    draftFromLine(meterRun.line, site.displayUnits === 'us' ? 'in' : 'mm'),
  );
  const [errors, setErrors] = useState<FieldErrors>({});

  const limitsChanged =
    parseNumberText(holdLimit) !== meterRun.holdLimitS ||
    parseNumberText(maxGap) !== meterRun.maxGapS ||
    parseNumberText(cutoff) !== cutoffOf(meterRun);
  const effectiveFrom = zonedIso(effective.date, effective.time, site.timeZone);
  const effectiveMs = Date.parse(effectiveFrom);
  const backDated = Number.isFinite(effectiveMs) && effectiveMs < Date.now() - backDatingGraceMs;

  const submit = () => {
    const parsed = changeSchema.safeParse({
      name,
      holdLimitS: parseNumberText(holdLimit),
      maxGapS: parseNumberText(maxGap),
      noFlowCutoffPercentOfSpan: parseNumberText(cutoff),
      line: lineFromDraft(line),
    });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    // The dated settings go only when changed, with when and why; otherwise the server records no version.
    const { holdLimitS, maxGapS, noFlowCutoffPercentOfSpan, ...details } = parsed.data;
    const change: MeterRunChange = limitsChanged
      ? {
          ...details,
          holdLimitS,
          maxGapS,
          noFlowCutoffPercentOfSpan,
          effectiveFrom,
          reason: reason.trim() || undefined,
        }
      : details;
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
          label="Gap limit (s)"
          value={maxGap}
          onChangeText={setMaxGap}
          error={shown.maxGapS}
          testID={id('maxGapS')}
        />
        <NumberField
          label="No-flow cutoff (% of DP span)"
          value={cutoff}
          onChangeText={setCutoff}
          error={shown.noFlowCutoffPercentOfSpan}
          testID={id('noFlowCutoffPercentOfSpan')}
        />
      </FieldRow>
      {limitsChanged ? (
        <>
          <DatedChangeFields
            effective={effective}
            onEffectiveChange={setEffective}
            reason={reason}
            onReasonChange={setReason}
            errors={shown}
            dateLabel={`Effective date (${site.timeZone})`}
            timeLabel="Effective time"
            reasonHint="Why the limits change. It goes into the audit trail and the configuration history."
            testIDPrefix={prefix}
          />
          {backDated ? (
            <StateBadge
              priority="medium"
              testID={`${prefix}-backdated`}
              label={`Back-dated: saving this recomputes the hourly records, contract days and monthly totals of ${meterRun.tag} from ${formatOnSiteClock(effectiveFrom, site.timeZone)} on (closed months stay as they are).`}
            />
          ) : null}
          <Notice title="Dated settings">
            The hold limit, the gap limit and the no-flow cutoff decide which time counts as flow, as no flow and as
            missing. A change takes effect from the time above: hours before it keep the settings then in force, and the
            hour it falls in is split into two records.
          </Notice>
        </>
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
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
