/**
 * Corrections (issue 9): GET /api/corrections (the list, each with the original and current
 * figures of its period), GET /api/corrections/estimate, POST /api/corrections and the decision
 * (/approve, /reject). After a proposal or a decision every correction query is refreshed.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from '@/hooks/api/client';
import { transmitterKeys, transmitterResponseSchema } from '@/hooks/api/transmitters';

const id = z.union([z.string(), z.number()]).transform(String);
const person = z.object({ id, name: z.string(), email: z.string() });
const quantities = z.object({
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
});

export const correctionStatuses = ['proposed', 'approved', 'rejected'] as const;
export type CorrectionStatus = (typeof correctionStatuses)[number];

export const correctionSchema = z.object({
  id,
  status: z.enum(correctionStatuses),
  meterRunId: id,
  start: z.string(),
  end: z.string(),
  kind: z.enum(['substitute', 'adjust']),
  massKg: z.number().nullable(),
  factor: z.number().nullable(),
  substitute: z.object({ transmitterId: id, value: z.number().optional(), hold: z.boolean().optional() }).nullable(),
  origin: z.enum(['manual', 'estimate']),
  estimate: z.object({ uncertaintyPercent: z.number().nullable(), method: z.string() }).loose().nullable(),
  reason: z.string(),
  proposedBy: person,
  proposedAt: z.string(),
  decidedBy: person.nullable(),
  decidedAt: z.string().nullable(),
  decisionReason: z.string().nullable(),
  figures: z
    .object({ hours: z.number(), original: quantities, current: quantities, difference: quantities })
    .optional(),
});
export type Correction = z.infer<typeof correctionSchema>;

export const estimateSchema = z.object({
  meterRunId: id,
  start: z.string(),
  end: z.string(),
  massKg: z.number(),
  uncertaintyPercent: z.number().nullable(),
  method: z.string(),
  basis: z.unknown(),
});
export type CorrectionEstimate = z.infer<typeof estimateSchema>;

/** What a proposal sends (DESIGN.md: `POST /api/corrections`). */
export interface CorrectionProposal {
  meterRunId: string;
  start: string;
  end: string;
  kind: 'substitute' | 'adjust';
  massKg?: number;
  factor?: number;
  substitute?: { transmitterId: string; value: number } | { transmitterId: string; hold: true };
  origin?: 'manual' | 'estimate';
  reason: string;
}

export interface CorrectionFilters {
  meterRunId?: string;
  status?: CorrectionStatus;
}

export const correctionKeys = {
  all: ['corrections'] as const,
  list: (filters: CorrectionFilters) => [...correctionKeys.all, 'list', filters] as const,
};

export function useCorrections(filters: CorrectionFilters) {
  return useQuery({
    queryKey: correctionKeys.list(filters),
    queryFn: ({ signal }) =>
      apiRequest({
        path: '/corrections',
        query: { meterRunId: filters.meterRunId, status: filters.status },
        schema: z.array(correctionSchema),
        signal,
      }),
    placeholderData: keepPreviousData,
    // Others decide corrections, and an approval's recompute lands a few seconds after it.
    refetchInterval: 10_000,
  });
}

/**
 * The meter run's transmitters (the same query and cache as the set-up screens), fetched only
 * when `enabled`: a correction card needs them only to show a substituted transmitter's tag.
 */
export function useCorrectionTransmitters(meterRunId: string, enabled: boolean) {
  return useQuery({
    queryKey: transmitterKeys.list(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/transmitters', query: { meterRunId }, schema: z.array(transmitterResponseSchema), signal }),
    enabled,
  });
}

/** Asks for an estimate of the period (only when the person presses the estimate button). */
export function useEstimate() {
  return useMutation({
    mutationFn: (period: { meterRunId: string; start: string; end: string }) =>
      apiRequest({ path: '/corrections/estimate', query: period, schema: estimateSchema }),
  });
}

export function useProposeCorrection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (proposal: CorrectionProposal) =>
      apiRequest({ method: 'POST', path: '/corrections', body: proposal, schema: correctionSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: correctionKeys.all }),
  });
}

export function useDecideCorrection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      id: correctionId,
      decision,
      reason,
    }: {
      id: string;
      decision: 'approve' | 'reject';
      reason: string;
    }) =>
      apiRequest({
        method: 'POST',
        path: `/corrections/${encodeURIComponent(correctionId)}/${decision}`,
        body: { reason },
        schema: correctionSchema,
      }),
    // A 409 (someone decided first) refreshes the list too, so it shows the decision that stands.
    onSettled: () => queryClient.invalidateQueries({ queryKey: correctionKeys.all }),
  });
}
