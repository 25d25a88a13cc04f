import crypto from 'node:crypto';
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { Device, Site } from '../../models';
import { requireCapability } from '../../auth/passport';
import { hashPassword } from '../../auth/passwords';
import { recordAuditEvent } from '../../audit';
import { badRequest, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { deviceSchema } from '../../../shared/schemas/setup';

const present = (d: Device, siteCode?: string) => ({
  id: String(d.id),
  siteId: String(d.siteId),
  ...(siteCode ? { siteCode } : {}),
  name: d.name,
  username: d.username,
  disabled: d.disabled,
  acceptedCount: Number(d.acceptedCount),
  rejectedCount: Number(d.rejectedCount),
  lastRejection: d.lastRejection,
  lastSeenAt: d.lastSeenAt ? d.lastSeenAt.toISOString() : null,
  createdAt: d.createdAt.toISOString(),
});

/** Device credentials (admin): the password is shown once, at creation, and stored only as a hash. */
export function devicesRouter(sequelize: Sequelize, hooks: { credentialsChanged(username: string): void }) {
  const router = Router();
  router.use(requireCapability('administer'));

  router.get('/', async (_req, res) => {
    const [devices, sites] = await Promise.all([Device.findAll({ order: [['id', 'ASC']] }), Site.findAll()]);
    const codes = new Map(sites.map((s) => [String(s.id), s.code]));
    res.json(devices.map((d) => present(d, codes.get(String(d.siteId)))));
  });

  router.post('/', async (req, res) => {
    const input = validate(deviceSchema, req.body);
    const site = await Site.findByPk(input.siteId);
    if (!site) throw badRequest(`siteId: no site ${input.siteId}`, 'siteId', 'invalid_field');
    const username = `${site.code.toLowerCase()}-${crypto.randomBytes(4).toString('hex')}`;
    const password = crypto.randomBytes(18).toString('base64url');
    const device = await sequelize.transaction(async (transaction) => {
      const created = await Device.create(
        { siteId: site.id, name: input.name, username, passwordHash: await hashPassword(password) },
        { transaction },
      );
      await recordAuditEvent(
        {
          actor: req.user!,
          action: 'device.create',
          entityType: 'device',
          entityId: String(created.id),
          after: present(created, site.code),
        },
        transaction,
      );
      return created;
    });
    res.status(201).json({ ...present(device, site.code), password });
  });

  router.patch('/:id', async (req, res) => {
    const patch = validate(z.object({ disabled: z.boolean({ error: 'must be true or false' }) }).strict(), req.body);
    const device = /^\d+$/.test(String(req.params.id)) ? await Device.findByPk(String(req.params.id)) : null;
    if (!device) throw notFound('Device');
    const before = present(device);
    await sequelize.transaction(async (transaction) => {
      await device.update(patch, { transaction });
      await recordAuditEvent(
        {
          actor: req.user!,
          action: 'device.update',
          entityType: 'device',
          entityId: String(device.id),
          before,
          after: present(device),
        },
        transaction,
      );
    });
    if (patch.disabled) hooks.credentialsChanged(device.username);
    else hooks.credentialsChanged('');
    res.json(present(device));
  });

  return router;
}
