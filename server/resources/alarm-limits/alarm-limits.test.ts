import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
let operator: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
  operator = (await t.signedIn('operator')).token;
  f = await alarmFixture(t, engineer);
});
afterAll(() => t.close());

const post = (token: string, body: object) =>
  t.http().post('/api/alarm-limits').set('Authorization', `Bearer ${token}`).send(body);

describe('/api/alarm-limits', () => {
  it.each([
    [{ condition: 'dp-low-in-range', onDelayS: -10 }, 'onDelayS'],
    [{ condition: 'stale', offDelayS: -1 }, 'offDelayS'],
    [{ condition: 'dp-low-in-range', thresholdShareOfSpan: 1.2 }, 'thresholdShareOfSpan'],
    [{ condition: 'dp-low-in-range', deadbandShareOfSpan: 1.5 }, 'deadbandShareOfSpan'],
    [{ condition: 'dp-over-range', deadbandShareOfSpan: 1.2 }, 'deadbandShareOfSpan'],
    [{ condition: 'frozen', windowS: 10 }, 'windowS'],
    [{ condition: 'stale', windowS: 600 }, 'windowS'],
    [{ condition: 'dp-low-in-range', priority: 'urgent' }, 'priority'],
  ])('refuses %j with 400 naming %s', async (over, field) => {
    const res = await post(engineer, { meterRunId: f.meterRunId, ...over });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_field', field });
  });

  it('refuses a DP-only condition on a temperature transmitter, naming transmitterId', async () => {
    const res = await post(engineer, {
      meterRunId: f.meterRunId,
      transmitterId: f.tt.id,
      condition: 'dp-low-in-range',
      onDelayS: 60,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('transmitterId');
  });

  it('stores a meter-run setting and a transmitter setting over it, and shows the limits in force', async () => {
    expect(
      (
        await post(engineer, {
          meterRunId: f.meterRunId,
          condition: 'dp-low-in-range',
          thresholdShareOfSpan: 0.15,
          onDelayS: 120,
        })
      ).status,
    ).toBe(201);
    const res = await post(engineer, {
      meterRunId: f.meterRunId,
      transmitterId: f.dp.id,
      condition: 'dp-low-in-range',
      onDelayS: 600,
    });
    expect(res.status).toBe(201);
    const got = await t
      .http()
      .get(`/api/alarm-limits?meterRunId=${f.meterRunId}`)
      .set('Authorization', `Bearer ${operator}`);
    expect(got.status).toBe(200);
    const low = got.body.effective.find(
      (e: { condition: string; transmitterId: string }) =>
        e.condition === 'dp-low-in-range' && e.transmitterId === f.dp.id,
    );
    expect(low).toMatchObject({
      source: 'transmitter',
      limits: { thresholdShareOfSpan: 0.15, onDelayS: 600, offDelayS: 60, priority: 'medium' },
    });
    // null goes back to the level above
    const back = await post(engineer, {
      meterRunId: f.meterRunId,
      transmitterId: f.dp.id,
      condition: 'dp-low-in-range',
      onDelayS: null,
    });
    expect(back.status).toBe(200);
    expect(
      back.body.effective.find(
        (e: { condition: string; transmitterId: string }) =>
          e.condition === 'dp-low-in-range' && e.transmitterId === f.dp.id,
      ).limits.onDelayS,
    ).toBe(120);
  });

  it('refuses an operator changing limits with 403', async () => {
    expect((await post(operator, { meterRunId: f.meterRunId, condition: 'stale', maxAgeS: 60 })).status).toBe(403);
  });

  it('refuses a read without a meter run, or of one that does not exist', async () => {
    const get = (query: string) => t.http().get(`/api/alarm-limits${query}`).set('Authorization', `Bearer ${operator}`);
    const missing = await get('');
    expect(missing.status).toBe(400);
    expect(missing.body.error).toMatchObject({ field: 'meterRunId', message: 'meterRunId: is required' });
    expect((await get('?meterRunId=MR-1')).body.error.field).toBe('meterRunId');
    expect((await get('?meterRunId=987654321')).status).toBe(404);
    const unknownRun = await post(engineer, { meterRunId: '987654321', condition: 'stale', maxAgeS: 120 });
    expect(unknownRun.status).toBe(400);
    expect(unknownRun.body.error.field).toBe('meterRunId');
  });

  it('deletes a stored setting, so its point goes back to the default, records it, and answers a second delete with 404', async () => {
    const saved = await post(engineer, { meterRunId: f.meterRunId, condition: 'stale', maxAgeS: 120 });
    expect(saved.status).toBe(201);
    const del = () => t.http().delete(`/api/alarm-limits/${saved.body.id}`).set('Authorization', `Bearer ${engineer}`);
    expect((await del()).status).toBe(204);
    const got = await t
      .http()
      .get(`/api/alarm-limits?meterRunId=${f.meterRunId}`)
      .set('Authorization', `Bearer ${operator}`);
    expect(got.body.effective.find((e: { condition: string }) => e.condition === 'stale').source).toBe('default');
    const [rows] = await t.sequelize.query(
      "SELECT before FROM audit_events WHERE action = 'alarm-limits.delete' AND entity_id = :id ORDER BY id DESC LIMIT 1",
      { replacements: { id: f.meterRunId } },
    );
    expect((rows as { before: unknown }[])[0].before).toMatchObject({ condition: 'stale', settings: { maxAgeS: 120 } });
    expect((await del()).status).toBe(404);
    expect((await t.http().delete('/api/alarm-limits/stale').set('Authorization', `Bearer ${engineer}`)).status).toBe(
      404,
    );
  });
});
