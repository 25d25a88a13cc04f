import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { createConfigVersionBody, createMeterRunBody, meterRunListQuery, updateMeterRunBody } from './schema';
import { meterRunRepository } from './repository';
import {
  addConfigVersion,
  createMeterRun,
  getMeterRun,
  listConfigVersions,
  listMeterRuns,
  listSettingVersions,
  updateMeterRun,
  type MeterRunHooks,
} from './use-cases';
import {
  presentConfigVersionEntry,
  presentCreatedConfigVersion,
  presentMeterRun,
  presentSettingVersionEntry,
} from './presenter';

/** Set-up of meter runs and their configuration versions (history is in meter-run-history). */
export function meterRunsRouter(sequelize: Sequelize, hooks: MeterRunHooks) {
  const router = Router();
  const repository = meterRunRepository(sequelize);
  const deps = { sequelize, repository, hooks };

  router.get('/', requireCapability('view'), async (req, res) => {
    const query = validate(meterRunListQuery, req.query, 'query');
    const runs = await listMeterRuns(repository, { siteId: query.siteId });
    res.json(runs.map((r) => presentMeterRun(r.meterRun, r.config)));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const { meterRun, config } = await getMeterRun(repository, parseId(req.params.id, 'Meter run'));
    res.json(presentMeterRun(meterRun, config));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(createMeterRunBody, req.body);
    const { meterRun, config } = await createMeterRun(deps, input, req.user!);
    res.status(201).json(presentMeterRun(meterRun, config));
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const changes = validate(updateMeterRunBody, req.body);
    const meterRunId = parseId(req.params.id, 'Meter run');
    const { meterRun, config } = await updateMeterRun(deps, { meterRunId, changes, actor: req.user! });
    res.json(presentMeterRun(meterRun, config));
  });

  router.get('/:id/config-versions', requireCapability('view'), async (req, res) => {
    const versions = await listConfigVersions(repository, parseId(req.params.id, 'Meter run'));
    res.json(versions.map(presentConfigVersionEntry));
  });

  // Dated settings (issue 9): the meter run's own, its transmitters' ranges and its site's, with who, why and what changed.
  router.get('/:id/setting-versions', requireCapability('view'), async (req, res) => {
    const versions = await listSettingVersions(repository, parseId(req.params.id, 'Meter run'));
    res.json(versions.map(presentSettingVersionEntry));
  });

  router.post('/:id/config-versions', requireCapability('configure'), async (req, res) => {
    const input = validate(createConfigVersionBody, req.body);
    const meterRunId = parseId(req.params.id, 'Meter run');
    const version = await addConfigVersion(deps, { meterRunId, input, actor: req.user! });
    res.status(201).json(presentCreatedConfigVersion(version));
  });

  return router;
}
