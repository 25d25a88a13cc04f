import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { badRequest } from '../../errors';
import { validate } from '../../http/validate';
import { parseTimeWindow } from '../../http/params';
import { AUDIT_MAX_DAYS, auditEventsQuery, type AuditEventsQuery } from './schema';
import { auditEventsRepository } from './repository';
import { auditActors, auditLog, exportAuditLog } from './use-cases';
import { auditEventsCsv, presentAuditActor, presentAuditEvent } from './presenter';

/** The period of a query: both ends or neither, refusing the one missing. */
function periodOf(query: AuditEventsQuery) {
  if (query.from === undefined && query.to === undefined) return {};
  if (query.from === undefined) throw badRequest('from: required with to', 'from');
  if (query.to === undefined) throw badRequest('to: required with from', 'to');
  return parseTimeWindow({ from: query.from, to: query.to }, { maxDays: AUDIT_MAX_DAYS, what: 'audit events' });
}

/**
 * The audit log (`GET /api/audit-events`, `?format=csv` to export it, `GET /api/audit-events/actors`),
 * for the roles that read it (engineer, accountant, admin).
 */
export function auditEventsRouter(pool: Pool) {
  const router = Router();
  const repository = auditEventsRepository(pool);
  router.use(requireCapability('readAuditLog'));

  router.get('/', async (req, res) => {
    const { format, ...query } = validate(auditEventsQuery, req.query, 'query');
    const filter = { ...query, ...periodOf({ format, ...query }) };
    if (format === 'json') {
      res.json((await auditLog(repository, filter)).map(presentAuditEvent));
      return;
    }
    const events = await exportAuditLog(repository, { filter, filters: query, actor: req.user! });
    res.attachment(`audit-events-${new Date().toISOString().slice(0, 10)}.csv`);
    res.type('text/csv; charset=utf-8').send(auditEventsCsv(events));
  });

  router.get('/actors', async (_req, res) => {
    res.json((await auditActors(repository)).map(presentAuditActor));
  });

  return router;
}
