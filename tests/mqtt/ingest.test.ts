import mqtt from 'mqtt';
import { client, createMeterRun, mqttPort, settled, signIn, until, type Client } from '../support/api';

/**
 * Readings in over the real embedded broker, with device credentials the admin issued, into the
 * real database and on to the hourly records.
 */
let engineer: Client;
let admin: Client;
let f: Awaited<ReturnType<typeof createMeterRun>>;
let device: { id: string; username: string; password: string };

beforeAll(async () => {
  engineer = client(await signIn('engineer@demo.tallyrun'));
  admin = client(await signIn('admin@demo.tallyrun'));
  f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const created = await admin.post('/api/devices', { name: 'test RTU', siteId: f.site.id });
  expect(created.status).toBe(201);
  device = created.body;
});

function connect(username: string, password: string) {
  return new Promise<mqtt.MqttClient>((resolve, reject) => {
    const c = mqtt.connect({
      host: '127.0.0.1',
      port: mqttPort,
      protocolVersion: 4,
      username,
      password,
      reconnectPeriod: 0,
      clean: true,
    });
    c.once('connect', () => resolve(c));
    c.once('error', reject);
  });
}

const publish = (c: mqtt.MqttClient, topic: string, payload: unknown) =>
  new Promise<void>((resolve, reject) =>
    c.publish(topic, typeof payload === 'string' ? payload : JSON.stringify(payload), { qos: 1 }, (err) =>
      err ? reject(err) : resolve(),
    ),
  );

it('stores a reading as soon as the broker has acknowledged it (QoS 1)', async () => {
  const c = await connect(device.username, device.password);
  try {
    const t = new Date(Date.now() - 60_000).toISOString();
    await publish(c, `tallyrun/${f.site.code}/${f.dp.tag}`, { t, v: 12.5, q: 'good' });
    // No waiting: the PUBACK came after the commit.
    const stored = await engineer.get(
      `/api/readings?transmitterId=${f.dp.id}&from=${new Date(Date.now() - 3_600_000).toISOString()}`,
    );
    expect(stored.body).toEqual([{ time: t, value: 12.5, quality: 'good', source: 'mqtt' }]);
  } finally {
    c.end(true);
  }
});

it('takes an array of readings in one message and turns them into an hourly record', async () => {
  const c = await connect(device.username, device.password);
  try {
    const now = Date.now();
    const times = Array.from({ length: 30 }, (_, i) => now - (30 - i) * 10_000);
    await publish(
      c,
      `tallyrun/${f.site.code}/${f.pt.tag}`,
      times.map((t) => ({ t, v: 2, q: 'good' })),
    );
    await publish(
      c,
      `tallyrun/${f.site.code}/${f.tt.tag}`,
      times.map((t) => ({ t: new Date(t).toISOString(), v: 300 })),
    );
    await publish(
      c,
      `tallyrun/${f.site.code}/${f.dp.tag}`,
      times.map((t) => ({ t, v: 20 })),
    );
    await settled(engineer, f.meterRun.id);
    const from = new Date(now - 2 * 3_600_000).toISOString();
    const to = new Date(now + 3_600_000).toISOString();
    const hours = await until('an hourly record with flow', async () => {
      const r = await engineer.get(`/api/meter-runs/${f.meterRun.id}/totals?interval=hour&from=${from}&to=${to}`);
      return r.body.find((h: { massKg: number }) => h.massKg > 0) ? r.body : null;
    });
    expect(hours.some((h: { flowTimeS: number }) => h.flowTimeS > 0)).toBe(true);
  } finally {
    c.end(true);
  }
});

it('counts a redelivered message as a duplicate, not a second reading', async () => {
  const c = await connect(device.username, device.password);
  try {
    const t = Date.now() - 120_000;
    await publish(c, `tallyrun/${f.site.code}/${f.tt.tag}`, { t, v: 301 });
    await publish(c, `tallyrun/${f.site.code}/${f.tt.tag}`, { t, v: 301 });
    const stored = await engineer.get(
      `/api/readings?transmitterId=${f.tt.id}&from=${new Date(t).toISOString()}&to=${new Date(t + 1).toISOString()}`,
    );
    expect(stored.body).toHaveLength(1);
  } finally {
    c.end(true);
  }
});

it('keeps the first of two readings for the same time with different values, and lists the second as a conflict', async () => {
  const c = await connect(device.username, device.password);
  try {
    const t = new Date(Date.now() - 180_000).toISOString();
    const topic = `tallyrun/${f.site.code}/${f.dp.tag}`;
    await publish(c, topic, { t, v: 7.25, q: 'good' });
    await publish(c, topic, { t, v: 7.75, q: 'good' });
    const window = `from=${t}&to=${new Date(Date.parse(t) + 1).toISOString()}`;
    const stored = await engineer.get(`/api/readings?transmitterId=${f.dp.id}&${window}&provenance=true`);
    expect(stored.body).toEqual([
      {
        time: t,
        value: 7.25,
        quality: 'good',
        source: 'mqtt',
        deviceId: device.id,
        importId: null,
        arrivedAt: expect.any(String),
      },
    ]);
    const conflictsAt = async () =>
      (await engineer.get(`/api/reading-conflicts?meterRunId=${f.meterRun.id}&status=open`)).body.filter(
        (x: { time: string }) => x.time === t,
      );
    expect(await conflictsAt()).toEqual([
      expect.objectContaining({
        transmitterId: f.dp.id,
        storedValue: 7.25,
        offeredValue: 7.75,
        storedSource: `device:${device.id}`,
        offeredSource: `device:${device.id}`,
        status: 'open',
      }),
    ]);
    // The stored one again (a QoS 1 redelivery): a silent duplicate, no second conflict.
    await publish(c, topic, { t, v: 7.25, q: 'good' });
    expect(await conflictsAt()).toHaveLength(1);
  } finally {
    c.end(true);
  }
});

it('counts a redelivered message as a duplicate without a conflict', async () => {
  const c = await connect(device.username, device.password);
  try {
    const t = Date.now() - 240_000;
    await publish(c, `tallyrun/${f.site.code}/${f.pt.tag}`, { t, v: 2.5 });
    await publish(c, `tallyrun/${f.site.code}/${f.pt.tag}`, { t, v: 2.5 });
    const open = await engineer.get(`/api/reading-conflicts?meterRunId=${f.meterRun.id}&status=open`);
    expect(open.body.filter((x: { transmitterId: string }) => x.transmitterId === f.pt.id)).toEqual([]);
  } finally {
    c.end(true);
  }
});

it('rejects bad payloads and foreign topics, counts them for the device, and keeps the connection', async () => {
  const c = await connect(device.username, device.password);
  try {
    const before = (await admin.get('/api/devices')).body.find((d: { id: string }) => d.id === device.id);
    await publish(c, `tallyrun/${f.site.code}/${f.dp.tag}`, 'not json at all');
    await publish(c, `tallyrun/${f.site.code}/${f.dp.tag}`, { t: '2026-11-01T10:00:00', v: 1 }); // no offset
    await publish(c, `tallyrun/${f.site.code}/${f.dp.tag}`, { t: Date.now(), v: 'NaN' });
    await publish(c, `tallyrun/${f.site.code}/NO-SUCH-TAG`, { t: Date.now(), v: 1 });
    await publish(c, `tallyrun/SOMEWHERE-ELSE/${f.dp.tag}`, { t: Date.now(), v: 1 });
    await publish(c, `tallyrun/${f.site.code}/${f.dp.tag}`, [
      { t: Date.now() - 1000, v: 3 },
      { t: Date.now(), v: Infinity },
    ]); // JSON turns Infinity into null
    expect(c.connected).toBe(true);
    const after = await until('the rejections to be counted', async () => {
      const d = (await admin.get('/api/devices')).body.find((x: { id: string }) => x.id === device.id);
      return d.rejectedCount - before.rejectedCount >= 6 ? d : null;
    });
    expect(after.rejectedCount - before.rejectedCount).toBe(6);
    expect(after.lastRejection).toMatch(/value/);
  } finally {
    c.end(true);
  }
});

it('refuses a device that an admin has disabled', async () => {
  const other = (await admin.post('/api/devices', { name: 'retired RTU', siteId: f.site.id })).body;
  await admin.patch(`/api/devices/${other.id}`, { disabled: true });
  await expect(connect(other.username, other.password)).rejects.toMatchObject({ code: 4 });
});
