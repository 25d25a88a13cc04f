import { isIP } from 'node:net';
import { z } from 'zod';
import { demoStartDecision, type PasswordCheck } from './seed/production-demo';
import { checkPasswordPolicy } from './auth/password-policy';

/**
 * The one place that reads process.env. Fails fast with a readable list of what is wrong.
 */
const port = (fallback: number) => z.coerce.number().int().min(0).max(65535).default(fallback);
const flag = (fallback: 'on' | 'off') => z.enum(['on', 'off']).default(fallback);
/** One entry of TALLYRUN_TRUST_PROXY: a name Express knows, an IP address, or an address/prefix subnet. */
const isProxyEntry = (entry: string) => {
  if (['loopback', 'linklocal', 'uniquelocal'].includes(entry)) return true;
  const [address, prefix, ...extra] = entry.split('/');
  const version = isIP(address);
  if (!version || extra.length) return false;
  return prefix === undefined || (/^\d+$/.test(prefix) && Number(prefix) <= (version === 4 ? 32 : 128));
};

const schema = z.object({
  NODE_ENV: z.string().default('development'),
  PORT: port(8080),
  HOST: z.string().default('127.0.0.1'),
  MQTT_PORT: port(1883),
  MQTT_WS_PORT: port(0),
  /** When set, ingest subscribes to this external broker instead of embedding aedes. */
  MQTT_URL: z.string().url('MQTT_URL must be a URL such as mqtt://broker:1883').optional(),
  /** With an external MQTT 5 broker: share the subscription among several Tallyrun processes. */
  MQTT_SHARED_GROUP: z
    .string()
    .regex(/^[A-Za-z0-9_-]+$/)
    .optional(),
  /**
   * The external broker's client id of this process: stable across its restarts (the broker keeps its
   * session, and the messages in flight to it, until it comes back) and different for every process
   * sharing MQTT_SHARED_GROUP. Defaults to `tallyrun-ingest-<host name>`.
   */
  MQTT_CLIENT_ID: z
    .string()
    .regex(/^[A-Za-z0-9_.-]{1,64}$/, 'MQTT_CLIENT_ID must be 1 to 64 letters, digits, dots, dashes or underscores')
    .optional(),
  /** How long the external broker keeps this process's session (and its queued messages) while it is away, s. */
  MQTT_SESSION_EXPIRY_S: z.coerce.number().int().min(0).max(4_294_967_295).default(86_400),
  /**
   * How often a process that does not run the scheduled jobs and the history recompute checks whether
   * their runner has gone (PostgreSQL advisory lock), ms.
   */
  TALLYRUN_RUNNER_POLL_MS: z.coerce.number().int().min(100).default(5000),
  SMTP_PORT: port(2525),
  DATABASE_URL: z.string().min(1, 'DATABASE_URL is required (npm start sets it for the private cluster)'),
  TALLYRUN_DATA_DIR: z.string().default('.tallyrun'),
  TALLYRUN_DEMO: flag('on'),
  TALLYRUN_SIMULATORS: flag('on'),
  TALLYRUN_DEMO_PASSWORD: z
    .string()
    .min(8, 'TALLYRUN_DEMO_PASSWORD must be at least 8 characters')
    .default('tallyrun-demo'),
  TALLYRUN_JWT_SECRET: z.string().min(16).optional(),
  TALLYRUN_TOKEN_HOURS: z.coerce.number().positive().default(12),
  TALLYRUN_LOGIN_LIMIT: z.coerce.number().int().positive().default(10),
  /**
   * Which proxies' X-Forwarded-For to believe (Express's `trust proxy`): unset trusts none, so a client
   * cannot pick its own address for the sign-in limit; a hop count (`1`), or addresses, subnets and
   * the names loopback, linklocal, uniquelocal separated by commas (`loopback, 10.0.0.0/8`).
   */
  TALLYRUN_TRUST_PROXY: z
    .string()
    .optional()
    .transform((value, ctx) => {
      const text = value?.trim() ?? '';
      if (text === '') return false;
      if (/^\d+$/.test(text)) return Number(text);
      const entries = text.split(',').map((entry) => entry.trim());
      const bad = entries.find((entry) => !isProxyEntry(entry));
      if (bad === undefined) return entries.join(',');
      ctx.addIssue({
        code: 'custom',
        message: `"${bad}" is not a hop count, an IP address or subnet, or loopback, linklocal, uniquelocal`,
      });
      return z.NEVER;
    }),
  TALLYRUN_WEB_DIR: z.string().default('dist'),
});

export type Env = z.infer<typeof schema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Tallyrun configuration is invalid:\n${lines.join('\n')}`);
  }
  return { ...parsed.data, TALLYRUN_DEMO: demoSeeded(source) ? 'on' : 'off' };
}

/**
 * Whether demo data is seeded; throws the start-up error naming the setting when production would
 * seed it without being asked, or with the shipped password (server/seed/production-demo.ts).
 */
export function demoSeeded(source: Record<string, string | undefined> = process.env): boolean {
  const demo = demoStartDecision(source, passwordPolicy);
  if (!demo.ok) throw new Error(`Tallyrun configuration is invalid:\n  ${demo.field}: ${demo.message}`);
  return demo.seed;
}

/** The password policy (server/auth/password-policy.ts) the demo password must pass in production. */
const passwordPolicy: PasswordCheck = (password, context) => {
  const reason = checkPasswordPolicy(password, context);
  return reason === null ? { ok: true } : { ok: false, reason };
};
