import { testApp } from '../../test-support/app';
import { AlarmEvaluator } from '../../alarms/alarm-evaluator';
import { unshelveExpired } from '../../alarms/alarm-store';
import { alarmFixture, repeat } from '../../alarms/alarm-test-fixture';

/** The alarm API on the real app and database: list, acknowledge (409 on a second), shelve, roles. */
let t: Awaited<ReturnType<typeof testApp>>;
const who = {} as Record<'engineer' | 'operator' | 'accountant' | 'admin', { token: string; email: string }>;
let evaluator: AlarmEvaluator;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const T0 = Date.parse('2026-10-02T06:00:00Z');

beforeAll(async () => {
  t = await testApp();
  for (const role of ['engineer', 'operator', 'accountant', 'admin'] as const) who[role] = await t.signedIn(role);
  evaluator = new AlarmEvaluator(t.services.pool, { now: () => Date.parse('2026-10-03T00:00:00Z') });
  f = await alarmFixture(t, who.engineer.token);
  // DP at 40 % then held at 5 % to the end: one low-in-range alarm, still active.
  await f.writeMinutes(T0, [...repeat(10, 0.4), ...repeat(30, 0.05)]);
  await t.services.history.settle();
  await evaluator.evaluate(f.meterRunId);
});
afterAll(() => t.close());

const as = (role: keyof typeof who) => ({
  get: (url: string) => t.http().get(url).set('Authorization', `Bearer ${who[role].token}`),
  post: (url: string, body: object = {}) =>
    t.http().post(url).set('Authorization', `Bearer ${who[role].token}`).send(body),
});
const lowAlarm = async () =>
  (await as('operator').get(`/api/alarms?meterRunId=${f.meterRunId}&condition=dp-low-in-range`)).body[0];

describe('/api/alarms', () => {
  it('lists the alarm with the fields of the design', async () => {
    const res = await as('accountant').get(`/api/alarms?meterRunId=${f.meterRunId}&state=active-unacknowledged`);
    expect(res.status).toBe(200);
    const low = res.body.find((a: { condition: string }) => a.condition === 'dp-low-in-range');
    expect(low).toMatchObject({
      id: expect.any(String),
      meterRunId: f.meterRunId,
      transmitterId: f.dp.id,
      condition: 'dp-low-in-range',
      priority: 'medium',
      state: 'active-unacknowledged',
      raisedAt: '2026-10-02T06:15:00.000Z', // 5 % from 06:10, on-delay 300 s
      clearedAt: null,
      acknowledgedAt: null,
      acknowledgedBy: null,
      message: expect.stringMatching(/5\.0 % of its span/),
    });
  });

  it('refuses an accountant acknowledging with 403', async () => {
    const a = await lowAlarm();
    const res = await as('accountant').post(`/api/alarms/${a.id}/acknowledge`);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('acknowledges once, answers a second acknowledge with 409, and logs who did it', async () => {
    const a = await lowAlarm();
    const first = await as('operator').post(`/api/alarms/${a.id}/acknowledge`);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ state: 'active-acknowledged', acknowledgedBy: who.operator.email });
    const second = await as('engineer').post(`/api/alarms/${a.id}/acknowledge`);
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('already_acknowledged');
    const events = (await as('accountant').get(`/api/alarms/${a.id}/events`)).body;
    expect(events.map((e: { action: string }) => e.action)).toEqual(['raised', 'acknowledged']);
    expect(events[0]).toMatchObject({ occurredAt: '2026-10-02T06:15:00.000Z', userEmail: null });
    expect(events[1]).toMatchObject({
      fromState: 'active-unacknowledged',
      toState: 'active-acknowledged',
      userEmail: who.operator.email,
    });
  });

  it('refuses shelving without minutes or reason, naming the field', async () => {
    const a = await lowAlarm();
    const noMinutes = await as('operator').post(`/api/alarms/${a.id}/shelve`, { reason: 'sensor work' });
    expect(noMinutes.status).toBe(400);
    expect(noMinutes.body.error.field).toBe('minutes');
    const tooLong = await as('operator').post(`/api/alarms/${a.id}/shelve`, { minutes: 5000, reason: 'x' });
    expect(tooLong.body.error.field).toBe('minutes');
    const noReason = await as('operator').post(`/api/alarms/${a.id}/shelve`, { minutes: 30 });
    expect(noReason.body.error.field).toBe('reason');
  });

  it('shelves for a limited time and unshelves by itself when the time is over, active again', async () => {
    const a = await lowAlarm();
    const res = await as('engineer').post(`/api/alarms/${a.id}/shelve`, {
      minutes: 30,
      reason: 'low flow expected during the well test',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'shelved', shelveReason: 'low flow expected during the well test' });
    const until = Date.parse(res.body.shelvedUntil);
    expect(await unshelveExpired(t.services.pool, until - 1000)).not.toContain(a.id);
    expect(await unshelveExpired(t.services.pool, until + 1000)).toContain(a.id);
    const after = (await as('operator').get(`/api/alarms/${a.id}`)).body;
    expect(after.state).toBe('active-unacknowledged'); // the condition still holds: annunciated again
    expect(after.events.map((e: { action: string }) => e.action)).toEqual([
      'raised',
      'acknowledged',
      'shelved',
      'unshelved',
    ]);
  });

  it('answers an acknowledge of an alarm already normal with 409', async () => {
    await f.writeMinutes(T0 + 40 * 60_000, repeat(10, 0.4));
    await t.services.history.settle();
    await evaluator.evaluate(f.meterRunId);
    const a = await lowAlarm();
    expect(a.state).toBe('returned-unacknowledged');
    expect((await as('operator').post(`/api/alarms/${a.id}/acknowledge`)).body.state).toBe('normal');
    const again = await as('operator').post(`/api/alarms/${a.id}/acknowledge`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_normal');
  });

  it('counts open alarms for the banner', async () => {
    const res = await as('operator').get(`/api/alarms/counts?meterRunId=${f.meterRunId}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      open: expect.any(Number),
      unacknowledged: expect.any(Number),
      flood: expect.any(Boolean),
    });
  });

  it('refuses an unknown state filter naming the field', async () => {
    const res = await as('operator').get('/api/alarms?state=sleeping');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('state');
  });

  it('lists each alarm with its log when asked to include events', async () => {
    const res = await as('accountant').get(
      `/api/alarms?meterRunId=${f.meterRunId}&condition=dp-low-in-range&include=events`,
    );
    expect(res.status).toBe(200);
    const [low] = res.body;
    expect(low.events.map((e: { action: string }) => e.action).slice(0, 2)).toEqual(['raised', 'acknowledged']);
    expect(low.events.every((e: { alarmId: string }) => e.alarmId === low.id)).toBe(true);
  });

  it('keeps an alarm in a window it overlaps and leaves it out of windows before it was raised or after it cleared', async () => {
    // Raised at 06:15 (5 % from 06:10, on-delay 300 s); cleared soon after DP went back to 40 % at 06:40.
    const list = async (window: string) =>
      (await as('operator').get(`/api/alarms?meterRunId=${f.meterRunId}&condition=dp-low-in-range&${window}`)).body.map(
        (a: { id: string }) => a.id,
      );
    const a = await lowAlarm();
    expect(await list('from=2026-10-02T06:20:00Z&to=2026-10-02T06:30:00Z')).toEqual([a.id]);
    expect(await list('from=2026-10-02T05:00:00Z&to=2026-10-02T06:15:00Z')).toEqual([]);
    expect(await list('from=2026-10-02T07:00:00Z&to=2026-10-02T08:00:00Z')).toEqual([]);
    const bad = await as('operator').get('/api/alarms?from=2026-10-02T06:20:00');
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('from');
  });

  it('counts the alarms of one site, and none for a site that does not exist', async () => {
    const site = await as('operator').get(`/api/alarms/counts?siteId=${f.siteId}`);
    expect(site.status).toBe(200);
    expect(site.body.unacknowledgedByPriority).toEqual({
      high: expect.any(Number),
      medium: expect.any(Number),
      low: expect.any(Number),
    });
    const none = await as('operator').get('/api/alarms/counts?siteId=987654321');
    expect(none.body).toMatchObject({ open: 0, unacknowledged: 0, byState: {}, raisedLast10Minutes: 0, flood: false });
    const bad = await as('operator').get('/api/alarms/counts?siteId=north');
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('siteId');
  });

  it('answers an alarm that does not exist, or an id that cannot name one, with 404', async () => {
    expect((await as('operator').get('/api/alarms/987654321')).status).toBe(404);
    expect((await as('operator').get('/api/alarms/first/events')).status).toBe(404);
    expect((await as('operator').post('/api/alarms/987654321/acknowledge')).status).toBe(404);
    // The body is checked first: a shelve without its fields is a 400 whatever the alarm.
    expect((await as('operator').post('/api/alarms/first/shelve')).status).toBe(400);
  });
});
