/**
 * Corrections with four eyes (issue 9): the list, filtered by meter run and status, each
 * approved one with its period's original and corrected figures; a form to propose one; approve
 * and reject, with a reason, for somebody else's proposals (the server refuses one's own too).
 */
import { useState } from 'react';

import { CorrectionCard } from '@/components/corrections/CorrectionCard';
import { CorrectionProposeForm } from '@/components/corrections/CorrectionProposeForm';
import { correctionStatuses, useCorrections, type CorrectionStatus } from '@/components/corrections/api';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { can } from '@/constants/roles';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites } from '@/hooks/api/sites';
import { useSignedInUser } from '@/hooks/session/SessionProvider';

const statusLabels: Record<CorrectionStatus | 'all', string> = {
  all: 'All',
  proposed: 'Waiting for a decision',
  approved: 'Approved',
  rejected: 'Rejected',
};

export function CorrectionsScreen() {
  const user = useSignedInUser();
  const [status, setStatus] = useState<CorrectionStatus | 'all'>('all');
  const [meterRunId, setMeterRunId] = useState<string>('all');
  const [proposing, setProposing] = useState(false);
  const meterRuns = useMeterRuns();
  const sites = useSites();
  const corrections = useCorrections({
    status: status === 'all' ? undefined : status,
    meterRunId: meterRunId === 'all' ? undefined : meterRunId,
  });
  const runs = meterRuns.data ?? [];
  const siteList = sites.data ?? [];
  const zoneOf = (runId: string) => siteList.find((s) => s.id === runs.find((r) => r.id === runId)?.siteId)?.timeZone;

  return (
    <Screen
      testID="screen-corrections"
      lead="A correction replaces or scales a meter run's figures for a period, always with a reason; another engineer or an administrator approves it. The original figures stay on record beside the corrected ones."
    >
      {can(user.role, 'proposeCorrection') ? (
        <Panel title="Propose a correction">
          {proposing && runs.length ? (
            <CorrectionProposeForm
              meterRuns={runs}
              sites={siteList}
              onDone={() => {
                setProposing(false);
                setStatus('proposed');
              }}
            />
          ) : (
            <Button
              label="New correction"
              variant="primary"
              onPress={() => setProposing(true)}
              testID="correction-new"
            />
          )}
        </Panel>
      ) : null}
      <Panel title="Corrections">
        <ChoiceGroup
          label="Status"
          options={(['all', ...correctionStatuses] as const).map((value) => ({ value, label: statusLabels[value] }))}
          value={status}
          onChange={setStatus}
          testIDPrefix="corrections-status"
        />
        <ChoiceGroup
          label="Meter run"
          options={[{ value: 'all', label: 'All' }, ...runs.map((r) => ({ value: r.id, label: r.tag }))]}
          value={meterRunId}
          onChange={setMeterRunId}
          testIDPrefix="corrections-meter-run"
        />
      </Panel>
      <QueryState
        isPending={corrections.isPending}
        error={corrections.error}
        onRetry={() => void corrections.refetch()}
        noun="corrections"
      />
      {corrections.data?.map((c) => (
        <CorrectionCard
          key={c.id}
          correction={c}
          meterRunTag={runs.find((r) => r.id === c.meterRunId)?.tag ?? `Meter run ${c.meterRunId}`}
          timeZone={zoneOf(c.meterRunId) ?? 'UTC'}
          canDecide={can(user.role, 'approveCorrection') && c.proposedBy.id !== user.id}
        />
      ))}
      {corrections.data && !corrections.data.length ? (
        <AppText tone="muted" testID="corrections-empty">
          No corrections match these filters.
        </AppText>
      ) : null}
    </Screen>
  );
}
