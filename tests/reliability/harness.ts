/**
 * The shared set-up of `npm run test:reliability`: a PostgreSQL cluster of its own on its own port (never
 * the shared one), a fresh database, the server spawned as a child process (so it can be stopped or killed
 * with -9), signing in and device credentials. Every part of tests/reliability/run.ts builds on it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Client as PgClient } from 'pg';
import { clusterDir, ensureCluster, type Cluster } from '../../server/cli/postgres';
import { prepareDatabase } from '../../server/db/prepare';
import { hashPassword } from '../../server/auth/passwords';
import { client, createMeterRun, type Client } from '../support/api';

export const root = path.resolve(__dirname, '..', '..');
export const say = (s: string) => process.stdout.write(`[reliability] ${s}\n`);
export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const password = 'reliability-password-7';

export interface ServerProcess {
  url: string;
  mqttPort: number;
  child: ChildProcess;
  /** Every line the server printed (JSON log lines). */
  output: string[];
  /** Why the process ended, or null while it runs. */
  exited(): string | null;
  /** SIGTERM, then waits for the process to end. */
  stop(): Promise<void>;
}

export interface Harness {
  dataDir: string;
  /** The app's own connection (tallyrun_app), for checks against the database. */
  appUrl: string;
  /** The current cluster (replaced after a restart). */
  cluster(): Cluster;
  stopCluster(): void;
  startCluster(): Promise<void>;
  startServer(): Promise<ServerProcess>;
  /** Stops every server this harness started and its cluster, and removes its folders. Safe to call twice. */
  cleanup(): Promise<void>;
}

export async function openHarness(options: { port: number }): Promise<Harness> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-reliability-'));
  const clusterOptions = { dataDir, port: options.port, log: say };
  let cluster: Cluster = await ensureCluster(clusterOptions);
  const servers = new Set<ServerProcess>();
  let cleaned = false;
  const cleanup = async () => {
    if (cleaned) return;
    cleaned = true;
    for (const s of servers) await s.stop();
    cluster.stop();
    // When the postgres user cannot reach the temporary folder, the cluster was kept elsewhere: remove it too.
    const kept = path.dirname(clusterDir(dataDir, () => undefined));
    if (kept !== dataDir && kept.startsWith('/var/lib/tallyrun/')) fs.rmSync(kept, { recursive: true, force: true });
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
  try {
    const db = await prepareDatabase({
      adminUrl: cluster.url('postgres'),
      database: 'tallyrun_reliability',
      secretsDir: cluster.secretsDir,
      fresh: true,
    });
    const direct = new PgClient({ connectionString: db.appUrl });
    await direct.connect();
    for (const role of ['engineer', 'admin'])
      await direct.query('INSERT INTO users (email, name, role, password_hash) VALUES ($1, $2, $3, $4)', [
        `${role}@reliability.test`,
        `Reliability ${role}`,
        role,
        await hashPassword(password),
      ]);
    await direct.end();

    const startServer = async (): Promise<ServerProcess> => {
      const output: string[] = [];
      let exited: string | null = null;
      // node itself with tsx as a loader, not the tsx command: that one runs the server in a grandchild
      // process, so a kill -9 of the child would leave the server running.
      const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'index.ts')], {
        cwd: root,
        env: {
          ...process.env,
          DATABASE_URL: db.serverUrl,
          PORT: '0',
          MQTT_PORT: '0',
          SMTP_PORT: '0',
          TALLYRUN_DEMO: 'off',
          TALLYRUN_SIMULATORS: 'off',
          TALLYRUN_DATA_DIR: dataDir,
          TALLYRUN_WEB_DIR: path.join(dataDir, 'no-web-client'),
          LOG_LEVEL: 'info',
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      const ended = new Promise<void>((resolve) =>
        child.on('exit', (code, signal) => {
          exited = `code ${code} signal ${signal}`;
          resolve();
        }),
      );
      const started = await new Promise<{ url: string; mqttPort: number }>((resolve, reject) => {
        let buffered = '';
        const onData = (chunk: Buffer) => {
          buffered += chunk.toString('utf8');
          const lines = buffered.split('\n');
          buffered = lines.pop() ?? '';
          for (const line of lines) {
            // Keep the head of the log only: a long load would otherwise hold every request line.
            if (output.length < 5000) output.push(line);
            if (line.includes('"server started"')) {
              const s = JSON.parse(line) as { http: string; mqttPort: number };
              resolve({ url: s.http, mqttPort: s.mqttPort });
            }
          }
        };
        child.stdout.on('data', onData);
        child.stderr.on('data', onData);
        child.once('exit', () => reject(new Error(`the server ended before it started:\n${output.join('\n')}`)));
      });
      const server: ServerProcess = {
        ...started,
        child,
        output,
        exited: () => exited,
        stop: async () => {
          servers.delete(server);
          if (exited) return;
          child.kill('SIGTERM');
          await ended;
        },
      };
      servers.add(server);
      return server;
    };

    return {
      dataDir,
      appUrl: db.appUrl,
      cluster: () => cluster,
      stopCluster: () => cluster.stop(),
      startCluster: async () => {
        cluster = await ensureCluster(clusterOptions);
      },
      startServer,
      cleanup,
    };
  } catch (err) {
    await cleanup();
    throw err;
  }
}

/** Signs a seeded user (`engineer` or `admin`) in; returns the token and an API client. */
export async function signInAs(server: ServerProcess, role: 'engineer' | 'admin') {
  const res = await fetch(`${server.url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: `${role}@reliability.test`, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${role}: HTTP ${res.status}`);
  const token = (await res.json()).token as string;
  return { token, api: client(token, server.url) };
}

/** A new site with a meter run, and a device of that site with its MQTT credentials. */
export async function meterRunWithDevice(server: ServerProcess) {
  const engineer = await signInAs(server, 'engineer');
  const admin = await signInAs(server, 'admin');
  const f = await createMeterRun(engineer.api, { timeZone: 'UTC', contractHour: 0 });
  const device = (await admin.api.post('/api/devices', { name: 'reliability RTU', siteId: f.site.id })).body as {
    username: string;
    password: string;
  };
  if (!device?.username) throw new Error('the device could not be created');
  return { engineer, admin, f, device, topic: `tallyrun/${f.site.code}/${f.dp.tag}` };
}

export type Engineer = { token: string; api: Client };
