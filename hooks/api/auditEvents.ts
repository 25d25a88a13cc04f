/**
 * The audit trail (engineer, accountant, admin): GET /api/audit-events with its filters, the same
 * as a CSV download (`format=csv`, itself recorded as an export), and GET /api/audit-events/actors.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { useSession } from '@/hooks/session/SessionProvider';
import { AUDIT_KINDS, auditKindOf, type AuditKind } from '@/shared/audit/audit-kinds';
import { apiRequest } from './client';
import { downloadAuthenticated } from './download';

const auditEventSchema = z
  .object({
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
    reason: z.string().nullable().optional(),
    actorId: z.string().nullable().optional(),
    actorName: z.string().nullable().optional(),
    kind: z.enum(AUDIT_KINDS).optional().catch(undefined),
  })
  // A server from before the kinds still gets each event's kind, from the same map.
  .transform((event) => ({ ...event, kind: event.kind ?? auditKindOf(event.action) }));
export type AuditEvent = z.infer<typeof auditEventSchema>;

/** What the audit log is narrowed to; every field optional. `from` and `to` are ISO instants, given together. */
export interface AuditFilters {
  meterRunId?: string;
  userId?: string;
  kind?: AuditKind;
  from?: string;
  to?: string;
}

/** Newest events shown by default. */
export const defaultAuditLimit = 100;

export const auditEventKeys = {
  all: ['audit-events'] as const,
  list: (limit: number, filters: AuditFilters = {}) => [...auditEventKeys.all, 'list', { limit, ...filters }] as const,
  actors: () => [...auditEventKeys.all, 'actors'] as const,
};

/** The filters as query parameters, leaving out those not set. */
export function auditQuery(filters: AuditFilters): Record<string, string | undefined> {
  return {
    meterRunId: filters.meterRunId,
    userId: filters.userId,
    kind: filters.kind,
    from: filters.from,
    to: filters.to,
  };
}

/**
 * @param limit how many of the newest events to fetch
 * @param filters meter run, user, kind and period
 */
export function useAuditEvents(limit: number = defaultAuditLimit, filters: AuditFilters = {}, enabled = true) {
  return useQuery({
    queryKey: auditEventKeys.list(limit, filters),
    queryFn: ({ signal }) =>
      apiRequest({
        path: '/audit-events',
        query: { limit, ...auditQuery(filters) },
        schema: z.array(auditEventSchema),
        signal,
      }),
    enabled,
  });
}

/** Everyone who has acted in the audit trail (id and email), for the user filter. */
export function useAuditActors() {
  return useQuery({
    queryKey: auditEventKeys.actors(),
    queryFn: ({ signal }) =>
      apiRequest({
        path: '/audit-events/actors',
        schema: z.array(z.object({ id: z.string(), email: z.string() })),
        signal,
      }),
  });
}

/** @returns a mutation that downloads the filtered events as CSV (web), the server recording the export */
export function useExportAuditCsv() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: (filters: AuditFilters) => {
      const params = new URLSearchParams({ format: 'csv' });
      for (const [key, value] of Object.entries(auditQuery(filters))) if (value !== undefined) params.set(key, value);
      return downloadAuthenticated(
        `/audit-events?${params.toString()}`,
        `audit-events-${new Date().toISOString().slice(0, 10)}.csv`,
        { token, onUnauthorized: () => signOut('expired') },
      );
    },
  });
}
