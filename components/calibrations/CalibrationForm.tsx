/**
 * Records a calibration of one transmitter (engineer, admin): the dates, the laboratory and its
 * accreditation, the points as found and as left (typed one per line), who did it, and the
 * certificate. The server computes each point's error in % of span and judges it.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { isApiError } from '@/hooks/api/client';
import type { Transmitter } from '@/hooks/api/transmitters';
import { useRecordCalibration, type CertificateFile } from './api';
import { CertificatePicker } from './CertificatePicker';
import { parsePoints } from './pointsText';

type Field =
  | 'calibratedOn'
  | 'laboratory'
  | 'accreditation'
  | 'tolerancePercentOfSpan'
  | 'asFound'
  | 'asLeft'
  | 'performedBy'
  | 'nextDue'
  | 'certificate';

/** The form field a server error names (`asFound.1.appliedValue` belongs to the as-found points). */
function formField(serverField: string | undefined): Field | null {
  const head = serverField?.split('.')[0];
  const known: Field[] = [
    'calibratedOn',
    'laboratory',
    'accreditation',
    'tolerancePercentOfSpan',
    'asFound',
    'asLeft',
    'performedBy',
    'nextDue',
    'certificate',
  ];
  return known.find((f) => f === head) ?? null;
}

export function CalibrationForm({ transmitter, onDone }: { transmitter: Transmitter; onDone: () => void }) {
  const record = useRecordCalibration(transmitter.id);
  const [calibratedOn, setCalibratedOn] = useState('');
  const [laboratory, setLaboratory] = useState('');
  const [standard, setStandard] = useState('ISO/IEC 17025');
  const [number, setNumber] = useState('');
  const [tolerance, setTolerance] = useState(String(transmitter.accuracyPercentOfSpan));
  const [asFound, setAsFound] = useState('');
  const [asLeft, setAsLeft] = useState('');
  const [performedBy, setPerformedBy] = useState('');
  const [nextDue, setNextDue] = useState('');
  const [certificate, setCertificate] = useState<CertificateFile | null>(null);
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const unit = transmitter.unit;

  const submit = () => {
    const found = parsePoints(asFound);
    const left = parsePoints(asLeft);
    const toleranceValue = Number(tolerance);
    const problems: Partial<Record<Field, string>> = {};
    if (!found.ok) problems.asFound = found.message;
    else if (found.points.length === 0) problems.asFound = 'Give at least one point as found.';
    if (!left.ok) problems.asLeft = left.message;
    if (!/^\d{4}-\d{2}-\d{2}$/.test(calibratedOn)) problems.calibratedOn = 'A date YYYY-MM-DD.';
    if (!/^\d{4}-\d{2}-\d{2}$/.test(nextDue)) problems.nextDue = 'A date YYYY-MM-DD.';
    if (!laboratory.trim()) problems.laboratory = 'Name the laboratory.';
    if (!performedBy.trim()) problems.performedBy = 'Name who performed it.';
    if (!(toleranceValue > 0)) problems.tolerancePercentOfSpan = 'A tolerance above 0.';
    setErrors(problems);
    setFormError(null);
    if (Object.keys(problems).length || !found.ok || !left.ok) return;
    record.mutate(
      {
        calibration: {
          calibratedOn,
          laboratory: laboratory.trim(),
          accreditation: {
            ...(standard.trim() ? { standard: standard.trim() } : {}),
            ...(number.trim() ? { number: number.trim() } : {}),
          },
          tolerancePercentOfSpan: toleranceValue,
          asFound: found.points,
          asLeft: left.points,
          performedBy: performedBy.trim(),
          nextDue,
        },
        certificate,
      },
      {
        onSuccess: onDone,
        onError: (error) => {
          const field = isApiError(error) ? formField(error.field) : null;
          if (field) setErrors({ [field]: error.message });
          else setFormError(error.message);
        },
      },
    );
  };

  return (
    <View style={styles.form} testID="calibration-form">
      <TextField
        label="Calibration date (YYYY-MM-DD)"
        value={calibratedOn}
        onChangeText={setCalibratedOn}
        error={errors.calibratedOn}
        testID="calibration-date"
        inputMode="numeric"
      />
      <TextField
        label="Laboratory"
        value={laboratory}
        onChangeText={setLaboratory}
        error={errors.laboratory}
        testID="calibration-laboratory"
      />
      <TextField
        label="Accreditation standard"
        value={standard}
        onChangeText={setStandard}
        error={errors.accreditation}
        testID="calibration-accreditation-standard"
      />
      <TextField
        label="Accreditation number"
        value={number}
        onChangeText={setNumber}
        testID="calibration-accreditation-number"
      />
      <TextField
        label="Tolerance, % of span"
        value={tolerance}
        onChangeText={setTolerance}
        error={errors.tolerancePercentOfSpan}
        testID="calibration-tolerance"
        inputMode="decimal"
      />
      <TextField
        label={`As found: applied and indicated, ${unit}, one point per line`}
        value={asFound}
        onChangeText={setAsFound}
        error={errors.asFound}
        hint={`For example "0 0.02". Range ${transmitter.lowerRange} to ${transmitter.upperRange} ${unit}.`}
        multiline
        numberOfLines={4}
        testID="calibration-as-found"
      />
      <TextField
        label={`As left: applied and indicated, ${unit}, one point per line`}
        value={asLeft}
        onChangeText={setAsLeft}
        error={errors.asLeft}
        hint="Leave empty when nothing was adjusted."
        multiline
        numberOfLines={4}
        testID="calibration-as-left"
      />
      <TextField
        label="Performed by"
        value={performedBy}
        onChangeText={setPerformedBy}
        error={errors.performedBy}
        testID="calibration-performed-by"
      />
      <TextField
        label="Next due (YYYY-MM-DD)"
        value={nextDue}
        onChangeText={setNextDue}
        error={errors.nextDue}
        testID="calibration-next-due"
        inputMode="numeric"
      />
      <CertificatePicker file={certificate} onChange={setCertificate} disabled={record.isPending} />
      {errors.certificate ? (
        <AppText tone="error" testID="calibration-certificate-error">
          ⊗ {errors.certificate}
        </AppText>
      ) : null}
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <View style={styles.actions}>
        <Button
          label="Record calibration"
          variant="primary"
          onPress={submit}
          busy={record.isPending}
          testID="calibration-submit"
        />
        <Button label="Cancel" variant="quiet" onPress={onDone} disabled={record.isPending} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
