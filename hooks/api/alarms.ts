/**
 * Alarms: GET /api/alarms (the list, filtered), /api/alarms/counts (the banner),
 * /api/alarms/:id/events (an alarm's log) and the lifecycle actions (acknowledge, shelve,
 * unshelve, out of service, return to service). After any action, or a 409 that says someone
 * else got there first, every alarm query is refreshed, so list, banner and history agree.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import {
  ALARM_CONDITIONS,
  ALARM_PRIORITIES,
  ALARM_STATES,
  type AlarmPriority,
  type AlarmState,
} from '@/shared/alarms/alarm-codes';
import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const alarmSchema = z.object({
  id,
  meterRunId: id,
  meterRunTag: z.string(),
  siteId: id,
  transmitterId: id.nullable(),
  transmitterTag: z.string().nullable(),
  /** A condition code this client does not know yet still lists (shown by its code). */
  condition: z.union([z.enum(ALARM_CONDITIONS), z.string()]),
  priority: z.enum(ALARM_PRIORITIES),
  state: z.enum(ALARM_STATES),
  conditionActive: z.boolean(),
  onsetAt: z.string().nullable(),
  raisedAt: z.string().nullable(),
  clearedAt: z.string().nullable(),
  acknowledgedAt: z.string().nullable(),
  acknowledgedBy: z.string().nullable(),
  shelvedUntil: z.string().nullable(),
  shelveReason: z.string().nullable(),
  activations: z.number(),
  message: z.string(),
  /**
   * The consequential-alarm group (ISA-18.2 first-out), on list reads only: the first-out's id,
   * the first-out this alarm falls under (null on a first-out), how many fall under a first-out.
   */
  groupId: id.optional(),
  firstOutId: id.nullable().optional(),
  consequentialCount: z.number().optional(),
});
export type Alarm = z.infer<typeof alarmSchema>;

export const alarmEventSchema = z.object({
  id,
  alarmId: id,
  occurredAt: z.string().nullable(),
  recordedAt: z.string().nullable(),
  action: z.string(),
  fromState: z.string().nullable(),
  toState: z.string(),
  userEmail: z.string().nullable(),
  note: z.string().nullable(),
});
export type AlarmEvent = z.infer<typeof alarmEventSchema>;

const countsSchema = z.object({
  open: z.number(),
  unacknowledged: z.number(),
  unacknowledgedByPriority: z.object({ high: z.number(), medium: z.number(), low: z.number() }),
  byState: z.record(z.string(), z.number()),
  raisedLast10Minutes: z.number(),
  flood: z.boolean(),
});
export type AlarmCounts = z.infer<typeof countsSchema>;

/** States waiting for someone to acknowledge them (ISA-18.2). */
export const unacknowledgedStates: readonly AlarmState[] = ['active-unacknowledged', 'returned-unacknowledged'];

/** The list's filters; `state` 'open' is every state but normal, 'all' sends no state at all. */
export interface AlarmFilters {
  state: 'open' | 'all' | AlarmState | 'unacknowledged';
  siteId?: string;
  meterRunId?: string;
  priority?: AlarmPriority;
  limit?: number;
}

function stateQuery(state: AlarmFilters['state']): string | undefined {
  if (state === 'all') return undefined;
  if (state === 'unacknowledged') return unacknowledgedStates.join(',');
  return state;
}

export const alarmKeys = {
  all: ['alarms'] as const,
  list: (filters: AlarmFilters) => [...alarmKeys.all, 'list', filters] as const,
  counts: () => [...alarmKeys.all, 'counts'] as const,
  newest: () => [...alarmKeys.all, 'newest-unacknowledged'] as const,
  events: (alarmId: string) => [...alarmKeys.all, 'events', alarmId] as const,
};

/** How often the banner asks for the counts: alarms need attention within seconds, not minutes. */
export const alarmPollMs = 10_000;

/** @param filters state, site, meter run, priority */
export function useAlarms(filters: AlarmFilters) {
  return useQuery({
    queryKey: alarmKeys.list(filters),
    queryFn: ({ signal }) =>
      apiRequest({
        path: '/alarms',
        query: {
          state: stateQuery(filters.state),
          siteId: filters.siteId,
          meterRunId: filters.meterRunId,
          priority: filters.priority,
          limit: filters.limit,
        },
        schema: z.array(alarmSchema),
        signal,
      }),
    placeholderData: keepPreviousData,
    refetchInterval: alarmPollMs,
  });
}

/** @returns the banner's counts, polled every 10 s and on focus */
export function useAlarmCounts() {
  return useQuery({
    queryKey: alarmKeys.counts(),
    queryFn: ({ signal }) => apiRequest({ path: '/alarms/counts', schema: countsSchema, signal }),
    refetchInterval: alarmPollMs,
    refetchOnWindowFocus: 'always',
  });
}

/** How many of the newest unacknowledged alarms the banner reads to find the newest one's group. */
const newestGroupReach = 50;

/**
 * @param enabled ask only while there is something unacknowledged
 * @returns the first-out of the newest unacknowledged alarm's group (for its message in the banner), or null
 */
export function useNewestUnacknowledgedAlarm(enabled: boolean) {
  return useQuery({
    queryKey: alarmKeys.newest(),
    queryFn: async ({ signal }) => {
      // Enough of the newest to hold the newest one's group: the banner shows that group's first-out
      // (whose consequentialCount counts the unacknowledged alarms raised under it).
      const list = await apiRequest({
        path: '/alarms',
        query: { state: unacknowledgedStates.join(','), limit: newestGroupReach },
        schema: z.array(alarmSchema),
        signal,
      });
      const newest = list[0];
      if (!newest) return null;
      return list.find((a) => a.id === (newest.firstOutId ?? newest.id)) ?? newest;
    },
    enabled,
    refetchInterval: alarmPollMs,
    refetchOnWindowFocus: 'always',
  });
}

/**
 * @param alarmId the alarm
 * @param enabled read it only when the log is open
 */
export function useAlarmEvents(alarmId: string, enabled: boolean) {
  return useQuery({
    queryKey: alarmKeys.events(alarmId),
    queryFn: ({ signal }) =>
      apiRequest({ path: `/alarms/${encodeURIComponent(alarmId)}/events`, schema: z.array(alarmEventSchema), signal }),
    enabled,
  });
}

/**
 * Puts a changed alarm into every cached list at once (before the refetch lands), so the row
 * shows its new state the moment the server has answered.
 * @param queryClient the app's query client
 * @param alarm the alarm as the server now has it
 */
export function setAlarmInLists(queryClient: QueryClient, alarm: Alarm): void {
  queryClient.setQueriesData<Alarm[]>({ queryKey: [...alarmKeys.all, 'list'] }, (list) =>
    // An action answers with the alarm alone: its place in a group is kept from the list.
    list?.map((item) => (item.id === alarm.id ? { ...item, ...alarm } : item)),
  );
}

/** Refreshes lists, counts, the banner's newest alarm and open logs. */
export function refreshAlarms(queryClient: QueryClient): Promise<void> {
  return queryClient.invalidateQueries({ queryKey: alarmKeys.all });
}

export type AlarmAction =
  | { kind: 'acknowledge' }
  | { kind: 'shelve'; minutes: number; reason: string }
  | { kind: 'unshelve' }
  | { kind: 'out-of-service'; reason: string }
  | { kind: 'return-to-service'; reason?: string };

function actionRequest(action: AlarmAction): { path: string; body: object } {
  switch (action.kind) {
    case 'acknowledge':
      return { path: 'acknowledge', body: {} };
    case 'shelve':
      return { path: 'shelve', body: { minutes: action.minutes, reason: action.reason } };
    case 'unshelve':
      return { path: 'unshelve', body: {} };
    case 'out-of-service':
      return { path: 'out-of-service', body: { reason: action.reason } };
    case 'return-to-service':
      return { path: 'return-to-service', body: action.reason ? { reason: action.reason } : {} };
  }
}

/** @returns a mutation that applies one lifecycle action to one alarm */
export function useAlarmAction() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ alarmId, action }: { alarmId: string; action: AlarmAction }) => {
      const { path, body } = actionRequest(action);
      return apiRequest({
        method: 'POST',
        path: `/alarms/${encodeURIComponent(alarmId)}/${path}`,
        body,
        schema: alarmSchema,
      });
    },
    onSuccess: (alarm) => setAlarmInLists(queryClient, alarm),
    // A 409 means the alarm moved on (someone else acknowledged it, it returned to normal):
    // refresh either way so the screen shows where it is now.
    onSettled: () => refreshAlarms(queryClient),
  });
}
