/**
 * The care of a meter run's primary element (issue 11 §2, §3) on its set-up screen: gas
 * analyses, laboratory calibrations of the element and inspections, each listed newest first
 * with a small form to record one. Each may become a configuration version (shown in the
 * configuration history), so a recorded one refreshes the meter run's queries.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { FieldRow } from '@/components/setup/FieldRow';
import { fieldErrorFromServer, parseNumberText } from '@/components/setup/formFields';
import { NumberField } from '@/components/setup/NumberField';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { apiRequest } from '@/hooks/api/client';
import { meterRunKeys } from '@/hooks/api/meterRuns';
import { parseComponentsText } from './componentsText';

const recorded = z.object({ id: z.string(), configVersionId: z.string().nullable() }).passthrough();
const analysis = recorded.extend({ sampledAt: z.string(), laboratory: z.string(), certificate: z.string().nullable() });
const calibration = recorded.extend({
  calibratedAt: z.string(),
  laboratory: z.string(),
  certificate: z.string().nullable(),
  uncertaintyPercent: z.number(),
  points: z.array(z.object({ reynoldsNumber: z.number(), dischargeCoefficient: z.number() })),
});
const inspection = recorded.extend({ inspectedAt: z.string(), kind: z.string(), condition: z.string() });

const instantHint = 'ISO 8601 with Z or an offset, e.g. 2026-11-20T08:00:00Z';

/** A meter run's records of one kind, and recording one (which refreshes the meter run's queries). */
function useRecords<S extends z.ZodType>(meterRunId: string, path: string, schema: S) {
  const queryClient = useQueryClient();
  const key = [...meterRunKeys.all, path, meterRunId] as const;
  const list = useQuery({
    queryKey: key,
    queryFn: ({ signal }) =>
      apiRequest({ path: `/meter-runs/${encodeURIComponent(meterRunId)}/${path}`, schema: z.array(schema), signal }),
  });
  const record = useMutation({
    mutationFn: (body: unknown) =>
      apiRequest({ method: 'POST', path: `/meter-runs/${encodeURIComponent(meterRunId)}/${path}`, body, schema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meterRunKeys.all }),
  });
  return { list, record };
}

/** The server's word on a field, else its message when it named no field of this form. */
function problemOf(error: unknown, field: string, fields: readonly string[]): string | undefined {
  const byField = fieldErrorFromServer(error);
  if (byField?.[field]) return byField[field];
  const named = byField
    ? Object.keys(byField).some((f) => fields.some((g) => f === g || f.startsWith(`${g}.`)))
    : false;
  if (field === fields[0] && error instanceof Error && !named) return error.message;
  const prefixed = byField ? Object.entries(byField).find(([f]) => f.startsWith(`${field}.`)) : undefined;
  return prefixed?.[1];
}

const optional = (text: string) => (text.trim() === '' ? undefined : text.trim());

function versionNote(configVersionId: string | null) {
  return configVersionId ? ' · became a configuration version' : '';
}

export function GasAnalysesPanel({ meterRunId }: { meterRunId: string }) {
  const { list, record } = useRecords(meterRunId, 'gas-analyses', analysis);
  const [sampledAt, setSampledAt] = useState('');
  const [laboratory, setLaboratory] = useState('');
  const [certificate, setCertificate] = useState('');
  const [componentsText, setComponentsText] = useState('');
  const [problem, setProblem] = useState<string | undefined>(undefined);
  const fields = ['sampledAt', 'laboratory', 'certificate', 'components'] as const;
  const submit = () => {
    const parsed = parseComponentsText(componentsText);
    if ('problem' in parsed) {
      setProblem(parsed.problem);
      return;
    }
    setProblem(undefined);
    record.mutate({ sampledAt: sampledAt.trim(), laboratory, certificate: optional(certificate), ...parsed });
  };
  return (
    <Panel title="Gas analyses" testID="gas-analyses">
      <AppText variant="caption" tone="muted">
        Each analysis replaces the gas composition from its sample time and recomputes the hours after it.
      </AppText>
      {(list.data ?? []).map((a) => (
        <AppText key={a.id} testID={`gas-analysis-${a.id}`}>
          {`${a.sampledAt} · ${a.laboratory}${a.certificate ? ` · certificate ${a.certificate}` : ''}${versionNote(a.configVersionId)}`}
        </AppText>
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No gas analysis recorded.</AppText> : null}
      <FieldRow>
        <TextField
          label="Sampled at"
          value={sampledAt}
          onChangeText={setSampledAt}
          hint={instantHint}
          error={problemOf(record.error, 'sampledAt', fields)}
          testID="gas-analysis-sampledAt"
        />
        <TextField
          label="Laboratory"
          value={laboratory}
          onChangeText={setLaboratory}
          error={problemOf(record.error, 'laboratory', fields)}
          testID="gas-analysis-laboratory"
        />
        <TextField
          label="Certificate (optional)"
          value={certificate}
          onChangeText={setCertificate}
          testID="gas-analysis-certificate"
        />
      </FieldRow>
      <TextField
        label="Components (one a line: name and mole fraction or mol %)"
        value={componentsText}
        onChangeText={setComponentsText}
        multiline
        numberOfLines={6}
        error={problem ?? problemOf(record.error, 'components', fields)}
        testID="gas-analysis-components"
      />
      <View style={styles.actions}>
        <Button
          label="Record analysis"
          size="compact"
          onPress={submit}
          busy={record.isPending}
          testID="gas-analysis-submit"
        />
      </View>
      {record.isSuccess ? <Notice testID="gas-analysis-saved">Analysis recorded.</Notice> : null}
    </Panel>
  );
}

export function ElementCalibrationsPanel({ meterRunId }: { meterRunId: string }) {
  const { list, record } = useRecords(meterRunId, 'element-calibrations', calibration);
  const [calibratedAt, setCalibratedAt] = useState('');
  const [laboratory, setLaboratory] = useState('');
  const [certificate, setCertificate] = useState('');
  const [uncertainty, setUncertainty] = useState('');
  const [pointsCsv, setPointsCsv] = useState('reynoldsNumber,dischargeCoefficient\n');
  const fields = ['calibratedAt', 'laboratory', 'certificate', 'uncertaintyPercent', 'pointsCsv', 'points'] as const;
  const submit = () =>
    record.mutate({
      calibratedAt: calibratedAt.trim(),
      laboratory,
      certificate: optional(certificate),
      uncertaintyPercent: parseNumberText(uncertainty) ?? uncertainty,
      pointsCsv,
    });
  return (
    <Panel title="Element calibrations" testID="element-calibrations">
      <AppText variant="caption" tone="muted">
        A laboratory curve of C against Re_D replaces the element&apos;s C from its date; the certificate&apos;s
        uncertainty of C replaces the default, and hours outside its Re_D range are flagged.
      </AppText>
      {(list.data ?? []).map((c) => (
        <AppText key={c.id} testID={`element-calibration-${c.id}`}>
          {`${c.calibratedAt} · ${c.laboratory} · U(C) ${c.uncertaintyPercent} % · ${c.points.length} points${c.certificate ? ` · certificate ${c.certificate}` : ''}`}
        </AppText>
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No element calibration recorded.</AppText> : null}
      <FieldRow>
        <TextField
          label="Calibrated at"
          value={calibratedAt}
          onChangeText={setCalibratedAt}
          hint={instantHint}
          error={problemOf(record.error, 'calibratedAt', fields)}
          testID="element-calibration-calibratedAt"
        />
        <TextField
          label="Laboratory"
          value={laboratory}
          onChangeText={setLaboratory}
          error={problemOf(record.error, 'laboratory', fields)}
          testID="element-calibration-laboratory"
        />
        <TextField
          label="Certificate (optional)"
          value={certificate}
          onChangeText={setCertificate}
          testID="element-calibration-certificate"
        />
        <NumberField
          label="Uncertainty of C (%, k = 2)"
          value={uncertainty}
          onChangeText={setUncertainty}
          error={problemOf(record.error, 'uncertaintyPercent', fields)}
          testID="element-calibration-uncertaintyPercent"
        />
      </FieldRow>
      <TextField
        label="Points (CSV: reynoldsNumber,dischargeCoefficient)"
        value={pointsCsv}
        onChangeText={setPointsCsv}
        multiline
        numberOfLines={6}
        error={problemOf(record.error, 'pointsCsv', fields) ?? problemOf(record.error, 'points', fields)}
        testID="element-calibration-pointsCsv"
      />
      <View style={styles.actions}>
        <Button
          label="Record calibration"
          size="compact"
          onPress={submit}
          busy={record.isPending}
          testID="element-calibration-submit"
        />
      </View>
      {record.isSuccess ? <Notice testID="element-calibration-saved">Calibration recorded.</Notice> : null}
    </Panel>
  );
}

const kinds = [
  { value: 'orifice-plate', label: 'Orifice plate' },
  { value: 'cone', label: 'Cone' },
  { value: 'venturi', label: 'Venturi' },
  { value: 'nozzle', label: 'Nozzle' },
] as const;
type Kind = (typeof kinds)[number]['value'];

export function InspectionsPanel({ meterRunId }: { meterRunId: string }) {
  const { list, record } = useRecords(meterRunId, 'inspections', inspection);
  const [inspectedAt, setInspectedAt] = useState('');
  const [kind, setKind] = useState<Kind>('orifice-plate');
  const [boreMm, setBoreMm] = useState('');
  const [flatnessMm, setFlatnessMm] = useState('');
  const [condition, setCondition] = useState('');
  const [certificate, setCertificate] = useState('');
  const fields = ['inspectedAt', 'kind', 'measured', 'condition', 'certificate'] as const;
  const submit = () => {
    const bore = parseNumberText(boreMm);
    const flatness = parseNumberText(flatnessMm);
    const diameter = bore !== undefined ? bore / 1000 : undefined;
    record.mutate({
      inspectedAt: inspectedAt.trim(),
      kind,
      measured: {
        ...(diameter !== undefined
          ? kind === 'cone'
            ? { coneDiameterM: diameter }
            : { boreDiameterM: diameter }
          : {}),
        ...(flatness !== undefined ? { flatnessMm: flatness } : {}),
      },
      condition,
      certificate: optional(certificate),
    });
  };
  return (
    <Panel title="Element inspections" testID="inspections">
      <AppText variant="caption" tone="muted">
        A measured bore (or cone diameter) that differs from the element in force becomes a configuration version from
        the inspection time.
      </AppText>
      {(list.data ?? []).map((i) => (
        <AppText key={i.id} testID={`inspection-${i.id}`}>
          {`${i.inspectedAt} · ${i.kind} · ${i.condition}${versionNote(i.configVersionId)}`}
        </AppText>
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No inspection recorded.</AppText> : null}
      <ChoiceGroup label="Element" options={kinds} value={kind} onChange={setKind} testIDPrefix="inspection-kind" />
      <FieldRow>
        <TextField
          label="Inspected at"
          value={inspectedAt}
          onChangeText={setInspectedAt}
          hint={instantHint}
          error={problemOf(record.error, 'inspectedAt', fields) ?? problemOf(record.error, 'kind', fields)}
          testID="inspection-inspectedAt"
        />
        <NumberField
          label={kind === 'cone' ? 'Measured cone diameter (mm)' : 'Measured bore (mm)'}
          value={boreMm}
          onChangeText={setBoreMm}
          error={problemOf(record.error, 'measured', fields)}
          testID="inspection-bore"
        />
        <NumberField
          label="Flatness (mm)"
          value={flatnessMm}
          onChangeText={setFlatnessMm}
          testID="inspection-flatness"
        />
      </FieldRow>
      <FieldRow>
        <TextField
          label="Condition"
          value={condition}
          onChangeText={setCondition}
          error={problemOf(record.error, 'condition', fields)}
          testID="inspection-condition"
        />
        <TextField
          label="Certificate (optional)"
          value={certificate}
          onChangeText={setCertificate}
          testID="inspection-certificate"
        />
      </FieldRow>
      <View style={styles.actions}>
        <Button
          label="Record inspection"
          size="compact"
          onPress={submit}
          busy={record.isPending}
          testID="inspection-submit"
        />
      </View>
      {record.isSuccess ? <Notice testID="inspection-saved">Inspection recorded.</Notice> : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
