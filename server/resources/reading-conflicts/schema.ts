import { z } from 'zod';
import { idField } from '../../http/params';

export const conflictStatuses = ['open', 'resolved'] as const;
export type ConflictStatus = (typeof conflictStatuses)[number];

/** `GET /api/reading-conflicts[?meterRunId][&status]`: every meter run and both statuses when left out. */
export const readingConflictsQuery = z.object({
  meterRunId: idField('meter run').optional(),
  status: z.enum(conflictStatuses, { error: 'must be open or resolved' }).optional(),
});
export type ReadingConflictsQuery = z.infer<typeof readingConflictsQuery>;

/** `POST /api/reading-conflicts/:id/resolve`: why the conflict is settled, and the correction that settled it, if any. */
export const resolveConflictBody = z
  .object({
    resolution: z.string({ error: 'is required' }).trim().min(1, 'is required').max(1000),
    correctionId: idField('correction').optional(),
  })
  .strict();
export type ResolveConflictBody = z.infer<typeof resolveConflictBody>;
