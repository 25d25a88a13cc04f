/**
 * Meter runs and their configuration versions: GET/POST /api/meter-runs, GET/PATCH
 * /api/meter-runs/:id, GET/POST /api/meter-runs/:id/config-versions. The one home of the meter
 * run query keys, read hooks, mutations and cache helpers; every screen (set-up, meter runs,
 * range check, alarms, live board...) reads meter runs through these keys. A meter run comes
 * with the element and fluid of its configuration version in effect now.
 *
 * Request bodies are the shapes of shared/schemas/setup.ts, already validated by the form with
 * the same schemas the server uses.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import type { FluidSpec } from '@/shared/fluids';
import type { ElementSpec } from '@/shared/flow';
import {
  directionSources,
  type ConfigVersionInput,
  type MeterRunInput,
  type meterRunSchema,
} from '@/shared/schemas/setup';
import { apiRequest } from './client';
import { liveKeys } from './live';
import { upsertInList } from './upsertInList';

const id = z.union([z.string(), z.number()]).transform(String);

/**
 * The element and fluid were validated by the server's schema when they were stored; here they
 * are only checked for their kind, so an extra field written by a newer server does not make
 * the whole list unreadable.
 */
const elementSchema = z
  .looseObject({ kind: z.enum(['orifice', 'venturi', 'nozzle', 'cone']), pipeDiameterM: z.number() })
  .transform((element) => element as unknown as ElementSpec);
const fluidSchema = z
  .looseObject({ kind: z.enum(['water', 'steam', 'natural-gas', 'ideal-gas', 'liquid']) })
  .transform((fluid) => fluid as unknown as FluidSpec);

export const meterRunResponseSchema = z.object({
  id,
  siteId: id,
  tag: z.string(),
  name: z.string(),
  holdLimitS: z.number(),
  maxGapS: z.number(),
  stackSwitchUpShare: z.number(),
  stackSwitchDownShare: z.number(),
  /** No-flow cutoff, percent of the active DP transmitter's span (a dated setting; absent from older servers). */
  noFlowCutoffPercentOfSpan: z.number().optional(),
  /** Reconciliation tolerance against field totals, ± percent of the field total. */
  reconciliationTolerancePercent: z.number().optional(),
  /** Line data (nominal size, schedule, materials, straight lengths...), all optional. */
  line: z.record(z.string(), z.unknown()).catch({}),
  /** Absent when no configuration version is in effect yet. */
  element: elementSchema.optional(),
  fluid: fluidSchema.optional(),
  configVersionId: id.optional(),
  /** Only on a bi-directional meter run: the element's constants in reverse flow, in effect now. */
  reverseElement: elementSchema.optional(),
  /** Only on a bi-directional meter run: how the direction of flow is known. */
  directionSource: z.enum(directionSources).optional(),
});
export type MeterRun = z.infer<typeof meterRunResponseSchema>;

export const configVersionResponseSchema = z.object({
  id,
  meterRunId: id,
  effectiveFrom: z.string(),
  element: elementSchema,
  fluid: fluidSchema,
  reason: z.string().nullable(),
  createdAt: z.string(),
  /** Who made the version (null for versions stored without an author). */
  createdBy: z.object({ email: z.string(), name: z.string() }).nullable().optional(),
  /** Field by field, against the version in force just before it; empty for the first. */
  changes: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })).optional(),
  first: z.boolean().optional(),
  /** On a new version: the computed hours from the one containing its effective time on, queued again. */
  recompute: z.object({ from: z.string(), hours: z.number() }).optional(),
  /** Only on a bi-directional version. */
  reverseElement: elementSchema.optional(),
  directionSource: z.enum(directionSources).optional(),
});
export type ConfigVersion = z.infer<typeof configVersionResponseSchema>;

export const meterRunKeys = {
  all: ['meter-runs'] as const,
  list: (siteId?: string) => [...meterRunKeys.all, 'list', { siteId: siteId ?? null }] as const,
  detail: (meterRunId: string) => [...meterRunKeys.all, 'detail', meterRunId] as const,
  configVersions: (meterRunId: string) => [...meterRunKeys.all, 'config-versions', meterRunId] as const,
  settingVersions: (meterRunId: string) => [...meterRunKeys.all, 'setting-versions', meterRunId] as const,
};

/** One dated setting version (issue 9): the meter run's limits, a transmitter's range, or the site's settings. */
export const settingVersionResponseSchema = z.object({
  kind: z.enum(['meter-run', 'transmitter', 'site']),
  id,
  subject: z.object({ id, tag: z.string().nullable() }),
  effectiveFrom: z.string(),
  values: z.record(z.string(), z.number()),
  reason: z.string(),
  createdAt: z.string(),
  createdBy: z.object({ email: z.string(), name: z.string() }).nullable(),
  changes: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })),
  first: z.boolean(),
});
export type SettingVersion = z.infer<typeof settingVersionResponseSchema>;

/** @param meterRunId the meter run whose dated settings (its own, its transmitters', its site's) to list, oldest first */
export function useSettingVersions(meterRunId: string) {
  return useQuery({
    queryKey: meterRunKeys.settingVersions(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/setting-versions`,
        schema: z.array(settingVersionResponseSchema),
        signal,
      }),
  });
}

/** @param siteId only this site's meter runs; every meter run when undefined */
export function useMeterRuns(siteId?: string) {
  return useQuery({
    queryKey: meterRunKeys.list(siteId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/meter-runs', query: { siteId }, schema: z.array(meterRunResponseSchema), signal }),
  });
}

/** @param meterRunId the meter run's id */
export function useMeterRun(meterRunId: string) {
  return useQuery({
    queryKey: meterRunKeys.detail(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({ path: `/meter-runs/${encodeURIComponent(meterRunId)}`, schema: meterRunResponseSchema, signal }),
  });
}

/** @param meterRunId the meter run whose configuration versions to list, oldest first */
export function useConfigVersions(meterRunId: string) {
  return useQuery({
    queryKey: meterRunKeys.configVersions(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/config-versions`,
        schema: z.array(configVersionResponseSchema),
        signal,
      }),
  });
}

/**
 * Refetches every meter run query (lists, details and configuration versions, read by the
 * set-up, meter run, range check and alarm screens) and the live board: the stream sends a new
 * board only when readings arrive, so a new or renamed meter run would not appear on it until then.
 * @param queryClient the app's query client
 */
export function invalidateMeterRuns(queryClient: QueryClient): void {
  void queryClient.invalidateQueries({ queryKey: meterRunKeys.all });
  void queryClient.invalidateQueries({ queryKey: liveKeys.all });
}

/**
 * Shows a created or changed meter run at once (its detail, its site's list and the list of
 * all meter runs), then refetches as {@link invalidateMeterRuns} does.
 * @param queryClient the app's query client
 * @param run the meter run as the server returned it
 */
export function refreshAfterMeterRunChange(queryClient: QueryClient, run: MeterRun): void {
  queryClient.setQueryData(meterRunKeys.detail(run.id), run);
  upsertInList(queryClient, meterRunKeys.list(run.siteId), run);
  upsertInList(queryClient, meterRunKeys.list(), run);
  invalidateMeterRuns(queryClient);
}

export type NewMeterRun = z.input<typeof meterRunSchema>;
export interface MeterRunChange {
  name?: string;
  holdLimitS?: number;
  maxGapS?: number;
  noFlowCutoffPercentOfSpan?: number;
  line?: MeterRunInput['line'];
  /** When a change of the hold limit, longest gap or no-flow cutoff takes effect (ISO 8601; default now). */
  effectiveFrom?: string;
  reason?: string;
}

/** @returns a mutation that creates a meter run with its first configuration version */
export function useCreateMeterRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (run: NewMeterRun) =>
      apiRequest({ method: 'POST', path: '/meter-runs', body: run, schema: meterRunResponseSchema }),
    onSuccess: (run) => refreshAfterMeterRunChange(queryClient, run),
  });
}

/** @returns a mutation that changes a meter run's name, limits or line data */
export function useUpdateMeterRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id: meterRunId, change }: { id: string; change: MeterRunChange }) =>
      apiRequest({
        method: 'PATCH',
        path: `/meter-runs/${encodeURIComponent(meterRunId)}`,
        body: change,
        schema: meterRunResponseSchema,
      }),
    onSuccess: (run) => refreshAfterMeterRunChange(queryClient, run),
  });
}

/**
 * @param meterRunId the meter run the version belongs to
 * @returns a mutation that adds a configuration version (an element or fluid change with its
 * effective time); the meter run's element and fluid in effect may change with it, so every
 * meter run query is refetched too
 */
export function useCreateConfigVersion(meterRunId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: ConfigVersionInput) =>
      apiRequest({
        method: 'POST',
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/config-versions`,
        body: version,
        schema: configVersionResponseSchema,
      }),
    onSuccess: (version) => {
      upsertInList(queryClient, meterRunKeys.configVersions(meterRunId), version);
      invalidateMeterRuns(queryClient);
    },
  });
}
