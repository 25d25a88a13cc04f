import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { parseId } from '../../http/params';
import { validate } from '../../http/validate';
import { alarmLimitsBody, alarmLimitsQuery } from './schema';
import { alarmLimitsRepository } from './repository';
import { alarmLimitsOf, deleteAlarmLimit, setAlarmLimits } from './use-cases';
import { presentAlarmLimits } from './presenter';

/**
 * Alarm limits of a meter run and its transmitters (`/api/alarm-limits`): every role reads them;
 * engineers and admins change them (they are part of a meter run's configuration). Settings are
 * stored only where they differ from the level above; a field set to null goes back to it.
 */
export function alarmLimitsRouter(pool: Pool, hooks: { changed?(meterRunId: string): void } = {}) {
  const router = Router();
  const repository = alarmLimitsRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const { meterRunId } = validate(alarmLimitsQuery, req.query, 'query');
    res.json(presentAlarmLimits(await alarmLimitsOf(repository, meterRunId)));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(alarmLimitsBody, req.body);
    const saved = await setAlarmLimits(repository, input, req.user!, hooks.changed);
    res.status(saved.created ? 201 : 200).json(presentAlarmLimits(saved.limits, saved));
  });

  router.delete('/:id', requireCapability('configure'), async (req, res) => {
    await deleteAlarmLimit(repository, parseId(req.params.id, 'Alarm limit'), req.user!, hooks.changed);
    res.status(204).end();
  });

  return router;
}
