/**
 * `npm start`: the private PostgreSQL cluster (or DATABASE_URL), migrations and demo data, the
 * exported web client, the server with its broker and SMTP stand-in, and the simulators.
 * Ctrl-C stops every child, PostgreSQL included when this run started it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { ensureCluster, type Cluster } from './postgres';
import { prepareDatabase } from '../db/prepare';
import { exportWebClient } from './web-export';
import { demoSeeded, readEnv } from '../env';
import { startServer, type RunningServer } from '../index';
import { demoUsers } from '../seed/demo-users';
import { componentLogger } from '../log';

const root = path.resolve(__dirname, '..', '..');
const launcher = componentLogger('launcher');
const log = (s: string) => launcher.info(s);

async function main() {
  const began = Date.now();
  const dataDir = path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun'));
  let cluster: Cluster | null = null;
  let server: RunningServer | null = null;
  let simulators: ChildProcess | null = null;
  let stopping = false;

  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log('stopping ...');
    if (simulators?.pid && simulators.exitCode === null) {
      // Let the simulators hand over what they hold while the broker is still up (at most 5 s).
      const exited = new Promise<void>((resolve) => simulators!.once('exit', () => resolve()));
      try {
        process.kill(-simulators.pid, 'SIGTERM');
      } catch {
        /* already gone */
      }
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    }
    await server?.stop().catch((err) => launcher.error({ err }, 'the server did not stop cleanly'));
    if (cluster?.startedHere) {
      cluster.stop();
      log('PostgreSQL stopped');
    }
    process.exit(code);
  };
  // A stray failure in background work (a job, an evaluation) is logged; it must not take the
  // historian down with it.
  process.on('unhandledRejection', (reason) =>
    launcher.error({ err: reason }, 'unhandled rejection in background work'),
  );
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));

  try {
    // A production start that would seed demo sign-ins is refused before a cluster is made (issue 12 §5).
    demoSeeded(process.env);
    // DATABASE_URL, when set, is a superuser's connection to the database to use: it makes the
    // roles and migrates as the owner, and the server connects as the app role (server/db/roles.ts).
    let adminUrl = process.env.DATABASE_URL;
    let secretsDir = dataDir;
    if (!adminUrl) {
      cluster = await ensureCluster({ dataDir, port: Number(process.env.TALLYRUN_PG_PORT ?? 54329), log });
      adminUrl = cluster.url('tallyrun');
      secretsDir = cluster.secretsDir;
    }
    const database = decodeURIComponent(new URL(adminUrl).pathname.slice(1)) || 'tallyrun';
    const prepared = await prepareDatabase({ adminUrl, database, secretsDir });
    if (!prepared.separateRoles)
      launcher.warn('DATABASE_URL is no superuser, so it cannot make the database roles: the server connects with it');
    const databaseUrl = prepared.serverUrl;
    exportWebClient(root, log);
    const env = readEnv({
      ...process.env,
      DATABASE_URL: databaseUrl,
      TALLYRUN_DATA_DIR: dataDir,
      TALLYRUN_WEB_DIR: path.join(root, 'dist'),
    });
    server = await startServer(env);

    const simulatorEntry = path.join(root, 'simulators', 'index.ts');
    if (env.TALLYRUN_SIMULATORS === 'on' && fs.existsSync(simulatorEntry)) {
      simulators = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), [simulatorEntry], {
        cwd: root,
        detached: true, // own process group, so Ctrl-C handling stays here and we stop it as a group
        stdio: ['ignore', 'inherit', 'inherit'],
        env: {
          ...process.env,
          // The back-fill writes readings as the server does, so it connects as the server does.
          DATABASE_URL: databaseUrl,
          TALLYRUN_MQTT_URL: env.MQTT_URL ?? `mqtt://127.0.0.1:${server.mqttPort}`,
        },
      });
    }

    const seconds = ((Date.now() - began) / 1000).toFixed(1);
    // The banner is the command's answer to a person, not a log line.
    process.stdout.write(`
  Tallyrun is running (ready in ${seconds} s)
    web and API   ${server.url}
    health        ${server.url}/api/health
    MQTT broker   ${env.MQTT_URL ? `${env.MQTT_URL.replace(/\/\/[^@/]*@/, '//')} (external)` : `mqtt://127.0.0.1:${server.mqttPort}`}
    SMTP stand-in 127.0.0.1:${server.smtpPort} (mail lands in the admin's outbox)
${env.TALLYRUN_DEMO === 'on' ? `  Demo sign-ins (password "${env.TALLYRUN_DEMO_PASSWORD === 'tallyrun-demo' ? 'tallyrun-demo' : '<TALLYRUN_DEMO_PASSWORD>'}"):\n${demoUsers.map((u) => `    ${u.role.padEnd(11)} ${u.email}`).join('\n')}\n` : ''}
  Press Ctrl-C to stop.

`);
  } catch (err) {
    launcher.fatal(`could not start: ${err instanceof Error ? err.message : String(err)}`);
    await shutdown(1);
  }
}

void main();
