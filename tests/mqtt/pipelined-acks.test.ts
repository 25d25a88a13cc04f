import mqtt from 'mqtt';
import { Pool } from 'pg';
import { client, createMeterRun, mqttPort, signIn, type Client } from '../support/api';

/**
 * Issue 15 §2: one connection keeps many QoS 1 messages in flight; the server pipelines them to
 * the writer, yet each PUBACK comes only after that message's own readings are committed, and in
 * the order the messages were published (MQTT 3.1.1 §4.6). Checked against the real broker and
 * the real database: when each PUBACK arrives, the message's readings are queried.
 */
let engineer: Client;
let admin: Client;
let f: Awaited<ReturnType<typeof createMeterRun>>;
let device: { id: string; username: string; password: string };
let db: Pool;

beforeAll(async () => {
  engineer = client(await signIn('engineer@demo.tallyrun'));
  admin = client(await signIn('admin@demo.tallyrun'));
  f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const created = await admin.post('/api/devices', { name: 'pipelining gateway', siteId: f.site.id });
  expect(created.status).toBe(201);
  device = created.body;
  // The database of the server under test (`npm test` passes it).
  db = new Pool({ connectionString: process.env.TALLYRUN_E2E_DATABASE_URL, max: 4 });
});

afterAll(async () => {
  await db?.end();
});

function connect() {
  return new Promise<mqtt.MqttClient>((resolve, reject) => {
    const c = mqtt.connect({
      host: '127.0.0.1',
      port: mqttPort,
      protocolVersion: 4,
      username: device.username,
      password: device.password,
      reconnectPeriod: 0,
      clean: true,
    });
    c.once('connect', () => resolve(c));
    c.once('error', reject);
  });
}

/** Readings of the DP transmitter stored between two instants (inclusive). */
const storedBetween = async (fromMs: number, toMs: number) =>
  (
    await db.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM readings
        WHERE transmitter_id = $1 AND time BETWEEN to_timestamp($2 / 1000.0) AND to_timestamp($3 / 1000.0)`,
      [f.dp.id, fromMs, toMs],
    )
  ).rows[0].n;

/**
 * Publishes every message at once (all in flight on one connection) and, as each PUBACK arrives,
 * notes its place and queries what is stored of that message. Resolves once every PUBACK is in.
 */
async function publishAllInFlight(c: mqtt.MqttClient, payloads: string[], storedOf: (i: number) => Promise<number>) {
  const acked: number[] = [];
  const storedAtAck: Promise<number>[] = [];
  await Promise.all(
    payloads.map(
      (payload, i) =>
        new Promise<void>((resolve, reject) =>
          c.publish(`tallyrun/${f.site.code}/${f.dp.tag}`, payload, { qos: 1 }, (err) => {
            if (err) return reject(err);
            acked.push(i);
            storedAtAck[i] = storedOf(i);
            resolve();
          }),
        ),
    ),
  );
  return { acked, storedAtAck: await Promise.all(storedAtAck) };
}

it('with many messages in flight on one connection, acknowledges each in publish order and only after its readings are in the database', async () => {
  const messages = 120;
  const perMessage = 50;
  const fromMs = Math.floor((Date.now() - 6 * 3_600_000) / 1000) * 1000;
  const timeOf = (i: number, j: number) => fromMs + (i * perMessage + j) * 100;
  const payloads = Array.from({ length: messages }, (_, i) =>
    JSON.stringify(Array.from({ length: perMessage }, (_, j) => ({ t: timeOf(i, j), v: 10 + (j % 7), q: 'good' }))),
  );
  const c = await connect();
  try {
    const { acked, storedAtAck } = await publishAllInFlight(c, payloads, (i) =>
      storedBetween(timeOf(i, 0), timeOf(i, perMessage - 1)),
    );
    expect(acked).toEqual(Array.from({ length: messages }, (_, i) => i));
    expect(storedAtAck).toEqual(Array.from({ length: messages }, () => perMessage));
  } finally {
    c.end(true);
  }
});

it('acknowledges a message that fails validation in its turn, and it costs only itself', async () => {
  const fromMs = Math.floor((Date.now() - 5 * 3_600_000) / 1000) * 1000;
  const timeOf = (i: number) => fromMs + i * 1000;
  const bad = new Set([3, 7]);
  const payloads = Array.from({ length: 12 }, (_, i) =>
    i === 3
      ? 'not json at all'
      : i === 7
        ? JSON.stringify({ t: timeOf(i), v: 'twelve', q: 'good' })
        : JSON.stringify({ t: timeOf(i), v: 12, q: 'good' }),
  );
  const c = await connect();
  try {
    const { acked, storedAtAck } = await publishAllInFlight(c, payloads, (i) => storedBetween(timeOf(i), timeOf(i)));
    expect(acked).toEqual(Array.from({ length: 12 }, (_, i) => i));
    expect(storedAtAck).toEqual(Array.from({ length: 12 }, (_, i) => (bad.has(i) ? 0 : 1)));
    // The connection stayed open: the next message is taken as usual.
    const after = await publishAllInFlight(c, [JSON.stringify({ t: timeOf(20), v: 12, q: 'good' })], () =>
      storedBetween(timeOf(20), timeOf(20)),
    );
    expect(after.storedAtAck).toEqual([1]);
  } finally {
    c.end(true);
  }
});
