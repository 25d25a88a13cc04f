/**
 * The care of a meter run's primary element (issue 11 §2, §3) on its set-up screen: gas
 * analyses, laboratory calibrations of the element and inspections, each listed newest first
 * with its certificate (a download) and next due date, and a small form to record one: its date
 * and time on the site's clock, the certificate file and the next due date. Each may become a
 * configuration version (shown in the configuration history), so a recorded one refreshes the
 * meter run's queries. On a bi-directional meter run an element calibration says which flow
 * direction its curve is for: a reverse curve goes into the reverse constants.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { DatedChangeFields, type EffectiveOnSiteClock } from '@/components/setup/DatedChangeFields';
import { FieldRow } from '@/components/setup/FieldRow';
import { fieldErrorFromServer, parseNumberText } from '@/components/setup/formFields';
import { NumberField } from '@/components/setup/NumberField';
import { siteClockNow, zonedIso } from '@/components/setup/zonedTime';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useMeterRun } from '@/hooks/api/meterRuns';
import { formatDate, formatInstant } from '@/shared/format/time';
import { CareCertificatePicker } from './CareCertificatePicker';
import {
  careRecordSchema,
  useCareRecords,
  useDownloadCareCertificate,
  useMeterRunZone,
  type CareCertificateFile,
  type ChosenCertificate,
} from './careApi';
import { parseComponentsText } from './componentsText';

const analysis = careRecordSchema.extend({ sampledAt: z.string(), laboratory: z.string() });
const calibration = careRecordSchema.extend({
  calibratedAt: z.string(),
  laboratory: z.string(),
  uncertaintyPercent: z.number(),
  points: z.array(z.object({ reynoldsNumber: z.number(), dischargeCoefficient: z.number() })),
  /** The flow direction the curve is for (absent from older servers: forward). */
  direction: z.enum(['forward', 'reverse']).optional(),
});

type FlowDirection = 'forward' | 'reverse';
const directionOptions: { value: FlowDirection; label: string }[] = [
  { value: 'forward', label: 'Forward flow' },
  { value: 'reverse', label: 'Reverse flow' },
];
const directionWordsOf: Record<FlowDirection, string> = { forward: 'forward flow', reverse: 'reverse flow' };
const inspection = careRecordSchema.extend({ inspectedAt: z.string(), kind: z.string(), condition: z.string() });

/** The fields every record shares: when (site clock), why, the certificate and the next due date. */
function useCommonFields(zone: string) {
  const [when, setWhen] = useState<EffectiveOnSiteClock | null>(null);
  const [reason, setReason] = useState('');
  const [certificate, setCertificate] = useState('');
  const [file, setFile] = useState<ChosenCertificate | null>(null);
  const [nextDue, setNextDue] = useState('');
  // The form starts at now on the site's clock, once the zone is known.
  const effective = when ?? siteClockNow(zone, Date.now());
  return {
    effective,
    setEffective: (update: (current: EffectiveOnSiteClock) => EffectiveOnSiteClock) => setWhen(update(effective)),
    reason,
    setReason,
    certificate,
    setCertificate,
    file,
    setFile,
    nextDue,
    setNextDue,
    /** The shared part of the body, with the record's date under `dateField`. */
    body: (dateField: string) => ({
      [dateField]: zonedIso(effective.date, effective.time, zone),
      certificate: optional(certificate),
      nextDue: optional(nextDue),
      reason: optional(reason),
    }),
  };
}
type CommonFields = ReturnType<typeof useCommonFields>;

/** Date and time, reason, certificate number, certificate file and next due date of a record form. */
function CommonFieldsView(props: {
  common: CommonFields;
  dateField: string;
  dateLabel: string;
  timeLabel: string;
  error: unknown;
  fields: readonly string[];
  testIDPrefix: string;
}) {
  const { common, error, fields, testIDPrefix } = props;
  return (
    <>
      <DatedChangeFields
        effective={common.effective}
        onEffectiveChange={common.setEffective}
        reason={common.reason}
        onReasonChange={common.setReason}
        errors={{
          effectiveFrom: problemOf(error, props.dateField, fields),
          reason: problemOf(error, 'reason', fields),
        }}
        dateLabel={props.dateLabel}
        timeLabel={props.timeLabel}
        reasonHint="Optional: why, for the configuration history"
        testIDPrefix={testIDPrefix}
      />
      <FieldRow>
        <TextField
          label="Certificate number (optional)"
          value={common.certificate}
          onChangeText={common.setCertificate}
          error={problemOf(error, 'certificate', fields)}
          testID={`${testIDPrefix}-certificate`}
        />
        <TextField
          label="Next due (optional)"
          value={common.nextDue}
          onChangeText={common.setNextDue}
          hint="YYYY-MM-DD on the site’s clock"
          error={problemOf(error, 'nextDue', fields)}
          testID={`${testIDPrefix}-nextDue`}
        />
      </FieldRow>
      <CareCertificatePicker
        file={common.file}
        onChange={common.setFile}
        testIDPrefix={`${testIDPrefix}-certificate`}
      />
    </>
  );
}

/** One record in a history: its line, its next due date and its certificate as a download. */
function RecordLine(props: { text: string; nextDue: string | null; file: CareCertificateFile | null; testID: string }) {
  const download = useDownloadCareCertificate();
  return (
    <View style={styles.record} testID={props.testID}>
      <AppText>{props.text}</AppText>
      {props.nextDue ? <AppText tone="muted">{`Next due ${formatDate(props.nextDue)}`}</AppText> : null}
      {props.file ? (
        <View style={styles.actions}>
          <Button
            label={`Certificate: ${props.file.name}`}
            size="compact"
            onPress={() => download.mutate(props.file!)}
            busy={download.isPending}
            testID={`${props.testID}-certificate`}
          />
        </View>
      ) : null}
      {download.error ? <AppText tone="error">⊗ {download.error.message}</AppText> : null}
    </View>
  );
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

function optional(text: string) {
  return text.trim() === '' ? undefined : text.trim();
}

function versionNote(configVersionId: string | null) {
  return configVersionId ? ' · became a configuration version' : '';
}

const certificateNumber = (r: { certificate: string | null }) =>
  r.certificate ? ` · certificate ${r.certificate}` : '';

export function GasAnalysesPanel({ meterRunId }: { meterRunId: string }) {
  const zone = useMeterRunZone(meterRunId);
  const { list, record } = useCareRecords(meterRunId, 'gas-analyses', 'analysis', analysis);
  const common = useCommonFields(zone);
  const [laboratory, setLaboratory] = useState('');
  const [componentsText, setComponentsText] = useState('');
  const [problem, setProblem] = useState<string | undefined>(undefined);
  const fields = ['sampledAt', 'laboratory', 'certificate', 'components', 'nextDue', 'reason'] as const;
  const submit = () => {
    const parsed = parseComponentsText(componentsText);
    if ('problem' in parsed) {
      setProblem(parsed.problem);
      return;
    }
    setProblem(undefined);
    record.mutate({ body: { ...common.body('sampledAt'), laboratory, ...parsed }, certificate: common.file });
  };
  return (
    <Panel title="Gas analyses" testID="gas-analyses">
      <AppText variant="caption" tone="muted">
        Each analysis replaces the gas composition from its sample time and recomputes the hours after it.
      </AppText>
      {(list.data ?? []).map((a) => (
        <RecordLine
          key={a.id}
          testID={`gas-analysis-${a.id}`}
          text={`${formatInstant(a.sampledAt, zone)} · ${a.laboratory}${certificateNumber(a)}${versionNote(a.configVersionId)}`}
          nextDue={a.nextDue}
          file={a.certificateFile}
        />
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No gas analysis recorded.</AppText> : null}
      <CommonFieldsView
        common={common}
        dateField="sampledAt"
        dateLabel="Sample date"
        timeLabel="Sample time"
        error={record.error}
        fields={fields}
        testIDPrefix="gas-analysis"
      />
      <TextField
        label="Laboratory"
        value={laboratory}
        onChangeText={setLaboratory}
        error={problemOf(record.error, 'laboratory', fields)}
        testID="gas-analysis-laboratory"
      />
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
  const zone = useMeterRunZone(meterRunId);
  const { list, record } = useCareRecords(meterRunId, 'element-calibrations', 'calibration', calibration);
  const common = useCommonFields(zone);
  // Only a bi-directional meter run (reverse constants in force) takes a reverse curve; the server refuses one otherwise.
  const bidirectional = useMeterRun(meterRunId).data?.reverseElement !== undefined;
  const [direction, setDirection] = useState<FlowDirection>('forward');
  const [laboratory, setLaboratory] = useState('');
  const [uncertainty, setUncertainty] = useState('');
  const [pointsCsv, setPointsCsv] = useState('reynoldsNumber,dischargeCoefficient\n');
  const fields = [
    'calibratedAt',
    'laboratory',
    'certificate',
    'uncertaintyPercent',
    'pointsCsv',
    'points',
    'nextDue',
    'reason',
    'effectiveFrom',
    'direction',
  ] as const;
  const submit = () =>
    record.mutate({
      body: {
        ...common.body('calibratedAt'),
        laboratory,
        uncertaintyPercent: parseNumberText(uncertainty) ?? uncertainty,
        pointsCsv,
        direction: bidirectional ? direction : 'forward',
      },
      certificate: common.file,
    });
  return (
    <Panel title="Element calibrations" testID="element-calibrations">
      <AppText variant="caption" tone="muted">
        A laboratory curve of C against Re_D replaces the element&apos;s C from its date; the certificate&apos;s
        uncertainty of C replaces the default, and hours outside its Re_D range are flagged.
        {bidirectional ? ' A reverse-flow curve replaces the C of the element in reverse flow only.' : ''}
      </AppText>
      {(list.data ?? []).map((c) => (
        <RecordLine
          key={c.id}
          testID={`element-calibration-${c.id}`}
          text={`${formatInstant(c.calibratedAt, zone)} · ${directionWordsOf[c.direction ?? 'forward']} · ${c.laboratory} · U(C) ${c.uncertaintyPercent} % · ${c.points.length} points${certificateNumber(c)}`}
          nextDue={c.nextDue}
          file={c.certificateFile}
        />
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No element calibration recorded.</AppText> : null}
      <CommonFieldsView
        common={common}
        dateField="calibratedAt"
        dateLabel="Calibration date"
        timeLabel="Calibration time"
        error={record.error}
        fields={fields}
        testIDPrefix="element-calibration"
      />
      {bidirectional ? (
        <View style={styles.record}>
          <ChoiceGroup
            label="Curve for"
            options={directionOptions}
            value={direction}
            onChange={setDirection}
            testIDPrefix="element-calibration-direction"
          />
          {problemOf(record.error, 'direction', fields) ? (
            <AppText tone="error" testID="element-calibration-direction-error">
              {`⊗ ${problemOf(record.error, 'direction', fields)}`}
            </AppText>
          ) : null}
        </View>
      ) : null}
      <FieldRow>
        <TextField
          label="Laboratory"
          value={laboratory}
          onChangeText={setLaboratory}
          error={problemOf(record.error, 'laboratory', fields)}
          testID="element-calibration-laboratory"
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
  const zone = useMeterRunZone(meterRunId);
  const { list, record } = useCareRecords(meterRunId, 'inspections', 'inspection', inspection);
  const common = useCommonFields(zone);
  const [kind, setKind] = useState<Kind>('orifice-plate');
  const [boreMm, setBoreMm] = useState('');
  const [flatnessMm, setFlatnessMm] = useState('');
  const [condition, setCondition] = useState('');
  const fields = ['inspectedAt', 'kind', 'measured', 'condition', 'certificate', 'nextDue', 'reason'] as const;
  const submit = () => {
    const bore = parseNumberText(boreMm);
    const flatness = parseNumberText(flatnessMm);
    const diameter = bore !== undefined ? bore / 1000 : undefined;
    record.mutate({
      body: {
        ...common.body('inspectedAt'),
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
      },
      certificate: common.file,
    });
  };
  return (
    <Panel title="Element inspections" testID="inspections">
      <AppText variant="caption" tone="muted">
        A measured bore (or cone diameter) that differs from the element in force becomes a configuration version from
        the inspection time.
      </AppText>
      <Notice title="Safety" testID="inspection-caution">
        Pulling a plate or a cone opens a pressurised line: isolate, depressurise and vent it safely, prove zero
        pressure and a gas-free line, and work under the site&apos;s permit and lock-out before a flange is broken.
      </Notice>
      {(list.data ?? []).map((i) => (
        <RecordLine
          key={i.id}
          testID={`inspection-${i.id}`}
          text={`${formatInstant(i.inspectedAt, zone)} · ${i.kind} · ${i.condition}${certificateNumber(i)}${versionNote(i.configVersionId)}`}
          nextDue={i.nextDue}
          file={i.certificateFile}
        />
      ))}
      {list.data?.length === 0 ? <AppText tone="muted">No inspection recorded.</AppText> : null}
      <ChoiceGroup label="Element" options={kinds} value={kind} onChange={setKind} testIDPrefix="inspection-kind" />
      <CommonFieldsView
        common={common}
        dateField="inspectedAt"
        dateLabel="Inspection date"
        timeLabel="Inspection time"
        error={record.error}
        fields={fields}
        testIDPrefix="inspection"
      />
      <FieldRow>
        <NumberField
          label={kind === 'cone' ? 'Measured cone diameter (mm)' : 'Measured bore (mm)'}
          value={boreMm}
          onChangeText={setBoreMm}
          error={problemOf(record.error, 'measured', fields) ?? problemOf(record.error, 'kind', fields)}
          testID="inspection-bore"
        />
        <NumberField
          label="Flatness (mm)"
          value={flatnessMm}
          onChangeText={setFlatnessMm}
          testID="inspection-flatness"
        />
      </FieldRow>
      <TextField
        label="Condition"
        value={condition}
        onChangeText={setCondition}
        error={problemOf(record.error, 'condition', fields)}
        testID="inspection-condition"
      />
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
  record: { gap: space.xs },
});
