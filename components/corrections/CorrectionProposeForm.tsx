/**
 * Proposing a correction: the meter run, the period on the site's clock, what is corrected (a
 * quantity for the period, substituted readings of one transmitter, or a factor) and the reason.
 * "Estimate" asks the server for an estimate of the period and fills the quantity with it,
 * saying how it was made and how uncertain it is; typing over it makes the quantity manual.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Reveal } from '@/components/setup/Reveal';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { isApiError } from '@/hooks/api/client';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { useTransmitters } from '@/hooks/api/transmitters';
import { useEstimate, useProposeCorrection, type CorrectionEstimate } from './api';
import { estimateMethodText } from './estimateMethod';
import {
  emptyDraft,
  periodOf,
  proposalFromDraft,
  type CorrectionMode,
  type DraftErrors,
  type ProposalDraft,
} from './proposalDraft';

interface Props {
  meterRuns: MeterRun[];
  sites: Site[];
  onDone: () => void;
  /** A prefilled draft (e.g. a failed calibration's suggestion); the engineer may change any of it. */
  initial?: Partial<ProposalDraft>;
}

const modes: { value: CorrectionMode; label: string }[] = [
  { value: 'quantity', label: 'Substitute a quantity' },
  { value: 'readings', label: 'Substitute readings' },
  { value: 'factor', label: 'Adjust by a factor' },
];

export function CorrectionProposeForm({ meterRuns, sites, onDone, initial }: Props) {
  const [draft, setDraft] = useState(() => ({ ...emptyDraft, meterRunId: meterRuns[0]?.id ?? '', ...initial }));
  const [errors, setErrors] = useState<DraftErrors>({});
  const [estimate, setEstimate] = useState<CorrectionEstimate | null>(null);
  const propose = useProposeCorrection();
  const estimator = useEstimate();
  const transmitters = useTransmitters(draft.meterRunId || undefined);
  const run = meterRuns.find((r) => r.id === draft.meterRunId);
  const site = sites.find((s) => s.id === run?.siteId);
  const timeZone = site?.timeZone ?? 'UTC';
  const set = (patch: Partial<typeof draft>) => {
    setDraft((d) => ({ ...d, ...patch }));
    setErrors((e) => {
      const next = { ...e };
      for (const key of Object.keys(patch)) delete next[key];
      return next;
    });
  };

  const askEstimate = () => {
    const period = periodOf(draft, timeZone);
    if (!('start' in period && 'end' in period && period.start && period.end) || !draft.meterRunId) {
      setErrors({ ...(period as DraftErrors), ...(draft.meterRunId ? {} : { meterRunId: 'Choose the meter run.' }) });
      return;
    }
    estimator.mutate(
      { meterRunId: draft.meterRunId, start: period.start as string, end: period.end as string },
      {
        onSuccess: (made) => {
          setEstimate(made);
          set({ massKg: String(Math.round(made.massKg * 1000) / 1000), origin: 'estimate', mode: 'quantity' });
        },
        onError: (err) => setErrors({ [isApiError(err) && err.field ? err.field : 'massKg']: err.message }),
      },
    );
  };

  const submit = () => {
    const made = proposalFromDraft(draft, timeZone);
    if (!made.ok) {
      setErrors(made.errors);
      return;
    }
    // An estimate is proposed as the server's own figure: the rounded one on screen is not sent.
    const proposal = made.proposal.origin === 'estimate' ? { ...made.proposal, massKg: undefined } : made.proposal;
    propose.mutate(proposal, {
      onSuccess: onDone,
      onError: (err) => setErrors({ [isApiError(err) && err.field ? err.field : 'form']: err.message }),
    });
  };

  return (
    <View style={styles.form} testID="correction-form">
      <ChoiceGroup
        label="Meter run"
        options={meterRuns.map((r) => ({ value: r.id, label: r.tag }))}
        value={draft.meterRunId}
        onChange={(meterRunId) => set({ meterRunId, transmitterId: '' })}
        testIDPrefix="correction-meter-run"
      />
      {errors.meterRunId ? <AppText tone="error">{`⊗ ${errors.meterRunId}`}</AppText> : null}
      <AppText variant="caption" tone="muted">
        {`Times are on the site’s clock (${timeZone}), whole hours; the period runs from the start up to the end.`}
      </AppText>
      <View style={styles.row}>
        <View style={styles.cell}>
          <TextField
            label="Start date"
            value={draft.startDate}
            onChangeText={(startDate) => set({ startDate, origin: 'manual' })}
            placeholder="YYYY-MM-DD"
            error={errors.start}
            testID="correction-start-date"
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="Start hour"
            value={draft.startTime}
            onChangeText={(startTime) => set({ startTime, origin: 'manual' })}
            placeholder="HH:00"
            testID="correction-start-time"
          />
        </View>
      </View>
      <View style={styles.row}>
        <View style={styles.cell}>
          <TextField
            label="End date"
            value={draft.endDate}
            onChangeText={(endDate) => set({ endDate, origin: 'manual' })}
            placeholder="YYYY-MM-DD"
            error={errors.end}
            testID="correction-end-date"
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="End hour"
            value={draft.endTime}
            onChangeText={(endTime) => set({ endTime, origin: 'manual' })}
            placeholder="HH:00"
            testID="correction-end-time"
          />
        </View>
      </View>
      <ChoiceGroup
        label="What is corrected"
        options={modes}
        value={draft.mode}
        onChange={(mode) => set({ mode })}
        testIDPrefix="correction-mode"
      />
      {draft.mode === 'quantity' ? (
        <View style={styles.form}>
          <TextField
            label="Mass for the whole period (kg)"
            value={draft.massKg}
            onChangeText={(massKg) => set({ massKg, origin: 'manual' })}
            keyboardType="decimal-pad"
            error={errors.massKg}
            testID="correction-mass"
          />
          <Button
            label="Estimate"
            variant="secondary"
            busy={estimator.isPending}
            onPress={askEstimate}
            testID="correction-estimate"
          />
          {estimate && draft.origin === 'estimate' ? (
            <AppText variant="caption" tone="muted" testID="correction-estimate-text">
              {`Estimate: ${estimate.massKg.toFixed(1)} kg ± ${
                estimate.uncertaintyPercent === null ? '—' : estimate.uncertaintyPercent.toFixed(1)
              } % (95 %). ${estimateMethodText(estimate.method, estimate.basis)} Proposed as an estimate; it is flagged estimated once approved.`}
            </AppText>
          ) : null}
        </View>
      ) : null}
      {draft.mode === 'factor' ? (
        <TextField
          label="Factor (every quantity of the period is multiplied by it)"
          value={draft.factor}
          onChangeText={(factor) => set({ factor })}
          keyboardType="decimal-pad"
          error={errors.factor}
          testID="correction-factor"
        />
      ) : null}
      {draft.mode === 'readings' ? (
        <View style={styles.form}>
          <ChoiceGroup
            label="Transmitter"
            options={(transmitters.data ?? []).map((t) => ({ value: t.id, label: `${t.tag} (${t.unit})` }))}
            value={draft.transmitterId}
            onChange={(transmitterId) => set({ transmitterId })}
            testIDPrefix="correction-transmitter"
          />
          {errors['substitute.transmitterId'] ? (
            <AppText tone="error">{`⊗ ${errors['substitute.transmitterId']}`}</AppText>
          ) : null}
          <ChoiceGroup
            label="Substituted value"
            options={[
              { value: 'fixed', label: 'A fixed value' },
              { value: 'hold', label: 'Hold the last value before the period' },
            ]}
            value={draft.hold ? 'hold' : 'fixed'}
            onChange={(v) => set({ hold: v === 'hold' })}
            testIDPrefix="correction-hold"
          />
          {!draft.hold ? (
            <TextField
              label="Value, in the transmitter’s unit"
              value={draft.value}
              onChangeText={(value) => set({ value })}
              keyboardType="decimal-pad"
              error={errors['substitute.value'] ?? errors.substitute ?? errors['substitute.hold']}
              testID="correction-value"
            />
          ) : errors['substitute.hold'] ? (
            <AppText tone="error">{`⊗ ${errors['substitute.hold']}`}</AppText>
          ) : null}
        </View>
      ) : null}
      <TextField
        label="Reason (required)"
        value={draft.reason}
        onChangeText={(reason) => set({ reason })}
        error={errors.reason}
        maxLength={2000}
        testID="correction-reason"
      />
      {errors.form ? (
        <Reveal when={errors}>
          <Notice tone="error" testID="correction-form-error">
            {errors.form}
          </Notice>
        </Reveal>
      ) : null}
      <Button
        label="Propose correction"
        variant="primary"
        busy={propose.isPending}
        onPress={submit}
        testID="correction-submit"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 150 },
});
