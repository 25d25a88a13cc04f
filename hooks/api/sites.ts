/**
 * Sites: GET /api/sites, GET /api/sites/:id, POST /api/sites, PATCH /api/sites/:id. The one
 * home of the site query keys, read hooks, mutations and cache helpers; every screen (set-up,
 * meter runs, live board, alarms...) reads sites through these keys.
 *
 * Request bodies are the shapes of shared/schemas/setup.ts, already validated by the form with
 * the same schemas the server uses.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import type { SiteInput, siteSchema } from '@/shared/schemas/setup';
import { upsertInList } from './upsertInList';
import { apiRequest } from './client';
import { liveKeys } from './live';

const id = z.union([z.string(), z.number()]).transform(String);

export const siteResponseSchema = z.object({
  id,
  code: z.string(),
  name: z.string(),
  /** IANA zone: contract days and the times on screen follow it. */
  timeZone: z.string(),
  contractHour: z.number(),
  basePressurePa: z.number(),
  baseTemperatureK: z.number(),
  atmosphericPressurePa: z.number(),
  displayUnits: z.enum(['si', 'us']).catch('si'),
});
export type Site = z.infer<typeof siteResponseSchema>;

export const siteKeys = {
  all: ['sites'] as const,
  list: () => [...siteKeys.all, 'list'] as const,
  detail: (siteId: string) => [...siteKeys.all, 'detail', siteId] as const,
};

/** @returns every site, by code */
export function useSites() {
  return useQuery({
    queryKey: siteKeys.list(),
    queryFn: ({ signal }) => apiRequest({ path: '/sites', schema: z.array(siteResponseSchema), signal }),
  });
}

/** @param siteId the site's id; the query waits while it is undefined */
export function useSite(siteId: string | undefined) {
  return useQuery({
    queryKey: siteKeys.detail(siteId ?? ''),
    queryFn: ({ signal }) =>
      apiRequest({ path: `/sites/${encodeURIComponent(siteId ?? '')}`, schema: siteResponseSchema, signal }),
    enabled: siteId !== undefined,
  });
}

/**
 * Shows a created or changed site at once, then refetches every site query (set-up, meter run
 * and alarm screens all read `siteKeys`) and the live board, whose rows carry the site's code and
 * time zone; the stream sends a new board only when readings arrive.
 * @param queryClient the app's query client
 * @param site the site as the server returned it
 */
export function refreshAfterSiteChange(queryClient: QueryClient, site: Site): void {
  upsertInList(queryClient, siteKeys.list(), site);
  queryClient.setQueryData(siteKeys.detail(site.id), site);
  void queryClient.invalidateQueries({ queryKey: siteKeys.all });
  void queryClient.invalidateQueries({ queryKey: liveKeys.all });
}

/** The body of POST /api/sites: the site schema's input (displayUnits may be left out). */
export type NewSite = z.input<typeof siteSchema>;
/** A change of a site; the dated settings (contract hour, base conditions, atmospheric pressure) with when and why. */
export type SiteChange = Partial<SiteInput> & { effectiveFrom?: string; reason?: string };

/** @returns a mutation that creates a site */
export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (site: NewSite) =>
      apiRequest({ method: 'POST', path: '/sites', body: site, schema: siteResponseSchema }),
    onSuccess: (site) => refreshAfterSiteChange(queryClient, site),
  });
}

/** @returns a mutation that changes a site's fields */
export function useUpdateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id: siteId, change }: { id: string; change: SiteChange }) =>
      apiRequest({
        method: 'PATCH',
        path: `/sites/${encodeURIComponent(siteId)}`,
        body: change,
        schema: siteResponseSchema,
      }),
    onSuccess: (site) => refreshAfterSiteChange(queryClient, site),
  });
}
