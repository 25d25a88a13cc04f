/**
 * One correction in the list: what it corrects, for which period (on the site's clock), why, who
 * proposed and who decided it; for an approved one, the original and the corrected figures of its
 * period side by side with the difference; approve and reject for somebody else's proposal.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { ReasonDialog } from '@/components/ui/ReasonDialog';
import { space } from '@/constants/theme';
import { isApiError } from '@/hooks/api/client';
import { formatInstant } from '@/shared/format/time';
import { useCorrectionTransmitters, useDecideCorrection, type Correction } from './api';
import { estimateMethodText } from './estimateMethod';

interface Props {
  correction: Correction;
  meterRunTag: string;
  timeZone: string;
  /** Whether the signed-in person may decide it (role allows, and it is not their own). */
  canDecide: boolean;
}

const kg = (n: number) => `${n.toLocaleString('en', { maximumFractionDigits: 1, minimumFractionDigits: 1 })} kg`;
const m3 = (n: number) => `${n.toLocaleString('en', { maximumFractionDigits: 1, minimumFractionDigits: 1 })} m³`;
const signed = (n: number, unit: (n: number) => string) => `${n >= 0 ? '+' : '−'}${unit(Math.abs(n))}`;

/** @param transmitterTag the substituted transmitter's tag (its id until the transmitters have loaded) */
function whatText(c: Correction, transmitterTag: string): string {
  if (c.kind === 'adjust') return `Adjustment: every quantity × ${c.factor}`;
  if (c.substitute) {
    return c.substitute.hold
      ? `Substituted readings of ${transmitterTag}: the value held from before`
      : `Substituted readings of ${transmitterTag}: ${c.substitute.value} in its unit`;
  }
  const u = c.estimate?.uncertaintyPercent;
  return c.origin === 'estimate'
    ? `Estimate: ${kg(c.massKg ?? 0)} for the period (± ${u === null || u === undefined ? '—' : u.toFixed(1)} %, 95 %)`
    : `Substitution: ${kg(c.massKg ?? 0)} for the period`;
}

const statusText = { proposed: '◇ Proposed', approved: '✓ Approved', rejected: '✕ Rejected' } as const;

export function CorrectionCard({ correction: c, meterRunTag, timeZone, canDecide }: Props) {
  const [deciding, setDeciding] = useState<'approve' | 'reject' | null>(null);
  const decide = useDecideCorrection();
  const error = decide.error;
  const figures = c.figures;
  // Only a reading substitution needs the meter run's transmitters (to show the tag, not the id).
  const transmitters = useCorrectionTransmitters(c.meterRunId, Boolean(c.substitute));
  const transmitterTag = c.substitute
    ? (transmitters.data?.find((x) => x.id === c.substitute?.transmitterId)?.tag ??
      `transmitter ${c.substitute.transmitterId}`)
    : '';
  return (
    <Panel title={`${meterRunTag} · ${statusText[c.status]}`} testID={`correction-${c.id}`}>
      <AppText variant="bodyStrong">{whatText(c, transmitterTag)}</AppText>
      {c.origin === 'estimate' && c.estimate ? (
        <AppText variant="caption" tone="muted" testID={`correction-${c.id}-method`}>
          {estimateMethodText(c.estimate.method, c.estimate.basis)}
        </AppText>
      ) : null}
      <AppText>{`${formatInstant(c.start, timeZone)} → ${formatInstant(c.end, timeZone)}`}</AppText>
      <AppText tone="muted">{`Why: ${c.reason}`}</AppText>
      <AppText variant="caption" tone="muted">
        {`Proposed by ${c.proposedBy.name} on ${formatInstant(c.proposedAt, timeZone)}`}
      </AppText>
      {c.decidedBy && c.decidedAt ? (
        <AppText variant="caption" tone="muted" testID={`correction-${c.id}-decision`}>
          {`${c.status === 'approved' ? 'Approved' : 'Rejected'} by ${c.decidedBy.name} on ${formatInstant(c.decidedAt, timeZone)}: ${c.decisionReason ?? ''}`}
        </AppText>
      ) : null}
      {c.status === 'approved' && figures ? (
        <View
          style={styles.figures}
          testID={`correction-${c.id}-figures`}
          // A group, not a table: three figure blocks, no rows (axe "aria-required-children").
          role="group"
          aria-label="Original, corrected and difference"
        >
          {(
            [
              ['Original', figures.original],
              ['Corrected', figures.current],
            ] as const
          ).map(([label, q]) => (
            <View key={label} style={styles.figure} testID={`correction-${c.id}-${label.toLowerCase()}`}>
              <AppText variant="label" tone="muted">
                {label}
              </AppText>
              <AppText tabular>{kg(q.massKg)}</AppText>
              <AppText tabular variant="caption">{`${m3(q.standardVolumeM3)} at base`}</AppText>
            </View>
          ))}
          <View style={styles.figure} testID={`correction-${c.id}-difference`}>
            <AppText variant="label" tone="muted">
              Difference
            </AppText>
            <AppText tabular>{signed(figures.difference.massKg, kg)}</AppText>
            <AppText tabular variant="caption">{`${signed(figures.difference.standardVolumeM3, m3)} at base`}</AppText>
          </View>
        </View>
      ) : null}
      {c.status === 'approved' && figures && figures.hours === 0 ? (
        <AppText variant="caption" tone="muted">
          The period’s hours are being recomputed with this correction.
        </AppText>
      ) : null}
      {c.status === 'proposed' && canDecide && !deciding ? (
        <View style={styles.actions}>
          <Button
            label="Approve"
            variant="primary"
            onPress={() => setDeciding('approve')}
            testID={`correction-${c.id}-approve`}
          />
          <Button
            label="Reject"
            variant="secondary"
            onPress={() => setDeciding('reject')}
            testID={`correction-${c.id}-reject`}
          />
        </View>
      ) : null}
      {deciding ? (
        <ReasonDialog
          title={deciding === 'approve' ? 'Approve this correction' : 'Reject this correction'}
          explanation={
            deciding === 'approve'
              ? 'The period’s hourly records and totals are recomputed with it; the original figures stay readable beside the corrected ones.'
              : 'The correction stays on record as rejected; the figures do not change.'
          }
          ariaLabel={deciding === 'approve' ? 'Approve correction' : 'Reject correction'}
          testIDPrefix={`correction-${deciding}`}
          missingReason="Say why you decide so."
          reasonError={isApiError(error) && error.field === 'reason' ? error.message : undefined}
          otherError={error && !(isApiError(error) && error.field === 'reason') ? error.message : undefined}
          confirmLabel={deciding === 'approve' ? 'Approve' : 'Reject'}
          busy={decide.isPending}
          onConfirm={(reason) =>
            decide.mutate({ id: c.id, decision: deciding, reason }, { onSuccess: () => setDeciding(null) })
          }
          onCancel={() => {
            decide.reset();
            setDeciding(null);
          }}
        />
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  figure: { flexGrow: 1, flexBasis: 100, gap: space.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
