/**
 * The accountant's month (issue 10): GET /api/monthly-volumes, the exports of the month
 * (GET /api/exports/monthly-volumes as CSV or Excel, GET /api/exports/monthly-statement as a
 * printable page) and the month's close (GET /api/periods/:month, POST /api/periods/:month/close).
 * Quantities are SI; the screen converts them for display.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { useSession } from '@/hooks/session/SessionProvider';
import { config } from '@/constants/config';
import { ApiError, apiRequest } from './client';
import { downloadAuthenticated } from './download';

const comparedMonthSchema = z
  .object({ month: z.string(), massKg: z.number(), standardVolumeM3: z.number(), energyJ: z.number().nullable() })
  .nullable();

const figures = {
  massKg: z.number().nullable(),
  volumeM3: z.number().nullable(),
  standardVolumeM3: z.number().nullable(),
  energyJ: z.number().nullable(),
  coverage: z.number().nullable(),
  flags: z.array(z.string()),
  /** Expanded uncertainty (k = 2) of the volume at base conditions, percent. */
  uncertaintyPercent: z.number().nullable(),
  status: z.enum(['provisional', 'complete', 'missing', 'closed']),
  correctionsInForce: z.number(),
  previousMonth: comparedMonthSchema,
  yearEarlier: comparedMonthSchema,
  changeFromPreviousMonthPercent: z.number().nullable(),
  changeFromYearEarlierPercent: z.number().nullable(),
};

/** A bi-directional meter run's month: its reverse flow, and net (forward − reverse) as its own figure. */
const reverseMonthSchema = z.object({
  flowTimeS: z.number(),
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
});
const netMonthSchema = z.object({
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
});

export const monthlyVolumesSchema = z.object({
  site: z.object({
    id: z.string(),
    code: z.string(),
    name: z.string(),
    timeZone: z.string(),
    contractHour: z.number(),
    basePressurePa: z.number(),
    baseTemperatureK: z.number(),
    displayUnits: z.enum(['si', 'us']),
  }),
  month: z.string(),
  start: z.string(),
  end: z.string(),
  status: z.enum(['provisional', 'complete', 'missing', 'closed']),
  meterRuns: z.array(
    z.object({
      meterRunId: z.string(),
      tag: z.string(),
      name: z.string(),
      version: z.number().nullable(),
      ...figures,
      /** Only where the meter run flowed in reverse this month; the figures above are forward. */
      reverse: reverseMonthSchema.optional(),
      net: netMonthSchema.optional(),
    }),
  ),
  /** The site's total; reverse and net (the site's forward − its reverse) only when some meter run flowed in reverse. */
  totals: z.object({ ...figures, reverse: reverseMonthSchema.optional(), net: netMonthSchema.optional() }),
});
export type MonthlyVolumes = z.infer<typeof monthlyVolumesSchema>;
export type MeterRunMonth = MonthlyVolumes['meterRuns'][number];
export type MonthFigures = MonthlyVolumes['totals'];

export const monthlyVolumesKeys = {
  all: ['monthly-volumes'] as const,
  month: (siteId: string, month: string) => ['monthly-volumes', siteId, month] as const,
  period: (siteId: string, month: string) => ['periods', siteId, month] as const,
};

/** @param siteId the site; the query waits while it is undefined */
export function useMonthlyVolumes(siteId: string | undefined, month: string) {
  return useQuery({
    queryKey: monthlyVolumesKeys.month(siteId ?? '', month),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/monthly-volumes', query: { siteId, month }, schema: monthlyVolumesSchema, signal }),
    enabled: siteId !== undefined,
  });
}

/** Downloads the month as CSV or Excel (web); the server records the export in the audit trail. */
export function useExportMonthlyVolumes() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: (request: { siteId: string; siteCode: string; month: string; format: 'csv' | 'xlsx' }) => {
      const params = new URLSearchParams({ month: request.month, siteId: request.siteId, format: request.format });
      return downloadAuthenticated(
        `/exports/monthly-volumes?${params.toString()}`,
        `monthly-volumes-${request.siteCode}-${request.month}.${request.format}`,
        { token, onUnauthorized: () => signOut('expired') },
      );
    },
  });
}

/**
 * Opens the printable statement in a new tab (web). The page is fetched with the session's token
 * (a plain link could not send it) and shown from a blob, where the browser's print applies its
 * print stylesheet. The tab is opened before the fetch, so a popup blocker sees the tap.
 */
export function useOpenStatement() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: async (request: { siteId: string; month: string }) => {
      if (typeof window === 'undefined') throw new ApiError(0, 'unsupported', 'Open the statement in a web browser.');
      const tab = window.open('', '_blank');
      const params = new URLSearchParams({ month: request.month, siteId: request.siteId, format: 'html' });
      const response = await fetch(`${config.apiBaseUrl}/exports/monthly-statement?${params.toString()}`, {
        headers: token ? { Authorization: `Bearer ${token}` } : {},
      });
      if (!response.ok) {
        tab?.close();
        if (response.status === 401 && token) signOut('expired');
        const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
        throw new ApiError(response.status, 'statement', body?.error?.message ?? 'The statement could not be made.');
      }
      const url = URL.createObjectURL(new Blob([await response.text()], { type: 'text/html' }));
      if (tab) tab.location.href = url;
      else window.location.assign(url);
    },
  });
}

export const periodSchema = z.object({
  status: z.enum(['open', 'closed']),
  closedAt: z.string().nullable(),
  closedBy: z.object({ email: z.string() }).passthrough().nullable(),
  pending: z.unknown(),
  incomplete: z
    .object({
      final: z.boolean(),
      hours: z.array(z.unknown()),
      corrections: z.array(z.unknown()),
      alarms: z.array(z.unknown()),
    })
    .partial()
    .passthrough()
    .optional(),
});
export type Period = z.infer<typeof periodSchema>;

/**
 * The month's close state. The periods API (issue 10 §5) may be missing on an older server: a
 * 404 "No API route" then reads as `null`, and the screen offers no close.
 */
export function usePeriod(siteId: string | undefined, month: string) {
  return useQuery({
    queryKey: monthlyVolumesKeys.period(siteId ?? '', month),
    queryFn: async ({ signal }) => {
      try {
        return await apiRequest({
          path: `/periods/${encodeURIComponent(month)}`,
          query: { siteId },
          schema: periodSchema,
          signal,
        });
      } catch (error) {
        if (error instanceof ApiError && error.status === 404 && /No API route/.test(error.message)) return null;
        throw error;
      }
    },
    enabled: siteId !== undefined,
  });
}

/** Closes the month; without `confirm` an incomplete month is refused (409, naming what is incomplete). */
export function useClosePeriod() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: { siteId: string; month: string; confirm: boolean }) =>
      apiRequest({
        method: 'POST',
        path: `/periods/${encodeURIComponent(request.month)}/close`,
        body: { siteId: request.siteId, confirm: request.confirm },
        schema: z.unknown(),
      }),
    onSuccess: (_data, request) => {
      void queryClient.invalidateQueries({ queryKey: monthlyVolumesKeys.period(request.siteId, request.month) });
      void queryClient.invalidateQueries({ queryKey: monthlyVolumesKeys.month(request.siteId, request.month) });
    },
  });
}

const allocationSchema = z.object({
  balanceGroupId: z.string(),
  month: z.string(),
  sales: z.object({
    meterRunId: z.string(),
    tag: z.string(),
    standardVolumeM3: z.number(),
    energyJ: z.number().nullable(),
  }),
  wells: z.array(
    z.object({
      meterRunId: z.string(),
      tag: z.string(),
      standardVolumeM3: z.number(),
      factor: z.number().nullable(),
      allocatedStandardVolumeM3: z.number().nullable(),
      allocatedEnergyJ: z.number().nullable(),
    }),
  ),
});
export type MonthAllocation = z.infer<typeof allocationSchema> & { groupName: string };

const groupListSchema = z.array(
  z.object({ id: z.string(), name: z.string(), outletMeterRunIds: z.array(z.string()) }).passthrough(),
);

/**
 * The pro-rata allocations of the site's month (issue 10 §4): each balance group of the site with
 * one outlet (a sales meter) shares that meter's month out to its inlets. A group whose sales
 * meter has no total for the month is left out; without the balance groups API there are none.
 */
export function useMonthAllocations(siteId: string | undefined, month: string) {
  return useQuery({
    queryKey: ['allocations', siteId ?? '', month] as const,
    queryFn: async ({ signal }): Promise<MonthAllocation[]> => {
      let groups: z.infer<typeof groupListSchema>;
      try {
        groups = await apiRequest({ path: '/balance-groups', query: { siteId }, schema: groupListSchema, signal });
      } catch (error) {
        if (error instanceof ApiError && error.status === 404) return [];
        throw error;
      }
      const out: MonthAllocation[] = [];
      for (const group of groups.filter((g) => g.outletMeterRunIds.length === 1)) {
        try {
          const allocation = await apiRequest({
            path: `/balance-groups/${encodeURIComponent(group.id)}/allocation`,
            query: { month },
            schema: allocationSchema,
            signal,
          });
          out.push({ ...allocation, groupName: group.name });
        } catch (error) {
          if (!(error instanceof ApiError && error.status === 404)) throw error;
        }
      }
      return out;
    },
    enabled: siteId !== undefined,
  });
}
