import { z } from 'zod';

/**
 * The one place that reads process.env. Fails fast with a readable list of what is wrong.
 */
const port = (fallback: number) => z.coerce.number().int().min(0).max(65535).default(fallback);
const flag = (fallback: 'on' | 'off') => z.enum(['on', 'off']).default(fallback);

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
  TALLYRUN_WEB_DIR: z.string().default('dist'),
});

export type Env = z.infer<typeof schema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Tallyrun configuration is invalid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
