/**
 * A meter run's reconciliation tolerance, a dated setting: the versions in force so far and a
 * form for a new one (tolerance, from when on the site's clock, and why). A new tolerance judges
 * the contract days that start from its effective time on; days already begun keep the verdict
 * they had (GET/PATCH /api/reconciliations/tolerances/:id).
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { DatedChangeFields } from '@/components/setup/DatedChangeFields';
import { FieldRow } from '@/components/setup/FieldRow';
import { fieldErrorFromServer, numberText, parseNumberText } from '@/components/setup/formFields';
import { NumberField } from '@/components/setup/NumberField';
import { formatOnSiteClock, siteClockNow, zonedIso } from '@/components/setup/zonedTime';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { space } from '@/constants/theme';
import { apiRequest } from '@/hooks/api/client';
import { meterRunKeys, type MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { reconciliationKeys } from './useReconciliations';

const toleranceVersionSchema = z.object({
  meterRunId: z.string(),
  versionId: z.string(),
  tolerancePercent: z.number(),
  effectiveFrom: z.string(),
  reason: z.string(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
});
type ToleranceVersion = z.infer<typeof toleranceVersionSchema>;

const versionsKey = (meterRunId: string) => [...reconciliationKeys.all, meterRunId, 'tolerances'] as const;

/** The version in force at `atMs` (oldest first; the later of a tie wins). */
function inForceAt(versions: readonly ToleranceVersion[], atMs: number): ToleranceVersion | undefined {
  return versions.filter((v) => Date.parse(v.effectiveFrom) <= atMs).at(-1);
}

export function ToleranceForm({ run, site }: { run: MeterRun; site: Site }) {
  const queryClient = useQueryClient();
  const prefix = 'run-tolerance';
  const [text, setText] = useState('');
  const [effective, setEffective] = useState(() => siteClockNow(site.timeZone, Date.now()));
  const [reason, setReason] = useState('');
  const [problems, setProblems] = useState<{ tolerancePercent?: string; reason?: string }>({});
  const versions = useQuery({
    queryKey: versionsKey(run.id),
    queryFn: () =>
      apiRequest({
        path: `/reconciliations/tolerances/${encodeURIComponent(run.id)}`,
        schema: z.array(toleranceVersionSchema),
      }),
  });
  const save = useMutation({
    mutationFn: (body: { tolerancePercent: number; effectiveFrom: string; reason: string }) =>
      apiRequest({
        method: 'PATCH',
        path: `/reconciliations/tolerances/${encodeURIComponent(run.id)}`,
        body,
        schema: toleranceVersionSchema,
      }),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reconciliationKeys.all }),
        queryClient.invalidateQueries({ queryKey: meterRunKeys.all }),
      ]),
  });
  const list = versions.data ?? [];
  const now = inForceAt(list, Date.now())?.tolerancePercent ?? run.reconciliationTolerancePercent;
  const submit = () => {
    const value = parseNumberText(text);
    const found: typeof problems = {};
    if (value === undefined || !Number.isFinite(value) || value <= 0 || value > 100)
      found.tolerancePercent = 'must be a number above 0 and at most 100';
    if (!reason.trim()) found.reason = 'say why the tolerance changes';
    setProblems(found);
    if (Object.keys(found).length || value === undefined) return;
    save.mutate(
      { tolerancePercent: value, effectiveFrom: zonedIso(effective.date, effective.time, site.timeZone), reason },
      {
        onSuccess: () => {
          setText('');
          setReason('');
        },
      },
    );
  };
  const server = fieldErrorFromServer(save.error) ?? {};
  const general = save.error && !fieldErrorFromServer(save.error) ? save.error.message : undefined;
  return (
    <Panel title="Reconciliation tolerance" testID={prefix}>
      <AppText variant="caption" tone="muted" testID={`${prefix}-current`}>
        {now !== undefined
          ? `In force: ±${numberText(now)} % of the field total. A contract day further apart raises a reconciliation alarm.`
          : 'How far a contract day may differ from the field total, in percent of it, before it raises an alarm. A meter run starts at ±0.5 %.'}
      </AppText>
      {list.length > 1 ? (
        <View style={styles.versions} testID={`${prefix}-versions`}>
          {list
            .slice()
            .reverse()
            .map((v) => (
              <AppText key={v.versionId} variant="caption">
                {`±${numberText(v.tolerancePercent)} % from ${formatOnSiteClock(v.effectiveFrom, site.timeZone)}${v.reason ? ` — ${v.reason}` : ''}`}
              </AppText>
            ))}
        </View>
      ) : null}
      <FieldRow>
        <NumberField
          label="New tolerance (± % of the field total)"
          value={text}
          onChangeText={setText}
          error={problems.tolerancePercent ?? server.tolerancePercent}
          testID={`${prefix}-tolerancePercent`}
        />
      </FieldRow>
      <DatedChangeFields
        effective={effective}
        onEffectiveChange={setEffective}
        reason={reason}
        onReasonChange={setReason}
        errors={{ effectiveFrom: server.effectiveFrom, reason: problems.reason ?? server.reason }}
        dateLabel={`Judges contract days from (${site.timeZone})`}
        timeLabel="Time"
        reasonHint="Why it changes (a contract amendment, a re-proved field meter). It goes into the audit trail."
        testIDPrefix={prefix}
      />
      {general ? <Notice tone="error">{general}</Notice> : null}
      <View style={styles.actions}>
        <Button
          label="Save tolerance"
          size="compact"
          onPress={submit}
          busy={save.isPending}
          testID={`${prefix}-submit`}
        />
      </View>
      {save.isSuccess ? (
        <Notice testID={`${prefix}-saved`}>
          {`Tolerance ±${numberText(save.data.tolerancePercent)} % saved; it judges the contract days that start from ${formatOnSiteClock(save.data.effectiveFrom, site.timeZone)} on. Earlier days keep their verdicts.`}
        </Notice>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  versions: { gap: space.xs, marginVertical: space.sm },
  actions: { flexDirection: 'row', marginTop: space.sm },
});
