/**
 * Set-up (engineer, admin), first level: the sites, each with its meter runs counted, a form to
 * add one, and each site's own fields to edit. A site opens its meter runs.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { SetupCaution } from '@/components/setup/SetupCaution';
import { SiteForm } from '@/components/setup/SiteForm';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { colors, radius, space } from '@/constants/theme';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';
import { useBreakpoint } from '@/hooks/useBreakpoint';

function SiteRow({ site, meterRunCount }: { site: Site; meterRunCount: number | undefined }) {
  const [editing, setEditing] = useState(false);
  const href = `/setup?site=${encodeURIComponent(site.id)}`;
  return (
    <View style={styles.row} testID={`site-row-${site.code}`}>
      <Link href={href} asChild>
        <Pressable style={styles.rowLink} testID={`site-open-${site.code}`}>
          <View style={styles.rowTitle}>
            <AppText variant="bodyStrong">{site.code}</AppText>
            <AppText style={styles.rowName}>{site.name}</AppText>
            <AppText variant="label">›</AppText>
          </View>
          <AppText variant="caption" tone="muted">
            {`${site.timeZone} · contract day from ${String(site.contractHour).padStart(2, '0')}:00 · ${site.displayUnits === 'us' ? 'US customary' : 'SI'} units · ${
              meterRunCount === undefined ? '…' : `${meterRunCount} meter run${meterRunCount === 1 ? '' : 's'}`
            }`}
          </AppText>
        </Pressable>
      </Link>
      {editing ? (
        <SiteForm site={site} onDone={() => setEditing(false)} onCancel={() => setEditing(false)} />
      ) : (
        <View style={styles.rowActions}>
          <Button label="Edit site" size="compact" onPress={() => setEditing(true)} testID={`site-edit-${site.code}`} />
        </View>
      )}
    </View>
  );
}

export function SetupScreen() {
  const sites = useSites();
  const runs = useMeterRuns();
  const wide = useBreakpoint() === 'wide';
  const counts = new Map<string, number>();
  for (const run of runs.data ?? []) counts.set(run.siteId, (counts.get(run.siteId) ?? 0) + 1);

  const listPanel = (
    <Panel
      title={sites.data ? `Sites (${sites.data.length})` : 'Sites'}
      testID="site-list"
      style={wide && styles.listWide}
    >
      <QueryState isPending={sites.isPending} error={sites.error} onRetry={() => void sites.refetch()} noun="sites" />
      {sites.data && sites.data.length === 0 ? <AppText tone="muted">No sites yet. Add the first one.</AppText> : null}
      {(sites.data ?? []).map((site) => (
        <SiteRow key={site.id} site={site} meterRunCount={runs.data ? (counts.get(site.id) ?? 0) : undefined} />
      ))}
    </Panel>
  );
  const formPanel = (
    <Panel title="Add a site" style={wide && styles.formWide}>
      <SiteForm />
    </Panel>
  );

  return (
    <Screen lead="Sites with their clock and base conditions; open a site for its meter runs, and a meter run for its transmitters and configuration versions.">
      <SetupCaution />
      {wide ? (
        <View style={styles.columns}>
          {listPanel}
          {formPanel}
        </View>
      ) : (
        <>
          {listPanel}
          {formPanel}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  listWide: { flex: 1, minWidth: 0 },
  formWide: { flex: 1, minWidth: 360 },
  row: {
    gap: space.sm,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rowLink: { gap: space.xxs },
  rowTitle: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  rowName: { flex: 1 },
  rowActions: { flexDirection: 'row', gap: space.sm },
});
