/**
 * `npm test`: the same bring-up as `npm start` with databases of its own, then every test:
 * unit (shared/), API and MQTT (real PostgreSQL, real broker) and browser end-to-end (Debian's
 * Chromium against the real server with the exported client). Extra arguments go to jest.
 */
import { execFileSync, spawn, spawnSync, type SpawnOptions } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { dropDatabase, ensureCluster, type Cluster } from './postgres';
import { exportWebClient } from './web-export';
import { readEnv } from '../env';
import { startServer, type RunningServer } from '../index';
import { prepareDatabase } from '../db/prepare';
import { componentLogger } from '../log';
import { runStaticChecks } from './static-checks';

const root = path.resolve(__dirname, '..', '..');
const testLog = componentLogger('test', { level: 'info' });
const log = (s: string) => testLog.info(s);
/** The closing lines are the command's answer (CI and people read them), so they go to stdout as plain text. */
const say = (s: string) => process.stdout.write(`${s}\n`);
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

/** Debian packages the tests call: reference libraries (IAPWS-IF97, units), the browser and the MQTT 5 broker. */
function ensureTestTools() {
  const missing: string[] = [];
  const hasPython = (mod: string) =>
    spawnSync('/usr/bin/python3', ['-c', `import ${mod}`], { stdio: 'ignore' }).status === 0;
  if (!hasPython('iapws')) missing.push('python3-iapws');
  if (!hasPython('pint')) missing.push('python3-pint');
  if (!fs.existsSync('/usr/bin/chromium')) missing.push('chromium');
  // Mosquitto 2 stands for the external broker of several ingest workers (tests/mqtt/mosquitto.ts).
  if (!fs.existsSync('/usr/sbin/mosquitto')) missing.push('mosquitto');
  if (missing.length === 0) return;
  if (!isRoot)
    throw new Error(`missing Debian packages for the tests: ${missing.join(' ')} (install them with apt-get)`);
  log(`installing ${missing.join(', ')} from Debian (apt-get) ...`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', ...missing], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

async function main(): Promise<number> {
  const began = Date.now();
  const dataDir = path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun'));
  let cluster: Cluster | null = null;
  let server: RunningServer | null = null;
  let adminUrl: string | null = null;
  const databases: string[] = [];
  try {
    // Types and lint first: a run that cannot pass them fails in seconds, not after the bring-up.
    // A partial run (`npm test -- <paths>`) is a developer's loop and skips them (said once).
    const jestArgs = process.argv.slice(2);
    if (jestArgs.length === 0) {
      const checks = await runStaticChecks(root, log);
      if (!checks.ok) {
        say(`\n[test] stopped before the tests: ${checks.failed.join(' and ')} failed (see above).`);
        say('0 passed, 1 failed, 0 skipped');
        return 1;
      }
    } else {
      log('partial run: type check and lint skipped (`npm run typecheck`, `npm run lint` run them)');
    }
    ensureTestTools();
    // Databases of this run alone (by process id), so two runs on one machine do not collide;
    // they are dropped at the end.
    const e2eName = `tallyrun_e2e_${process.pid}`;
    const jestName = `tallyrun_jest_${process.pid}`;
    // DATABASE_URL, when set, is a superuser's connection to an outside server: the two test
    // databases are made beside the given one. Each is owned by tallyrun_owner, migrated as it,
    // and used through the role the server connects as (server/db/roles.ts).
    let secretsDir = dataDir;
    if (process.env.DATABASE_URL) {
      const admin = new URL(process.env.DATABASE_URL);
      admin.pathname = '/postgres';
      adminUrl = admin.toString();
    } else {
      cluster = await ensureCluster({ dataDir, port: Number(process.env.TALLYRUN_PG_PORT ?? 54329), log });
      adminUrl = cluster.url('postgres');
      secretsDir = cluster.secretsDir;
    }
    databases.push(e2eName, jestName);
    const e2e = await prepareDatabase({ adminUrl, database: e2eName, secretsDir, fresh: true });
    const jestDb = await prepareDatabase({ adminUrl, database: jestName, secretsDir, fresh: true });
    const e2eUrl = e2e.serverUrl;
    const jestUrl = jestDb.serverUrl;

    exportWebClient(root, log);
    const password = process.env.TALLYRUN_DEMO_PASSWORD ?? 'tallyrun-demo';
    const testDataDir = path.join(dataDir, 'test');
    fs.mkdirSync(testDataDir, { recursive: true });
    server = await startServer(
      readEnv({
        ...process.env,
        DATABASE_URL: e2eUrl,
        PORT: '0',
        MQTT_PORT: '0',
        SMTP_PORT: '0',
        TALLYRUN_DEMO: 'on',
        TALLYRUN_SIMULATORS: 'off',
        TALLYRUN_DEMO_PASSWORD: password,
        TALLYRUN_DATA_DIR: testDataDir,
        TALLYRUN_WEB_DIR: path.join(root, 'dist'),
      }),
    );
    log(`bring-up took ${((Date.now() - began) / 1000).toFixed(1)} s; server at ${server.url}`);

    const resultsFile = path.join(root, '.test-results', `jest-${process.pid}.json`);
    fs.mkdirSync(path.dirname(resultsFile), { recursive: true });
    fs.rmSync(resultsFile, { force: true });
    // Async spawn, not spawnSync: the server under test lives in this process and must keep answering.
    const jestExit = await runChild(
      path.join(root, 'node_modules', '.bin', 'jest'),
      ['--ci', '--maxWorkers=2', '--json', `--outputFile=${resultsFile}`, ...process.argv.slice(2)],
      {
        cwd: root,
        stdio: 'inherit',
        env: {
          ...process.env,
          TALLYRUN_BASE_URL: server.url,
          TALLYRUN_MQTT_PORT: String(server.mqttPort),
          TALLYRUN_SMTP_PORT: String(server.smtpPort),
          TALLYRUN_E2E_DATABASE_URL: e2eUrl,
          TEST_DATABASE_URL: jestUrl,
          // The same test database as the owner and as the app role, and the superuser's
          // connection (database postgres), for the tests of the roles themselves.
          TEST_OWNER_DATABASE_URL: jestDb.ownerUrl,
          TEST_APP_DATABASE_URL: jestDb.appUrl,
          TEST_ADMIN_DATABASE_URL: adminUrl,
          TALLYRUN_DEMO_PASSWORD: password,
        },
      },
    );
    let summary = { passed: 0, failed: 0, skipped: 0 };
    if (fs.existsSync(resultsFile)) {
      const r = JSON.parse(fs.readFileSync(resultsFile, 'utf8'));
      summary = {
        passed: r.numPassedTests,
        failed: r.numFailedTests + (r.numRuntimeErrorTestSuites ?? 0),
        skipped: r.numPendingTests + r.numTodoTests,
      };
      // Keep only the latest run's results, as jest.json.
      fs.renameSync(resultsFile, path.join(root, '.test-results', 'jest.json'));
    }
    const ok = jestExit === 0 && summary.failed === 0;
    say(`\n[test] finished in ${((Date.now() - began) / 1000).toFixed(0)} s`);
    say(`${summary.passed} passed, ${summary.failed} failed, ${summary.skipped} skipped`);
    return ok ? 0 : 1;
  } catch (err) {
    testLog.fatal({ err }, 'could not run the tests');
    say('0 passed, 1 failed');
    return 1;
  } finally {
    await server?.stop().catch(() => undefined);
    if (adminUrl) for (const name of databases) await dropDatabase(adminUrl, name).catch(() => undefined);
    if (cluster?.startedHere) cluster.stop();
  }
}

function runChild(command: string, args: string[], options: SpawnOptions): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(command, args, options);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(1));
  });
}

void main().then((code) => process.exit(code));
