/**
 * Meter runs as every screen reads them: GET /api/meter-runs, GET /api/meter-runs/:id, each
 * with the element and fluid of its configuration version in effect now. Changes and
 * configuration versions go through the set-up hooks (hooks/api/setup.ts), which invalidate
 * these keys.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import type { FluidSpec } from '@/shared/fluids';
import type { ElementSpec } from '@/shared/flow';
import { apiRequest } from './client';

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
  /** Line data (nominal size, schedule, materials, straight lengths...), all optional. */
  line: z.record(z.string(), z.unknown()).catch({}),
  /** Absent when no configuration version is in effect yet. */
  element: elementSchema.optional(),
  fluid: fluidSchema.optional(),
  configVersionId: id.optional(),
});
export type MeterRun = z.infer<typeof meterRunResponseSchema>;

export const meterRunKeys = {
  all: ['meter-runs'] as const,
  list: (siteId?: string) => [...meterRunKeys.all, 'list', { siteId: siteId ?? null }] as const,
  detail: (meterRunId: string) => [...meterRunKeys.all, 'detail', meterRunId] as const,
};

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
