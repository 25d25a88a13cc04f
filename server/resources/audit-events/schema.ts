import { z } from 'zod';
import { AUDIT_KINDS } from '../../../shared/audit/audit-kinds';
import { idField, isoInstant } from '../../http/params';

/** The longest period one request may ask for (ten years: an auditor reads back several years). */
export const AUDIT_MAX_DAYS = 3660;

/**
 * `GET /api/audit-events`: the newest events, optionally of one entity type or one entity, of one
 * meter run (the run itself and what belongs to it), by one user, of one kind, within [from, to);
 * `format=csv` answers the same events as a CSV file (and records the export).
 */
export const auditEventsQuery = z.object({
  limit: z.coerce.number().int().min(1).max(1000).optional(),
  entityType: z.string().optional(),
  entityId: z.string().optional(),
  meterRunId: idField('meter run').optional(),
  userId: idField('user').optional(),
  kind: z.enum(AUDIT_KINDS, { error: `must be one of ${AUDIT_KINDS.join(', ')}` }).optional(),
  from: isoInstant.optional(),
  to: isoInstant.optional(),
  format: z.enum(['json', 'csv'], { error: 'must be json or csv' }).default('json'),
});
export type AuditEventsQuery = z.infer<typeof auditEventsQuery>;
