import pino, { type Logger } from 'pino';

/**
 * The server's one logger (pino): JSON lines, one object per event, so a log collector can
 * read them; pretty, coloured lines only when a person watches a terminal.
 *
 * The level is read here rather than in env.ts because the logger must exist before the
 * environment is validated (a bad environment is itself logged). `LOG_LEVEL` sets it; under
 * jest the default is `warn`, so request lines do not bury the test report.
 */
const level = process.env.LOG_LEVEL ?? (process.env.JEST_WORKER_ID || process.env.TALLYRUN_TESTING ? 'warn' : 'info');
const pretty = Boolean(process.stdout.isTTY) && process.env.NODE_ENV !== 'production';

export const logger: Logger = pino({
  level,
  base: undefined,
  // Whatever is logged, a bearer token or a password never reaches the log.
  redact: ['req.headers.authorization', 'req.headers.cookie', '*.password', 'password'],
  ...(pretty
    ? {
        transport: {
          target: 'pino-pretty',
          options: { colorize: true, translateTime: 'SYS:HH:MM:ss.l', ignore: 'pid,hostname' },
        },
      }
    : {}),
});

/**
 * A logger for one part of the server (`history`, `alarms`, `mail`, `jobs`, `imports`, `http`, …);
 * the name appears in every line it writes as `component`.
 * @example const log = componentLogger('history'); log.error({ err, meterRunId }, 'hour failed');
 */
export function componentLogger(component: string, options: { level?: string } = {}): Logger {
  return logger.child({ component }, options);
}
