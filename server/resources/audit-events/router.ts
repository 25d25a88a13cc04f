import { Router } from 'express';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { auditEventsQuery } from './schema';
import { auditEventsRepository } from './repository';
import { auditLog } from './use-cases';
import { presentAuditEvent } from './presenter';

/** The audit log (`GET /api/audit-events`), for the roles that read it (engineer, accountant, admin). */
export function auditEventsRouter() {
  const router = Router();
  const repository = auditEventsRepository();
  router.use(requireCapability('readAuditLog'));

  router.get('/', async (req, res) => {
    const filter = validate(auditEventsQuery, req.query, 'query');
    res.json((await auditLog(repository, filter)).map(presentAuditEvent));
  });

  return router;
}
