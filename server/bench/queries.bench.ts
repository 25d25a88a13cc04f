/**
 * Query latency (issue 15 item 3), on a database of its own, each figure beside its base measured
 * in the same run:
 *   - daily totals of 100 meter runs × 365 days, one meter run per request over HTTP (p50 / p95),
 *     vs the same SQL through the repository without HTTP (goals: p95 ≤ 50 ms, ≤ 3 × the SQL);
 *   - a one-week 1-Hz trend (604,800 readings per transmitter, seeded with COPY), downsampled on the
 *     server to 600 slices, over HTTP vs the same bucket SQL (goal ≤ 100 ms).
 * `--plans` prints EXPLAIN (ANALYZE, BUFFERS) of each query as the repository sends it.
 * Usage: `tsx server/bench/queries.bench.ts [--quick] [--plans] [--json path]`. The machine may be
 * shared: compare ratios measured in the same run.
 */
import type { Pool } from 'pg';
import { componentLogger } from '../log';
import { meterRunHistoryRepository } from '../resources/meter-run-history/repository';
import { benchServer, copyOneHertz, percentile, print, writeFigures, type BenchFigure } from './bench-kit';

const quick = process.argv.includes('--quick');
const showPlans = process.argv.includes('--plans');
const RUNS = 100;
const DAYS = 365;
/** The trend's window: a week at 1 Hz (one day in --quick). */
const TREND_DAYS = quick ? 1 : 7;
const REPEATS = quick ? 8 : 40;
/** Requests per pass over the 100 meter runs' totals (warm-up, then two passes each way). */
const TOTALS_PASSES = quick ? 1 : 2;
const log = componentLogger('bench');

/** A pool that remembers the last statement it was asked, so EXPLAIN runs exactly what the repository sends. */
function recordingPool(pool: Pool) {
  const last: { text: string; values: unknown[] } = { text: '', values: [] };
  const proxy = new Proxy(pool, {
    get(target, key, receiver) {
      if (key !== 'query') return Reflect.get(target, key, receiver);
      return (text: string, values: unknown[]) => {
        last.text = text;
        last.values = values;
        return target.query(text, values);
      };
    },
  });
  return { proxy, last };
}

async function explain(pool: Pool, statement: { text: string; values: unknown[] }) {
  const { rows } = await pool.query<{ 'QUERY PLAN': string }>(
    `EXPLAIN (ANALYZE, BUFFERS) ${statement.text}`,
    statement.values,
  );
  return rows.map((r) => r['QUERY PLAN']).join('\n');
}

async function timed(n: number, fn: (i: number) => Promise<unknown>): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const s = performance.now();
    await fn(i);
    out.push(performance.now() - s);
  }
  return out;
}

async function main() {
  const bench = await benchServer('tallyrun_bench_queries');
  const { pool, api, site } = bench;
  const figures: BenchFigure[] = [];
  const plans: Record<string, string> = {};
  try {
    // 1. Daily totals: 100 meter runs × 365 stored days.
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
    await pool.query('ANALYZE daily_totals');
    const fromMs = day0;
    const toMs = day0 + DAYS * 86_400_000;
    const from = new Date(fromMs).toISOString();
    const to = new Date(toMs).toISOString();
    const totalsOverHttp = async (i: number) => {
      const list = await api<unknown[]>(
        'GET',
        `/api/meter-runs/${runIds[i % RUNS]}/totals?interval=day&from=${from}&to=${to}`,
      );
      if (list.length !== DAYS) throw new Error(`expected ${DAYS} days, got ${list.length}`);
    };
    const recording = recordingPool(pool);
    const repository = meterRunHistoryRepository(recording.proxy);
    const totalsBySql = async (i: number) => {
      const list = await repository.totals(runIds[i % RUNS], 'day', fromMs, toMs);
      if (list.length !== DAYS) throw new Error(`expected ${DAYS} days, got ${list.length}`);
    };
    // Warm both paths (JIT, connections, the table's pages), then interleave so load spikes hit both alike.
    await timed(quick ? 20 : RUNS, totalsOverHttp);
    await timed(quick ? 20 : RUNS, totalsBySql);
    const http: number[] = [];
    const sql: number[] = [];
    for (let pass = 0; pass < TOTALS_PASSES; pass++) {
      http.push(...(await timed(RUNS, totalsOverHttp)));
      sql.push(...(await timed(RUNS, totalsBySql)));
    }
    plans['daily totals of one meter run, 365 days'] = await explain(pool, recording.last);
    const httpP95 = percentile(http, 95);
    const sqlP95 = percentile(sql, 95);
    figures.push({
      figure: `daily totals, ${RUNS} runs × ${DAYS} days, HTTP p95`,
      value: httpP95,
      unit: 'ms',
      base: { name: 'same SQL, no HTTP, p95', value: sqlP95 },
      ratio: httpP95 / sqlP95,
      goal: '≤ 50 ms and ≤ 3 × SQL',
      met: httpP95 <= 50 && httpP95 / sqlP95 <= 3,
      note: `HTTP p50 ${percentile(http, 50).toFixed(1)} ms, SQL p50 ${percentile(sql, 50).toFixed(1)} ms, ${http.length} requests`,
    });

    // 2. A 1-Hz trend downsampled on the server.
    const trendRun = await bench.makeRun('TREND');
    const trendTo = Date.UTC(2026, 0, 1);
    const trendFrom = trendTo - TREND_DAYS * 86_400_000;
    const t0 = performance.now();
    const seeded = await copyOneHertz(pool, trendRun, trendFrom, trendTo);
    const copyMs = performance.now() - t0;
    const trendUrl = `/api/meter-runs/${trendRun.run.id}/trend?from=${new Date(trendFrom).toISOString()}&to=${new Date(trendTo).toISOString()}`;
    const trendOverHttp = async () => {
      const trend = await api<{ series: { points: { count: number }[] }[] }>('GET', trendUrl);
      const counted = trend.series.reduce((n, s) => n + s.points.reduce((m, p) => m + p.count, 0), 0);
      if (counted !== seeded) throw new Error(`the trend counted ${counted} readings of ${seeded}`);
    };
    const bucketsBySql = async () => {
      for (const t of [trendRun.dp, trendRun.pt, trendRun.tt]) {
        await repository.readingBuckets(t.id, trendFrom, trendTo, 600);
      }
    };
    await trendOverHttp();
    await bucketsBySql();
    const trendHttp: number[] = [];
    const trendSql: number[] = [];
    for (let i = 0; i < REPEATS; i++) {
      trendHttp.push(...(await timed(1, trendOverHttp)));
      trendSql.push(...(await timed(1, bucketsBySql)));
    }
    plans[`trend of one transmitter, ${TREND_DAYS} days at 1 Hz, 600 slices`] = await explain(pool, recording.last);
    const trendP95 = percentile(trendHttp, 95);
    const trendSqlP95 = percentile(trendSql, 95);
    figures.push({
      figure: `${TREND_DAYS === 7 ? 'one-week' : `${TREND_DAYS}-day`} 1-Hz trend (3 × ${fmt(seeded / 3)} readings), HTTP p95`,
      value: trendP95,
      unit: 'ms',
      base: { name: 'same bucket SQL, no HTTP, p95', value: trendSqlP95 },
      ratio: trendP95 / trendSqlP95,
      goal: '≤ 100 ms',
      met: trendP95 <= 100,
      note: `HTTP p50 ${percentile(trendHttp, 50).toFixed(1)} ms, ${REPEATS} requests; ${fmt(seeded)} readings seeded by COPY in ${(copyMs / 1000).toFixed(1)} s`,
    });

    print(`\nTallyrun query benchmark${quick ? ` (quick: the trend covers ${TREND_DAYS} days, not 7)` : ''}`);
    for (const f of figures) {
      print(
        `  ${f.figure.padEnd(58)} ${f.value.toFixed(1).padStart(8)} ${f.unit}   base ${f.base?.value.toFixed(1)} ${f.unit} (${f.base?.name}), ratio ${f.ratio?.toFixed(2)}, goal ${f.goal}: ${f.met ? 'met' : 'NOT met'}`,
      );
      if (f.note) print(`     ${f.note}`);
    }
    if (showPlans) {
      for (const [name, plan] of Object.entries(plans)) print(`\n  plan — ${name}:\n${plan.replace(/^/gm, '    ')}`);
    }
    writeFigures('queries', figures, { quick, plans });
  } finally {
    await bench.stop();
  }
}

const fmt = (x: number) => Math.round(x).toLocaleString('en-US');

main().catch((err) => {
  log.fatal({ err }, 'the query benchmark failed');
  process.exit(1);
});
