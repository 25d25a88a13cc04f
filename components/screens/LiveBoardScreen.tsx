/**
 * The operator's live board (every role): each meter run's rate now, today's running total,
 * DP as a share of span and the transmitter in use, grouped by site, kept current by the live
 * stream. An overview first (what needs attention), then one card per meter run, each opening
 * the meter run's own screen (ISA-101: overview, unit, detail).
 */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';

import { CardGrid } from '@/components/live/CardGrid';
import { fluidFamily } from '@/components/live/flowFigures';
import { LiveConnectionLine } from '@/components/live/LiveConnectionLine';
import { LiveRunCard } from '@/components/live/LiveRunCard';
import { defaultStaleAfterS, runStates, type RunState } from '@/components/live/runStates';
import { useNow } from '@/components/live/useNow';
import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, space } from '@/constants/theme';
import { useLiveBoard, type LiveBoardRow } from '@/hooks/api/live';
import { useMeterRuns, type MeterRun } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';

/** Ages are re-read this often between server updates. */
const clockTickMs = 1_000;
/** Narrowest card: a phone's width less its padding still fits one. */
const minCardWidthPx = 320;

interface BoardEntry {
  row: LiveBoardRow;
  ageS: number | null;
  states: RunState[];
}

interface SiteGroup {
  code: string;
  site: Site | undefined;
  entries: BoardEntry[];
}

function groupBySite(entries: BoardEntry[], sites: Site[]): SiteGroup[] {
  const groups = new Map<string, SiteGroup>();
  for (const entry of entries) {
    const code = entry.row.siteCode;
    let group = groups.get(code);
    if (!group) {
      group = { code, site: sites.find((site) => site.code === code), entries: [] };
      groups.set(code, group);
    }
    group.entries.push(entry);
  }
  return [...groups.values()].sort((a, b) => a.code.localeCompare(b.code));
}

function AttentionPanel({ entries }: { entries: BoardEntry[] }) {
  const attention = entries.filter((entry) => entry.states.length > 0);
  if (attention.length === 0) {
    return <AppText testID="live-all-normal">{`All ${entries.length} meter runs normal.`}</AppText>;
  }
  // Meter runs that have never reported share one line, so a new site does not bury the rest.
  const silent = attention.filter(({ states }) => states.length === 1 && states[0].key === 'no-readings');
  const others = attention.filter((entry) => !silent.includes(entry));
  return (
    <Panel title={`Needs attention (${attention.length} of ${entries.length})`} testID="live-attention">
      {others.map(({ row, states }) => (
        <Link key={row.meterRunId} href={`/meter-runs/${encodeURIComponent(row.meterRunId)}`} asChild>
          <Pressable
            style={styles.attentionRow}
            aria-label={`${row.tag}: ${states.map((state) => state.label).join('; ')}`}
          >
            <AppText variant="bodyStrong" style={styles.attentionTag}>
              {row.tag}
            </AppText>
            <StateBadge
              priority={states[0].priority}
              label={states.length > 1 ? `${states[0].label} (+${states.length - 1} more)` : states[0].label}
              variant="inline"
            />
          </Pressable>
        </Link>
      ))}
      {silent.length ? (
        <View style={styles.attentionRow} testID="live-attention-silent">
          <StateBadge
            priority="medium"
            variant="inline"
            label={`No readings yet from ${silent.length === 1 ? 'one meter run' : `${silent.length} meter runs`}: ${silent.map(({ row }) => row.tag).join(', ')}`}
          />
        </View>
      ) : null}
    </Panel>
  );
}

export function LiveBoardScreen() {
  const { board, connection } = useLiveBoard();
  const sites = useSites();
  const runs = useMeterRuns();
  const nowMs = useNow(clockTickMs);

  const runById = new Map<string, MeterRun>((runs.data ?? []).map((run) => [run.id, run]));
  const receivedAtMs = board.data?.receivedAtMs;
  const sinceReceivedS = receivedAtMs === undefined ? 0 : Math.max(0, (nowMs - receivedAtMs) / 1000);
  const entries: BoardEntry[] = (board.data?.rows ?? []).map((row) => {
    const ageS = row.freshnessS === null ? null : row.freshnessS + sinceReceivedS;
    const staleAfterS = runById.get(row.meterRunId)?.holdLimitS ?? defaultStaleAfterS;
    return { row, ageS, states: runStates(row, ageS, staleAfterS) };
  });
  const groups = sites.isPending || runs.isPending ? [] : groupBySite(entries, sites.data ?? []);

  return (
    <Screen testID="screen-live">
      <LiveConnectionLine connection={connection} receivedAtMs={receivedAtMs} nowMs={nowMs} />
      <QueryState
        isPending={board.isPending || sites.isPending || runs.isPending}
        error={board.data ? null : (board.error ?? sites.error ?? runs.error)}
        onRetry={() => {
          void board.refetch();
          void sites.refetch();
          void runs.refetch();
        }}
        noun="the live board"
      />
      {board.data && entries.length === 0 ? (
        <Notice title="No meter runs yet">
          Engineers add sites, meter runs and transmitters under Set-up; they appear here once they exist.
        </Notice>
      ) : null}
      {groups.length > 0 ? <AttentionPanel entries={entries} /> : null}
      {groups.map((group) => (
        <View key={group.code} style={styles.site} testID={`live-site-${group.code}`}>
          <View style={styles.siteHeading}>
            <AppText variant="title" role="heading" aria-level={2}>
              {group.site ? `${group.code} · ${group.site.name}` : group.code}
            </AppText>
            <AppText variant="caption" tone="muted">
              {group.site?.displayUnits === 'us' ? 'US customary units' : 'SI units'}
              {` · ${group.entries[0]?.row.timeZone ?? ''}`}
            </AppText>
          </View>
          <CardGrid minCardWidth={minCardWidthPx}>
            {(width) =>
              group.entries.map((entry) => {
                const run = runById.get(entry.row.meterRunId);
                return (
                  <LiveRunCard
                    key={entry.row.meterRunId}
                    row={entry.row}
                    ageS={entry.ageS}
                    states={entry.states}
                    family={fluidFamily(run?.fluid?.kind)}
                    displayUnits={group.site?.displayUnits ?? 'si'}
                    width={width}
                  />
                );
              })
            }
          </CardGrid>
        </View>
      ))}
    </Screen>
  );
}

const styles = StyleSheet.create({
  site: { gap: space.md },
  siteHeading: { gap: space.xxs, borderBottomWidth: 1, borderBottomColor: colors.divider, paddingBottom: space.xs },
  attentionRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.xs,
    flexWrap: 'wrap',
  },
  attentionTag: { minWidth: 96 },
});
