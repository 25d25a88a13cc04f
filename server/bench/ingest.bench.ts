/**
 * `npm run bench:ingest`: ingest throughput and totals read latency, measured in one run on a
 * database of its own, with ratios against bases measured in the same run:
 *   - MQTT single readings (QoS 1, committed before PUBACK) vs the same broker storing nothing;
 *   - MQTT batches of 50 readings per message on one connection, 64 in flight (a field gateway), vs
 *     the same load through a bare aedes broker in the same run; and on four connections;
 *   - peak resident memory of the process under sustained batched load (`--minutes N`);
 *   - CSV rows through the HTTP import vs raw COPY of the same rows into the same table;
 *   - daily totals of 100 meter runs × 365 days read over HTTP (p50 / p95 per request).
 * "With flow computed" figures include the history worker's recomputation of the touched hours.
 * The bare-broker bases are aedes with every publish authorised at once and nothing stored. The
 * machine may be shared: compare ratios measured in the same run, not figures across runs.
 */
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { Pool } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { pipeline } from 'node:stream/promises';
import { Readable } from 'node:stream';
import mqtt from 'mqtt';
import { ensureCluster } from '../cli/postgres';
import { prepareDatabase } from '../db/prepare';
import { readEnv } from '../env';
import { startServer } from '../index';
import { startEmbeddedBroker } from '../ingest/broker';
import { hashPassword } from '../auth/passwords';
import { componentLogger } from '../log';

const quick = process.argv.includes('--quick');
const minutesArg = process.argv.indexOf('--minutes');
/** How long the sustained batched load runs for the peak-memory figure. */
const SUSTAIN_MS = (minutesArg > 0 ? Number(process.argv[minutesArg + 1]) : quick ? 0.25 : 10) * 60_000;
const SINGLE = quick ? 5_000 : 30_000;
const BATCHES = quick ? 1_000 : 6_000;
const CSV_ROWS = quick ? 60_000 : 300_000;
const RUNS = 100;
const DAYS = 365;

const log = componentLogger('bench');
/** The report is the command's answer to a person: plain lines on stdout, not log lines. */
const print = (line: string) => process.stdout.write(`${line}\n`);
const rate = (n: number, ms: number) => n / (ms / 1000);
const fmt = (x: number) => Math.round(x).toLocaleString('en-US');
const verdict = (met: boolean) => (met ? 'met' : 'NOT met');

/** A broker with aedes' own flow only: credentials accepted, every publish authorised at once. */
async function bareBroker() {
  const broker = await startEmbeddedBroker({
    host: '127.0.0.1',
    port: 0,
    authenticate: async () => ({ id: '0', siteCode: 'BENCH' }),
    onPublish: async () => undefined,
  });
  broker.aedes.authorizePublish = (_client, _packet, callback) => callback(null);
  return broker;
}

/** The faster of two bare-broker runs, one before and one after the measured run (not flattering the ratio). */
async function againstBare<T>(
  messages: { topic: string; payload: string }[],
  clients: number,
  window: number,
  measured: () => Promise<T>,
): Promise<{ bareMs: number; result: T }> {
  const bare = await bareBroker();
  await mqttLoad(bare.port, 'x', 'y', messages.slice(0, Math.min(2000, messages.length)), clients, window);
  const first = await mqttLoad(bare.port, 'x', 'y', messages, clients, window);
  const result = await measured();
  const second = await mqttLoad(bare.port, 'x', 'y', messages, clients, window);
  await bare.close();
  return { bareMs: Math.min(first, second), result };
}

async function mqttLoad(
  port: number,
  username: string,
  password: string,
  messages: { topic: string; payload: string }[],
  clients = Number(process.env.BENCH_CLIENTS ?? 4),
  window = 1000,
) {
  const conns = await Promise.all(
    Array.from(
      { length: clients },
      () =>
        new Promise<mqtt.MqttClient>((resolve, reject) => {
          const c = mqtt.connect({
            host: '127.0.0.1',
            port,
            protocolVersion: 4,
            username,
            password,
            reconnectPeriod: 0,
          });
          c.once('connect', () => resolve(c));
          c.once('error', reject);
        }),
    ),
  );
  const started = performance.now();
  await Promise.all(
    conns.map(async (c, k) => {
      const mine = messages.filter((_, i) => i % clients === k);
      let next = 0;
      await new Promise<void>((resolve, reject) => {
        let inFlight = 0;
        let done = 0;
        const pump = () => {
          while (inFlight < window && next < mine.length) {
            const m = mine[next++];
            inFlight++;
            c.publish(m.topic, m.payload, { qos: 1 }, (err) => {
              if (err) return reject(err);
              inFlight--;
              done++;
              if (done === mine.length) resolve();
              else pump();
            });
          }
        };
        if (mine.length === 0) resolve();
        pump();
      });
    }),
  );
  const elapsed = performance.now() - started;
  conns.forEach((c) => c.end(true));
  return elapsed;
}

async function main() {
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
      database: 'tallyrun_bench',
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
  const pool = new Pool({ connectionString: url });
  try {
    // An admin and a signed-in client.
    await pool.query(
      `INSERT INTO users (email, name, role, password_hash) VALUES ('bench@bench', 'Bench', 'admin', $1)`,
      [await hashPassword('bench-password')],
    );
    const token = (
      await (
        await fetch(`${server.url}/api/auth/login`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ email: 'bench@bench', password: 'bench-password' }),
        })
      ).json()
    ).token;
    const api = async (method: string, p: string, body?: unknown) => {
      const res = await fetch(`${server.url}${p}`, {
        method,
        headers: { Authorization: `Bearer ${token}`, 'content-type': 'application/json' },
        body: body ? JSON.stringify(body) : undefined,
      });
      return res.json();
    };
    const site = await api('POST', '/api/sites', {
      code: 'BENCH',
      name: 'Bench',
      timeZone: 'UTC',
      contractHour: 0,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
    const makeRun = async (tag: string) => {
      const run = await api('POST', '/api/meter-runs', {
        siteId: site.id,
        tag,
        name: tag,
        effectiveFrom: '2020-01-01T00:00:00Z',
        holdLimitS: 3600,
        maxGapS: 900,
        element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
        fluid: {
          kind: 'natural-gas',
          composition: {
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
          },
        },
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
    const device = await api('POST', '/api/devices', { name: 'bench RTU', siteId: site.id });
    const now = Date.now();
    const settle = async () => {
      for (;;) {
        const { rows } = await pool.query<{ n: number }>('SELECT count(*)::int AS n FROM stale_hours');
        if (rows[0].n === 0) return;
        await new Promise((r) => setTimeout(r, 50));
      }
    };

    // 1. Single readings, QoS 1: stored vs a bare broker, both warmed up first (JIT, connections).
    const single = await makeRun('SINGLE');
    const singleMessages = Array.from({ length: SINGLE }, (_, i) => {
      const tr = [single.dp, single.pt, single.tt][i % 3];
      const v = tr === single.dp ? 20 : tr === single.pt ? 5 : 290;
      return {
        topic: `tallyrun/BENCH/${tr.tag}`,
        payload: JSON.stringify({ t: now - 8 * 3600_000 + Math.floor(i / 3) * 1000, v, q: 'good' }),
      };
    });
    const warm = await makeRun('WARM');
    await mqttLoad(
      server.mqttPort,
      device.username,
      device.password,
      Array.from({ length: 2000 }, (_, i) => ({
        topic: `tallyrun/BENCH/${warm.dp.tag}`,
        payload: JSON.stringify({ t: now - 30 * 3600_000 + i * 1000, v: 20, q: 'good' }),
      })),
    );
    const { bareMs, result: singleMs } = await againstBare(singleMessages, 4, 1000, () =>
      mqttLoad(server.mqttPort, device.username, device.password, singleMessages),
    );
    const t0 = performance.now();
    await settle();
    const singleSettleMs = performance.now() - t0;
    const stored = (
      await pool.query<{ n: number }>(
        'SELECT count(*)::int AS n FROM readings r JOIN transmitters t ON t.id = r.transmitter_id WHERE t.meter_run_id = $1',
        [single.run.id],
      )
    ).rows[0].n;

    // 2. Batches of 50 readings per message: one connection with 64 in flight (a field gateway
    // carrying all its tags), then four connections; each against a bare broker in the same run.
    const batchPayloads = (run: Awaited<ReturnType<typeof makeRun>>, count: number, fromMs: number, stepMs = 200) =>
      Array.from({ length: count }, (_, i) => {
        const tr = [run.dp, run.pt, run.tt][i % 3];
        const v = tr === run.dp ? 20 : tr === run.pt ? 5 : 290;
        const k = Math.floor(i / 3);
        return {
          topic: `tallyrun/BENCH/${tr.tag}`,
          payload: JSON.stringify(
            Array.from({ length: 50 }, (_, j) => ({ t: fromMs + (k * 50 + j) * stepMs, v, q: 'good' })),
          ),
        };
      });
    const gateway = await makeRun('GATEWAY');
    const gatewayMessages = batchPayloads(gateway, BATCHES, now - 10 * 3600_000);
    const { bareMs: gatewayBareMs, result: gatewayMs } = await againstBare(gatewayMessages, 1, 64, () =>
      mqttLoad(server.mqttPort, device.username, device.password, gatewayMessages, 1, 64),
    );
    const gatewayStored = (
      await pool.query<{ n: number }>(
        'SELECT count(*)::int AS n FROM readings r JOIN transmitters t ON t.id = r.transmitter_id WHERE t.meter_run_id = $1',
        [gateway.run.id],
      )
    ).rows[0].n;
    await settle();
    const batched = await makeRun('BATCHED');
    const batchMessages = batchPayloads(batched, BATCHES, now - 10 * 3600_000);
    const { bareMs: batchBareMs, result: batchMs } = await againstBare(batchMessages, 4, 64, () =>
      mqttLoad(server.mqttPort, device.username, device.password, batchMessages, 4, 64),
    );
    const t1 = performance.now();
    await settle();
    const batchSettleMs = performance.now() - t1;
    const batchReadings = BATCHES * 50;

    // 2b. Sustained batched load on one connection, the resident memory sampled every 250 ms (the
    // benchmark's publisher runs in the same process, so the figure includes it).
    const sustained = await makeRun('SUSTAINED');
    let peakRss = process.memoryUsage().rss;
    const startRss = peakRss;
    const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 250);
    let sustainedReadings = 0;
    const sustainStarted = performance.now();
    for (let round = 0; performance.now() - sustainStarted < SUSTAIN_MS; round++) {
      // 10 ms apart, so ten minutes at the batched rate stays within a few weeks of readings.
      const from = now - 40 * 86_400_000 + round * 2_000 * 50 * 10;
      const chunk = batchPayloads(sustained, 2_000, from, 10);
      await mqttLoad(server.mqttPort, device.username, device.password, chunk, 1, 64);
      sustainedReadings += chunk.length * 50;
    }
    const sustainMs = performance.now() - sustainStarted;
    clearInterval(sampler);
    // 3. CSV through the HTTP import, then the same rows by raw COPY.
    const csvRun = await makeRun('CSV');
    const lines = ['time,tag,value,quality'];
    const copyRows: string[] = [];
    for (let i = 0; i < CSV_ROWS; i++) {
      const tr = [csvRun.dp, csvRun.pt, csvRun.tt][i % 3];
      const v = tr === csvRun.dp ? 20 : tr === csvRun.pt ? 5 : 290;
      const t = new Date(now - 20 * 3600_000 + Math.floor(i / 3) * 200).toISOString();
      lines.push(`${t},${tr.tag},${v},good`);
      copyRows.push(`${tr.id}\t${t}\t${v}\t0\t1\n`);
    }
    const form = new FormData();
    form.append('file', new Blob([lines.join('\n')], { type: 'text/csv' }), 'bench.csv');
    const t2 = performance.now();
    const started = await (
      await fetch(`${server.url}/api/imports`, {
        method: 'POST',
        headers: { Authorization: `Bearer ${token}` },
        body: form,
      })
    ).json();
    let result;
    for (;;) {
      result = await api('GET', `/api/imports/${started.id}`);
      if (result.status !== 'running') break;
      await new Promise((r) => setTimeout(r, 20));
    }
    const csvMs = performance.now() - t2;
    const t3 = performance.now();
    await settle();
    const csvSettleMs = performance.now() - t3;
    // The base: the same rows by raw COPY into the same table, best of two (the machine is shared
    // with the server's own background work, so a single COPY can be unlucky).
    let copyMs = Infinity;
    for (let attempt = 0; attempt < 2; attempt++) {
      await pool.query('DELETE FROM readings WHERE transmitter_id = ANY($1::bigint[])', [
        [csvRun.dp.id, csvRun.pt.id, csvRun.tt.id],
      ]);
      await pool.query('VACUUM readings');
      const copyClient = await pool.connect();
      const t4 = performance.now();
      await pipeline(
        Readable.from(copyRows),
        copyClient.query(copyFrom('COPY readings (transmitter_id, time, value, quality, source) FROM STDIN')),
      );
      copyMs = Math.min(copyMs, performance.now() - t4);
      copyClient.release();
    }

    // 4. Daily totals: 100 meter runs × 365 days, read over HTTP one meter run at a time.
    const day0 = Date.UTC(2025, 0, 1);
    const runIds: string[] = [];
    for (let i = 0; i < RUNS; i++) {
      const { rows } = await pool.query<{ id: string }>(
        `INSERT INTO meter_runs (site_id, tag, name) VALUES ($1, $2, $2) RETURNING id::text`,
        [site.id, `TOT-${i}`],
      );
      runIds.push(rows[0].id);
    }
    await pool.query(
      `INSERT INTO daily_totals (meter_run_id, contract_day, start, "end", hours, flow_time_s, mass_kg, volume_m3, standard_volume_m3, energy_j, coverage, flags, uncertainty_percent, status)
       SELECT r, d::date, d, d + interval '1 day', 24, 86400, 1000, 10, 1200, 4.5e10, 1, '{}', 0.8, 'complete'
         FROM unnest($1::bigint[]) AS r, generate_series($2::timestamptz, $2::timestamptz + interval '${DAYS - 1} days', interval '1 day') AS d`,
      [runIds, new Date(day0).toISOString()],
    );
    const from = new Date(day0).toISOString();
    const to = new Date(day0 + DAYS * 86_400_000).toISOString();
    const latencies: number[] = [];
    for (let pass = 0; pass < 2; pass++) {
      for (const id of runIds) {
        const s = performance.now();
        const list = await api('GET', `/api/meter-runs/${id}/totals?interval=day&from=${from}&to=${to}`);
        if (pass === 1) latencies.push(performance.now() - s);
        if (list.length !== DAYS) throw new Error(`expected ${DAYS} days, got ${list.length}`);
      }
    }
    latencies.sort((a, b) => a - b);
    const pct = (p: number) => latencies[Math.min(latencies.length - 1, Math.floor((p / 100) * latencies.length))];

    const bareRate = rate(SINGLE, bareMs);
    const singleRate = rate(SINGLE, singleMs);
    const gatewayRate = rate(BATCHES * 50, gatewayMs);
    const gatewayBareRate = rate(BATCHES * 50, gatewayBareMs);
    const batchRate = rate(batchReadings, batchMs);
    const batchBareRate = rate(batchReadings, batchBareMs);
    const csvRate = rate(CSV_ROWS, csvMs);
    const copyRate = rate(CSV_ROWS, copyMs);
    const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MB`;
    print('\nTallyrun ingest benchmark' + (quick ? ' (quick)' : ''));
    print(`  machine: ${os.cpus().length} cores, ${os.cpus()[0]?.model ?? ''}, node ${process.version}`);
    print(`  MQTT single readings, bare broker (base)     ${fmt(bareRate)} msg/s`);
    print(
      `  MQTT single readings committed               ${fmt(singleRate)} readings/s   ratio ${(singleRate / bareRate).toFixed(2)} × bare broker (goal ≥ 0.70: ${verdict(singleRate / bareRate >= 0.7)}); ${stored} stored`,
    );
    print(
      `     … with flow computed (history settled)     ${fmt(rate(SINGLE, singleMs + singleSettleMs))} readings/s   (settle ${singleSettleMs.toFixed(0)} ms)`,
    );
    print(`  MQTT batches of 50, 1 connection, 64 in flight, bare broker (base)   ${fmt(gatewayBareRate)} readings/s`);
    print(
      `  MQTT batches of 50, 1 connection committed   ${fmt(gatewayRate)} readings/s   ratio ${(gatewayRate / gatewayBareRate).toFixed(2)} × bare broker (goals ≥ 0.35: ${verdict(gatewayRate / gatewayBareRate >= 0.35)}; ≥ 150,000/s: ${verdict(gatewayRate >= 150_000)}); ${gatewayStored} stored`,
    );
    print(`  MQTT batches of 50, 4 connections, bare broker (base)                ${fmt(batchBareRate)} readings/s`);
    print(
      `  MQTT batches of 50, 4 connections committed  ${fmt(batchRate)} readings/s   ratio ${(batchRate / batchBareRate).toFixed(2)} × bare broker`,
    );
    print(
      `     … with flow computed (history settled)     ${fmt(rate(batchReadings, batchMs + batchSettleMs))} readings/s   (settle ${batchSettleMs.toFixed(0)} ms)`,
    );
    print(
      `  sustained batches, 1 connection, ${(sustainMs / 60_000).toFixed(1)} min: ${fmt(rate(sustainedReadings, sustainMs))} readings/s, resident memory ${mb(startRss)} at start, peak ${mb(peakRss)} (the publisher included)`,
    );
    print(
      `  CSV import over HTTP                         ${fmt(csvRate)} rows/s       ratio ${(csvRate / copyRate).toFixed(2)} × raw COPY (goal ≥ 0.50); ${result.rowsImported} imported`,
    );
    print(
      `     … with flow computed (history settled)     ${fmt(rate(CSV_ROWS, csvMs + csvSettleMs))} rows/s       (settle ${csvSettleMs.toFixed(0)} ms)`,
    );
    print(`  raw COPY of the same rows (base)             ${fmt(copyRate)} rows/s`);
    print(
      `  daily totals, ${RUNS} meter runs × ${DAYS} days over HTTP: p50 ${pct(50).toFixed(1)} ms, p95 ${pct(95).toFixed(1)} ms per request (goal p95 ≤ 50 ms)`,
    );
  } finally {
    await pool.end();
    await server.stop();
    if (cluster?.startedHere) cluster.stop();
  }
}

main().catch((err) => {
  log.fatal({ err }, 'the ingest benchmark failed');
  process.exit(1);
});
