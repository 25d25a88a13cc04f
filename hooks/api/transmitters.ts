/**
 * Transmitters of meter runs as every screen reads them: GET /api/transmitters. Changes go
 * through the set-up hooks (hooks/api/setup.ts), which invalidate these keys.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { measures, transmitterUnits } from '@/shared/schemas/setup';
import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const stackRoles = ['single', 'low', 'high'] as const;
export type StackRole = (typeof stackRoles)[number];

export const transmitterResponseSchema = z.object({
  id,
  meterRunId: id,
  tag: z.string(),
  measures: z.enum(measures),
  /** Unit code the transmitter is ranged in and reports in (shared/units). */
  unit: z.enum(transmitterUnits),
  pressureReference: z.enum(['absolute', 'gauge']),
  lowerRange: z.number(),
  upperRange: z.number(),
  stackRole: z.enum(stackRoles),
  accuracyPercentOfSpan: z.number(),
  calibrationDue: z.string().nullable(),
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
