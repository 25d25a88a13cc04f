import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { unauthorized } from '../../errors';
import { validate } from '../../http/validate';
import { closeBody, monthParam, periodQuery, reopenBody } from './schema';
import { periodsRepository } from './repository';
import { closePeriod, getPeriod, reopenPeriod, type PeriodDeps } from './use-cases';
import { presentPeriod } from './presenter';

/**
 * Period close per site and contract month (issue 10 §5): every role reads a month's status;
 * the accountant and the admin close it; only the admin reopens it.
 */
export function periodsRouter(options: { sequelize: Sequelize; reopened: PeriodDeps['reopened'] }) {
  const router = Router();
  const repository = periodsRepository(options.sequelize);
  const deps: PeriodDeps = { ...options, repository };
  const actorOf = (user: Express.User | undefined) => {
    if (!user) throw unauthorized();
    return user;
  };
  const monthOf = (value: unknown) => validate(monthParam, value, 'month');

  router.get('/:month', requireCapability('view'), async (req, res) => {
    const month = monthOf(req.params.month);
    const { siteId } = validate(periodQuery, req.query, 'query');
    res.json(presentPeriod(await getPeriod(repository, { siteId, month })));
  });

  router.post('/:month/close', requireCapability('closePeriod'), async (req, res) => {
    const month = monthOf(req.params.month);
    const input = validate(closeBody, req.body);
    res.json(presentPeriod(await closePeriod(deps, { month, input, actor: actorOf(req.user) })));
  });

  router.post('/:month/reopen', requireCapability('reopenPeriod'), async (req, res) => {
    const month = monthOf(req.params.month);
    const input = validate(reopenBody, req.body);
    res.json(presentPeriod(await reopenPeriod(deps, { month, input, actor: actorOf(req.user) })));
  });

  return router;
}
