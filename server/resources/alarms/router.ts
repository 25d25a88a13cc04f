import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { AppError, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { ALARM_SELECT, applyAction } from '../../alarms/alarm-store';
import { AlarmTransitionError, type AlarmAction } from '../../../shared/alarms/alarm-lifecycle';
import { presentAlarm, presentAlarmEvent } from './presenter';
import { acknowledgeBody, alarmListQuery, countsQuery, optionalReasonBody, reasonBody, shelveBody } from './schema';

/**
 * Alarms: the list (filters by meter run, site, state, condition, priority, time), counts for
 * the banner, one alarm with its log, and the lifecycle actions. Every role reads; operators,
 * engineers and admins acknowledge and shelve (respondToAlarms); taking an alarm out of service
 * is maintenance, for engineers and admins (configure).
 */
export function alarmsRouter(pool: Pool, hooks: { changed?(alarmIds: string[]): void } = {}) {
  const router = Router();

  router.get('/', requireCapability('view'), async (req, res) => {
    const q = validate(alarmListQuery, req.query, 'query');
    const where: string[] = [];
    const params: unknown[] = [];
    const add = (sql: string, value: unknown) => {
      params.push(value);
      where.push(sql.replace('?', `$${params.length}`));
    };
    if (q.meterRunId) add('a.meter_run_id = ?', q.meterRunId);
    if (q.siteId) add('m.site_id = ?', q.siteId);
    if (q.transmitterId) add('a.transmitter_id = ?', q.transmitterId);
    if (q.condition) add('a.condition = ?', q.condition);
    if (q.priority) add('a.priority = ?', q.priority);
    if (q.from) add("coalesce(a.cleared_at, 'infinity') >= ?", q.from);
    if (q.to) add('a.raised_at < ?', q.to);
    if (q.state) {
      const states = q.state.filter((s) => s !== 'open');
      const open = q.state.includes('open');
      params.push(states);
      where.push(`(a.state = ANY($${params.length}::text[])${open ? " OR a.state <> 'normal'" : ''})`);
    }
    params.push(q.limit);
    const { rows } = await pool.query(
      `${ALARM_SELECT} ${where.length ? `WHERE ${where.join(' AND ')}` : ''} ORDER BY a.raised_at DESC, a.id DESC LIMIT $${params.length}`,
      params,
    );
    const list = rows.map(presentAlarm);
    if (q.include === 'events' && list.length) {
      const events = await pool.query('SELECT * FROM alarm_events WHERE alarm_id = ANY($1::bigint[]) ORDER BY id', [
        list.map((a) => a.id),
      ]);
      const byAlarm = new Map<string, ReturnType<typeof presentAlarmEvent>[]>();
      for (const e of events.rows.map(presentAlarmEvent))
        byAlarm.set(e.alarmId, [...(byAlarm.get(e.alarmId) ?? []), e]);
      return res.json(list.map((a) => ({ ...a, events: byAlarm.get(a.id) ?? [] })));
    }
    res.json(list);
  });

  /** For the banner on every screen: open alarms, how many wait for acknowledgement, by priority. */
  router.get('/counts', requireCapability('view'), async (req, res) => {
    const q = validate(countsQuery, req.query, 'query');
    const params: unknown[] = [];
    let filter = '';
    if (q.siteId) {
      params.push(q.siteId);
      filter += ` AND m.site_id = $${params.length}`;
    }
    if (q.meterRunId) {
      params.push(q.meterRunId);
      filter += ` AND a.meter_run_id = $${params.length}`;
    }
    const { rows } = await pool.query(
      `SELECT a.state, a.priority, count(*)::int AS n FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
        WHERE a.state <> 'normal'${filter} GROUP BY a.state, a.priority`,
      params,
    );
    const byState: Record<string, number> = {};
    const unacknowledgedByPriority = { high: 0, medium: 0, low: 0 } as Record<string, number>;
    let open = 0;
    for (const r of rows) {
      open += r.n;
      byState[r.state] = (byState[r.state] ?? 0) + r.n;
      if (r.state === 'active-unacknowledged' || r.state === 'returned-unacknowledged')
        unacknowledgedByPriority[r.priority] += r.n;
    }
    const recent = await pool.query(
      `SELECT count(*)::int AS n FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id WHERE a.raised_at > now() - interval '10 minutes'${filter}`,
      params,
    );
    res.json({
      open,
      unacknowledged: (byState['active-unacknowledged'] ?? 0) + (byState['returned-unacknowledged'] ?? 0),
      unacknowledgedByPriority,
      byState,
      // TRADE.md §7: a flood is more than 10 alarms in 10 minutes.
      raisedLast10Minutes: recent.rows[0].n,
      flood: recent.rows[0].n > 10,
    });
  });

  const findAlarm = async (id: string) => {
    if (!/^\d+$/.test(id)) throw notFound('Alarm');
    const row = (await pool.query(`${ALARM_SELECT} WHERE a.id = $1`, [id])).rows[0];
    if (!row) throw notFound('Alarm');
    return row;
  };
  const events = async (id: string) =>
    (await pool.query('SELECT * FROM alarm_events WHERE alarm_id = $1 ORDER BY id', [id])).rows.map(presentAlarmEvent);

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const row = await findAlarm(String(req.params.id));
    res.json({ ...presentAlarm(row), events: await events(row.id) });
  });

  router.get('/:id/events', requireCapability('view'), async (req, res) => {
    const row = await findAlarm(String(req.params.id));
    res.json(await events(row.id));
  });

  const act = async (
    id: string,
    action: Exclude<AlarmAction, 'raise' | 'clear'>,
    user: Express.User,
    options: { minutes?: number; reason?: string },
  ) => {
    await findAlarm(id);
    try {
      const row = await applyAction(pool, id, action, { id: user.id, email: user.email }, options);
      if (!row) throw notFound('Alarm');
      hooks.changed?.([id]);
      return presentAlarm(row);
    } catch (err) {
      // Not allowed in its state (a second acknowledge, one already normal, ...): 409 with a stable code.
      if (err instanceof AlarmTransitionError) throw new AppError(409, err.code, err.message, 'state');
      throw err;
    }
  };

  router.post('/:id/acknowledge', requireCapability('respondToAlarms'), async (req, res) => {
    const body = validate(acknowledgeBody, req.body);
    res.json(await act(String(req.params.id), 'acknowledge', req.user!, { reason: body.comment }));
  });

  router.post('/:id/shelve', requireCapability('respondToAlarms'), async (req, res) => {
    const body = validate(shelveBody, req.body);
    res.json(await act(String(req.params.id), 'shelve', req.user!, body));
  });

  router.post('/:id/unshelve', requireCapability('respondToAlarms'), async (req, res) => {
    const body = validate(optionalReasonBody, req.body);
    res.json(await act(String(req.params.id), 'unshelve', req.user!, body));
  });

  router.post('/:id/out-of-service', requireCapability('configure'), async (req, res) => {
    const body = validate(reasonBody, req.body);
    res.json(await act(String(req.params.id), 'remove-from-service', req.user!, body));
  });

  router.post('/:id/return-to-service', requireCapability('configure'), async (req, res) => {
    const body = validate(optionalReasonBody, req.body);
    res.json(await act(String(req.params.id), 'return-to-service', req.user!, body));
  });

  return router;
}
