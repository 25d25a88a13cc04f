import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { parseId } from '../../http/params';
import { validate } from '../../http/validate';
import { readingConflictRepository } from './repository';
import { readingConflictsQuery, resolveConflictBody } from './schema';
import { listReadingConflicts, resolveReadingConflict } from './use-cases';
import { presentReadingConflict } from './presenter';

/**
 * Re-sent readings that differed from the stored ones (issue 9):
 * `GET /api/reading-conflicts?meterRunId=&status=open|resolved` for everyone who sees totals;
 * `POST /api/reading-conflicts/:id/resolve { resolution, correctionId? }` for engineers and admins
 * (those who may propose a correction), audited with the resolution as its reason.
 */
export function readingConflictsRouter(sequelize: Sequelize) {
  const router = Router();
  const repository = readingConflictRepository(sequelize);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(readingConflictsQuery, req.query, 'query');
    res.json((await listReadingConflicts(repository, query)).map(presentReadingConflict));
  });

  router.post('/:id/resolve', requireCapability('proposeCorrection'), async (req, res) => {
    const conflictId = parseId(req.params.id, 'Reading conflict');
    const body = validate(resolveConflictBody, req.body);
    const resolved = await resolveReadingConflict({ sequelize, repository }, { conflictId, body, actor: req.user! });
    res.json(presentReadingConflict(resolved));
  });

  return router;
}
