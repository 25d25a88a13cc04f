import { spawn } from 'node:child_process';
import path from 'node:path';

interface Check {
  name: string;
  command: string;
  args: string[];
  /** What to run to see the problems again. */
  rerun: string;
}

const checks: Check[] = [
  { name: 'the type check', command: 'tsc', args: ['--noEmit', '-p', 'tsconfig.json'], rerun: 'npm run typecheck' },
  { name: 'the linter', command: 'eslint', args: ['.', '--max-warnings', '0'], rerun: 'npm run lint' },
  {
    name: 'the format check',
    command: 'prettier',
    args: ['--check', '.', '--log-level', 'warn'],
    rerun: 'npm run format',
  },
];

/**
 * Runs the type check, the linter and the format check side by side (they are independent and
 * the machine has two cores), prints the output of any that failed, and says how to rerun it.
 */
export async function runStaticChecks(root: string, log: (line: string) => void) {
  const began = Date.now();
  const results = await Promise.all(
    checks.map(
      (check) =>
        new Promise<{ check: Check; ok: boolean; output: string }>((resolve) => {
          const child = spawn(path.join(root, 'node_modules', '.bin', check.command), check.args, { cwd: root });
          let output = '';
          child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
          child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
          child.on('error', (err) => resolve({ check, ok: false, output: String(err) }));
          child.on('close', (code) => resolve({ check, ok: code === 0, output }));
        }),
    ),
  );
  const failed = results.filter((r) => !r.ok);
  for (const r of failed) {
    process.stdout.write(`\n── ${r.check.name} failed (rerun: ${r.check.rerun}) ──\n${r.output.trim()}\n`);
  }
  if (!failed.length) log(`type check, lint and format check passed in ${((Date.now() - began) / 1000).toFixed(0)} s`);
  return { ok: failed.length === 0, failed: failed.map((r) => r.check.name) };
}
