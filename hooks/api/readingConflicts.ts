/**
 * Re-sent readings that differed from the stored ones (issue 9): GET /api/reading-conflicts
 * (every role) and POST /api/reading-conflicts/:id/resolve (engineer, admin; a reason is required).
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const readingConflictSchema = z.object({
  id,
  meterRunId: id,
  transmitterId: id,
  transmitterTag: z.string(),
  time: z.string(),
  storedValue: z.number(),
  storedQuality: z.string(),
  offeredValue: z.number(),
  offeredQuality: z.string(),
  unit: z.string(),
  storedSource: z.string(),
  storedArrivedAt: z.string().nullable(),
  offeredSource: z.string(),
  offeredArrivedAt: z.string(),
  status: z.enum(['open', 'resolved']),
  resolvedBy: z.string().nullable(),
  resolvedAt: z.string().nullable(),
  resolution: z.string().nullable(),
  correctionId: id.nullable(),
});
export type ReadingConflict = z.infer<typeof readingConflictSchema>;

export const readingConflictKeys = {
  all: ['reading-conflicts'] as const,
  open: () => [...readingConflictKeys.all, 'open'] as const,
};

/** @returns the open conflicts of every meter run, newest reading first */
export function useOpenReadingConflicts() {
  return useQuery({
    queryKey: readingConflictKeys.open(),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/reading-conflicts?status=open', schema: z.array(readingConflictSchema), signal }),
  });
}

/** @returns a mutation that resolves a conflict with a reason; the open list is re-read either way */
export function useResolveReadingConflict() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ conflictId, resolution }: { conflictId: string; resolution: string }) =>
      apiRequest({
        method: 'POST',
        path: `/reading-conflicts/${encodeURIComponent(conflictId)}/resolve`,
        body: { resolution },
        schema: readingConflictSchema,
      }),
    // A 409 means someone else resolved it first: the refreshed list shows that.
    onSettled: () => queryClient.invalidateQueries({ queryKey: readingConflictKeys.all }),
  });
}
