/**
 * The web client's figures (issue 15 item 4), measured on the export in dist/ (exported first when
 * older than its sources) and in Debian's headless Chromium:
 *   - the entry script raw / gzip / brotli, and the JavaScript a first visit loads (every script the
 *     page's HTML names) gzipped, for the live board (/) and the sign-in page, vs 450 KB;
 *   - drawing a 100 k-point trend with uPlot (the chart library of components/charts), vs 50 ms;
 *   - the live board's first meaningful paint: from navigation start until the first meter-run
 *     card is visible, signed in as the demo operator, with an empty browser cache and a warm one.
 * Usage: `tsx server/bench/web.bench.ts [results.json]` (TALLYRUN_WEB_DIR=<dir> for another export). The machine may be shared: the drawing
 * time is the median of several draws, the paint the median of several loads.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { chromium, type Browser } from 'playwright-core';

import { ensureCluster } from '../cli/postgres';
import { exportWebClient } from '../cli/web-export';
import { prepareDatabase } from '../db/prepare';
import { readEnv } from '../env';
import { startServer } from '../index';

const FIRST_LOAD_GOAL_KB = 450;
const DRAW_GOAL_MS = 50;
const TREND_POINTS = 100_000;
const DRAWS = 7;
const PAINT_LOADS = 5;

const root = path.resolve(__dirname, '..', '..');
/** TALLYRUN_WEB_DIR measures another export as it is (not re-exported), e.g. a copy kept still. */
const distDir = path.resolve(process.env.TALLYRUN_WEB_DIR ?? path.join(root, 'dist'));
/** The report is the command's answer to a person: plain lines on stdout, not log lines. */
const print = (line: string) => process.stdout.write(`${line}\n`);
const kb = (bytes: number) => bytes / 1024;
const verdict = (met: boolean) => (met ? 'met' : 'NOT met');
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

interface Sizes {
  rawBytes: number;
  gzipBytes: number;
  brBytes: number;
}

function sizesOf(file: string): Sizes {
  const raw = fs.readFileSync(file);
  return {
    rawBytes: raw.length,
    gzipBytes: zlib.gzipSync(raw, { level: 9 }).length,
    brBytes: zlib.brotliCompressSync(raw, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11 } }).length,
  };
}

/** Every script a page's HTML loads before it can draw (async route chunks it names included). */
function firstLoad(page: string) {
  const html = fs.readFileSync(path.join(distDir, page), 'utf8');
  const scripts = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1]);
  const sizes = scripts.map((src) => ({ src, ...sizesOf(path.join(distDir, src)) }));
  const total = (key: keyof Sizes) => sizes.reduce((sum, s) => sum + s[key], 0);
  return {
    page,
    scripts: sizes,
    rawBytes: total('rawBytes'),
    gzipBytes: total('gzipBytes'),
    brBytes: total('brBytes'),
  };
}

/** Draws a 100 k-point trend (value, min and max lines) with uPlot in a blank page; ms per draw. */
async function uplotDraw(browser: Browser) {
  const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  await page.setContent('<!DOCTYPE html><html><body style="margin:0"><div id="chart"></div></body></html>');
  await page.addStyleTag({ path: path.join(root, 'node_modules', 'uplot', 'dist', 'uPlot.min.css') });
  await page.addScriptTag({ path: path.join(root, 'node_modules', 'uplot', 'dist', 'uPlot.iife.min.js') });
  const times = await page.evaluate(
    async ({ points, draws }) => {
      type Plot = { destroy: () => void };
      const UPlot = (window as unknown as { uPlot: new (o: object, d: number[][], el: HTMLElement) => Plot }).uPlot;
      // One week at about 6 s steps, a slow swing with noise, as a DP trend looks.
      const xs = new Array<number>(points);
      const ys = new Array<number>(points);
      const lows = new Array<number>(points);
      const highs = new Array<number>(points);
      const start = Date.UTC(2026, 0, 5) / 1000;
      for (let i = 0; i < points; i++) {
        xs[i] = start + i * 6;
        ys[i] = 12_000 + 4_000 * Math.sin(i / 2_000) + 300 * Math.sin(i * 1.7);
        lows[i] = ys[i] - 150;
        highs[i] = ys[i] + 150;
      }
      const el = document.getElementById('chart')!;
      const result: number[] = [];
      for (let run = 0; run < draws; run++) {
        let drawn = 0;
        const started = performance.now();
        const plot = new UPlot(
          {
            width: 1400,
            height: 400,
            series: [{}, { stroke: '#333', width: 1 }, { stroke: '#999' }, { stroke: '#999' }],
            hooks: { draw: [() => (drawn = performance.now())] },
          },
          [xs, ys, lows, highs],
          el,
        );
        // uPlot commits its first draw in a microtask; wait for the draw hook.
        while (drawn === 0) await new Promise((resolve) => setTimeout(resolve, 0));
        result.push(drawn - started);
        plot.destroy();
      }
      return result;
    },
    { points: TREND_POINTS, draws: DRAWS },
  );
  await page.close();
  return { points: TREND_POINTS, drawsMs: times, firstMs: times[0], medianMs: median(times) };
}

/** Time from navigation start until the first meter-run card of the live board is visible. */
async function liveBoardPaint(browser: Browser, baseUrl: string, password: string) {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByTestId('sign-in-email').fill('operator@demo.tallyrun');
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('current-user').waitFor({ timeout: 60_000 });
  const cdp = await context.newCDPSession(page);
  const measure = async (cold: boolean) => {
    if (cold) await cdp.send('Network.clearBrowserCache');
    await page.goto(`${baseUrl}/`, { waitUntil: 'commit' });
    const handle = await page.waitForFunction(
      () => {
        const card = document.querySelector('[data-testid^="live-run-"]') as HTMLElement | null;
        return card && card.getBoundingClientRect().height > 0 ? performance.now() : null;
      },
      undefined,
      { polling: 'raf', timeout: 60_000 },
    );
    const cardMs = (await handle.jsonValue()) as number;
    const fcpMs = await page.evaluate(
      () => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null,
    );
    return { cardMs, fcpMs };
  };
  const cold: { cardMs: number; fcpMs: number | null }[] = [];
  const warm: { cardMs: number; fcpMs: number | null }[] = [];
  for (let i = 0; i < PAINT_LOADS; i++) {
    cold.push(await measure(true));
    warm.push(await measure(false));
  }
  await context.close();
  return {
    coldCacheMs: median(cold.map((r) => r.cardMs)),
    warmCacheMs: median(warm.map((r) => r.cardMs)),
    coldFirstContentfulPaintMs: median(cold.map((r) => r.fcpMs ?? NaN)),
    runs: { cold, warm },
  };
}

async function main() {
  const jsonPath = process.argv.slice(2).find((a) => !a.startsWith('--'));
  if (!process.env.TALLYRUN_WEB_DIR) exportWebClient(root, (line) => print(line));

  const html = fs.readFileSync(path.join(distDir, 'index.html'), 'utf8');
  const entrySrc = html.match(/<script[^>]*\ssrc="(\/_expo\/static\/js\/web\/entry-[^"]+\.js)"/)![1];
  const entry = { src: entrySrc, ...sizesOf(path.join(distDir, entrySrc)) };
  const pages = ['index.html', 'sign-in.html'].map(firstLoad);
  const worstFirstLoad = Math.max(...pages.map((p) => p.gzipBytes));
  const fonts = fs.existsSync(path.join(distDir, 'fonts'))
    ? fs.readdirSync(path.join(distDir, 'fonts')).filter((f) => f.endsWith('.woff2'))
    : [];
  const ttf = fs.readdirSync(distDir, { recursive: true }).filter((f) => String(f).endsWith('.ttf'));

  print('');
  print('Web client (issue 15 item 4)');
  print(
    `  entry script ${path.basename(entrySrc)}: ${kb(entry.rawBytes).toFixed(0)} KB raw, ` +
      `${kb(entry.gzipBytes).toFixed(0)} KB gzip, ${kb(entry.brBytes).toFixed(0)} KB brotli`,
  );
  for (const p of pages)
    print(
      `  first-load JS of ${p.page} (${p.scripts.length} scripts): ${kb(p.gzipBytes).toFixed(0)} KB gzip ` +
        `(${kb(p.brBytes).toFixed(0)} KB brotli) — goal ≤ ${FIRST_LOAD_GOAL_KB} KB gzip: ` +
        verdict(kb(p.gzipBytes) <= FIRST_LOAD_GOAL_KB),
    );
  print(`  fonts: ${fonts.length} WOFF2 files, ${ttf.length} TTF files in the export`);

  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  let draw;
  let paint;
  let server;
  try {
    draw = await uplotDraw(browser);
    print(
      `  uPlot, ${TREND_POINTS.toLocaleString('en-US')}-point trend: median ${draw.medianMs.toFixed(1)} ms ` +
        `(first ${draw.firstMs.toFixed(1)} ms) — goal ≤ ${DRAW_GOAL_MS} ms: ${verdict(draw.medianMs <= DRAW_GOAL_MS)}`,
    );

    // A database of its own with the demo scenario, and the server serving the export.
    const cluster = await ensureCluster({
      dataDir: path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun')),
      port: Number(process.env.TALLYRUN_PG_PORT ?? 54329),
      log: () => undefined,
    });
    const prepared = await prepareDatabase({
      adminUrl: cluster.url('postgres'),
      database: 'tallyrun_bench_web',
      secretsDir: cluster.secretsDir,
      fresh: true,
    });
    const password = process.env.TALLYRUN_DEMO_PASSWORD ?? 'tallyrun-demo';
    server = await startServer(
      readEnv({
        ...process.env,
        DATABASE_URL: prepared.serverUrl,
        PORT: '0',
        MQTT_PORT: '0',
        SMTP_PORT: '0',
        TALLYRUN_DEMO: 'on',
        TALLYRUN_SIMULATORS: 'off',
        TALLYRUN_DEMO_PASSWORD: password,
        TALLYRUN_DATA_DIR: fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-bench-web-')),
        TALLYRUN_WEB_DIR: distDir,
      }),
    );
    paint = await liveBoardPaint(browser, server.url, password);
    print(
      `  live board, first meter-run card visible from navigation start: ${paint.coldCacheMs.toFixed(0)} ms ` +
        `with an empty cache (first contentful paint ${paint.coldFirstContentfulPaintMs.toFixed(0)} ms), ` +
        `${paint.warmCacheMs.toFixed(0)} ms with a warm one — no goal set: measured`,
    );
  } finally {
    await browser.close();
    await server?.stop();
  }

  if (jsonPath) {
    const results = {
      measuredAt: new Date().toISOString(),
      machine: { cpus: os.cpus().length, cpu: os.cpus()[0]?.model, node: process.version },
      entryScript: entry,
      firstLoad: pages.map((p) => ({ ...p, goalGzipBytes: FIRST_LOAD_GOAL_KB * 1024 })),
      firstLoadMet: kb(worstFirstLoad) <= FIRST_LOAD_GOAL_KB,
      fonts: { woff2: fonts, ttf },
      uplotDraw: { ...draw, goalMs: DRAW_GOAL_MS, met: draw!.medianMs <= DRAW_GOAL_MS },
      liveBoardPaint: paint,
    };
    fs.writeFileSync(jsonPath, `${JSON.stringify(results, null, 2)}\n`);
    print(`  results written to ${jsonPath}`);
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    process.stderr.write(`${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`);
    process.exit(1);
  },
);
