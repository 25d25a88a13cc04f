/**
 * A transmitter's calibration history (every role): its calibrations newest first, each with
 * its points as found and as left (error in % of span, pass or fail), laboratory, due date and
 * certificate, an as-found error chart across the history, and (engineer, admin) the form to
 * record one. A failed as-found offers "Propose a correction": the server's suggestion prefills
 * the ordinary corrections form, and the engineer submits it as a proposal another person approves.
 * Phone first: one column of cards.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { DateTime } from 'luxon';

import { Chart } from '@/components/charts/Chart';
import { CorrectionProposeForm } from '@/components/corrections/CorrectionProposeForm';
import { calibrationState } from '@/components/meter-runs/calibrationState';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { can } from '@/constants/roles';
import { space } from '@/constants/theme';
import { formatPlain, unitLabel } from '@/constants/units-display';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites } from '@/hooks/api/sites';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { formatDate } from '@/shared/format/time';
import {
  useCalibrations,
  useCorrectionProposal,
  useDownloadCertificate,
  useTransmitter,
  type Calibration,
  type CalibrationCorrectionProposal,
  type CalibrationPoint,
} from './api';
import { asFoundPlot } from './asFoundPlot';
import { CalibrationForm } from './CalibrationForm';

function Points({ title, points, unit }: { title: string; points: CalibrationPoint[]; unit: string }) {
  if (points.length === 0) return null;
  return (
    <View style={styles.points}>
      <AppText variant="label">{title}</AppText>
      {points.map((p, i) => (
        <AppText key={i} tabular style={p.pass ? null : styles.fail}>
          {`${formatPlain(p.appliedValue)} → ${formatPlain(p.indicatedValue)} ${unitLabel(unit)}: ${p.errorPercentOfSpan >= 0 ? '+' : '−'}${Math.abs(p.errorPercentOfSpan).toFixed(3)} % of span (±${formatPlain(p.tolerancePercentOfSpan)}) ${p.pass ? 'pass' : '⚑ fail'}`}
        </AppText>
      ))}
    </View>
  );
}

/** The date and whole hour of an instant on the site's clock, as the corrections form takes them. */
function onSiteClock(iso: string, zone: string) {
  const moment = DateTime.fromISO(iso, { zone });
  return { date: moment.toFormat('yyyy-LL-dd'), time: moment.toFormat('HH:00') };
}

/** "Propose a correction" for a failed as-found: fetches the suggestion, then the prefilled form. */
function ProposeCorrection({ calibration }: { calibration: Calibration }) {
  const suggest = useCorrectionProposal();
  const meterRuns = useMeterRuns();
  const sites = useSites();
  const [proposal, setProposal] = useState<CalibrationCorrectionProposal | null>(null);
  const [proposed, setProposed] = useState(false);
  if (proposed)
    return (
      <Notice testID={`calibration-correction-proposed-${calibration.id}`}>
        Correction proposed: it waits for another engineer or an administrator to approve it.
      </Notice>
    );
  if (proposal && meterRuns.data && sites.data) {
    const start = onSiteClock(proposal.start, proposal.timeZone);
    const end = onSiteClock(proposal.end, proposal.timeZone);
    return (
      <View style={styles.points} testID={`calibration-correction-${calibration.id}`}>
        <AppText tone="muted">{proposal.basis}</AppText>
        {proposal.shortened ? (
          <AppText tone="muted">
            The period since the last good calibration is longer than a correction may cover: this covers its last days;
            propose the earlier periods separately.
          </AppText>
        ) : null}
        <CorrectionProposeForm
          meterRuns={meterRuns.data}
          sites={sites.data}
          initial={{
            meterRunId: proposal.meterRunId,
            startDate: start.date,
            startTime: start.time,
            endDate: end.date,
            endTime: end.time,
            mode: 'factor',
            factor: String(proposal.factor),
            reason: proposal.reason,
          }}
          onDone={() => setProposed(true)}
        />
      </View>
    );
  }
  return (
    <View style={styles.row}>
      <Button
        label="Propose a correction"
        size="compact"
        onPress={() => suggest.mutate(calibration.id, { onSuccess: setProposal })}
        busy={suggest.isPending}
        testID={`calibration-propose-correction-${calibration.id}`}
      />
      {suggest.error ? <AppText tone="error">⊗ {suggest.error.message}</AppText> : null}
    </View>
  );
}

function CalibrationCard({ calibration, canPropose }: { calibration: Calibration; canPropose: boolean }) {
  const download = useDownloadCertificate();
  const c = calibration;
  const accreditation = [c.accreditation.standard, c.accreditation.number].filter(Boolean).join(' · ');
  return (
    <View style={styles.card} testID={`calibration-${c.id}`}>
      <AppText variant="bodyStrong">
        {formatDate(c.calibratedOn)} · {c.laboratory}
        {c.current ? '' : ' (corrected by a later record)'}
      </AppText>
      {accreditation ? <AppText tone="muted">{accreditation}</AppText> : null}
      <AppText>
        As found: {c.asFoundPass ? 'pass' : '⚑ fail'} · As left:{' '}
        {c.asLeft.length ? (c.asLeftPass ? 'pass' : '⚑ fail') : '—'}
      </AppText>
      <Points title="As found" points={c.asFound} unit={c.unit} />
      <Points title="As left" points={c.asLeft} unit={c.unit} />
      <AppText tone="muted">
        Performed by {c.performedBy} · next due {c.nextDue ? formatDate(c.nextDue) : '—'}
      </AppText>
      {c.certificate ? (
        <View style={styles.row}>
          <Button
            label={`Certificate: ${c.certificate.fileName}`}
            size="compact"
            onPress={() => download.mutate(c)}
            busy={download.isPending}
            testID={`calibration-certificate-${c.id}`}
          />
          {download.error ? <AppText tone="error">⊗ {download.error.message}</AppText> : null}
        </View>
      ) : (
        <AppText tone="muted">No certificate attached.</AppText>
      )}
      {canPropose && !c.asFoundPass ? <ProposeCorrection calibration={c} /> : null}
    </View>
  );
}

export function TransmitterCalibrationsScreen({ transmitterId }: { transmitterId: string }) {
  const user = useSignedInUser();
  const transmitter = useTransmitter(transmitterId);
  const calibrations = useCalibrations(transmitterId);
  const [recording, setRecording] = useState(false);
  const [recorded, setRecorded] = useState(false);
  const t = transmitter.data;
  const list = calibrations.data ?? [];
  const latest = list.find((c) => c.current);
  const due = calibrationState(latest?.nextDue ?? t?.calibrationDue ?? null, DateTime.utc().toISODate()!);

  return (
    <Screen
      testID="screen-transmitter-calibrations"
      lead="Each calibration of this transmitter as recorded, newest first, with its certificate. A calibration is never changed; a correction is a new record."
    >
      <QueryState
        isPending={transmitter.isPending}
        error={transmitter.error}
        onRetry={() => void transmitter.refetch()}
        noun="the transmitter"
      />
      {t ? (
        <Panel title={`${t.tag} · calibrations`} testID="transmitter-calibrations">
          <AppText>
            Range {formatPlain(t.lowerRange)} to {formatPlain(t.upperRange)} {unitLabel(t.unit)} · accuracy ±
            {formatPlain(t.accuracyPercentOfSpan)} % of span
          </AppText>
          <AppText
            variant={due.abnormal ? 'bodyStrong' : 'body'}
            tone={due.abnormal ? 'error' : 'default'}
            testID="calibration-due"
          >
            Calibration due: {due.text}
          </AppText>
          {can(user.role, 'configure') ? (
            recording ? (
              <CalibrationForm
                transmitter={t}
                onDone={() => {
                  setRecording(false);
                  setRecorded(true);
                }}
              />
            ) : (
              <View style={styles.row}>
                <Button
                  label="Record a calibration"
                  variant="primary"
                  onPress={() => {
                    setRecording(true);
                    setRecorded(false);
                  }}
                  testID="calibration-record"
                />
              </View>
            )
          ) : null}
          {recorded ? <Notice testID="calibration-recorded">Calibration recorded.</Notice> : null}
        </Panel>
      ) : null}
      <QueryState
        isPending={calibrations.isPending}
        error={calibrations.error}
        onRetry={() => void calibrations.refetch()}
        noun="the calibrations"
      />
      {calibrations.data ? (
        <>
          <Panel title="As-found error">
            <Chart {...asFoundPlot(list)} />
          </Panel>
          <Panel title="History" testID="calibration-history">
            {list.length === 0 ? <AppText tone="muted">No calibration recorded yet.</AppText> : null}
            {list.map((c) => (
              <CalibrationCard key={c.id} calibration={c} canPropose={can(user.role, 'proposeCorrection')} />
            ))}
          </Panel>
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.xs, paddingVertical: space.md, borderBottomWidth: StyleSheet.hairlineWidth },
  points: { gap: 2 },
  fail: { fontWeight: '600' },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
});
