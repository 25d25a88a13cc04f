/**
 * Set-up, second level: one site, its fields, its meter runs (each opening its transmitters and
 * configuration versions), the form for a new meter run, and its balance groups with their form.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { BalanceGroupForm } from '@/components/setup/BalanceGroupForm';
import { Breadcrumbs } from '@/components/setup/Breadcrumbs';
import { describeElement } from '@/components/setup/elementDraft';
import { describeFluid } from '@/components/setup/fluidDraft';
import { MeterRunForm } from '@/components/setup/MeterRunForm';
import { SetupCaution } from '@/components/setup/SetupCaution';
import { SiteForm } from '@/components/setup/SiteForm';
import { fromSI } from '@/components/setup/unitChoices';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { colors, radius, space } from '@/constants/theme';
import { useMeterRuns, type MeterRun } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';

function siteFacts(site: Site): string {
  const us = site.displayUnits === 'us';
  const pressure = us
    ? `${fromSI(site.basePressurePa, 'psi').toFixed(3)} psia`
    : `${fromSI(site.basePressurePa, 'kPa').toFixed(3)} kPa`;
  const temperature = us
    ? `${fromSI(site.baseTemperatureK, 'degF').toFixed(2)} °F`
    : `${fromSI(site.baseTemperatureK, 'degC').toFixed(2)} °C`;
  const atmosphere = us
    ? `${fromSI(site.atmosphericPressurePa, 'psi').toFixed(3)} psia`
    : `${fromSI(site.atmosphericPressurePa, 'kPa').toFixed(3)} kPa`;
  return `${site.timeZone} · contract day from ${String(site.contractHour).padStart(2, '0')}:00 · base ${pressure}, ${temperature} · atmosphere ${atmosphere} · ${us ? 'US customary' : 'SI'} units`;
}

function MeterRunRow({ run, site }: { run: MeterRun; site: Site }) {
  const unit = site.displayUnits === 'us' ? 'in' : 'mm';
  return (
    <Link href={`/setup?meterRun=${encodeURIComponent(run.id)}`} asChild>
      <Pressable style={styles.row} testID={`run-row-${run.tag}`}>
        <View style={styles.rowTitle}>
          <AppText variant="bodyStrong">{run.tag}</AppText>
          <AppText style={styles.rowName}>{run.name}</AppText>
          <AppText variant="label">›</AppText>
        </View>
        <AppText
          variant="caption"
          tone="muted"
        >{`${describeElement(run.element, unit)} · ${describeFluid(run.fluid)}`}</AppText>
      </Pressable>
    </Link>
  );
}

export function SetupSiteScreen({ siteId }: { siteId: string }) {
  const sites = useSites();
  const runs = useMeterRuns(siteId);
  const [editing, setEditing] = useState(false);
  const site = sites.data?.find((candidate) => candidate.id === siteId);

  if (!site) {
    return (
      <Screen>
        <Breadcrumbs crumbs={[{ label: 'Set-up', href: '/setup' }, { label: 'Site' }]} />
        <QueryState
          isPending={sites.isPending}
          error={sites.error}
          onRetry={() => void sites.refetch()}
          noun="the site"
        />
        {sites.data ? (
          <Notice
            tone="error"
            title="No such site"
          >{`There is no site ${siteId}. It may have been given another id; go back to Set-up.`}</Notice>
        ) : null}
      </Screen>
    );
  }

  return (
    <Screen>
      <Breadcrumbs crumbs={[{ label: 'Set-up', href: '/setup' }, { label: `${site.code} · ${site.name}` }]} />
      <Panel
        title={`${site.code} · ${site.name}`}
        actions={
          editing ? null : (
            <Button label="Edit site" size="compact" onPress={() => setEditing(true)} testID="site-edit" />
          )
        }
        testID="site-summary"
      >
        {editing ? (
          <SiteForm site={site} onDone={() => setEditing(false)} onCancel={() => setEditing(false)} />
        ) : (
          <AppText tone="muted">{siteFacts(site)}</AppText>
        )}
      </Panel>
      <Panel title={runs.data ? `Meter runs (${runs.data.length})` : 'Meter runs'} testID="run-list">
        <QueryState
          isPending={runs.isPending}
          error={runs.error}
          onRetry={() => void runs.refetch()}
          noun="meter runs"
        />
        {runs.data && runs.data.length === 0 ? <AppText tone="muted">No meter runs at this site yet.</AppText> : null}
        {(runs.data ?? []).map((run) => (
          <MeterRunRow key={run.id} run={run} site={site} />
        ))}
      </Panel>
      {/* Drawn once the list is in, so the form does not move under the hand as the list fills. */}
      {runs.data ? (
        <Panel title="Add a meter run" testID="run-create-panel">
          <MeterRunForm site={site} />
        </Panel>
      ) : null}
      {runs.data ? (
        <Panel title="Balance groups" testID="balance-group-panel">
          <BalanceGroupForm site={site} meterRuns={runs.data} />
        </Panel>
      ) : null}
      <SetupCaution />
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: {
    gap: space.xxs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rowTitle: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  rowName: { flex: 1 },
});
