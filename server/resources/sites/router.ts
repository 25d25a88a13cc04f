import { Router } from 'express';
import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { Site } from '../../models';
import { requireCapability } from '../../auth/passport';
import { recordAuditEvent } from '../../audit';
import { conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { siteSchema } from '../../../shared/schemas/setup';
import { presentSite } from './presenter';

export function sitesRouter(sequelize: Sequelize) {
  const router = Router();

  router.get('/', requireCapability('view'), async (_req, res) => {
    res.json((await Site.findAll({ order: [['code', 'ASC']] })).map(presentSite));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const site = /^\d+$/.test(String(req.params.id)) ? await Site.findByPk(String(req.params.id)) : null;
    if (!site) throw notFound('Site');
    res.json(presentSite(site));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(siteSchema, req.body);
    try {
      const site = await sequelize.transaction(async (transaction) => {
        const created = await Site.create(input, { transaction });
        await recordAuditEvent(
          {
            actor: req.user!,
            action: 'site.create',
            entityType: 'site',
            entityId: String(created.id),
            after: presentSite(created),
          },
          transaction,
        );
        return created;
      });
      res.status(201).json(presentSite(site));
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw conflict(`A site with code ${input.code} already exists.`, 'code', 'duplicate');
      throw err;
    }
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const input = validate(siteSchema.partial().strict(), req.body);
    const site = await sequelize.transaction(async (transaction) => {
      const found = /^\d+$/.test(String(req.params.id))
        ? await Site.findByPk(String(req.params.id), { transaction, lock: transaction.LOCK.UPDATE })
        : null;
      if (!found) throw notFound('Site');
      const before = presentSite(found);
      await found.update(input, { transaction });
      await recordAuditEvent(
        {
          actor: req.user!,
          action: 'site.update',
          entityType: 'site',
          entityId: String(found.id),
          before,
          after: presentSite(found),
        },
        transaction,
      );
      return found;
    });
    res.json(presentSite(site));
  });

  return router;
}
