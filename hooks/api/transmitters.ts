/**
 * Transmitters of meter runs: GET/POST /api/transmitters, PATCH /api/transmitters/:id. The one
 * home of the transmitter query keys, read hooks, mutations and cache helpers; every screen
 * (set-up, meter run, range check, live board...) reads transmitters through these keys.
 *
 * Request bodies are the shapes of shared/schemas/setup.ts, already validated by the form with
 * the same schemas the server uses.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { transmitterMeasures, transmitterUnits, type transmitterSchema } from '@/shared/schemas/setup';
import { apiRequest } from './client';
import { liveKeys } from './live';
import { meterRunKeys } from './meterRuns';
import { upsertInList } from './upsertInList';

const id = z.union([z.string(), z.number()]).transform(String);

export const stackRoles = ['single', 'low', 'high'] as const;
export type StackRole = (typeof stackRoles)[number];

export const transmitterResponseSchema = z.object({
  id,
  meterRunId: id,
  tag: z.string(),
  measures: z.enum(transmitterMeasures),
  /** Unit code the transmitter is ranged in and reports in (shared/units). */
  unit: z.enum(transmitterUnits),
  pressureReference: z.enum(['absolute', 'gauge']),
  lowerRange: z.number(),
  upperRange: z.number(),
  stackRole: z.enum(stackRoles),
  accuracyPercentOfSpan: z.number(),
  calibrationDue: z.string().nullable(),
  /** What kind of figure the accuracy is (issue 13): a k = 2 uncertainty or a ± limit (÷ √3, GUM §4.3.7). */
  accuracyKind: z.enum(['expanded-k2', 'rectangular-limit']).optional(),
});
export type Transmitter = z.infer<typeof transmitterResponseSchema>;

export const transmitterKeys = {
  all: ['transmitters'] as const,
  list: (meterRunId?: string) => [...transmitterKeys.all, 'list', { meterRunId: meterRunId ?? null }] as const,
};

/** @param meterRunId only this meter run's transmitters; all of them when undefined */
export function useTransmitters(meterRunId?: string) {
  return useQuery({
    queryKey: transmitterKeys.list(meterRunId),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/transmitters', query: { meterRunId }, schema: z.array(transmitterResponseSchema), signal }),
  });
}

/**
 * Shows a created or changed transmitter at once (its meter run's list and the list of all
 * transmitters), then refetches every transmitter query and the live board, whose rows carry
 * each transmitter's range share; the stream sends a new board only when readings arrive.
 * @param queryClient the app's query client
 * @param transmitter the transmitter as the server returned it
 */
export function refreshAfterTransmitterChange(queryClient: QueryClient, transmitter: Transmitter): void {
  upsertInList(queryClient, transmitterKeys.list(transmitter.meterRunId), transmitter);
  upsertInList(queryClient, transmitterKeys.list(), transmitter);
  void queryClient.invalidateQueries({ queryKey: transmitterKeys.all });
  void queryClient.invalidateQueries({ queryKey: liveKeys.all });
  // A re-range is a dated setting: the meter run's list of them changes too.
  void queryClient.invalidateQueries({ queryKey: meterRunKeys.settingVersions(transmitter.meterRunId) });
}

export type NewTransmitter = z.input<typeof transmitterSchema>;
export interface TransmitterChange {
  lowerRange?: number;
  upperRange?: number;
  accuracyPercentOfSpan?: number;
  accuracyKind?: 'expanded-k2' | 'rectangular-limit';
  calibrationDue?: string | null;
  /** When a new range or accuracy takes effect (ISO 8601; default now), and why (issue 9: dated settings). */
  effectiveFrom?: string;
  reason?: string;
}

/** @returns a mutation that adds a transmitter to a meter run */
export function useCreateTransmitter() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (transmitter: NewTransmitter) =>
      apiRequest({ method: 'POST', path: '/transmitters', body: transmitter, schema: transmitterResponseSchema }),
    onSuccess: (transmitter) => refreshAfterTransmitterChange(queryClient, transmitter),
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
        schema: transmitterResponseSchema,
      }),
    onSuccess: (transmitter) => refreshAfterTransmitterChange(queryClient, transmitter),
  });
}
