/**
 * Set-up, third level: one meter run, its details and line data, its transmitters (add,
 * re-range, calibration due) and its configuration versions (add one for an element swap or a
 * new gas analysis, with its effective time and reason), and its reconciliation tolerance.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { ToleranceForm } from '@/components/reconciliation/ToleranceForm';
import {
  ElementCalibrationsPanel,
  GasAnalysesPanel,
  InspectionsPanel,
} from '@/components/element-care/ElementCarePanels';
import { Breadcrumbs } from '@/components/setup/Breadcrumbs';
import { ConfigVersionForm } from '@/components/setup/ConfigVersionForm';
import { ConfigVersionList } from '@/components/setup/ConfigVersionList';
import { describeElement } from '@/components/setup/elementDraft';
import { describeFluid } from '@/components/setup/fluidDraft';
import { MeterRunDetailsForm } from '@/components/setup/MeterRunDetailsForm';
import { SettingVersionsPanel } from '@/components/setup/SettingVersionList';
import { SetupCaution } from '@/components/setup/SetupCaution';
import { TransmitterForm } from '@/components/setup/TransmitterForm';
import { TransmitterRow } from '@/components/setup/TransmitterRow';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { space } from '@/constants/theme';
import { useConfigVersions, useMeterRun, type ConfigVersion, type MeterRun } from '@/hooks/api/meterRuns';
import { formatOnSiteClock } from '@/components/setup/zonedTime';
import { useSites, type Site } from '@/hooks/api/sites';
import { useTransmitters } from '@/hooks/api/transmitters';
import { useBreakpoint } from '@/hooks/useBreakpoint';

function lineSummary(run: MeterRun): string {
  const line = run.line as Record<string, unknown>;
  const parts = [
    line.nominalSize && `size ${String(line.nominalSize)}`,
    line.schedule && `schedule ${String(line.schedule)}`,
    line.flangeClass && `flanges ${String(line.flangeClass)}`,
    typeof line.upstreamStraightLengthD === 'number' && `${line.upstreamStraightLengthD} D upstream`,
    typeof line.downstreamStraightLengthD === 'number' && `${line.downstreamStraightLengthD} D downstream`,
    line.installDate && `installed ${String(line.installDate)}`,
    typeof line.expectedServiceLifeYears === 'number' && `service life ${line.expectedServiceLifeYears} years`,
    line.bidirectional === true && 'bidirectional',
  ].filter(Boolean);
  return parts.length ? parts.join(' · ') : 'No line data recorded.';
}

function Details({ run, site }: { run: MeterRun; site: Site }) {
  const [editing, setEditing] = useState(false);
  const unit = site.displayUnits === 'us' ? 'in' : 'mm';
  return (
    <Panel
      title={`${run.tag} · ${run.name}`}
      actions={
        editing ? null : (
          <Button label="Edit details" size="compact" onPress={() => setEditing(true)} testID="run-edit" />
        )
      }
      testID="run-summary"
    >
      {editing ? (
        <MeterRunDetailsForm
          meterRun={run}
          site={site}
          onDone={() => setEditing(false)}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <View style={styles.facts}>
          <AppText>{`${describeElement(run.element, unit)} · ${describeFluid(run.fluid)}`}</AppText>
          <AppText
            variant="caption"
            tone="muted"
          >{`Hold limit ${run.holdLimitS} s · gap limit ${run.maxGapS} s · no-flow cutoff ${run.noFlowCutoffPercentOfSpan ?? 0.5} % of DP span · stacked pair switches up at ${Math.round(run.stackSwitchUpShare * 100)} % and down at ${Math.round(run.stackSwitchDownShare * 100)} % of the low range`}</AppText>
          <AppText variant="caption" tone="muted">
            {lineSummary(run)}
          </AppText>
        </View>
      )}
    </Panel>
  );
}

function Transmitters({ run, site }: { run: MeterRun; site: Site }) {
  const transmitters = useTransmitters(run.id);
  const list = transmitters.data ?? [];
  const dp = list.filter((t) => t.measures === 'differential-pressure');
  const missing = [
    dp.length === 0 && 'a DP transmitter',
    !list.some((t) => t.measures === 'static-pressure') &&
      run.fluid?.kind !== 'water' &&
      run.fluid?.kind !== 'liquid' &&
      'a static pressure transmitter',
    !list.some((t) => t.measures === 'temperature') && 'a temperature transmitter',
  ].filter(Boolean);
  return (
    <Panel title={transmitters.data ? `Transmitters (${list.length})` : 'Transmitters'} testID="tx-list">
      <QueryState
        isPending={transmitters.isPending}
        error={transmitters.error}
        onRetry={() => void transmitters.refetch()}
        noun="transmitters"
      />
      {transmitters.data && missing.length ? (
        <Notice>{`Still needed for live flow: ${missing.join(', ')}.`}</Notice>
      ) : null}
      {list.map((transmitter) => (
        <TransmitterRow key={transmitter.id} transmitter={transmitter} timeZone={site.timeZone} />
      ))}
      {/* The form waits for the list: it checks a new DP transmitter against those already there. */}
      {transmitters.data ? (
        <>
          <View style={styles.subheading}>
            <AppText variant="title" role="heading" aria-level={3}>
              Add a transmitter
            </AppText>
          </View>
          <TransmitterForm meterRun={run} existing={list} us={site.displayUnits === 'us'} />
        </>
      ) : null}
    </Panel>
  );
}

function Versions({ run, site }: { run: MeterRun; site: Site }) {
  const versions = useConfigVersions(run.id);
  const [adding, setAdding] = useState(false);
  // The last version added here, with the recompute it started (null until one is added).
  const [added, setAdded] = useState<ConfigVersion | null>(null);
  return (
    <Panel
      title={versions.data ? `Configuration versions (${versions.data.length})` : 'Configuration versions'}
      actions={
        adding ? null : (
          <Button
            label="Add a version"
            size="compact"
            onPress={() => {
              setAdded(null);
              setAdding(true);
            }}
            testID="version-add"
          />
        )
      }
      testID="version-list"
    >
      <AppText variant="caption" tone="muted">
        The element and fluid in force at each moment. An element swap, a new gas analysis or a corrected diameter is a
        new version with the time it took effect.
      </AppText>
      {added ? (
        <Notice testID="version-create-done">
          {added.recompute && added.recompute.hours > 0
            ? `Version added. ${added.recompute.hours} recorded hour${added.recompute.hours === 1 ? '' : 's'} from ${formatOnSiteClock(added.recompute.from, site.timeZone)} on ${added.recompute.hours === 1 ? 'is' : 'are'} being recomputed.`
            : 'Version added. Hours from its effective time on are being recomputed.'}
        </Notice>
      ) : null}
      {adding ? (
        <ConfigVersionForm
          meterRun={run}
          site={site}
          onDone={(created) => {
            setAdding(false);
            setAdded(created);
          }}
          onCancel={() => setAdding(false)}
        />
      ) : null}
      <QueryState
        isPending={versions.isPending}
        error={versions.error}
        onRetry={() => void versions.refetch()}
        noun="configuration versions"
      />
      {versions.data ? (
        <ConfigVersionList
          versions={versions.data}
          currentId={run.configVersionId}
          timeZone={site.timeZone}
          lengthUnit={site.displayUnits === 'us' ? 'in' : 'mm'}
        />
      ) : null}
    </Panel>
  );
}

export function SetupMeterRunScreen({ meterRunId }: { meterRunId: string }) {
  const run = useMeterRun(meterRunId);
  const sites = useSites();
  const wide = useBreakpoint() === 'wide';
  const site = run.data ? sites.data?.find((candidate) => candidate.id === run.data.siteId) : undefined;

  if (!run.data || !site) {
    return (
      <Screen>
        <Breadcrumbs crumbs={[{ label: 'Set-up', href: '/setup' }, { label: 'Meter run' }]} />
        <QueryState
          isPending={run.isPending || sites.isPending}
          error={run.error ?? sites.error}
          onRetry={() => {
            void run.refetch();
            void sites.refetch();
          }}
          noun="the meter run"
        />
      </Screen>
    );
  }

  return (
    <Screen>
      <Breadcrumbs
        crumbs={[
          { label: 'Set-up', href: '/setup' },
          { label: `${site.code} · ${site.name}`, href: `/setup?site=${encodeURIComponent(site.id)}` },
          { label: run.data.tag },
        ]}
      />
      <Details run={run.data} site={site} />
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.column}>
            <Transmitters run={run.data} site={site} />
          </View>
          <View style={styles.column}>
            <Versions run={run.data} site={site} />
          </View>
        </View>
      ) : (
        <>
          <Transmitters run={run.data} site={site} />
          <Versions run={run.data} site={site} />
        </>
      )}
      <SettingVersionsPanel run={run.data} site={site} />
      <GasAnalysesPanel meterRunId={run.data.id} />
      <ElementCalibrationsPanel meterRunId={run.data.id} />
      <InspectionsPanel meterRunId={run.data.id} />
      <ToleranceForm run={run.data} site={site} />
      <SetupCaution />
    </Screen>
  );
}

const styles = StyleSheet.create({
  facts: { gap: space.xs },
  subheading: { paddingTop: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  column: { flex: 1, minWidth: 0, gap: space.lg },
});
