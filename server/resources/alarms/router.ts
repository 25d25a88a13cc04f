import { Router, type Request } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { parseId } from '../../http/params';
import { validate } from '../../http/validate';
import { acknowledgeBody, alarmListQuery, countsQuery, optionalReasonBody, reasonBody, shelveBody } from './schema';
import { alarmsRepository, type PersonAction } from './repository';
import { alarmCounts, alarmEvents, alarmWithEvents, listAlarms, respondToAlarm } from './use-cases';
import { presentAlarm, presentAlarmEvent, presentAlarmList, presentAlarmWithEvents } from './presenter';

/**
 * Alarms: the list (filters by meter run, site, state, condition, priority, time), counts for
 * the banner, one alarm with its log, and the lifecycle actions. Every role reads; operators,
 * engineers and admins acknowledge and shelve (respondToAlarms); taking an alarm out of service
 * is maintenance, for engineers and admins (configure).
 */
export function alarmsRouter(pool: Pool, hooks: { changed?(alarmIds: string[]): void } = {}) {
  const router = Router();
  const repository = alarmsRepository(pool);

  router.get('/', requireCapability('view'), async (req, res) => {
    const { state, include, ...filter } = validate(alarmListQuery, req.query, 'query');
    const list = await listAlarms(repository, { ...filter, states: state }, include === 'events');
    res.json(presentAlarmList(list));
  });

  router.get('/counts', requireCapability('view'), async (req, res) => {
    const scope = validate(countsQuery, req.query, 'query');
    res.json(await alarmCounts(repository, scope));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const alarm = await alarmWithEvents(repository, parseId(req.params.id, 'Alarm'));
    res.json(presentAlarmWithEvents(alarm));
  });

  router.get('/:id/events', requireCapability('view'), async (req, res) => {
    const events = await alarmEvents(repository, parseId(req.params.id, 'Alarm'));
    res.json(events.map(presentAlarmEvent));
  });

  /** Each handler checks the body first, so a bad body is a 400 even for an unknown alarm. */
  const respond = async (req: Request, action: PersonAction, options: { minutes?: number; reason?: string }) => {
    const alarmId = parseId(req.params.id, 'Alarm');
    const alarm = await respondToAlarm(repository, {
      alarmId,
      action,
      actor: req.user!,
      ...options,
      changed: hooks.changed,
    });
    return presentAlarm(alarm);
  };

  router.post('/:id/acknowledge', requireCapability('respondToAlarms'), async (req, res) => {
    const body = validate(acknowledgeBody, req.body);
    res.json(await respond(req, 'acknowledge', { reason: body.comment }));
  });

  router.post('/:id/shelve', requireCapability('respondToAlarms'), async (req, res) => {
    res.json(await respond(req, 'shelve', validate(shelveBody, req.body)));
  });

  router.post('/:id/unshelve', requireCapability('respondToAlarms'), async (req, res) => {
    res.json(await respond(req, 'unshelve', validate(optionalReasonBody, req.body)));
  });

  router.post('/:id/out-of-service', requireCapability('configure'), async (req, res) => {
    res.json(await respond(req, 'remove-from-service', validate(reasonBody, req.body)));
  });

  router.post('/:id/return-to-service', requireCapability('configure'), async (req, res) => {
    res.json(await respond(req, 'return-to-service', validate(optionalReasonBody, req.body)));
  });

  return router;
}
