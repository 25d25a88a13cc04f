/**
 * One transmitter of a meter run: what it measures, its range, its place in a stacked pair,
 * accuracy and calibration due date (overdue or near, said in words); re-range it or record a
 * new due date. A re-range is a dated setting: it takes effect from a time on the site's clock
 * (default now), with a reason, and changes what readings from then on mean, not earlier ones.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { FlagMark } from '@/components/ui/StatusMark';
import { TextField } from '@/components/ui/TextField';
import { colors, radius, space } from '@/constants/theme';
import { useUpdateTransmitter, type Transmitter } from '@/hooks/api/transmitters';
import { DatedChangeFields } from './DatedChangeFields';
import { FieldRow } from './FieldRow';
import { FormErrorSummary } from './FormErrorSummary';
import { transmitterSchema } from '@/shared/schemas/setup';
import {
  fieldErrorFromServer,
  fieldErrorsFromZod,
  numberText,
  optionalText,
  parseNumberText,
  type FieldErrors,
} from './formFields';
import { NumberField } from './NumberField';
import { siteClockNow, zonedIso } from './zonedTime';
import { measuresLabel, rangeLabel, unitLabel, type TransmitterUnitCode } from './transmitterUnits';

/** Calibrations due within this many days are pointed out. */
const dueSoonDays = 30;
const millisecondsPerDay = 24 * 60 * 60 * 1000;

function calibrationState(due: string | null, nowMs: number): { priority: 'medium' | 'low'; label: string } | null {
  if (!due) return null;
  const dueMs = Date.parse(`${due}T00:00:00Z`);
  if (Number.isNaN(dueMs)) return null;
  const days = Math.floor((dueMs - nowMs) / millisecondsPerDay);
  if (days < 0) return { priority: 'medium', label: `Calibration overdue since ${due}` };
  if (days <= dueSoonDays)
    return { priority: 'low', label: `Calibration due ${due} (in ${days} day${days === 1 ? '' : 's'})` };
  return null;
}

const stackWords = {
  single: '',
  low: ' · LOW range of the stacked pair',
  high: ' · HIGH range of the stacked pair',
} as const;

export function TransmitterRow({ transmitter, timeZone }: { transmitter: Transmitter; timeZone: string }) {
  const update = useUpdateTransmitter();
  const [editing, setEditing] = useState(false);
  const [lower, setLower] = useState('');
  const [upper, setUpper] = useState('');
  const [accuracy, setAccuracy] = useState('');
  const [due, setDue] = useState('');
  const [effective, setEffective] = useState(() => siteClockNow(timeZone, Date.now()));
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const state = calibrationState(transmitter.calibrationDue, Date.now());
  const unit = unitLabel[transmitter.unit as TransmitterUnitCode] ?? transmitter.unit;
  const testID = `tx-row-${transmitter.tag}`;

  const open = () => {
    setLower(numberText(transmitter.lowerRange));
    setUpper(numberText(transmitter.upperRange));
    setAccuracy(numberText(transmitter.accuracyPercentOfSpan));
    setDue(transmitter.calibrationDue ?? '');
    setEffective(siteClockNow(timeZone, Date.now()));
    setReason('');
    setErrors({});
    update.reset();
    setEditing(true);
  };

  const save = () => {
    const change = {
      lowerRange: parseNumberText(lower),
      upperRange: parseNumberText(upper),
      accuracyPercentOfSpan: parseNumberText(accuracy),
      calibrationDue: optionalText(due) ?? null,
    };
    // The whole transmitter as it would be after the change, checked as the server checks it.
    const parsed = transmitterSchema.safeParse({
      ...transmitter,
      ...change,
      calibrationDue: change.calibrationDue ?? undefined,
    });
    const found = parsed.success ? {} : fieldErrorsFromZod(parsed.error);
    setErrors(found);
    if (Object.keys(found).length) return;
    // A new range or accuracy is dated; a new calibration date alone is not.
    const dated = rangeChanged
      ? { effectiveFrom: zonedIso(effective.date, effective.time, timeZone), reason: reason.trim() || undefined }
      : {};
    update.mutate({ id: transmitter.id, change: { ...change, ...dated } }, { onSuccess: () => setEditing(false) });
  };

  const rangeChanged =
    editing &&
    (parseNumberText(lower) !== transmitter.lowerRange ||
      parseNumberText(upper) !== transmitter.upperRange ||
      parseNumberText(accuracy) !== transmitter.accuracyPercentOfSpan);

  const serverErrors = fieldErrorFromServer(update.error);
  const shown = { ...serverErrors, ...errors };

  return (
    <View style={styles.row} testID={testID}>
      <View style={styles.title}>
        <AppText variant="bodyStrong">{transmitter.tag}</AppText>
        <AppText
          tone="muted"
          style={styles.what}
        >{`${measuresLabel[transmitter.measures]}${stackWords[transmitter.stackRole]}`}</AppText>
      </View>
      <AppText variant="caption" tabular testID={`${testID}-range`}>
        {`${rangeLabel(transmitter.lowerRange, transmitter.upperRange, transmitter.unit)}${
          transmitter.measures === 'static-pressure' ? ` ${transmitter.pressureReference}` : ''
        } · accuracy ${transmitter.accuracyPercentOfSpan} % of span · calibration due ${transmitter.calibrationDue ?? 'not recorded'}`}
      </AppText>
      {state ? <FlagMark quiet={state.priority === 'low'} label={state.label} /> : null}
      {editing ? (
        <View style={styles.editor}>
          <FormErrorSummary
            errors={shown}
            labels={{
              lowerRange: 'Lower range value',
              upperRange: 'Upper range value',
              accuracyPercentOfSpan: 'Accuracy',
              calibrationDue: 'Calibration due',
              effectiveFrom: 'Effective from',
              reason: 'Reason',
            }}
            general={update.error && !serverErrors ? update.error.message : null}
          />
          <FieldRow>
            <NumberField
              label={`Lower range value (${unit})`}
              value={lower}
              onChangeText={setLower}
              error={shown.lowerRange}
              testID={`${testID}-lowerRange`}
            />
            <NumberField
              label={`Upper range value (${unit})`}
              value={upper}
              onChangeText={setUpper}
              error={shown.upperRange}
              testID={`${testID}-upperRange`}
            />
            <NumberField
              label="Accuracy (% of span)"
              value={accuracy}
              onChangeText={setAccuracy}
              error={shown.accuracyPercentOfSpan}
              testID={`${testID}-accuracy`}
            />
            <View style={styles.field}>
              <TextField
                label="Calibration due"
                value={due}
                onChangeText={setDue}
                error={shown.calibrationDue}
                hint="YYYY-MM-DD; empty to clear"
                testID={`${testID}-calibrationDue`}
              />
            </View>
          </FieldRow>
          {rangeChanged ? (
            <>
              <DatedChangeFields
                effective={effective}
                onEffectiveChange={setEffective}
                reason={reason}
                onReasonChange={setReason}
                errors={shown}
                dateLabel={`Re-ranged on (${timeZone})`}
                timeLabel="At"
                reasonHint="E.g. “Re-ranged at the calibration visit, certificate 2291”. It goes into the audit trail."
                testIDPrefix={testID}
              />
            </>
          ) : null}
          <AppText variant="caption" tone="muted">
            Change the range here once the transmitter itself has been re-ranged in the field: the range decides the
            share of span, low-in-range flags, stacked-pair switching and the uncertainty. Hours before the time it took
            effect keep the range then in force; the hour it falls in is split into two records.
          </AppText>
          <View style={styles.actions}>
            <Button
              label="Save"
              size="compact"
              variant="primary"
              busy={update.isPending}
              onPress={save}
              testID={`${testID}-save`}
            />
            <Button label="Cancel" size="compact" variant="quiet" onPress={() => setEditing(false)} />
          </View>
        </View>
      ) : (
        <View style={styles.actions}>
          <Button label="Re-range or calibration" size="compact" onPress={open} testID={`${testID}-edit`} />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    gap: space.xs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  title: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', gap: space.sm },
  what: { flexShrink: 1 },
  editor: { gap: space.sm, paddingTop: space.sm },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
