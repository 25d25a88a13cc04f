import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import readline from 'node:readline';
import { Client } from 'pg';
import { until } from '../../tests/support/api';

/**
 * The job runner's lock between real processes on the test database: one runs the jobs, the other
 * waits, and takes over when the first is killed (its connection closes, PostgreSQL releases the
 * session lock). A key of the test's own, so servers of other tests on the same database do not compete.
 */
const root = path.resolve(__dirname, '..', '..');
const lockKey = 7_340_009_000 + Math.floor(Math.random() * 1000);

interface Runner {
  child: ChildProcess;
  lines: string[];
  ended: Promise<void>;
}
const runners: Runner[] = [];

function startRunner(name: string): Runner {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'jobs', 'runner-child.ts')], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: process.env.TEST_DATABASE_URL,
      RUNNER_NAME: name,
      RUNNER_POLL_MS: '200',
      RUNNER_LOCK_KEY: String(lockKey),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const lines: string[] = [];
  readline.createInterface({ input: child.stdout! }).on('line', (line) => lines.push(line));
  const runner = { child, lines, ended: new Promise<void>((resolve) => child.once('exit', () => resolve())) };
  runners.push(runner);
  return runner;
}

const said = (r: Runner, line: string) => (r.lines.includes(line) ? true : null);

afterAll(async () => {
  for (const r of runners) {
    if (r.child.exitCode === null && r.child.signalCode === null) r.child.kill('SIGTERM');
    await r.ended;
  }
});

it('runs the jobs in one process at a time and hands them over when the holder is killed', async () => {
  const first = startRunner('first');
  await until('the first process to take the lock', async () => said(first, 'running first'), 60_000);
  const second = startRunner('second');
  await until('the second process to try the lock', async () => said(second, 'tried second'), 60_000);
  // Several poll periods later the second still waits.
  await new Promise((r) => setTimeout(r, 1500));
  expect(second.lines).not.toContain('running second');

  // The lock is a session advisory lock held by exactly one backend.
  const db = new Client({ connectionString: process.env.TEST_DATABASE_URL });
  await db.connect();
  try {
    const held = await db.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM pg_locks
        WHERE locktype = 'advisory' AND granted AND ((classid::bigint << 32) | objid::bigint) = $1::bigint`,
      [String(lockKey)],
    );
    expect(held.rows[0].n).toBe(1);
  } finally {
    await db.end();
  }

  first.child.kill('SIGKILL');
  await first.ended;
  // Not a timing assertion: a generous ceiling for the take-over.
  await until('the second process to take over', async () => said(second, 'running second'), 60_000);

  // A clean stop releases the lock at once for the next process.
  second.child.kill('SIGTERM');
  await second.ended;
  expect(second.lines).toContain('stopped second');
  const third = startRunner('third');
  await until('a third process to take the freed lock', async () => said(third, 'running third'), 60_000);
}, 180_000);
