/**
 * `npm run test:reliability` (issue 12, "What to prove"): on a PostgreSQL cluster of its own (never the shared
 * one), runs in sequence
 *   outage — PostgreSQL stopped and started under MQTT QoS 1 and a CSV import (tests/reliability/outage.ts),
 *   kill   — kill -9 of the server during a QoS 1 load, publisher ledger against the database (kill.ts),
 *   load   — autocannon against read routes while ingest runs (load.ts),
 * prints what it tried and found, a summary table at the end, and exits 1 when a check failed.
 *
 *   npm run test:reliability -- [--only outage|kill|load] [--quick] [--n 1000000]
 *
 * --quick: 100 000 readings in the kill part and 5 s a route in the load part (else 1 000 000 and 15 s).
 */
import { parseArgs } from 'node:util';
import { openHarness, say, type Harness } from './harness';
import { killPart } from './kill';
import { loadPart } from './load';
import { outagePart, type PartResult } from './outage';

const parts = ['outage', 'kill', 'load'] as const;
type Part = (typeof parts)[number];

function summary(results: PartResult[]) {
  const rows: [string, string, string][] = [['part', 'figure', 'value']];
  for (const r of results) {
    for (const [figure, value] of r.figures) rows.push([r.part, figure, value]);
    rows.push([r.part, 'result', r.failures.length ? `FAILED: ${r.failures.join('; ')}` : 'passed']);
  }
  const widths = [0, 1].map((c) => Math.max(...rows.map((row) => row[c].length)));
  const out = rows.map((row) => `${row[0].padEnd(widths[0])} | ${row[1].padEnd(widths[1])} | ${row[2]}`);
  out.splice(1, 0, `${'-'.repeat(widths[0])}-+-${'-'.repeat(widths[1])}-+-${'-'.repeat(20)}`);
  process.stdout.write(`\n${out.join('\n')}\n\n`);
}

async function main(): Promise<number> {
  const { values } = parseArgs({
    options: { only: { type: 'string' }, quick: { type: 'boolean', default: false }, n: { type: 'string' } },
  });
  if (values.only && !parts.includes(values.only as Part))
    throw new Error(`--only: "${values.only}" must be one of ${parts.join(', ')}`);
  const readings = Number(values.n ?? (values.quick ? 100_000 : 1_000_000));
  if (!Number.isInteger(readings) || readings < 1000)
    throw new Error(`--n: "${values.n}" must be a whole number ≥ 1000`);
  const chosen = values.only ? [values.only as Part] : [...parts];
  const port = Number(process.env.TALLYRUN_RELIABILITY_PG_PORT ?? 54391);

  let harness: Harness | null = null;
  // Ctrl-C: stop the servers and the cluster this run started before leaving.
  process.once('SIGINT', () => {
    say('interrupted: cleaning up');
    void (harness?.cleanup() ?? Promise.resolve()).finally(() => process.exit(130));
  });
  const results: PartResult[] = [];
  try {
    harness = await openHarness({ port });
    for (const part of chosen) {
      say(`— part ${part} —`);
      try {
        if (part === 'outage')
          results.push(
            await outagePart(harness, {
              messages: Number(process.env.TALLYRUN_RELIABILITY_MESSAGES ?? 3000),
              csvLines: Number(process.env.TALLYRUN_RELIABILITY_CSV_LINES ?? 60_000),
            }),
          );
        if (part === 'kill') results.push(await killPart(harness, { readings }));
        if (part === 'load')
          results.push(await loadPart(harness, { seconds: values.quick ? 5 : 15, readingsPerS: 2000 }));
      } catch (err) {
        results.push({
          part,
          figures: [],
          failures: [`could not run: ${err instanceof Error ? err.message : String(err)}`],
        });
      }
    }
  } finally {
    await harness?.cleanup();
  }
  summary(results);
  const failed = results.filter((r) => r.failures.length);
  say(failed.length ? `FAILED: ${failed.map((r) => r.part).join(', ')}` : `passed: ${chosen.join(', ')}`);
  return failed.length ? 1 : 0;
}

void main().then(
  (code) => process.exit(code),
  (err) => {
    say(`could not run: ${err instanceof Error ? err.stack : String(err)}`);
    process.exit(1);
  },
);
