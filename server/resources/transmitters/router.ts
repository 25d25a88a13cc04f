import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { transmitterBody, transmitterListQuery, updateTransmitterBody } from './schema';
import { transmitterRepository } from './repository';
import {
  createTransmitter,
  getTransmitter,
  listTransmitters,
  updateTransmitter,
  type TransmitterHooks,
} from './use-cases';
import { presentTransmitter } from './presenter';

/**
 * Transmitters of the meter runs. A change reaches ingest and the live board through
 * `hooks.changed` (the transmitter catalog is read again); a dated re-range recomputes history
 * from its effective time through `hooks.rangeChanged`.
 */
export function transmittersRouter(sequelize: Sequelize, hooks: TransmitterHooks) {
  const router = Router();
  const repository = transmitterRepository(sequelize);
  const deps = { sequelize, repository, hooks };

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(transmitterListQuery, req.query, 'query');
    res.json((await listTransmitters(repository, { meterRunId: query.meterRunId })).map(presentTransmitter));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    res.json(presentTransmitter(await getTransmitter(repository, parseId(req.params.id, 'Transmitter'))));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(transmitterBody, req.body);
    res.status(201).json(presentTransmitter(await createTransmitter(deps, input, req.user!)));
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const changes = validate(updateTransmitterBody, req.body);
    const transmitterId = parseId(req.params.id, 'Transmitter');
    res.json(presentTransmitter(await updateTransmitter(deps, { transmitterId, changes, actor: req.user! })));
  });

  return router;
}
