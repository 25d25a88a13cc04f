/** Meter runs (all roles): every meter run by site, with its element, β and fluid; each opens its own screen. */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { betaOf, elementName, fluidName } from '@/components/meter-runs/describeMeterRun';
import { AppText } from '@/components/ui/AppText';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { colors, layout, radius, space } from '@/constants/theme';
import { useMeterRuns, type MeterRun } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';

function MeterRunLink({ run, site }: { run: MeterRun; site: Site | undefined }) {
  // Link hands its props to the Pressable (asChild) and merges only a flat style object.
  const [hovered, setHovered] = useState(false);
  const [focused, setFocused] = useState(false);
  const beta = run.element ? betaOf(run.element) : null;
  return (
    <Link href={`/meter-runs/${run.id}`} asChild>
      <Pressable
        testID={`meter-run-row-${run.tag}`}
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        style={StyleSheet.flatten([styles.row, hovered && styles.rowHovered, focused && styles.rowFocused])}
      >
        <View style={styles.who}>
          <AppText variant="bodyStrong">{run.tag}</AppText>
          <AppText tone="muted" numberOfLines={1}>
            {run.name}
          </AppText>
        </View>
        <View style={styles.fact}>
          <AppText variant="caption" tone="muted">
            Site
          </AppText>
          <AppText>{site ? site.code : '…'}</AppText>
        </View>
        <View style={styles.factWide}>
          <AppText variant="caption" tone="muted">
            Primary element
          </AppText>
          <AppText>{run.element ? elementName(run.element) : 'not configured'}</AppText>
        </View>
        <View style={styles.fact}>
          <AppText variant="caption" tone="muted">
            β
          </AppText>
          <AppText tabular>{beta === null ? '—' : beta.toFixed(4)}</AppText>
        </View>
        <View style={styles.factFluid}>
          <AppText variant="caption" tone="muted">
            Fluid
          </AppText>
          <AppText>{run.fluid ? fluidName(run.fluid) : '—'}</AppText>
        </View>
        <AppText tone="muted" aria-hidden style={styles.chevron}>
          ›
        </AppText>
      </Pressable>
    </Link>
  );
}

export function MeterRunsScreen() {
  const runs = useMeterRuns();
  const sites = useSites();
  const list = runs.data ?? [];
  const siteById = new Map((sites.data ?? []).map((site) => [site.id, site]));
  // By site, in the order the server lists sites (by code); meter runs by tag within each.
  const siteIds = [...new Set([...(sites.data ?? []).map((site) => site.id), ...list.map((run) => run.siteId)])].filter(
    (id) => list.some((run) => run.siteId === id),
  );

  return (
    <Screen
      lead="Every meter run with its site, primary element, β and fluid. Open one for its transmitters, trends, hourly records and contract-day totals."
      testID="meter-runs-screen"
    >
      <QueryState isPending={runs.isPending} error={runs.error} onRetry={() => void runs.refetch()} noun="meter runs" />
      {runs.data && list.length === 0 ? (
        <Panel title="No meter runs yet">
          <AppText>Engineers add sites, meter runs and transmitters under Set-up.</AppText>
        </Panel>
      ) : null}
      {siteIds.map((siteId) => {
        const site = siteById.get(siteId);
        const inSite = list.filter((run) => run.siteId === siteId);
        return (
          <Panel
            key={siteId}
            title={site ? `${site.code} · ${site.name}` : `Site ${siteId}`}
            testID={`meter-run-site-${site?.code ?? siteId}`}
          >
            {site ? (
              <AppText variant="caption" tone="muted">
                {`${site.timeZone} · contract day from ${String(site.contractHour).padStart(2, '0')}:00 · ${site.displayUnits === 'us' ? 'US customary units' : 'SI units'} · ${inSite.length} meter run${inSite.length === 1 ? '' : 's'}`}
              </AppText>
            ) : null}
            <View style={styles.list}>
              {inSite.map((run) => (
                <MeterRunLink key={run.id} run={run} site={site} />
              ))}
            </View>
          </Panel>
        );
      })}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs },
  row: {
    minHeight: layout.touchTarget,
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    columnGap: space.lg,
    rowGap: space.xs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rowHovered: { borderColor: colors.borderStrong },
  rowFocused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: 2 },
  // Fixed widths, so the facts of every row line up in columns on a wide screen.
  who: { flexBasis: 220, flexGrow: 1, flexShrink: 1, minWidth: 160 },
  fact: { width: 72 },
  factWide: { width: 190 },
  factFluid: { width: 110 },
  chevron: { fontSize: 22 },
});
