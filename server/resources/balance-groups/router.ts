import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { unauthorized } from '../../errors';
import { validate } from '../../http/validate';
import { parseId, parseTimeWindow } from '../../http/params';
import { allocationQuery, BALANCE_MAX_DAYS, balanceGroupsQuery, balanceQuery, createBalanceGroupBody } from './schema';
import { balanceGroupsRepository } from './repository';
import {
  allocationForMonth,
  balanceForWindow,
  createBalanceGroup,
  getBalanceGroup,
  listBalanceGroups,
} from './use-cases';
import { presentAllocation, presentBalanceGroup, presentBalancePeriod } from './presenter';

/**
 * Balance groups (issue 10 §3, §4): station balances and pro-rata allocation. Every role reads
 * them (balances are in the "view" row of the role table); engineers and admins define groups,
 * as they configure meter runs.
 */
export function balanceGroupsRouter(sequelize: Sequelize) {
  const router = Router();
  const repository = balanceGroupsRepository(sequelize);

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(balanceGroupsQuery, req.query, 'query');
    res.json((await listBalanceGroups(repository, query)).map(presentBalanceGroup));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    if (!req.user) throw unauthorized();
    const input = validate(createBalanceGroupBody, req.body);
    const group = await createBalanceGroup({ sequelize, repository }, input, req.user);
    res.status(201).json(presentBalanceGroup(group));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    res.json(presentBalanceGroup(await getBalanceGroup(repository, parseId(req.params.id, 'Balance group'))));
  });

  router.get('/:id/balance', requireCapability('view'), async (req, res) => {
    const group = await getBalanceGroup(repository, parseId(req.params.id, 'Balance group'));
    const query = validate(balanceQuery, req.query, 'query');
    const window = parseTimeWindow(query, { maxDays: BALANCE_MAX_DAYS, timeZone: group.timeZone, what: 'balance' });
    const periods = await balanceForWindow(repository, { group, interval: query.interval, ...window });
    res.json(periods.map(presentBalancePeriod));
  });

  router.get('/:id/allocation', requireCapability('view'), async (req, res) => {
    const group = await getBalanceGroup(repository, parseId(req.params.id, 'Balance group'));
    const { month } = validate(allocationQuery, req.query, 'query');
    res.json(presentAllocation(await allocationForMonth(repository, { group, month })));
  });

  return router;
}
