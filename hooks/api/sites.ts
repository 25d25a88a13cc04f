/**
 * Sites as every screen reads them: GET /api/sites, GET /api/sites/:id. Changes go through the
 * set-up hooks (hooks/api/setup.ts), which invalidate these keys.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

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
    queryFn: ({ signal }) => apiRequest({ path: `/sites/${encodeURIComponent(siteId ?? '')}`, schema: siteResponseSchema, signal }),
    enabled: siteId !== undefined,
  });
}
