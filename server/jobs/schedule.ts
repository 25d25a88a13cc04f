import cron from 'node-cron';
import type { Pool } from 'pg';
import type { HistoryWorker } from '../history/worker';
import { ensureReadingPartition } from '../ingest/reading-writer';
import { componentLogger } from '../log';

const log = componentLogger('jobs');

const hourMs = 3_600_000;

/** Creates the readings partitions of this month and the next three, ahead of the data. */
export async function makePartitionsAhead(pool: Pool, nowMs = Date.now()) {
  const d = new Date(nowMs);
  for (let i = 0; i < 4; i++) await ensureReadingPartition(pool, Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + i, 1));
}

/**
 * Scheduled jobs (node-cron):
 * - every hour at minute 1: queue the hour that just ended (and the one before) for every meter
 *   run, so an hour finishes with asOf = its end even when no reading arrived (a dropout), and its
 *   contract day turns complete;
 * - every day at 00:10 UTC: create the next months' readings partitions.
 */
export function startSchedule(deps: { pool: Pool; history: HistoryWorker }) {
  const tasks = [
    cron.schedule('1 * * * *', () => {
      const now = Date.now();
      void deps.history
        .queueHours('all', now - 2 * hourMs, now)
        .catch((err) => log.error({ err }, 'the hourly sweep could not queue the past hours'));
    }),
    cron.schedule('10 0 * * *', () => {
      void makePartitionsAhead(deps.pool).catch((err) =>
        log.error({ err }, 'the readings partitions of the coming months could not be made'),
      );
    }),
  ];
  return { stop: () => tasks.forEach((t) => t.stop()) };
}

/**
 * Alarm jobs (issue 5), every minute: conditions judged by the clock (a transmitter gone
 * silent, calibration due or overdue, shelving that ran out), then mail that waits, and each
 * site's daily digest within the hour after its contract hour. A minute's run that is still busy
 * makes the next one skip.
 */
export function startAlarmSchedule(deps: {
  alarms: { tick(): Promise<void> };
  notifier: { run(): Promise<unknown>; sendDigests(): Promise<unknown> };
}) {
  let busy = false;
  const task = cron.schedule('* * * * *', () => {
    if (busy) return;
    busy = true;
    void (async () => {
      await deps.alarms.tick();
      await deps.notifier.run();
      await deps.notifier.sendDigests();
    })()
      .catch((err) => log.error({ err }, "the minute's alarm and mail jobs failed"))
      .finally(() => {
        busy = false;
      });
  });
  return { stop: () => task.stop() };
}
