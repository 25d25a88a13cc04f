import { z } from 'zod';

/** `GET /api/audit-events`: the newest events, optionally of one entity type or one entity. */
export const auditEventsQuery = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(100),
  entityType: z.string().optional(),
  entityId: z.string().optional(),
});
