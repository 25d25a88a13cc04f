/**
 * Test helper for single-runner.test.ts: a process that competes for the job runner's lock and
 * prints `running <name>` when it takes it. Stops cleanly (releasing the lock) on SIGTERM.
 * Not the logger: the parent reads these lines on stdout.
 */
import { startSingleRunner } from './single-runner';

const name = process.env.RUNNER_NAME ?? 'runner';
const runner = startSingleRunner({
  databaseUrl: process.env.DATABASE_URL!,
  pollMs: Number(process.env.RUNNER_POLL_MS ?? 200),
  lockKey: Number(process.env.RUNNER_LOCK_KEY),
  start: () => {
    process.stdout.write(`running ${name}\n`);
    return async () => {
      process.stdout.write(`stopped ${name}\n`);
    };
  },
});
void runner.firstTry.then(() => process.stdout.write(`tried ${name}\n`));
process.once('SIGTERM', () => void runner.stop().then(() => process.exit(0)));
