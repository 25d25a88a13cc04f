/**
 * Reconciliation against field totals: GET /api/reconciliations and /api/reconciliations/summary
 * (?meterRunId&from&to; from and to are instants or plain dates on the site's clock). Figures are
 * in the field total's unit; difference = Tallyrun − field; percent of the field total.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from '@/hooks/api/client';

const figures = {
  quantity: z.string(),
  unit: z.string(),
  tallyrunValue: z.number().nullable(),
  fieldValue: z.number(),
  difference: z.number().nullable(),
  differencePercent: z.number().nullable(),
  tolerancePercent: z.number(),
  withinTolerance: z.boolean().nullable(),
};

export const reconciliationDaySchema = z.object({ start: z.string(), end: z.string(), ...figures });
export const reconciliationSumSchema = z.object({
  from: z.string(),
  to: z.string(),
  days: z.number(),
  daysOutsideTolerance: z.number(),
  daysWithoutTallyrunFigure: z.number(),
  ...figures,
});

export interface ReconciliationRequest {
  meterRunId: string;
  from: string;
  to: string;
}

export const reconciliationKeys = {
  all: ['reconciliations'] as const,
  days: (r: ReconciliationRequest) => [...reconciliationKeys.all, r.meterRunId, 'days', r.from, r.to] as const,
  summary: (r: ReconciliationRequest) => [...reconciliationKeys.all, r.meterRunId, 'summary', r.from, r.to] as const,
};

export function useReconciliations(request: ReconciliationRequest) {
  return useQuery({
    queryKey: reconciliationKeys.days(request),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/reconciliations', query: { ...request }, schema: z.array(reconciliationDaySchema), signal }),
    placeholderData: keepPreviousData,
  });
}

export function useReconciliationSummary(request: ReconciliationRequest) {
  return useQuery({
    queryKey: reconciliationKeys.summary(request),
    queryFn: ({ signal }) =>
      apiRequest({
        path: '/reconciliations/summary',
        query: { ...request },
        schema: z.array(reconciliationSumSchema),
        signal,
      }),
    placeholderData: keepPreviousData,
  });
}
