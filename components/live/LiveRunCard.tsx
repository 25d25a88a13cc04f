/**
 * One meter run on the live board: its rate now, today's running total, DP as a share of span,
 * the DP transmitter in use, how old its newest reading is, and anything abnormal. The whole
 * card opens the meter run.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { PriorityBadge } from '@/components/alarms/PriorityBadge';
import { AppText } from '@/components/ui/AppText';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, radius, space } from '@/constants/theme';
import type { LiveBoardRow } from '@/hooks/api/live';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { formatClock } from '@/shared/format/time';
import type { RunAlarms } from './boardOrder';
import { DpShareBar } from './DpShareBar';
import { directionWords, flowFigures, type DisplayUnits, type FluidFamily } from './flowFigures';
import { formatAge, formatFigure } from './formatFigure';
import type { RunState } from './runStates';

interface LiveRunCardProps {
  row: LiveBoardRow;
  family: FluidFamily;
  displayUnits: DisplayUnits;
  /** Age of the newest reading now, in seconds. */
  ageS: number | null;
  states: RunState[];
  /** The meter run's open alarms (from the alarm list), so the card and the banner agree. */
  alarms?: RunAlarms;
  width?: number;
}

/** The card's alarm line in words: "2 open alarms, 1 unacknowledged". */
function alarmLine(alarms: RunAlarms): string {
  const open = `${alarms.open} open alarm${alarms.open === 1 ? '' : 's'}`;
  if (alarms.unacknowledged) return `${open}, ${alarms.unacknowledged} unacknowledged`;
  return alarms.worst ? `${open}, acknowledged` : `${open}, shelved or out of service`;
}

/** Which DP transmitter the server uses, in words: the stacked pair's choice is named, not coloured. */
function transmitterInUse(row: LiveBoardRow): string {
  const active = row.transmitters.find((t) => t.id === row.activeTransmitterId);
  const tag = active ? ` (${active.tag})` : '';
  if (row.activeStackRole === 'low') return `Stacked pair: LOW range in use${tag}`;
  if (row.activeStackRole === 'high') return `Stacked pair: HIGH range in use${tag}`;
  if (row.activeStackRole === 'single') return `Single DP transmitter${tag}`;
  const stacked = row.transmitters.some((t) => t.stackRole === 'low' || t.stackRole === 'high');
  return stacked ? 'Stacked pair: neither in use (no fresh DP)' : 'No DP transmitter in use';
}

/** The contract day's start in the site's own clock, e.g. "09:00 MST" (shared/format/time.ts). */
function dayStartLabel(row: LiveBoardRow): string {
  return Number.isNaN(Date.parse(row.todayStart)) ? '' : formatClock(row.todayStart, row.timeZone);
}

export function LiveRunCard({ row, family, displayUnits, ageS, states, alarms, width }: LiveRunCardProps) {
  const [hovered, setHovered] = useState(false);
  const [focused, setFocused] = useState(false);
  const figures = flowFigures(row, family, displayUnits);
  const abnormal = states.length > 0 || Boolean(alarms?.worst);
  const testID = `live-run-${row.tag}`;
  // The board's own list of meter runs (one cached query): is this one bi-directional now?
  const runs = useMeterRuns();
  const bidirectional = runs.data?.find((r) => r.id === row.meterRunId)?.reverseElement !== undefined;
  const direction = directionWords(row.direction, bidirectional);

  return (
    <Link href={`/meter-runs/${encodeURIComponent(row.meterRunId)}`} asChild>
      <Pressable
        testID={testID}
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        style={StyleSheet.flatten([
          styles.card,
          width !== undefined ? { width } : styles.fullWidth,
          abnormal && styles.cardAbnormal,
          hovered && styles.hovered,
          focused && styles.focused,
        ])}
      >
        <View style={styles.titleRow}>
          <AppText variant="bodyStrong" numberOfLines={1}>
            {row.tag}
          </AppText>
          <AppText tone="muted" numberOfLines={1} style={styles.name}>
            {row.name}
          </AppText>
        </View>

        {alarms?.open ? (
          <View style={styles.alarms} testID={`${testID}-alarms`}>
            {alarms.worst ? (
              <PriorityBadge
                priority={alarms.worst}
                emphasis={alarms.worstUnacknowledged ? 'unacknowledged' : 'acknowledged'}
              />
            ) : null}
            <AppText variant="label" testID={`${testID}-alarm-count`}>
              {alarmLine(alarms)}
            </AppText>
          </View>
        ) : null}

        {states.length ? (
          <View style={styles.states} testID={`${testID}-states`}>
            {states.map((state, index) => (
              <StateBadge
                key={`${state.key}-${index}`}
                priority={state.priority}
                label={state.label}
                testID={`${testID}-state-${state.key}`}
              />
            ))}
          </View>
        ) : null}

        <View style={styles.figures}>
          <View style={styles.figure}>
            <AppText variant="caption" tone="muted">
              Rate now
            </AppText>
            <View style={styles.valueRow}>
              <AppText variant="display" tabular testID={`${testID}-rate`}>
                {figures.rate === null ? '—' : formatFigure(figures.rate)}
              </AppText>
              <AppText variant="label" tone="muted">
                {figures.rateUnit}
              </AppText>
            </View>
            {figures.rate === null ? (
              <AppText variant="caption" tone="muted">
                No live rate
              </AppText>
            ) : null}
            {direction ? (
              <AppText variant={row.direction === 'reverse' ? 'bodyStrong' : 'label'} testID={`${testID}-direction`}>
                {direction}
              </AppText>
            ) : null}
          </View>
          <View style={styles.figure}>
            <AppText variant="caption" tone="muted">{`Today since ${dayStartLabel(row)}`}</AppText>
            <View style={styles.valueRow}>
              <AppText variant="title" tabular testID={`${testID}-today`}>
                {formatFigure(figures.total)}
              </AppText>
              <AppText variant="label" tone="muted">
                {figures.totalUnit}
              </AppText>
            </View>
            {figures.energy ? (
              <AppText
                variant="caption"
                tone="muted"
                tabular
              >{`${formatFigure(figures.energy.value)} ${figures.energy.unit}`}</AppText>
            ) : null}
          </View>
        </View>

        <DpShareBar share={row.dpShareOfSpan} testID={`${testID}-dp`} />

        <View style={styles.footer}>
          <AppText variant="caption" testID={`${testID}-stack`}>
            {transmitterInUse(row)}
          </AppText>
          <AppText variant="caption" tone="muted" tabular testID={`${testID}-age`}>
            {ageS === null ? 'No readings yet' : `Newest reading ${formatAge(ageS)} ago`}
          </AppText>
        </View>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  card: {
    gap: space.md,
    padding: space.lg,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.md,
    minWidth: 0,
  },
  // A heavier outline, not a colour: the badges inside carry the colour and the words.
  cardAbnormal: { borderColor: colors.borderStrong, borderLeftWidth: 4 },
  fullWidth: { width: '100%' },
  hovered: { backgroundColor: colors.surfaceRaised },
  focused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: 2 },
  titleRow: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  name: { flexShrink: 1 },
  states: { gap: space.xs },
  alarms: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, justifyContent: 'space-between' },
  figure: { gap: space.xxs, minWidth: 120 },
  valueRow: { flexDirection: 'row', alignItems: 'baseline', gap: space.xs },
  footer: { gap: space.xxs },
});
