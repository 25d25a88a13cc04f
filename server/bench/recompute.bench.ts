/**
 * Recomputing a meter-month at 1 Hz (issue 15 item 3) while live ingest runs, on a database of its
 * own: three transmitters × 30 days × 86,400 s ≈ 7.8 M readings are COPYed, every hour of the month
 * is queued as the hourly sweep queues it, and the server's own history worker recomputes them
 * (hourly records, contract days and the month; goal ≤ 15 s). Meanwhile one MQTT connection
 * publishes batches of 50 readings (64 in flight) to another meter run: its rate while the
 * recompute runs is set beside its rate just before, measured in the same run (the base).
 * Usage: `tsx server/bench/recompute.bench.ts [--quick] [--json path]` (--quick: 3 days, not 30);
 * add `node --cpu-prof` (`NODE_OPTIONS=--cpu-prof`) to see where the time goes.
 */
import mqtt from 'mqtt';
import { hourStartsBetween } from '../../shared/history/contract-day';
import { queueHourStarts } from '../history/history-repository';
import { componentLogger } from '../log';
import { benchServer, copyOneHertz, print, writeFigures, type BenchFigure, type BenchRun } from './bench-kit';

const quick = process.argv.includes('--quick');
const DAYS = quick ? 3 : 30;
/** How long the live rate is measured alone, before the recompute. */
const LIVE_ALONE_MS = quick ? 4_000 : 10_000;
const GOAL_S = 15 * (DAYS / 30);
const log = componentLogger('bench');
const fmt = (x: number) => Math.round(x).toLocaleString('en-US');

/** One MQTT connection publishing batches of 50 readings of a meter run, 64 in flight, until stopped. */
async function liveLoad(port: number, username: string, password: string, run: BenchRun, fromMs: number) {
  const client = await new Promise<mqtt.MqttClient>((resolve, reject) => {
    const c = mqtt.connect({ host: '127.0.0.1', port, protocolVersion: 4, username, password, reconnectPeriod: 0 });
    c.once('connect', () => resolve(c));
    c.once('error', reject);
  });
  const acked: number[] = [];
  let stopped = false;
  let next = 0;
  let inFlight = 0;
  let finished: () => void = () => undefined;
  const drained = new Promise<void>((resolve) => (finished = resolve));
  const tags = [run.dp.tag, run.pt.tag, run.tt.tag];
  const values = [20, 5, 290];
  const pump = () => {
    while (!stopped && inFlight < 64) {
      const k = next++;
      const tr = k % 3;
      const first = fromMs + Math.floor(k / 3) * 50 * 100;
      const payload = JSON.stringify(
        Array.from({ length: 50 }, (_, j) => ({ t: first + j * 100, v: values[tr], q: 'good' })),
      );
      inFlight++;
      client.publish(`tallyrun/BENCH/${tags[tr]}`, payload, { qos: 1 }, (err) => {
        inFlight--;
        if (err) log.error({ err }, 'a live publish failed');
        else acked.push(performance.now());
        if (stopped && inFlight === 0) finished();
        else pump();
      });
    }
  };
  pump();
  /** Readings acknowledged per second in [fromMs, toMs) of performance.now(). */
  const rateBetween = (from: number, to: number) =>
    (acked.filter((t) => t >= from && t < to).length * 50) / ((to - from) / 1000);
  return {
    rateBetween,
    async stop() {
      stopped = true;
      if (inFlight > 0) await drained;
      client.end(true);
    },
  };
}

async function main() {
  const bench = await benchServer('tallyrun_bench_recompute');
  const { pool, api, server } = bench;
  const figures: BenchFigure[] = [];
  try {
    const month = await bench.makeRun('MONTH');
    const live = await bench.makeRun('LIVE');
    const device = await api<{ username: string; password: string }>('POST', '/api/devices', {
      name: 'bench RTU',
      siteId: bench.site.id,
    });
    // The month before last (a finished month), in UTC: the site's zone, contract hour 0.
    const now = new Date();
    const monthStart = Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 2, 1);
    const monthEnd = monthStart + DAYS * 86_400_000;
    const t0 = performance.now();
    const seeded = await copyOneHertz(pool, month, monthStart, monthEnd);
    const copyS = (performance.now() - t0) / 1000;
    print(`  seeded ${fmt(seeded)} readings by COPY in ${copyS.toFixed(1)} s`);

    // Live ingest alone, then with the recompute.
    const load = await liveLoad(server.mqttPort, device.username, device.password, live, Date.now() - 6 * 3600_000);
    await new Promise((r) => setTimeout(r, 1000)); // warm-up
    const aloneFrom = performance.now();
    await new Promise((r) => setTimeout(r, LIVE_ALONE_MS));
    const aloneTo = performance.now();
    const hours = hourStartsBetween(monthStart, monthEnd, 'UTC');
    const pending = async () =>
      (
        await pool.query<{ n: number }>('SELECT count(*)::int AS n FROM stale_hours WHERE meter_run_id = $1', [
          month.run.id,
        ])
      ).rows[0].n;
    const started = performance.now();
    await queueHourStarts(pool, month.run.id, hours, { cause: 'scheduled', reference: null });
    while ((await pending()) > 0) await new Promise((r) => setTimeout(r, 100));
    const recomputeS = (performance.now() - started) / 1000;
    const duringTo = performance.now();
    await load.stop();
    const { rows } = await pool.query<{ records: number; days: number; months: number }>(
      `SELECT (SELECT count(*)::int FROM hourly_records WHERE meter_run_id = $1) AS records,
              (SELECT count(*)::int FROM daily_totals WHERE meter_run_id = $1) AS days,
              (SELECT count(*)::int FROM monthly_totals WHERE meter_run_id = $1) AS months`,
      [month.run.id],
    );
    if (rows[0].records !== hours.length)
      throw new Error(`expected ${hours.length} hourly records, got ${rows[0].records}`);
    const aloneRate = load.rateBetween(aloneFrom, aloneTo);
    const duringRate = load.rateBetween(started, duringTo);
    figures.push({
      figure: `recompute one meter-month at 1 Hz (${DAYS} days, ${fmt(seeded)} readings)`,
      value: recomputeS,
      unit: 's',
      goal: `≤ ${GOAL_S.toFixed(1)} s`,
      met: recomputeS <= GOAL_S,
      note: `${rows[0].records} hourly records, ${rows[0].days} days, ${rows[0].months} month(s); includes the worker's 1 s quiet time; live ingest running`,
    });
    figures.push({
      figure: 'live ingest during the recompute (1 connection, batches of 50)',
      value: duringRate,
      unit: 'readings/s',
      base: { name: 'live ingest just before, alone', value: aloneRate },
      ratio: duringRate / aloneRate,
      goal: null,
      met: null,
      note: 'the recompute must not starve live ingest: every publish is still acknowledged after its commit',
    });
    print(
      `\nTallyrun recompute benchmark${quick ? ` (quick: ${DAYS} days, not 30; goal scaled to ${GOAL_S.toFixed(1)} s)` : ''}`,
    );
    print(
      `  recompute ${DAYS} days × 3 transmitters at 1 Hz (${fmt(seeded)} readings): ${recomputeS.toFixed(1)} s (goal ≤ ${GOAL_S.toFixed(1)} s: ${recomputeS <= GOAL_S ? 'met' : 'NOT met'}); ${rows[0].records} hourly records, ${rows[0].days} days, ${rows[0].months} month(s)`,
    );
    print(
      `  live ingest: ${fmt(aloneRate)} readings/s alone, ${fmt(duringRate)} readings/s during the recompute (ratio ${(duringRate / aloneRate).toFixed(2)})`,
    );
    writeFigures('recompute', figures, { quick, days: DAYS, copyS });
  } finally {
    await bench.stop();
  }
}

main().catch((err) => {
  log.fatal({ err }, 'the recompute benchmark failed');
  process.exit(1);
});
