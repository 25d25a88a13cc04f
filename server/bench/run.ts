/**
 * `npm run bench [-- --quick] [-- --json path]`: every benchmark of issue 15 in one command, each
 * on a fresh database of its own in the private PostgreSQL cluster with its own server and broker
 * (the benchmarks start them; nothing shared with a running Tallyrun), one after the other so
 * they do not measure each other:
 *   engine (shared/bench/engine.bench.ts), ingest by MQTT and CSV (ingest.bench.ts), queries
 *   (queries.bench.ts), recompute (recompute.bench.ts) and web (web.bench.ts).
 * Prints ONE table (figure, its base measured in the same run, ratio, goal, met / not met) and
 * writes it as JSON (default .tallyrun/bench/latest.json); each benchmark's own output is kept
 * beside it (<name>.log). --quick scales the sizes down (said in the table's title) to finish in
 * about two minutes on a quiet 2-core machine. A benchmark that fails is reported in the table and
 * the command exits 1 after the others ran.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { BenchFigure } from './bench-kit';

const root = path.resolve(__dirname, '..', '..');
const quick = process.argv.includes('--quick');
const jsonArg = process.argv.indexOf('--json');
const jsonPath = path.resolve(
  jsonArg > 0 && process.argv[jsonArg + 1] ? process.argv[jsonArg + 1] : path.join(root, '.tallyrun/bench/latest.json'),
);
const outDir = path.dirname(jsonPath);
const print = (line: string) => process.stdout.write(`${line}\n`);
const progress = (line: string) => process.stderr.write(`${line}\n`);

interface BenchResult {
  name: string;
  seconds: number;
  ok: boolean;
  error?: string;
  figures: BenchFigure[];
}

/** Runs one benchmark in a child node (tsx loader); its output goes to <outDir>/<name>.log. */
function runChild(
  name: string,
  file: string,
  args: string[],
): Promise<{ ok: boolean; stdout: string; seconds: number }> {
  const started = performance.now();
  const log = fs.createWriteStream(path.join(outDir, `${name}.log`));
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, file), ...args], {
      cwd: root,
      env: { ...process.env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'error' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    child.stdout.on('data', (chunk: Buffer) => {
      stdout += chunk.toString();
      log.write(chunk);
    });
    child.stderr.on('data', (chunk: Buffer) => log.write(chunk));
    child.on('close', (code) => {
      log.end();
      resolve({ ok: code === 0, stdout, seconds: (performance.now() - started) / 1000 });
    });
  });
}

const num = (s: string) => Number(s.replace(/,/g, ''));
const unitValue = (s: string) => (s.endsWith('M') ? Number(s.slice(0, -1)) * 1e6 : Number(s.slice(0, -1)) * 1e3);

/** The engine benchmark's lines: `case  evals/s  goal  ratio`. */
function engineFigures(stdout: string): BenchFigure[] {
  const out: BenchFigure[] = [];
  for (const line of stdout.split('\n')) {
    const m = line.match(/^(.+?)\s+([\d.]+[kM])\s+(—|[\d.]+[kM])\s+(—|[\d.]+×)$/);
    if (!m) continue;
    const value = unitValue(m[2]);
    const goal = m[3] === '—' ? null : unitValue(m[3]);
    out.push({
      figure: `engine: ${m[1].trim()}`,
      value,
      unit: 'evals/s',
      goal: goal === null ? null : `≥ ${m[3]}/s`,
      met: goal === null ? null : value >= goal,
    });
  }
  return out;
}

/** The ingest benchmark's lines (server/bench/ingest.bench.ts prints them; no JSON of its own). */
function ingestFigures(stdout: string): BenchFigure[] {
  const out: BenchFigure[] = [];
  const find = (re: RegExp) => stdout.match(re);
  const bareSingle = find(/MQTT single readings, bare broker \(base\)\s+([\d,]+)/);
  const single = find(/MQTT single readings committed\s+([\d,]+) readings\/s/);
  if (bareSingle && single) {
    const value = num(single[1]);
    const base = num(bareSingle[1]);
    out.push({
      figure: 'MQTT single readings, QoS 1, committed',
      value,
      unit: 'readings/s',
      base: { name: 'bare aedes broker', value: base },
      ratio: value / base,
      goal: '≥ 0.70 × bare',
      met: value / base >= 0.7,
    });
  }
  const bareGateway = find(/MQTT batches of 50, 1 connection, 64 in flight, bare broker \(base\)\s+([\d,]+)/);
  const gateway = find(/MQTT batches of 50, 1 connection committed\s+([\d,]+) readings\/s/);
  if (bareGateway && gateway) {
    const value = num(gateway[1]);
    const base = num(bareGateway[1]);
    out.push({
      figure: 'MQTT batches of 50, 1 connection, committed',
      value,
      unit: 'readings/s',
      base: { name: 'bare aedes broker', value: base },
      ratio: value / base,
      goal: '≥ 0.35 × bare and ≥ 150,000/s',
      met: value / base >= 0.35 && value >= 150_000,
    });
  }
  const bareFour = find(/MQTT batches of 50, 4 connections, bare broker \(base\)\s+([\d,]+)/);
  const four = find(/MQTT batches of 50, 4 connections committed\s+([\d,]+) readings\/s/);
  if (bareFour && four) {
    const value = num(four[1]);
    const base = num(bareFour[1]);
    out.push({
      figure: 'MQTT batches of 50, 4 connections, committed',
      value,
      unit: 'readings/s',
      base: { name: 'bare aedes broker', value: base },
      ratio: value / base,
      goal: null,
      met: null,
    });
  }
  const sustained = find(
    /sustained batches, 1 connection, ([\d.]+) min: ([\d,]+) readings\/s, resident memory (\d+) MB at start, peak (\d+) MB/,
  );
  if (sustained) {
    out.push({
      figure: `peak resident memory, ${sustained[1]} min of batches on 1 connection`,
      value: num(sustained[4]),
      unit: 'MB',
      base: { name: 'at start', value: num(sustained[3]) },
      ratio: num(sustained[4]) / num(sustained[3]),
      goal: 'bounded (reported)',
      met: null,
      note: `${sustained[2]} readings/s sustained; the publisher runs in the same process`,
    });
  }
  const csv = find(/CSV import over HTTP\s+([\d,]+) rows\/s/);
  const copy = find(/raw COPY of the same rows \(base\)\s+([\d,]+)/);
  if (csv && copy) {
    const value = num(csv[1]);
    const base = num(copy[1]);
    out.push({
      figure: 'CSV import over HTTP',
      value,
      unit: 'rows/s',
      base: { name: 'raw COPY of the same rows', value: base },
      ratio: value / base,
      goal: '≥ 0.50 × COPY',
      met: value / base >= 0.5,
    });
  }
  return out;
}

/** The web benchmark's JSON (server/bench/web.bench.ts), read tolerantly: a missing part is skipped. */
function webFigures(file: string): BenchFigure[] {
  if (!fs.existsSync(file)) return [];
  const web = JSON.parse(fs.readFileSync(file, 'utf8')) as {
    firstLoad?: { page: string; gzipBytes: number; goalGzipBytes?: number }[];
    uplotDraw?: { medianMs: number; goalMs?: number };
    liveBoardPaint?: { coldCacheMs?: number; warmCacheMs?: number };
  };
  const out: BenchFigure[] = [];
  for (const p of web.firstLoad ?? []) {
    const kb = p.gzipBytes / 1024;
    out.push({
      figure: `web: first-load JavaScript of ${p.page}, gzip`,
      value: kb,
      unit: 'KB',
      goal: '≤ 450 KB',
      met: kb <= 450,
    });
  }
  if (web.uplotDraw) {
    out.push({
      figure: 'web: 100 k-point trend drawn (median)',
      value: web.uplotDraw.medianMs,
      unit: 'ms',
      goal: '≤ 50 ms',
      met: web.uplotDraw.medianMs <= 50,
    });
  }
  const paint = web.liveBoardPaint;
  if (paint?.coldCacheMs !== undefined) {
    out.push({
      figure: 'web: live board, first meter-run card (empty cache)',
      value: paint.coldCacheMs,
      unit: 'ms',
      ...(paint.warmCacheMs !== undefined ? { base: { name: 'warm cache', value: paint.warmCacheMs } } : {}),
      goal: null,
      met: null,
    });
  }
  return out;
}

const show = (x: number, unit: string) => {
  const digits = unit === 'ms' || unit === 's' ? 1 : 0;
  return `${x.toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: digits })} ${unit}`;
};

function table(results: BenchResult[]) {
  const rows = [['figure', 'value', 'base (same run)', 'ratio', 'goal', 'verdict']];
  for (const r of results) {
    if (!r.ok) rows.push([`${r.name}: FAILED (${r.error ?? 'see its log'})`, '', '', '', '', 'NOT met']);
    for (const f of r.figures) {
      rows.push([
        f.figure,
        show(f.value, f.unit),
        f.base ? `${show(f.base.value, f.unit)} (${f.base.name})` : '—',
        f.ratio === undefined ? '—' : `${f.ratio.toFixed(2)} ×`,
        f.goal ?? '—',
        f.met === null ? 'measured' : f.met ? 'met' : 'NOT met',
      ]);
    }
  }
  const widths = rows[0].map((_, c) => Math.max(...rows.map((row) => row[c].length)));
  return rows.map((row) =>
    row.map((cell, c) => (c === 1 ? cell.padStart(widths[c]) : cell.padEnd(widths[c]))).join('  '),
  );
}

async function main() {
  fs.mkdirSync(outDir, { recursive: true });
  const flag = quick ? ['--quick'] : [];
  const results: BenchResult[] = [];
  const benches: { name: string; run: () => Promise<BenchResult> }[] = [
    {
      name: 'engine',
      run: async () => {
        const r = await runChild('engine', 'shared/bench/engine.bench.ts', []);
        return { name: 'engine', seconds: r.seconds, ok: r.ok, figures: engineFigures(r.stdout) };
      },
    },
    {
      name: 'ingest',
      run: async () => {
        const r = await runChild('ingest', 'server/bench/ingest.bench.ts', flag);
        return { name: 'ingest', seconds: r.seconds, ok: r.ok, figures: ingestFigures(r.stdout) };
      },
    },
    ...(['queries', 'recompute'] as const).map((name) => ({
      name,
      run: async (): Promise<BenchResult> => {
        const file = path.join(outDir, `${name}.json`);
        fs.rmSync(file, { force: true });
        const r = await runChild(name, `server/bench/${name}.bench.ts`, [...flag, '--plans', '--json', file]);
        const figures = fs.existsSync(file)
          ? (JSON.parse(fs.readFileSync(file, 'utf8')) as { figures: BenchFigure[] }).figures
          : [];
        return { name, seconds: r.seconds, ok: r.ok, figures };
      },
    })),
    {
      name: 'web',
      run: async () => {
        const file = path.join(outDir, 'web.json');
        fs.rmSync(file, { force: true });
        const r = await runChild('web', 'server/bench/web.bench.ts', [file]);
        return { name: 'web', seconds: r.seconds, ok: r.ok, figures: webFigures(file) };
      },
    },
  ];
  const only = process.argv.indexOf('--only');
  const chosen = only > 0 ? process.argv[only + 1].split(',') : null;
  for (const b of benches) {
    if (chosen && !chosen.includes(b.name)) continue;
    progress(`bench: ${b.name} …`);
    let result: BenchResult;
    try {
      result = await b.run();
    } catch (err) {
      result = { name: b.name, seconds: 0, ok: false, error: String(err), figures: [] };
    }
    if (!result.ok && !result.error) result.error = `exited with an error, see ${path.join(outDir, `${b.name}.log`)}`;
    progress(`bench: ${b.name} ${result.ok ? 'done' : 'FAILED'} in ${result.seconds.toFixed(0)} s`);
    results.push(result);
  }
  const machine = {
    cpus: os.cpus().length,
    cpu: os.cpus()[0]?.model ?? '',
    memoryGB: Math.round(os.totalmem() / 1024 ** 3),
    loadAverage: os.loadavg(),
    node: process.version,
  };
  print('');
  print(
    `Tallyrun benchmarks${quick ? ' — QUICK: sizes scaled down (ingest 0.25 min sustained, trend 1 day, recompute 3 days with its goal scaled)' : ''}`,
  );
  print(
    `machine: ${machine.cpus} cores (${machine.cpu}), ${machine.memoryGB} GB, node ${machine.node}, load average ${machine.loadAverage.map((l) => l.toFixed(1)).join(' ')} at the end — compare ratios measured in the same run`,
  );
  print('');
  for (const line of table(results)) print(line);
  fs.writeFileSync(
    jsonPath,
    `${JSON.stringify({ measuredAt: new Date().toISOString(), quick, machine, results }, null, 2)}\n`,
  );
  print(`\nwritten to ${path.relative(process.cwd(), jsonPath) || jsonPath}; each benchmark's own output beside it`);
  if (results.some((r) => !r.ok)) process.exitCode = 1;
}

void main();
