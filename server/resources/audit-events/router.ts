import { Router } from 'express';
import { z } from 'zod';
import { AuditEvent } from '../../models';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';

const querySchema = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(100),
  entityType: z.string().optional(),
  entityId: z.string().optional(),
});

export function auditEventsRouter() {
  const router = Router();
  router.use(requireCapability('readAuditLog'));
  router.get('/', async (req, res) => {
    const q = validate(querySchema, req.query, 'query');
    const events = await AuditEvent.findAll({
      where: { ...(q.entityType ? { entityType: q.entityType } : {}), ...(q.entityId ? { entityId: q.entityId } : {}) },
      order: [
        ['occurredAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: q.limit,
    });
    res.json(
      events.map((e) => ({
        id: String(e.id),
        occurredAt: e.occurredAt.toISOString(),
        actorEmail: e.actorEmail,
        action: e.action,
        entityType: e.entityType,
        entityId: e.entityId,
        before: e.before,
        after: e.after,
      })),
    );
  });
  return router;
}
