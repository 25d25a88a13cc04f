/** The audit trail (engineer, accountant, admin): GET /api/audit-events. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const auditEventSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  occurredAt: z.string(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  entityType: z.string(),
  entityId: z
    .union([z.string(), z.number()])
    .nullable()
    .transform((value) => (value === null ? null : String(value))),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

/** Newest events shown by default. */
export const defaultAuditLimit = 100;

export const auditEventKeys = {
  all: ['audit-events'] as const,
  list: (limit: number) => [...auditEventKeys.all, 'list', { limit }] as const,
};

/** @param limit how many of the newest events to fetch */
export function useAuditEvents(limit: number = defaultAuditLimit) {
  return useQuery({
    queryKey: auditEventKeys.list(limit),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/audit-events', query: { limit }, schema: z.array(auditEventSchema), signal }),
  });
}
