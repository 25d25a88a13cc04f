import { Router } from 'express';
import type { Pool } from 'pg';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { unauthorized } from '../../errors';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { correctionsQuery, decisionBody, estimateQuery, proposeCorrectionBody } from './schema';
import { correctionsRepository } from './repository';
import {
  decideCorrection,
  estimateCorrection,
  getCorrection,
  listCorrections,
  proposeCorrection,
  type CorrectionDeps,
} from './use-cases';
import { presentCorrection, presentCorrectionWithFigures, presentEstimate } from './presenter';

/**
 * Corrections with four eyes (issue 9): every role reads them; engineers and admins propose,
 * estimate, and approve or reject somebody else's.
 */
export function correctionsRouter(options: { sequelize: Sequelize; pool: Pool; approved: CorrectionDeps['approved'] }) {
  const router = Router();
  const repository = correctionsRepository(options.sequelize);
  const deps: CorrectionDeps = { ...options, repository };
  const actorOf = (user: Express.User | undefined) => {
    if (!user) throw unauthorized();
    return user;
  };

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(correctionsQuery, req.query, 'query');
    res.json((await listCorrections(repository, query)).map(presentCorrectionWithFigures));
  });

  router.get('/estimate', requireCapability('proposeCorrection'), async (req, res) => {
    const query = validate(estimateQuery, req.query, 'query');
    const estimate = await estimateCorrection(repository, {
      meterRunId: query.meterRunId,
      startMs: Date.parse(query.start),
      endMs: Date.parse(query.end),
    });
    res.json(presentEstimate(estimate));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    res.json(presentCorrectionWithFigures(await getCorrection(repository, parseId(req.params.id, 'Correction'))));
  });

  router.post('/', requireCapability('proposeCorrection'), async (req, res) => {
    const input = validate(proposeCorrectionBody, req.body);
    const created = await proposeCorrection(deps, { input, actor: actorOf(req.user) });
    res.status(201).json(presentCorrection(created));
  });

  for (const [path, decision] of [
    ['/:id/approve', 'approved'],
    ['/:id/reject', 'rejected'],
  ] as const) {
    router.post(path, requireCapability('approveCorrection'), async (req, res) => {
      const id = parseId(req.params.id, 'Correction');
      const { reason } = validate(decisionBody, req.body);
      const decided = await decideCorrection(deps, { id, decision, reason, actor: actorOf(req.user) });
      res.json(presentCorrection(decided));
    });
  }

  return router;
}
