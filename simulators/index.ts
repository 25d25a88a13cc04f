/**
 * `npm run simulate` (and `npm start`, which spawns it): back-fills the demo history into
 * PostgreSQL, then publishes live readings over MQTT until SIGTERM/SIGINT; meanwhile, once the
 * history worker has computed the demo month, imports its field totals (server/seed/demo-month-end.ts).
 *
 * Environment: DATABASE_URL (back-fill; without it only live mode runs), TALLYRUN_MQTT_URL
 * (default mqtt://127.0.0.1:1883), TALLYRUN_DEMO_PASSWORD (default 'tallyrun-demo'; the demo
 * devices' MQTT password is derived from it), TALLYRUN_DATA_DIR (default .tallyrun: where the
 * imported field-totals file is kept). Flags: --backfill-only, --live-only.
 */
import path from 'node:path';
import { Pool } from 'pg';
import { seedDemoFieldTotalsWhenReady } from '../server/seed/demo-month-end';
import { backfillDemoHistory } from './backfill/backfill';
import { storedScenarioTimeline } from './backfill/stored-timeline';
import { startLivePublisher, type LivePublisher } from './live/live-publisher';

const log = (line: string) => console.log(`[simulators] ${line}`);
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
const isoMinute = (ms: number) => new Date(ms).toISOString().slice(0, 16).replace('T', ' ') + 'Z';

async function main() {
  const args = new Set(process.argv.slice(2));
  const unknown = [...args].filter((a) => a !== '--backfill-only' && a !== '--live-only');
  if (unknown.length || (args.has('--backfill-only') && args.has('--live-only'))) {
    console.error('usage: simulators [--backfill-only | --live-only]');
    process.exit(2);
  }
  const databaseUrl = process.env.DATABASE_URL;
  const mqttUrl = process.env.TALLYRUN_MQTT_URL || 'mqtt://127.0.0.1:1883';
  const demoPassword = process.env.TALLYRUN_DEMO_PASSWORD || 'tallyrun-demo';

  let stopping = false;
  let live: LivePublisher | null = null;
  const stop = () => {
    if (stopping) return;
    stopping = true;
    if (!live) return; // back-fill notices between batches
    const running = live;
    void running.stop().then(() => {
      const s = running.stats();
      log(
        `live: stopped after ${s.ticks} ticks, ${s.messages} messages, ${s.readings} readings (${s.lateReadings} late, ${s.dropped} dropped)`,
      );
      process.exit(0);
    });
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);

  const pool = databaseUrl ? new Pool({ connectionString: databaseUrl, max: 2 }) : null;
  try {
    const { timeline, from } = await storedScenarioTimeline(pool, Date.now());
    if (!args.has('--live-only')) {
      if (!pool) log('back-fill: skipped (DATABASE_URL is not set)');
      else {
        const r = await backfillDemoHistory({ pool, timeline, shouldStop: () => stopping });
        if (r.missingTags.length)
          log(
            `back-fill: ${r.missingTags.length} demo transmitters are not in the database (is the demo scenario seeded?): ${r.missingTags.join(' ')}`,
          );
        log(
          r.fromMs === null
            ? `back-fill: nothing to add for ${r.transmitters} transmitters (demo month ${timeline.demoMonth}) in ${seconds(r.elapsedMs)}`
            : `back-fill: ${r.inserted} readings (${r.generated} generated) for ${r.transmitters} transmitters, ${isoMinute(r.fromMs)} to ${isoMinute(r.toMs)}, demo month ${timeline.demoMonth} (from the ${from}), ${r.batches} batches in ${seconds(r.elapsedMs)}`,
        );
      }
    }
    if (stopping || args.has('--backfill-only')) {
      await pool?.end();
      process.exit(0);
    }
    live = startLivePublisher({ mqttUrl, demoPassword, timeline, log });
    log(`live: publishing the demo transmitters every 5 s to ${mqttUrl} (demo month ${timeline.demoMonth})`);
    if (pool && !args.has('--live-only')) {
      // The field totals reconcile against Tallyrun's daily totals: import them once the history
      // worker has computed the demo month (in the background, beside the live readings).
      const dataDir = path.resolve(process.env.TALLYRUN_DATA_DIR || '.tallyrun');
      void seedDemoFieldTotalsWhenReady({ pool, dataDir, databaseUrl }, timeline.demoMonth, {
        shouldStop: () => stopping,
      })
        .then((r) => {
          if (r.status === 'imported')
            log(
              `month end: imported ${r.days} field totals of the demo month ${timeline.demoMonth} (import ${r.importId})`,
            );
          else if (r.status !== 'present') log(`month end: no field totals imported (${r.status})`);
        })
        .catch((err: unknown) =>
          log(`month end: field totals failed: ${err instanceof Error ? err.message : String(err)}`),
        )
        .finally(() => void pool.end().catch(() => undefined));
    } else await pool?.end();
  } catch (err) {
    console.error(`[simulators] ${err instanceof Error ? err.message : String(err)}`);
    await pool?.end().catch(() => undefined);
    process.exit(1);
  }
}

void main();
