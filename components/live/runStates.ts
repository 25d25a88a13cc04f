/**
 * The abnormal states of one meter run on the live board, each with the alarm priority whose
 * colour and shape draw it (constants/theme.ts alarmStyle) and the words that say it, so colour
 * is never the only sign (ISA-101, TRADE.md §7).
 */
import type { LiveBoardRow } from '@/hooks/api/live';
import { DEFAULT_ALARM_LIMITS } from '@/shared/alarms/alarm-limits';
import { formatAge, formatShare } from './formatFigure';

/**
 * The bottom tenth of a DP transmitter's span: there a fixed error of, say, 0.1 % of span is
 * already 1 % of the reading or more, so flow measured there is flagged (common practice; the
 * server flags hours spent there as low-in-range).
 */
export const lowInRangeShare = 0.1;

/**
 * Drawn like the DP-low-in-range alarm at its default priority (shared/alarms/alarm-limits.ts),
 * so the board, the alarm banner and the alarm list show the same shape and colour for it.
 */
export const lowInRangePriority = DEFAULT_ALARM_LIMITS['dp-low-in-range'].priority;

/** Used when a meter run's hold limit is unknown: two minutes without a reading is stale. */
export const defaultStaleAfterS = 120;

export type RunStateKey = 'no-readings' | 'stale' | 'dp-low-in-range' | 'dp-over-range' | 'warning';

export interface RunState {
  key: RunStateKey;
  priority: 'high' | 'medium' | 'low';
  label: string;
}

/**
 * @param share DP as a share of the active transmitter's span, or null
 * @returns whether the DP sits in the bottom tenth of the span
 */
export function isLowInRange(share: number | null): boolean {
  return share !== null && share < lowInRangeShare;
}

/**
 * @param row the meter run's row of the live board
 * @param ageS age of its newest reading now, in seconds (null when it has none)
 * @param staleAfterS readings older than this make the row stale (the meter run's hold limit:
 *   past it the server stops using a reading, so the live rate goes too)
 * @returns the row's abnormal states, most urgent first; empty when all is normal
 */
export function runStates(row: LiveBoardRow, ageS: number | null, staleAfterS: number): RunState[] {
  const states: RunState[] = [];
  if (row.dpShareOfSpan !== null && row.dpShareOfSpan > 1) {
    states.push({
      key: 'dp-over-range',
      priority: 'high',
      label: `DP over range (${formatShare(row.dpShareOfSpan)} of span)`,
    });
  }
  const stale = ageS !== null && ageS > staleAfterS;
  if (ageS === null) states.push({ key: 'no-readings', priority: 'medium', label: 'No readings yet' });
  else if (stale)
    states.push({
      key: 'stale',
      priority: 'medium',
      label: `Transmitter silent: newest reading ${formatAge(ageS)} old`,
    });
  // With no readings at all, or none recent, the server's "no fresh ..." warnings only repeat that.
  const implied = (warning: string) => ageS === null || (stale && /^no fresh /.test(warning));
  for (const warning of row.warnings)
    if (!implied(warning)) states.push({ key: 'warning', priority: 'medium', label: warning });
  if (isLowInRange(row.dpShareOfSpan)) {
    states.push({
      key: 'dp-low-in-range',
      priority: lowInRangePriority,
      label: `DP low in range (${formatShare(row.dpShareOfSpan ?? 0)} of span)`,
    });
  }
  return states;
}
