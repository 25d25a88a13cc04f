import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { createSiteBody, updateSiteBody } from './schema';
import { siteRepository } from './repository';
import { createSite, getSite, listSites, updateSite, type SiteHooks } from './use-cases';
import { presentSite } from './presenter';

/** Sites: the time zone, contract hour and base conditions their meter runs are computed in. */
export function sitesRouter(sequelize: Sequelize, hooks: SiteHooks) {
  const router = Router();
  const repository = siteRepository(sequelize);
  const deps = { sequelize, repository, hooks };

  router.get('/', requireCapability('view'), async (_req, res) => {
    res.json((await listSites(repository)).map(presentSite));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    res.json(presentSite(await getSite(repository, parseId(req.params.id, 'Site'))));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(createSiteBody, req.body);
    res.status(201).json(presentSite(await createSite(deps, input, req.user!)));
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const changes = validate(updateSiteBody, req.body);
    const siteId = parseId(req.params.id, 'Site');
    res.json(presentSite(await updateSite(deps, { siteId, changes, actor: req.user! })));
  });

  return router;
}
