/**
 * Balance groups: GET /api/balance-groups?siteId, POST /api/balance-groups, GET
 * /api/balance-groups/:id/balance (?interval=day|month&from&to; plain dates on the site's clock)
 * and /:id/allocation?month. Every figure is SI: m³ at base conditions, J.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from '@/hooks/api/client';

export const balanceGroupSchema = z.object({
  id: z.string(),
  siteId: z.string(),
  name: z.string(),
  inletMeterRunIds: z.array(z.string()),
  outletMeterRunIds: z.array(z.string()),
  allowancePercent: z.number().nullable(),
  allowanceDailyM3: z.number().nullable(),
  tolerancePercent: z.number(),
  members: z.array(z.object({ meterRunId: z.string(), tag: z.string(), side: z.enum(['inlet', 'outlet']) })),
});

export const balancePeriodSchema = z.object({
  start: z.string(),
  end: z.string(),
  inletStandardVolumeM3: z.number(),
  outletStandardVolumeM3: z.number(),
  allowanceM3: z.number(),
  imbalanceM3: z.number(),
  imbalancePercent: z.number().nullable(),
  uncertaintyM3: z.number().nullable(),
  withinTolerance: z.boolean(),
  exceedsUncertainty: z.boolean().nullable(),
  missingMeterRunIds: z.array(z.string()),
});

export const allocationSchema = z.object({
  balanceGroupId: z.string(),
  month: z.string(),
  sales: z.object({
    meterRunId: z.string(),
    tag: z.string(),
    standardVolumeM3: z.number(),
    energyJ: z.number().nullable(),
    status: z.string(),
  }),
  wells: z.array(
    z.object({
      meterRunId: z.string(),
      tag: z.string(),
      status: z.string().nullable(),
      standardVolumeM3: z.number(),
      energyJ: z.number().nullable(),
      factor: z.number().nullable(),
      allocatedStandardVolumeM3: z.number().nullable(),
      energyFactor: z.number().nullable(),
      allocatedEnergyJ: z.number().nullable(),
    }),
  ),
});

export type BalanceGroup = z.infer<typeof balanceGroupSchema>;
export type BalancePeriod = z.infer<typeof balancePeriodSchema>;
export type Allocation = z.infer<typeof allocationSchema>;

export const balanceKeys = {
  all: ['balance-groups'] as const,
  list: (siteId: string) => [...balanceKeys.all, 'site', siteId] as const,
  balance: (id: string, interval: string, from: string, to: string) =>
    [...balanceKeys.all, id, 'balance', interval, from, to] as const,
  allocation: (id: string, month: string) => [...balanceKeys.all, id, 'allocation', month] as const,
};

export function useBalanceGroups(siteId: string) {
  return useQuery({
    queryKey: balanceKeys.list(siteId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/balance-groups', query: { siteId }, schema: z.array(balanceGroupSchema), signal }),
  });
}

export function useBalance(request: { groupId: string; interval: 'day' | 'month'; from: string; to: string }) {
  const { groupId, interval, from, to } = request;
  return useQuery({
    queryKey: balanceKeys.balance(groupId, interval, from, to),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/balance-groups/${groupId}/balance`,
        query: { interval, from, to },
        schema: z.array(balancePeriodSchema),
        signal,
      }),
    placeholderData: keepPreviousData,
  });
}

export function useAllocation(groupId: string, month: string) {
  return useQuery({
    queryKey: balanceKeys.allocation(groupId, month),
    queryFn: ({ signal }) =>
      apiRequest({ path: `/balance-groups/${groupId}/allocation`, query: { month }, schema: allocationSchema, signal }),
    placeholderData: keepPreviousData,
    retry: false,
  });
}

/** The body of POST /api/balance-groups: exactly one of the two allowances. */
export interface NewBalanceGroup {
  siteId: string;
  name: string;
  inletMeterRunIds: string[];
  outletMeterRunIds: string[];
  allowancePercent?: number;
  allowanceDailyM3?: number;
  tolerancePercent: number;
}

/** @returns a mutation that defines a balance group; the site's list (and every balance) is read again */
export function useCreateBalanceGroup() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (group: NewBalanceGroup) =>
      apiRequest({ method: 'POST', path: '/balance-groups', body: group, schema: balanceGroupSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: balanceKeys.all }),
  });
}
