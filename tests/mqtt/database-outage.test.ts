import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { spawn, type ChildProcess } from 'node:child_process';
import mqtt from 'mqtt';
import { Client as PgClient } from 'pg';
import { hashPassword } from '../../server/auth/passwords';
import { client, createMeterRun, until, type Client } from '../support/api';
import { makeOwnDatabase, startDatabaseProxy } from '../support/db-proxy';

/**
 * Issue 12 §1: the server rides out its database going away. A server process of its own
 * (`tsx server/index.ts`, as `npm run serve` starts it) runs on a database of its own, reached
 * through a TCP proxy that the test cuts (every connection ended, new ones refused, as a stopped
 * PostgreSQL does) and restores. The shared cluster is never stopped.
 */
let proxy: Awaited<ReturnType<typeof startDatabaseProxy>>;
let own: Awaited<ReturnType<typeof makeOwnDatabase>>;
let server: { url: string; mqttPort: number };
let child: ChildProcess;
let exited: { code: number | null; signal: string | null } | null = null;
const output: string[] = [];
let direct: PgClient;
let engineer: Client;
let f: Awaited<ReturnType<typeof createMeterRun>>;
let device: { username: string; password: string };
const password = 'outage-test-password-9';

async function signInAt(url: string, email: string) {
  const res = await fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status} ${await res.text()}`);
  return (await res.json()).token as string;
}

const health = async () => {
  const res = await fetch(`${server.url}/api/health`);
  return { status: res.status, body: await res.json() };
};

beforeAll(async () => {
  own = await makeOwnDatabase(`tallyrun_outage_${process.pid}`);
  const target = new URL(own.appUrl);
  proxy = await startDatabaseProxy({ host: target.hostname, port: Number(target.port || 5432) });
  direct = new PgClient({ connectionString: own.appUrl });
  await direct.connect();
  for (const role of ['engineer', 'admin'])
    await direct.query(`INSERT INTO users (email, name, role, password_hash) VALUES ($1, $2, $3, $4)`, [
      `${role}@outage.test`,
      `Outage ${role}`,
      role,
      await hashPassword(password),
    ]);
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-outage-'));
  const root = path.resolve(__dirname, '..', '..');
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DATABASE_URL: proxy.via(own.appUrl),
    PORT: '0',
    MQTT_PORT: '0',
    SMTP_PORT: '0',
    TALLYRUN_DEMO: 'off',
    TALLYRUN_SIMULATORS: 'off',
    TALLYRUN_DATA_DIR: dataDir,
    TALLYRUN_WEB_DIR: path.join(dataDir, 'no-web-client'),
    LOG_LEVEL: 'info',
  };
  delete env.MQTT_URL;
  child = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'server', 'index.ts')], {
    cwd: root,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.on('exit', (code, signal) => (exited = { code, signal }));
  server = await new Promise((resolve, reject) => {
    let buffered = '';
    const onData = (chunk: Buffer) => {
      buffered += chunk.toString('utf8');
      const lines = buffered.split('\n');
      buffered = lines.pop() ?? '';
      for (const line of lines) {
        output.push(line);
        if (!line.includes('"server started"')) continue;
        const started = JSON.parse(line) as { http: string; mqttPort: number };
        resolve({ url: started.http, mqttPort: started.mqttPort });
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.once('exit', () => reject(new Error(`the server ended before it started:\n${output.join('\n')}`)));
  });
  engineer = client(await signInAt(server.url, 'engineer@outage.test'), server.url);
  const admin = client(await signInAt(server.url, 'admin@outage.test'), server.url);
  f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const created = await admin.post('/api/devices', { name: 'outage RTU', siteId: f.site.id });
  expect(created.status).toBe(201);
  device = created.body;
});

afterAll(async () => {
  await proxy?.restore().catch(() => undefined);
  if (child && !exited) {
    const gone = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGTERM');
    await gone;
  }
  await proxy?.close();
  await direct?.end().catch(() => undefined);
  await own?.drop();
});

it('survives the database going away, answers 503 meanwhile, and stores a reading sent during the outage exactly once', async () => {
  expect(await health()).toEqual({ status: 200, body: { status: 'ok', database: 'up', broker: 'up' } });
  const publisher = mqtt.connect({
    host: '127.0.0.1',
    port: server.mqttPort,
    protocolVersion: 4,
    username: device.username,
    password: device.password,
    clean: true,
    reconnectPeriod: 300,
  });
  publisher.on('error', () => undefined); // refused reconnects while the database is down are expected
  await new Promise((resolve) => publisher.once('connect', resolve));
  const topic = `tallyrun/${f.site.code}/${f.dp.tag}`;
  const publish = (t: number, v: number) =>
    new Promise<void>((resolve, reject) =>
      publisher.publish(topic, JSON.stringify({ t, v, q: 'good' }), { qos: 1 }, (err) =>
        err ? reject(err) : resolve(),
      ),
    );
  const storedAt = async (t: number) =>
    (
      await direct.query<{ n: number }>(
        'SELECT count(*)::int AS n FROM readings WHERE transmitter_id = $1 AND time = to_timestamp($2 / 1000.0)',
        [f.dp.id, t],
      )
    ).rows[0].n;
  try {
    const before = Date.now() - 120_000;
    await publish(before, 11);
    expect(await storedAt(before)).toBe(1);

    await proxy.cut();
    const cutAt = Date.now();
    const down = await until('health to report the database down', async () => {
      const h = await health();
      return h.body.database === 'down' ? h : null;
    });
    expect(Date.now() - cutAt).toBeLessThan(5000);
    expect(down).toEqual({ status: 503, body: { status: 'degraded', database: 'down', broker: 'up' } });

    // A request that needs the database: a clear 503, not a 500 and not a hang.
    const startedAt = Date.now();
    const refused = await engineer.get(`/api/sites/${f.site.id}`);
    expect(Date.now() - startedAt).toBeLessThan(10_000);
    expect(refused.status).toBe(503);
    expect(refused.body.error.code).toBe('database_unavailable');
    expect(refused.body.error.message).toMatch(/database cannot be reached/);

    // A QoS 1 reading published now is not acknowledged while its readings cannot be committed.
    const during = Date.now() - 60_000;
    let acknowledged = false;
    const sent = publish(during, 22).then(() => {
      acknowledged = true;
    });
    await new Promise((r) => setTimeout(r, 1500));
    expect(acknowledged).toBe(false);

    await proxy.restore();
    await until('health to report the database up again', async () => {
      const h = await health();
      return h.status === 200 && h.body.database === 'up' ? h : null;
    });
    // The publisher resends on its own; the PUBACK then means the reading is committed, once.
    await sent;
    expect(await storedAt(during)).toBe(1);
    expect(await storedAt(before)).toBe(1);
    expect((await engineer.get(`/api/sites/${f.site.id}`)).status).toBe(200);
    // The process rode it out: still running, no unheard 'error' event in its output.
    expect(exited).toBeNull();
    expect(output.join('\n')).not.toMatch(/Unhandled 'error' event|unhandledRejection/);
  } finally {
    publisher.end(true);
  }
});

it('goes on recomputing hourly records after the database is back', async () => {
  const hourStart = Math.floor((Date.now() - 2 * 3_600_000) / 3_600_000) * 3_600_000;
  await direct.query(`INSERT INTO stale_hours (meter_run_id, start) VALUES ($1, to_timestamp($2 / 1000.0))`, [
    f.meterRun.id,
    hourStart,
  ]);
  await until(
    'the queued hour to be computed',
    async () =>
      (
        await direct.query<{ n: number }>(
          'SELECT count(*)::int AS n FROM stale_hours WHERE meter_run_id = $1 AND start = to_timestamp($2 / 1000.0)',
          [f.meterRun.id, hourStart],
        )
      ).rows[0].n === 0,
    30_000,
  );
});
