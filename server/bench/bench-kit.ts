/**
 * What the query and recompute benchmarks share: a fresh database of their own in the private
 * cluster with a running server (broker and history worker included), a signed-in admin, a site
 * and meter runs made through the API, COPY of generated readings, percentiles, and the figures
 * each benchmark hands to `npm run bench` (server/bench/run.ts) as JSON.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Pool } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { ensureCluster } from '../cli/postgres';
import { prepareDatabase } from '../db/prepare';
import { readEnv } from '../env';
import { startServer } from '../index';
import { hashPassword } from '../auth/passwords';

/** One figure of a benchmark: its value, the base measured in the same run, the goal and whether it is met. */
export interface BenchFigure {
  figure: string;
  value: number;
  unit: string;
  /** The base measured in the same run, and value ÷ base. */
  base?: { name: string; value: number };
  ratio?: number;
  /** The goal in words (`≤ 50 ms`, `≤ 3 × bare SQL`) and whether this run met it; null when there is no goal. */
  goal: string | null;
  met: boolean | null;
  note?: string;
}

/** The report is the command's answer to a person: plain lines on stdout, not log lines. */
export const print = (line: string) => process.stdout.write(`${line}\n`);

/** `--json <path>`: where a benchmark writes its figures for run.ts. */
export function jsonPathArg(): string | null {
  const i = process.argv.indexOf('--json');
  return i > 0 ? (process.argv[i + 1] ?? null) : null;
}

export function writeFigures(name: string, figures: BenchFigure[], extra: Record<string, unknown> = {}) {
  const file = jsonPathArg();
  if (!file) return;
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, `${JSON.stringify({ bench: name, ...extra, figures }, null, 2)}\n`);
}

/** The p-th percentile (nearest rank) of `xs`. */
export function percentile(xs: number[], p: number): number {
  const sorted = [...xs].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

export const GULF_COAST = {
  methane: 0.965222,
  nitrogen: 0.002595,
  'carbon-dioxide': 0.005956,
  ethane: 0.018186,
  propane: 0.004596,
  isobutane: 0.000977,
  'n-butane': 0.001007,
  isopentane: 0.000473,
  'n-pentane': 0.000324,
  'n-hexane': 0.000664,
};

export interface BenchRun {
  run: { id: string; tag: string };
  dp: { id: string; tag: string };
  pt: { id: string; tag: string };
  tt: { id: string; tag: string };
}

/** A fresh database `database` in the private cluster (or DATABASE_URL as it is), and a server on it. */
export async function benchServer(database: string) {
  const root = path.resolve(__dirname, '..', '..');
  const dataDir = path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun'));
  let url = process.env.DATABASE_URL;
  let cluster = null;
  if (!url) {
    cluster = await ensureCluster({
      dataDir,
      port: Number(process.env.TALLYRUN_PG_PORT ?? 54329),
      log: () => undefined,
    });
    const prepared = await prepareDatabase({
      adminUrl: cluster.url('postgres'),
      database,
      secretsDir: cluster.secretsDir,
      fresh: true,
    });
    url = prepared.serverUrl;
  }
  const server = await startServer(
    readEnv({
      ...process.env,
      DATABASE_URL: url,
      PORT: '0',
      MQTT_PORT: '0',
      SMTP_PORT: '0',
      TALLYRUN_DEMO: 'off',
      TALLYRUN_DATA_DIR: fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-bench-')),
      TALLYRUN_WEB_DIR: '/nonexistent',
      TALLYRUN_SIMULATORS: 'off',
    }),
  );
  const pool = new Pool({ connectionString: url, max: 4 });
  await pool.query(
    `INSERT INTO users (email, name, role, password_hash) VALUES ('bench@bench', 'Bench', 'admin', $1)`,
    [await hashPassword('bench-password')],
  );
  const login = await fetch(`${server.url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'bench@bench', password: 'bench-password' }),
  });
  const { token } = (await login.json()) as { token: string };
  const api = async <T = { id: string; tag: string }>(method: string, p: string, body?: unknown): Promise<T> => {
    const res = await fetch(`${server.url}${p}`, {
      method,
      headers: { Authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      body: body ? JSON.stringify(body) : undefined,
    });
    if (!res.ok) throw new Error(`${method} ${p}: ${res.status} ${await res.text()}`);
    return (await res.json()) as T;
  };
  const site = await api<{ id: string }>('POST', '/api/sites', {
    code: 'BENCH',
    name: 'Bench',
    timeZone: 'UTC',
    contractHour: 0,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  /** An orifice meter run on natural gas with a DP, a static pressure and a temperature transmitter. */
  const makeRun = async (tag: string): Promise<BenchRun> => {
    const run = await api('POST', '/api/meter-runs', {
      siteId: site.id,
      tag,
      name: tag,
      effectiveFrom: '2020-01-01T00:00:00Z',
      holdLimitS: 3600,
      maxGapS: 900,
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
      fluid: { kind: 'natural-gas', composition: GULF_COAST },
    });
    const t = async (suffix: string, body: object) =>
      api('POST', '/api/transmitters', { meterRunId: run.id, tag: `${tag}-${suffix}`, ...body });
    return {
      run,
      dp: await t('DP', { measures: 'differential-pressure', unit: 'kPa', lowerRange: 0, upperRange: 50 }),
      pt: await t('PT', { measures: 'static-pressure', unit: 'MPa', lowerRange: 0, upperRange: 10 }),
      tt: await t('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 }),
    };
  };
  const stop = async () => {
    await pool.end();
    await server.stop();
    if (cluster?.startedHere) cluster.stop();
  };
  return { server, pool, api, site, makeRun, stop, url };
}

/**
 * COPYs 1-Hz readings of the meter run's three transmitters over [fromMs, toMs) into `readings`
 * (DP around 20 kPa, static pressure around 5 MPa, temperature around 290 K, each varying slowly
 * so no two hours compute alike). @returns how many readings were written
 */
export async function copyOneHertz(pool: Pool, run: BenchRun, fromMs: number, toMs: number): Promise<number> {
  const series = [
    { id: run.dp.id, value: (s: number) => 20 + 5 * Math.sin(s / 5400) },
    { id: run.pt.id, value: (s: number) => 5 + 0.2 * Math.sin(s / 7200) },
    { id: run.tt.id, value: (s: number) => 290 + 3 * Math.sin(s / 43_200) },
  ];
  const seconds = Math.floor((toMs - fromMs) / 1000);
  function* rows() {
    for (const s of series) {
      for (let i = 0; i < seconds; i += 10_000) {
        let chunk = '';
        for (let k = i; k < Math.min(seconds, i + 10_000); k++) {
          chunk += `${s.id}\t${new Date(fromMs + k * 1000).toISOString()}\t${s.value(k).toFixed(4)}\t0\t2\n`;
        }
        yield chunk;
      }
    }
  }
  const client = await pool.connect();
  try {
    await pipeline(
      Readable.from(rows()),
      client.query(copyFrom('COPY readings (transmitter_id, time, value, quality, source) FROM STDIN')),
    );
  } finally {
    client.release();
  }
  await pool.query('ANALYZE readings');
  return seconds * series.length;
}
