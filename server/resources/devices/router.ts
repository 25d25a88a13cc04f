import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { parseId } from '../../http/params';
import { validate } from '../../http/validate';
import { brokerForDevices, type BrokerAddress } from './broker-address';
import { createDeviceBody, updateDeviceBody } from './schema';
import { devicesRepository } from './repository';
import { createDevice, deviceRejections, listDevices, setDeviceDisabled } from './use-cases';
import { presentDevice, presentRejections } from './presenter';

/**
 * Device credentials (admin): the password is shown once, at creation, and stored only as a hash;
 * each device comes with the broker it publishes to (`broker: { url }`, null when not known).
 */
export function devicesRouter(
  sequelize: Sequelize,
  hooks: { credentialsChanged(username: string): void; brokerAddress?: () => BrokerAddress },
) {
  const router = Router();
  const repository = devicesRepository(sequelize);
  router.use(requireCapability('administer'));

  const brokerFor = (req: { hostname: string }) => brokerForDevices(hooks.brokerAddress?.() ?? null, req.hostname);

  router.get('/', async (req, res) => {
    const devices = await listDevices(repository);
    const broker = brokerFor(req);
    res.json(devices.map(({ device, siteCode }) => ({ ...presentDevice(device, siteCode), broker })));
  });

  router.post('/', async (req, res) => {
    const input = validate(createDeviceBody, req.body);
    const { device, siteCode, password } = await createDevice(repository, input, req.user!);
    res.status(201).json({ ...presentDevice(device, siteCode), password, broker: brokerFor(req) });
  });

  // Why the device's readings were refused (issue 12 §12): counts by kind, the latest refusals.
  router.get('/:id/rejections', async (req, res) => {
    const id = parseId(req.params.id, 'Device');
    res.json(presentRejections(id, await deviceRejections(repository, id)));
  });

  router.patch('/:id', async (req, res) => {
    const { disabled } = validate(updateDeviceBody, req.body);
    const id = parseId(req.params.id, 'Device');
    const device = await setDeviceDisabled(repository, id, disabled, req.user!, (username) =>
      hooks.credentialsChanged(username),
    );
    res.json(presentDevice(device));
  });

  return router;
}
