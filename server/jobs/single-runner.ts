import { Client } from 'pg';
import { componentLogger } from '../log';

const log = componentLogger('runner');

/**
 * The advisory lock key of the job runner: one 64-bit number, chosen once (advisory locks are per
 * database, so processes of different databases never wait for each other).
 */
export const jobsLockKey = 7_340_001_015;

export interface SingleRunner {
  /** Whether this process holds the lock (runs the jobs) right now. */
  isRunner(): boolean;
  /** Settles after the first try to take the lock (a lone process runs its jobs from then on). */
  firstTry: Promise<void>;
  /** Stops the jobs if running here, releases the lock and closes its connection. */
  stop(): Promise<void>;
}

/**
 * Runs `start` in one process only among all those sharing the database: the holder of a
 * PostgreSQL session advisory lock taken on a connection of its own. The others try again every
 * `pollMs`; when the holder dies its connection closes, the lock is released, and the next try
 * of another process takes it over. If the lock's connection breaks here (the database went
 * away), the jobs stop at once — another process may take the lock meanwhile — and this process
 * polls again like the others.
 */
export function startSingleRunner(options: {
  databaseUrl: string;
  pollMs: number;
  /** Starts the jobs; returns what stops them. */
  start: () => Promise<() => Promise<void>> | (() => Promise<void>);
  lockKey?: number;
}): SingleRunner {
  const key = String(options.lockKey ?? jobsLockKey);
  let connection: Client | null = null;
  let stopJobs: (() => Promise<void>) | null = null;
  let stopped = false;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let attempt: Promise<void> = Promise.resolve();

  const loseLock = async (reason: unknown) => {
    const stopping = stopJobs;
    stopJobs = null;
    const old = connection;
    connection = null;
    old?.end().catch(() => undefined);
    if (stopping) {
      log.warn({ err: reason }, 'the job runner lost its lock; its jobs stop and it tries again');
      await stopping().catch((err) => log.error({ err }, 'the jobs did not stop cleanly'));
    }
  };

  const tryTake = async () => {
    if (stopped) return;
    try {
      // The holder checks its connection each period: a dead one must stop the jobs here soon.
      if (stopJobs) {
        await connection?.query('SELECT 1');
        return;
      }
      if (!connection) {
        const c = new Client({ connectionString: options.databaseUrl, application_name: 'tallyrun-job-runner' });
        // Without a listener an error of an idle connection would end the process.
        c.on('error', (err) => void loseLock(err));
        c.on('end', () => {
          if (connection === c) void loseLock(new Error('the lock connection closed'));
        });
        connection = c;
        await c.connect();
      }
      const { rows } = await connection.query<{ taken: boolean }>('SELECT pg_try_advisory_lock($1::bigint) AS taken', [
        key,
      ]);
      if (!rows[0].taken || stopped) return;
      log.info('this process runs the scheduled jobs and the history recompute');
      stopJobs = await options.start();
    } catch (err) {
      await loseLock(err);
    }
  };

  const poll = () => {
    if (stopped) return;
    attempt = tryTake().finally(() => {
      if (!stopped) timer = setTimeout(poll, options.pollMs);
    });
  };
  poll();
  const firstTry = attempt;

  return {
    firstTry,
    isRunner: () => stopJobs !== null,
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await attempt;
      const stopping = stopJobs;
      stopJobs = null;
      if (stopping) await stopping();
      const c = connection;
      connection = null;
      // Closing the session releases the lock; unlocking first makes it free before the socket closes.
      if (c)
        await c
          .query('SELECT pg_advisory_unlock($1::bigint)', [key])
          .then(
            () => c.end(),
            () => c.end(),
          )
          .catch(() => undefined);
    },
  };
}
