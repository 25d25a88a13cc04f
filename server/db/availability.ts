import { EventEmitter } from 'node:events';
import { Pool } from 'pg';
import { ConnectionError } from 'sequelize';
import { AppError } from '../errors';
import { componentLogger } from '../log';

const log = componentLogger('database');

/**
 * Socket codes and PostgreSQL SQLSTATEs that mean "the database cannot be reached or is going
 * away", not "this statement is wrong": class 08 (connection exception) and 57P01–57P03
 * (administrator shutdown, crash shutdown, cannot connect now — a server starting or stopping).
 */
const unreachableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  '57P01',
  '57P02',
  '57P03',
  '08000',
  '08001',
  '08003',
  '08004',
  '08006',
]);
/** What pg says when a connection ends under a query or a connect times out (these errors carry no code). */
const unreachableMessages = [
  /^Connection terminated/,
  /^timeout exceeded when trying to connect/,
  /^Client has encountered a connection error and is not queryable/,
  /^Query read timeout/,
];

/**
 * Whether an error (pg's, Sequelize's wrapping of it, or an AggregateError of both address
 * families) means the database is unreachable. Followed through `original`, `parent`, `cause`
 * and `errors`, a few levels deep.
 */
export function isDatabaseUnreachable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  if (err instanceof ConnectionError) return true;
  const e = err as { code?: unknown; message?: unknown; original?: unknown; parent?: unknown; cause?: unknown };
  if (typeof e.code === 'string' && unreachableCodes.has(e.code)) return true;
  if (typeof e.message === 'string' && unreachableMessages.some((m) => m.test(e.message as string))) return true;
  const inner = [e.original, e.parent, e.cause, ...((err as { errors?: unknown[] }).errors ?? [])];
  return inner.some((i) => i !== err && isDatabaseUnreachable(i, depth + 1));
}

/** The answer to a request that needed the database while it was unreachable (503, never a 500 or a hang). */
export const databaseUnavailable = () =>
  new AppError(
    503,
    'database_unavailable',
    'The database cannot be reached just now, so this request was not carried out. Try again in a moment; /api/health says when the database is back.',
  );

/** An 'error' listener for a pg Pool or Client: logged, never fatal (an unheard 'error' event ends the process). */
export function logConnectionError(what: string) {
  return (err: Error) =>
    log.warn(
      { err: { message: err.message, code: (err as { code?: string }).code }, what },
      'database connection lost',
    );
}

/**
 * Watches the database with a periodic `SELECT 1` over a connection of its own (so a busy main pool
 * cannot make it look down), each with a short timeout. `/api/health` reads its state; it says
 * `down` within one interval plus one timeout of losing the database and `up` again by itself when
 * the database answers. Emits `down` and `up` on each change, so parts that wait on the database
 * can resume at once.
 */
export class DatabaseMonitor extends EventEmitter {
  private state: 'up' | 'down' = 'up';
  /** Failed probes in a row: one slow probe on a busy machine is not an outage, two are. */
  private failuresInRow = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private readonly pool: Pool;
  private stopped = false;

  constructor(
    databaseUrl: string,
    private readonly options: { intervalMs: number; timeoutMs: number; failuresToDown: number } = {
      intervalMs: 1000,
      timeoutMs: 3000,
      failuresToDown: 2,
    },
  ) {
    super();
    this.pool = new Pool({
      connectionString: databaseUrl,
      max: 1,
      connectionTimeoutMillis: options.timeoutMs,
      query_timeout: options.timeoutMs,
      keepAlive: true,
    });
    this.pool.on('error', () => undefined); // the probe itself tells the state; nothing more to log
  }

  get database(): 'up' | 'down' {
    return this.state;
  }

  start() {
    this.stopped = false;
    const loop = () => {
      void this.check().finally(() => {
        if (this.stopped) return;
        this.timer = setTimeout(loop, this.options.intervalMs);
        this.timer.unref();
      });
    };
    loop();
  }

  /** Probes once and records the state. */
  async check(): Promise<'up' | 'down'> {
    let next: 'up' | 'down';
    try {
      await this.pool.query('SELECT 1');
      this.failuresInRow = 0;
      next = 'up';
    } catch (err) {
      this.failuresInRow++;
      next = this.failuresInRow >= this.options.failuresToDown ? 'down' : this.state;
      if (next === 'down' && this.state === 'up')
        log.error({ err: { message: (err as Error).message } }, 'the database is down');
    }
    if (next !== this.state) {
      this.state = next;
      if (next === 'up') log.warn('the database is back up');
      this.emit(next);
    }
    return next;
  }

  async stop() {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    await this.pool.end().catch(() => undefined);
  }
}
