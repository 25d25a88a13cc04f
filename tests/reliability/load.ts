/**
 * Part "load" (issue 12, "What to prove", last point): while a steady MQTT publisher sends readings (2 000 a
 * second by default), autocannon runs against a few read routes with a signed-in token, 10 connections, one
 * route after another. Prints p50/p95/p99 latency, requests/s and the count of answers other than 2xx (must be 0).
 */
import { createRequire } from 'node:module';
import mqtt from 'mqtt';
import { meterRunWithDevice, say, type Harness } from './harness';
import type { PartResult } from './outage';

/** The few fields of autocannon 9 used here (it ships no types). */
interface Autocannon {
  (options: {
    url: string;
    connections: number;
    duration: number;
    headers: Record<string, string>;
  }): AutocannonInstance;
}
interface AutocannonInstance extends PromiseLike<AutocannonResult> {
  on(
    event: 'response',
    listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void,
  ): void;
}
interface AutocannonResult {
  requests: { total: number; average: number };
  duration: number;
  non2xx: number;
  errors: number;
  timeouts: number;
}
const autocannon = createRequire(__filename)('autocannon') as Autocannon;

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN;

export async function loadPart(h: Harness, options: { seconds: number; readingsPerS: number }): Promise<PartResult> {
  const server = await h.startServer();
  const { engineer, f, device, topic } = await meterRunWithDevice(server);
  const failures: string[] = [];
  const figures: [string, string][] = [];
  const publisher = mqtt.connect({
    host: '127.0.0.1',
    port: server.mqttPort,
    username: device.username,
    password: device.password,
    protocolVersion: 4,
    clean: true,
    reconnectPeriod: 500,
  });
  publisher.on('error', () => undefined);
  let ticker: NodeJS.Timeout | undefined;
  try {
    await new Promise((r) => publisher.once('connect', r));
    // The steady ingest: every 100 ms a batch of readings (1 a reading apart), times ending near now.
    const perTick = Math.max(1, Math.round(options.readingsPerS / 10));
    const totalPlanned = perTick * 10 * (options.seconds * 3 + 30);
    let i = 0;
    let sent = 0;
    let acked = 0;
    let refused = 0;
    const t0 = Date.now() - totalPlanned * 10 - 60_000;
    ticker = setInterval(() => {
      const batch = [];
      for (let k = 0; k < perTick; k++, i++) batch.push({ t: t0 + i * 10, v: 10 + (i % 50), q: 'good' });
      sent += batch.length;
      publisher.publish(topic, JSON.stringify(batch), { qos: 1 }, (err) => (err ? refused++ : (acked += perTick)));
    }, 100);

    const month = new Date();
    const from = new Date(Date.UTC(month.getUTCFullYear(), month.getUTCMonth(), 1)).toISOString();
    const to = new Date(Date.UTC(month.getUTCFullYear(), month.getUTCMonth() + 1, 1)).toISOString();
    const routes: [string, string][] = [
      ['live board', '/api/live/board'],
      ['daily totals for a month', `/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=${from}&to=${to}`],
      ['alarms list', `/api/alarms?meterRunId=${f.meterRun.id}`],
    ];
    for (const [name, route] of routes) {
      const probe = await engineer.api.get(route);
      if (probe.status !== 200) failures.push(`${name}: GET ${route} answered ${probe.status} before the load`);
      const times: number[] = [];
      const instance = autocannon({
        url: `${server.url}${route}`,
        connections: 10,
        duration: options.seconds,
        headers: { authorization: `Bearer ${engineer.token}` },
      });
      instance.on('response', (_c, _status, _bytes, ms) => times.push(ms));
      const result = await instance;
      times.sort((a, b) => a - b);
      const line =
        `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, ` +
        `p99 ${percentile(times, 99).toFixed(1)} ms, ${(result.requests.total / result.duration).toFixed(0)} req/s, ` +
        `non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}`;
      say(`${name} (${route.split('?')[0]}): ${line}`);
      figures.push([name, line]);
      if (result.non2xx) failures.push(`${name}: ${result.non2xx} answers other than 2xx`);
      if (result.errors || result.timeouts)
        failures.push(`${name}: ${result.errors} errors, ${result.timeouts} timeouts`);
    }
    clearInterval(ticker);
    const settleMs = Date.now() + 10_000;
    while (acked + refused * perTick < sent && Date.now() < settleMs) await new Promise((r) => setTimeout(r, 100));
    say(`ingest during the load: ${sent} readings sent, ${acked} acknowledged`);
    figures.push([
      'ingest during the load',
      `${sent} readings sent (${options.readingsPerS}/s), ${acked} acknowledged`,
    ]);
    if (acked < sent) failures.push(`${sent - acked} readings sent during the load were not acknowledged`);
    if (server.exited()) failures.push(`the server process ended (${server.exited()})`);
    return { part: 'load', figures, failures };
  } finally {
    clearInterval(ticker);
    publisher.end(true);
    await server.stop();
  }
}
