/**
 * The alarm list's filters as an address gives them and as a line of words: the state and
 * priority choices, the filters read from the address (anything unknown dropped) and the line
 * that says what is shown.
 */
import { alarmStyle } from '@/constants/theme';
import type { AlarmFilters } from '@/hooks/api/alarms';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { ALARM_PRIORITIES, type AlarmPriority } from '@/shared/alarms/alarm-codes';

export const stateChoices = [
  { value: 'open', label: 'Open' },
  { value: 'unacknowledged', label: 'Unacknowledged' },
  { value: 'shelved', label: 'Shelved' },
  { value: 'out-of-service', label: 'Out of service' },
  { value: 'normal', label: 'Normal (closed)' },
  { value: 'all', label: 'All states' },
] as const satisfies readonly { value: AlarmFilters['state']; label: string }[];

export const priorityChoices = [
  { value: '', label: 'Any priority' },
  { value: 'high', label: `${alarmStyle.high.shape} High` },
  { value: 'medium', label: `${alarmStyle.medium.shape} Medium` },
  { value: 'low', label: `${alarmStyle.low.shape} Low` },
] as const;

export interface AlarmsScreenParams {
  state?: string;
  siteId?: string;
  meterRunId?: string;
  priority?: string;
}

/** @returns the filters an address asks for, with anything unknown dropped */
export function filtersFromParams(params: AlarmsScreenParams): AlarmFilters {
  const digits = (value: string | undefined) => (value && /^\d+$/.test(value) ? value : undefined);
  const state = stateChoices.find((choice) => choice.value === params.state)?.value ?? 'open';
  const priority = ALARM_PRIORITIES.includes(params.priority as AlarmPriority)
    ? (params.priority as AlarmPriority)
    : undefined;
  return { state, priority, siteId: digits(params.siteId), meterRunId: digits(params.meterRunId) };
}

/** @returns what the filters show, in a line, e.g. "Open · any priority · KFG · KFG-101" */
export function describeFilters(filters: AlarmFilters, sites: readonly Site[], meterRuns: readonly MeterRun[]): string {
  const state = stateChoices.find((c) => c.value === filters.state)?.label ?? filters.state;
  const priority = priorityChoices.find((c) => c.value === (filters.priority ?? ''))?.label ?? 'Any priority';
  const site = filters.siteId
    ? (sites.find((s) => s.id === filters.siteId)?.code ?? `site ${filters.siteId}`)
    : 'all sites';
  const run = filters.meterRunId
    ? (meterRuns.find((r) => r.id === filters.meterRunId)?.tag ?? `meter run ${filters.meterRunId}`)
    : null;
  return [state, priority.toLowerCase(), site, run].filter(Boolean).join(' · ');
}
