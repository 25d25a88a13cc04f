import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { readEnv, type Env } from './env';
import { connectDatabase } from './db/connect';
import { migrate } from './db/migrate';
import { initModels } from './models';
import { createApp } from './app';
import { startEmbeddedBroker } from './ingest/broker';
import { startExternalBrokerIngest } from './ingest/external-broker';
import { startSmtpStandIn } from './mail/smtp-stand-in';
import { seedDemoUsers } from './seed/demo-users';
import { seedDemoScenario } from './seed/demo-scenario';
import { createServices } from './services';
import { makePartitionsAhead, startAlarmSchedule, startSchedule } from './jobs/schedule';
import { startSingleRunner } from './jobs/single-runner';
import { createMailer } from './mail/send';
import { AlarmNotifier } from './mail/notifier';
import { componentLogger } from './log';
import { DatabaseMonitor } from './db/availability';

const serverLog = componentLogger('server');

export interface RunningServer {
  url: string;
  httpPort: number;
  mqttPort: number;
  smtpPort: number;
  stop(): Promise<void>;
}

/**
 * Starts everything the server process owns: database connection and migrations, demo seed,
 * the embedded MQTT broker, the SMTP stand-in and the HTTP API with the web client.
 * Ports may be 0 (tests): the real ones are returned.
 */
export async function startServer(env: Env = readEnv()): Promise<RunningServer> {
  const sequelize = connectDatabase(env.DATABASE_URL);
  await sequelize.authenticate();
  initModels(sequelize);
  await migrate(sequelize, env.DATABASE_URL);
  if (env.TALLYRUN_DEMO === 'on') {
    await seedDemoUsers(sequelize, env.TALLYRUN_DEMO_PASSWORD);
    // After the users, so the seeded configuration changes are recorded as made by the demo engineer.
    await seedDemoScenario(sequelize, { demoPassword: env.TALLYRUN_DEMO_PASSWORD });
  }

  const services = createServices({
    databaseUrl: env.DATABASE_URL,
    sequelize,
    dataDir: path.resolve(env.TALLYRUN_DATA_DIR),
  });
  // An import cut short by a stop is reported as such; its committed batches stay.
  await services.pool.query(
    `UPDATE imports SET status = 'failed', finished_at = now(), errors = errors || '[{"line": 0, "message": "the server stopped during this import; re-import the file (rows already stored count as duplicates)"}]'::jsonb WHERE status = 'running'`,
  );
  await makePartitionsAhead(services.pool);
  // The database may restart under a running server: watched here for /api/health; every pool and
  // worker logs and retries instead of ending the process (DEVELOPERS.md, "When the database goes away").
  const databaseMonitor = new DatabaseMonitor(env.DATABASE_URL);
  databaseMonitor.start();

  const broker = env.MQTT_URL
    ? {
        port: 0,
        ...(await startExternalBrokerIngest({
          url: env.MQTT_URL,
          sharedGroup: env.MQTT_SHARED_GROUP,
          clientId: env.MQTT_CLIENT_ID,
          sessionExpiryS: env.MQTT_SESSION_EXPIRY_S,
          ingest: services.mqttIngest,
        })),
      }
    : await startEmbeddedBroker({
        host: env.HOST,
        port: env.MQTT_PORT,
        authenticate: (username, password) => services.deviceAuth.authenticate(username, password),
        onPublish: (device, topic, payload) => services.mqttIngest(device, topic, payload),
      });
  if ('disconnect' in broker) services.brokerControl.disconnect = (username) => broker.disconnect(username);
  // Where devices publish, shown with each device credential (issue 14 item 6).
  services.brokerControl.address = env.MQTT_URL ? { externalUrl: env.MQTT_URL } : { port: broker.port };
  const smtp = await startSmtpStandIn({ host: env.HOST, port: env.SMTP_PORT });
  // Alarm mail through the stand-in (issue 5): new alarms soon after they are raised, digests and
  // clock-judged conditions (stale, calibration, shelving over) on the minute.
  const mailer = createMailer({ host: env.HOST, port: smtp.port, access: smtp.access });
  const notifier = new AlarmNotifier(services.pool, mailer);
  services.alarms.on('raised', () => notifier.requestRun());
  // The scheduled jobs and the history recompute run in one process of those sharing the database
  // (a PostgreSQL advisory lock); another takes them over when it dies (server/jobs/single-runner.ts).
  const runner = startSingleRunner({
    databaseUrl: env.DATABASE_URL,
    pollMs: env.TALLYRUN_RUNNER_POLL_MS,
    start: () => {
      services.history.start((ids) => {
        services.live.historyChanged(ids);
        // Alarms: judge the new readings of the meter runs just recomputed (issue 5).
        services.alarms.meterRunsChanged(ids);
      });
      const schedule = startSchedule({ pool: services.pool, history: services.history });
      const alarmSchedule = startAlarmSchedule({ alarms: services.alarms, notifier });
      return async () => {
        schedule.stop();
        await alarmSchedule.stop();
        await services.history.stop();
      };
    },
  });
  await runner.firstTry;

  const app = createApp({
    sequelize,
    jwtSecret: jwtSecret(env),
    tokenHours: env.TALLYRUN_TOKEN_HOURS,
    loginLimit: env.TALLYRUN_LOGIN_LIMIT,
    trustProxy: env.TALLYRUN_TRUST_PROXY,
    webDir: env.TALLYRUN_WEB_DIR,
    services,
    health: async () => ({
      database: databaseMonitor.database,
      broker: broker.isUp() ? 'up' : 'down',
    }),
  });
  const server = http.createServer(app);
  // Longer than clients' idle keep-alive (undici's fetch: 4 s), so the server never closes a socket
  // just as a client reuses it ("other side closed", seen under load); 65 s suits proxies in front too.
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(env.PORT, env.HOST, () => resolve());
  });
  const httpPort = (server.address() as AddressInfo).port;

  return {
    url: `http://${env.HOST}:${httpPort}`,
    httpPort,
    mqttPort: broker.port,
    smtpPort: smtp.port,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await runner.stop();
      notifier.stop();
      await broker.close();
      mailer.close();
      await smtp.close();
      await services.close();
      await databaseMonitor.stop();
      await sequelize.close();
    },
  };
}

/** A signing secret from the environment, or one generated once and kept in the data folder. */
function jwtSecret(env: Env): string {
  if (env.TALLYRUN_JWT_SECRET) return env.TALLYRUN_JWT_SECRET;
  const file = path.resolve(env.TALLYRUN_DATA_DIR, 'jwt-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const secret = crypto.randomBytes(48).toString('base64url');
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

// Run directly (`tsx server/index.ts`): start, and stop cleanly on SIGINT/SIGTERM.
if (require.main === module) {
  startServer()
    .then((running) => {
      serverLog.info({ http: running.url, mqttPort: running.mqttPort, smtpPort: running.smtpPort }, 'server started');
      const shutdown = () => {
        void running.stop().then(
          () => process.exit(0),
          () => process.exit(1),
        );
      };
      process.once('SIGINT', shutdown);
      process.once('SIGTERM', shutdown);
    })
    .catch((err) => {
      serverLog.fatal({ err }, 'the server could not start');
      process.exit(1);
    });
}
