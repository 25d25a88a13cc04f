/**
 * Set-up data for the engineer's set-up screens and the live board: sites, meter runs,
 * transmitters and configuration versions (GET, POST, PATCH under /api/sites, /api/meter-runs,
 * /api/transmitters and /api/meter-runs/:id/config-versions).
 *
 * The request bodies are the shapes of shared/schemas/setup.ts, already validated by the form
 * with the same schemas the server uses. Read hooks for other screens live in their own modules
 * (meterRuns.ts, sites.ts, transmitters.ts); these have keys of their own under 'setup'.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import type { ElementSpec } from '@/shared/flow/flow-types';
import type { FluidSpec } from '@/shared/fluids/fluid-types';
import type {
  ConfigVersionInput,
  MeterRunInput,
  SiteInput,
  meterRunSchema,
  siteSchema,
  transmitterSchema,
} from '@/shared/schemas/setup';
import { apiRequest } from './client';
import { liveKeys } from './live';
import { meterRunKeys } from './meterRuns';
import { siteKeys } from './sites';
import { transmitterKeys } from './transmitters';

const id = z.union([z.string(), z.number()]).transform(String);

export const setupSiteSchema = z.object({
  id,
  code: z.string(),
  name: z.string(),
  timeZone: z.string(),
  contractHour: z.number(),
  basePressurePa: z.number(),
  baseTemperatureK: z.number(),
  atmosphericPressurePa: z.number(),
  displayUnits: z.enum(['si', 'us']).catch('si'),
});
export type SetupSite = z.infer<typeof setupSiteSchema>;

/** Element and fluid are checked by the server's schema on the way in; here they are carried as given. */
const elementSchema = z.custom<ElementSpec>((value) => typeof value === 'object' && value !== null && 'kind' in value);
const fluidSchema = z.custom<FluidSpec>((value) => typeof value === 'object' && value !== null && 'kind' in value);

export const setupMeterRunSchema = z.object({
  id,
  siteId: id,
  tag: z.string(),
  name: z.string(),
  holdLimitS: z.number(),
  maxGapS: z.number(),
  stackSwitchUpShare: z.number(),
  stackSwitchDownShare: z.number(),
  line: z.record(z.string(), z.unknown()).nullable().transform((line) => line ?? {}),
  element: elementSchema.optional(),
  fluid: fluidSchema.optional(),
  configVersionId: id.optional(),
});
export type SetupMeterRun = z.infer<typeof setupMeterRunSchema>;

export const setupTransmitterSchema = z.object({
  id,
  meterRunId: id,
  tag: z.string(),
  measures: z.enum(['differential-pressure', 'static-pressure', 'temperature']),
  unit: z.string(),
  pressureReference: z.enum(['absolute', 'gauge']),
  lowerRange: z.number(),
  upperRange: z.number(),
  stackRole: z.enum(['single', 'low', 'high']),
  accuracyPercentOfSpan: z.number(),
  calibrationDue: z.string().nullable(),
});
export type SetupTransmitter = z.infer<typeof setupTransmitterSchema>;

export const setupConfigVersionSchema = z.object({
  id,
  meterRunId: id,
  effectiveFrom: z.string(),
  element: elementSchema,
  fluid: fluidSchema,
  reason: z.string().nullable(),
  createdAt: z.string(),
});
export type ConfigVersion = z.infer<typeof setupConfigVersionSchema>;

export const setupKeys = {
  all: ['setup'] as const,
  sites: () => [...setupKeys.all, 'sites'] as const,
  meterRuns: (siteId?: string) => [...setupKeys.all, 'meter-runs', { siteId: siteId ?? null }] as const,
  meterRun: (meterRunId: string) => [...setupKeys.all, 'meter-run', meterRunId] as const,
  transmitters: (meterRunId?: string) => [...setupKeys.all, 'transmitters', { meterRunId: meterRunId ?? null }] as const,
  configVersions: (meterRunId: string) => [...setupKeys.all, 'config-versions', meterRunId] as const,
};

/** @returns every site, ordered by code */
export function useSetupSites() {
  return useQuery({
    queryKey: setupKeys.sites(),
    queryFn: ({ signal }) => apiRequest({ path: '/sites', schema: z.array(setupSiteSchema), signal }),
  });
}

/** @param siteId only this site's meter runs; every meter run when omitted */
export function useSetupMeterRuns(siteId?: string) {
  return useQuery({
    queryKey: setupKeys.meterRuns(siteId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/meter-runs', query: { siteId }, schema: z.array(setupMeterRunSchema), signal }),
  });
}

/** @param meterRunId the meter run to fetch */
export function useSetupMeterRun(meterRunId: string) {
  return useQuery({
    queryKey: setupKeys.meterRun(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({ path: `/meter-runs/${encodeURIComponent(meterRunId)}`, schema: setupMeterRunSchema, signal }),
  });
}

/** @param meterRunId only this meter run's transmitters; every transmitter when omitted */
export function useSetupTransmitters(meterRunId?: string) {
  return useQuery({
    queryKey: setupKeys.transmitters(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/transmitters', query: { meterRunId }, schema: z.array(setupTransmitterSchema), signal }),
  });
}

/** @param meterRunId the meter run whose configuration versions to list, oldest first */
export function useConfigVersions(meterRunId: string) {
  return useQuery({
    queryKey: setupKeys.configVersions(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/config-versions`,
        schema: z.array(setupConfigVersionSchema),
        signal,
      }),
  });
}

/** Puts one changed or new item into a cached list, so the screen shows it before the refetch. */
function upsert<T extends { id: string }>(queryClient: QueryClient, key: readonly unknown[], item: T): void {
  queryClient.setQueryData<T[]>(key, (list) => {
    if (!list) return list;
    return list.some((existing) => existing.id === item.id)
      ? list.map((existing) => (existing.id === item.id ? item : existing))
      : [...list, item];
  });
}

/**
 * Everything set-up related is refetched after a change: lists are short and other screens read
 * them, through these keys and through the read modules' own (sites.ts, meterRuns.ts,
 * transmitters.ts). The live board too: the stream sends a new board only when readings arrive,
 * so a new meter run would not appear on it until then.
 */
function refreshSetup(queryClient: QueryClient): void {
  for (const queryKey of [setupKeys.all, siteKeys.all, meterRunKeys.all, transmitterKeys.all, liveKeys.all]) {
    void queryClient.invalidateQueries({ queryKey });
  }
}

/** The body of POST /api/sites: the site schema's input (displayUnits may be left out). */
export type NewSite = z.input<typeof siteSchema>;
export type SiteChange = Partial<SiteInput>;

/** @returns a mutation that creates a site */
export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (site: NewSite) => apiRequest({ method: 'POST', path: '/sites', body: site, schema: setupSiteSchema }),
    onSuccess: (site) => {
      upsert(queryClient, setupKeys.sites(), site);
      refreshSetup(queryClient);
    },
  });
}

/** @returns a mutation that changes a site's fields */
export function useUpdateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id: siteId, change }: { id: string; change: SiteChange }) =>
      apiRequest({ method: 'PATCH', path: `/sites/${encodeURIComponent(siteId)}`, body: change, schema: setupSiteSchema }),
    onSuccess: (site) => {
      upsert(queryClient, setupKeys.sites(), site);
      refreshSetup(queryClient);
    },
  });
}

export type NewMeterRun = z.input<typeof meterRunSchema>;
export interface MeterRunChange {
  name?: string;
  holdLimitS?: number;
  maxGapS?: number;
  line?: MeterRunInput['line'];
}

/** @returns a mutation that creates a meter run with its first configuration version */
export function useCreateMeterRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (run: NewMeterRun) =>
      apiRequest({ method: 'POST', path: '/meter-runs', body: run, schema: setupMeterRunSchema }),
    onSuccess: (run) => {
      upsert(queryClient, setupKeys.meterRuns(run.siteId), run);
      refreshSetup(queryClient);
    },
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
        schema: setupMeterRunSchema,
      }),
    onSuccess: (run) => {
      queryClient.setQueryData(setupKeys.meterRun(run.id), run);
      refreshSetup(queryClient);
    },
  });
}

export type NewTransmitter = z.input<typeof transmitterSchema>;
export interface TransmitterChange {
  lowerRange?: number;
  upperRange?: number;
  accuracyPercentOfSpan?: number;
  calibrationDue?: string | null;
}

/** @returns a mutation that adds a transmitter to a meter run */
export function useCreateTransmitter() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (transmitter: NewTransmitter) =>
      apiRequest({ method: 'POST', path: '/transmitters', body: transmitter, schema: setupTransmitterSchema }),
    onSuccess: (transmitter) => {
      upsert(queryClient, setupKeys.transmitters(transmitter.meterRunId), transmitter);
      refreshSetup(queryClient);
    },
  });
}

/** @returns a mutation that re-ranges a transmitter or records its accuracy and calibration due date */
export function useUpdateTransmitter() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id: transmitterId, change }: { id: string; change: TransmitterChange }) =>
      apiRequest({
        method: 'PATCH',
        path: `/transmitters/${encodeURIComponent(transmitterId)}`,
        body: change,
        schema: setupTransmitterSchema,
      }),
    onSuccess: (transmitter) => {
      upsert(queryClient, setupKeys.transmitters(transmitter.meterRunId), transmitter);
      refreshSetup(queryClient);
    },
  });
}

/** @returns a mutation that adds a configuration version (an element or fluid change with its effective time) */
export function useCreateConfigVersion(meterRunId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: ConfigVersionInput) =>
      apiRequest({
        method: 'POST',
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/config-versions`,
        body: version,
        schema: setupConfigVersionSchema,
      }),
    onSuccess: (version) => {
      upsert(queryClient, setupKeys.configVersions(meterRunId), version);
      refreshSetup(queryClient);
    },
  });
}

