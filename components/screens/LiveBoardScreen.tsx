/**
 * The operator's live board (every role): each meter run's rate now, today's running total,
 * DP as a share of span and the transmitter in use, grouped by site, kept current by the live
 * stream. An overview first (what needs attention), then one card per meter run, each opening
 * the meter run's own screen (ISA-101: overview, unit, detail).
 */
import { Link, router, useLocalSearchParams } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';

import { PriorityBadge } from '@/components/alarms/PriorityBadge';
import {
  alarmsByRun,
  boardOrderFrom,
  boardSummary,
  needsAttention,
  sortRuns,
  type BoardOrder,
  type RunAlarms,
} from '@/components/live/boardOrder';
import { CardGrid } from '@/components/live/CardGrid';
import { fluidFamily } from '@/components/live/flowFigures';
import { LiveConnectionLine } from '@/components/live/LiveConnectionLine';
import { LiveRunCard } from '@/components/live/LiveRunCard';
import { defaultStaleAfterS, runStates, type RunState } from '@/components/live/runStates';
import { useNow } from '@/components/live/useNow';
import { AppText } from '@/components/ui/AppText';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, space } from '@/constants/theme';
import { useAlarms } from '@/hooks/api/alarms';
import { useLiveBoard, type LiveBoardRow } from '@/hooks/api/live';
import { useMeterRuns, type MeterRun } from '@/hooks/api/meterRuns';
import { useSites, type Site } from '@/hooks/api/sites';

/** Ages are re-read this often between server updates. */
const clockTickMs = 1_000;
/** Narrowest card: a phone's width less its padding still fits one. */
const minCardWidthPx = 320;
/** Every open alarm is read to mark the cards: far more than a board's meter runs ever hold at once. */
const alarmReach = 300;

const orderOptions: readonly { value: BoardOrder; label: string }[] = [
  { value: 'worst', label: 'Worst first' },
  { value: 'dp-share', label: 'DP share' },
  { value: 'name', label: 'Name' },
];

interface BoardEntry {
  row: LiveBoardRow;
  ageS: number | null;
  states: RunState[];
  alarms: RunAlarms | undefined;
  /** For boardOrder.ts. */
  meterRunId: string;
  tag: string;
  dpShareOfSpan: number | null;
  stateCount: number;
}

interface SiteGroup {
  code: string;
  site: Site | undefined;
  entries: BoardEntry[];
}

/** Groups keep the order of their first (worst, lowest or first-named) meter run; by name, sites go by code. */
function groupBySite(entries: BoardEntry[], sites: Site[], order: BoardOrder): SiteGroup[] {
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
  const list = [...groups.values()];
  return order === 'name' ? list.sort((a, b) => a.code.localeCompare(b.code)) : list;
}

function alarmWords(alarms: RunAlarms): string {
  const open = `${alarms.open} open alarm${alarms.open === 1 ? '' : 's'}`;
  return alarms.unacknowledged ? `${open}, ${alarms.unacknowledged} unacknowledged` : open;
}

function AttentionPanel({ entries }: { entries: BoardEntry[] }) {
  const attention = entries.filter((entry) => needsAttention(entry, entry.alarms));
  const summary = boardSummary(
    entries,
    new Map(entries.flatMap((entry) => (entry.alarms ? [[entry.meterRunId, entry.alarms] as const] : []))),
  );
  if (attention.length === 0) {
    return <AppText testID="live-all-normal">{summary}</AppText>;
  }
  // Meter runs that have never reported share one line, so a new site does not bury the rest.
  const silent = attention.filter(
    ({ states, alarms }) => states.length === 1 && states[0].key === 'no-readings' && !alarms?.worst,
  );
  const others = attention.filter((entry) => !silent.includes(entry));
  return (
    <Panel title={summary} testID="live-attention">
      {others.map(({ row, states, alarms }) => (
        <Link key={row.meterRunId} href={`/meter-runs/${encodeURIComponent(row.meterRunId)}`} asChild>
          <Pressable style={styles.attentionRow}>
            <AppText variant="bodyStrong" style={styles.attentionTag}>
              {row.tag}
            </AppText>
            {alarms?.worst ? (
              <PriorityBadge
                priority={alarms.worst}
                emphasis={alarms.worstUnacknowledged ? 'unacknowledged' : 'acknowledged'}
                suffix={`· ${alarmWords(alarms)}`}
              />
            ) : null}
            {states.length ? (
              <StateBadge
                priority={states[0].priority}
                label={states.length > 1 ? `${states[0].label} (+${states.length - 1} more)` : states[0].label}
                variant="inline"
              />
            ) : null}
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
  const openAlarms = useAlarms({ state: 'open', limit: alarmReach });
  const params = useLocalSearchParams<{ order?: string }>();
  const order = boardOrderFrom(params.order);
  const runAlarms = alarmsByRun(openAlarms.data ?? []);

  const runById = new Map<string, MeterRun>((runs.data ?? []).map((run) => [run.id, run]));
  const receivedAtMs = board.data?.receivedAtMs;
  const sinceReceivedS = receivedAtMs === undefined ? 0 : Math.max(0, (nowMs - receivedAtMs) / 1000);
  const entries: BoardEntry[] = (board.data?.rows ?? []).map((row) => {
    const ageS = row.freshnessS === null ? null : row.freshnessS + sinceReceivedS;
    const staleAfterS = runById.get(row.meterRunId)?.holdLimitS ?? defaultStaleAfterS;
    const states = runStates(row, ageS, staleAfterS);
    return {
      row,
      ageS,
      states,
      alarms: runAlarms.get(row.meterRunId),
      meterRunId: row.meterRunId,
      tag: row.tag,
      dpShareOfSpan: row.dpShareOfSpan,
      stateCount: states.length,
    };
  });
  const sorted = sortRuns(entries, runAlarms, order);
  const groups = sites.isPending || runs.isPending ? [] : groupBySite(sorted, sites.data ?? [], order);

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
      {groups.length > 0 ? <AttentionPanel entries={sorted} /> : null}
      {groups.length > 0 ? (
        <ChoiceGroup
          label="Order"
          options={orderOptions}
          value={order}
          onChange={(next) => router.setParams({ order: next === 'worst' ? undefined : next })}
          testIDPrefix="live-order"
        />
      ) : null}
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
                    alarms={entry.alarms}
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
