import mqtt from 'mqtt';
import { client, createMeterRun, mqttPort, signIn, until, type Client } from '../support/api';

/**
 * Issue 12 §2 and §12 over the real embedded broker: a device stays inside its own site's topics
 * (publish, subscribe, retain, will, client id), and every refused reading is logged for it.
 * Two sites, each with its own devices; site B's devices listen where site A's device reaches.
 */
let admin: Client;
type Site = Awaited<ReturnType<typeof createMeterRun>>;
let a: Site;
let b: Site;
type Device = { id: string; username: string; password: string };
let deviceA: Device;
let deviceB: Device;
let deviceB2: Device;

beforeAll(async () => {
  const engineer = client(await signIn('engineer@demo.tallyrun'));
  admin = client(await signIn('admin@demo.tallyrun'));
  a = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  b = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const issue = async (name: string, siteId: string) => {
    const created = await admin.post('/api/devices', { name, siteId });
    expect(created.status).toBe(201);
    return created.body as Device;
  };
  deviceA = await issue('site A RTU', a.site.id);
  deviceB = await issue('site B RTU', b.site.id);
  deviceB2 = await issue('site B second RTU', b.site.id);
});

const open: mqtt.MqttClient[] = [];
afterEach(() => {
  for (const c of open.splice(0)) c.end(true);
});

function connect(device: Device, options: mqtt.IClientOptions = {}) {
  return new Promise<mqtt.MqttClient>((resolve, reject) => {
    const c = mqtt.connect({
      host: '127.0.0.1',
      port: mqttPort,
      protocolVersion: 4,
      username: device.username,
      password: device.password,
      reconnectPeriod: 0,
      clean: true,
      ...options,
    });
    open.push(c);
    c.once('connect', () => resolve(c));
    c.once('error', reject);
  });
}

const publish = (c: mqtt.MqttClient, topic: string, payload: unknown, options: { retain?: boolean } = {}) =>
  new Promise<void>((resolve, reject) =>
    c.publish(topic, JSON.stringify(payload), { qos: 1, ...options }, (err) => (err ? reject(err) : resolve())),
  );

/** The QoS the broker granted, or 128 when it refused (mqtt.js reports that as an error with the SUBACK). */
const subscribe = (c: mqtt.MqttClient, topic: string) =>
  new Promise<number>((resolve, reject) =>
    c.subscribe(topic, { qos: 1 }, (err, granted) => {
      const refused = (err as { packet?: { granted?: number[] } } | null)?.packet?.granted?.[0];
      if (refused === 128) return resolve(128);
      return err ? reject(err) : resolve(granted?.[0]?.qos ?? -1);
    }),
  );

/** Everything a subscriber receives, with a wait for one particular payload. */
function listen(c: mqtt.MqttClient) {
  const got: { topic: string; payload: string; retain: boolean }[] = [];
  c.on('message', (topic, payload, packet) => got.push({ topic, payload: payload.toString(), retain: packet.retain }));
  return {
    got,
    /** Waits for a marker message: deliveries are in order, so anything sent before it has arrived. */
    until: (marker: string) => until(`the message ${marker}`, async () => got.some((m) => m.payload.includes(marker))),
  };
}

const reading = (marker: string) => ({ t: Date.now() - 1000, v: 1, q: 'good', marker });

it("refuses a publish to another site's topic: it is acknowledged, logged, and never reaches that site", async () => {
  const listener = await connect(deviceB);
  expect(await subscribe(listener, `tallyrun/${b.site.code}/#`)).toBe(1);
  const heard = listen(listener);
  const intruder = await connect(deviceA);
  await publish(intruder, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('from-site-A'));
  const neighbour = await connect(deviceB2);
  await publish(neighbour, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('from-site-B'));
  await heard.until('from-site-B');
  expect(heard.got.map((m) => m.payload)).not.toContainEqual(expect.stringContaining('from-site-A'));
  expect(intruder.connected).toBe(true);
  const log = await until('the refusal to be logged', async () => {
    const r = await admin.get(`/api/devices/${deviceA.id}/rejections`);
    return r.body.latest.length ? r.body : null;
  });
  expect(log.latest[0]).toMatchObject({ kind: 'other-site', topic: `tallyrun/${b.site.code}/${b.dp.tag}` });
});

it("refuses a subscription to another site's topics", async () => {
  const c = await connect(deviceA);
  expect(await subscribe(c, `tallyrun/${b.site.code}/#`)).toBe(128);
  expect(await subscribe(c, `tallyrun/${b.site.code}/${b.dp.tag}`)).toBe(128);
  expect(await subscribe(c, 'somewhere/else')).toBe(128);
  expect(await subscribe(c, `tallyrun/${a.site.code}/#`)).toBe(1);
});

it("narrows '#' and '+' wildcards to the device's own site, so they never receive another site", async () => {
  const c = await connect(deviceA);
  expect(await subscribe(c, '#')).toBe(1);
  expect(await subscribe(c, `+/+/${b.dp.tag}`)).toBe(1);
  const heard = listen(c);
  const neighbour = await connect(deviceB2);
  await publish(neighbour, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('site-B-only'));
  const self = await connect(deviceA, { clientId: `${deviceA.username}-self` });
  await publish(self, `tallyrun/${a.site.code}/${a.dp.tag}`, reading('site-A-own'));
  await heard.until('site-A-own');
  expect(heard.got.every((m) => m.topic.startsWith(`tallyrun/${a.site.code}/`))).toBe(true);
  expect(heard.got.map((m) => m.payload)).not.toContainEqual(expect.stringContaining('site-B-only'));
});

it('keeps no retained message: a later subscriber receives nothing retained', async () => {
  const publisher = await connect(deviceB2);
  await publish(publisher, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('retained-own'), { retain: true });
  const intruder = await connect(deviceA);
  await publish(intruder, `tallyrun/${b.site.code}/${b.tt.tag}`, { t: Date.now(), v: 9999 }, { retain: true });
  const later = await connect(deviceB);
  const heard = listen(later);
  expect(await subscribe(later, `tallyrun/${b.site.code}/#`)).toBe(1);
  await publish(publisher, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('after-subscribe'));
  await heard.until('after-subscribe');
  expect(heard.got).toEqual([
    expect.objectContaining({ retain: false, payload: expect.stringContaining('after-subscribe') }),
  ]);
});

it("refuses at connect a device whose last will names another site's topic", async () => {
  await expect(
    connect(deviceA, {
      will: { topic: `tallyrun/${b.site.code}/${b.dp.tag}`, payload: Buffer.from('{}'), qos: 1, retain: false },
    }),
  ).rejects.toMatchObject({ code: 5 });
  // A will inside its own site is fine.
  const c = await connect(deviceA, {
    will: { topic: `tallyrun/${a.site.code}/${a.dp.tag}`, payload: Buffer.from('{}'), qos: 1, retain: true },
  });
  expect(c.connected).toBe(true);
});

it("refuses a device that connects with another device's client id, and the other stays connected", async () => {
  const clientId = `${deviceB.username}-field-unit`;
  const owner = await connect(deviceB, { clientId });
  await expect(connect(deviceA, { clientId })).rejects.toMatchObject({ code: 2 });
  expect(owner.connected).toBe(true);
  await publish(owner, `tallyrun/${b.site.code}/${b.dp.tag}`, reading('owner-still-here'));
  // The device itself may come back with its own id (and takes over its own old connection).
  const again = await connect(deviceB, { clientId });
  expect(again.connected).toBe(true);
});

it('logs all ten bad readings of one message, with their places and counts by reason', async () => {
  const before = (await admin.get(`/api/devices/${deviceB2.id}/rejections`)).body;
  const countOf = (body: { countsByReason: { kind: string; count: number }[] }, kind: string) =>
    body.countsByReason.find((c) => c.kind === kind)?.count ?? 0;
  const c = await connect(deviceB2);
  const now = Date.now();
  const bad = [
    ...Array.from({ length: 6 }, () => ({ t: now - 5000, v: 'not a number' })),
    ...Array.from({ length: 4 }, () => ({ t: '2026-11-01T10:00:00', v: 1 })), // no offset
  ];
  await publish(c, `tallyrun/${b.site.code}/${b.dp.tag}`, [{ t: now - 10_000, v: 5, q: 'good' }, ...bad]);
  const after = await until('ten refusals to be logged', async () => {
    const r = (await admin.get(`/api/devices/${deviceB2.id}/rejections`)).body;
    return countOf(r, 'value') + countOf(r, 'time') - countOf(before, 'value') - countOf(before, 'time') >= 10
      ? r
      : null;
  });
  expect(countOf(after, 'value') - countOf(before, 'value')).toBe(6);
  expect(countOf(after, 'time') - countOf(before, 'time')).toBe(4);
  const ten = after.latest.slice(0, 10);
  expect(ten.map((r: { readingIndex: number }) => r.readingIndex).sort((x: number, y: number) => x - y)).toEqual([
    1, 2, 3, 4, 5, 6, 7, 8, 9, 10,
  ]);
  expect(ten.every((r: { topic: string }) => r.topic === `tallyrun/${b.site.code}/${b.dp.tag}`)).toBe(true);
  const devices = (await admin.get('/api/devices')).body;
  expect(devices.find((d: { id: string }) => d.id === deviceB2.id).rejectedCount).toBeGreaterThanOrEqual(10);
});

it('answers 404 for the rejections of a device that does not exist', async () => {
  const r = await admin.get('/api/devices/999999999/rejections');
  expect(r.status).toBe(404);
});
