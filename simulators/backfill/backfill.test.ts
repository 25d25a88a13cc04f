import { testApp } from '../../server/test-support/app';
import { seedDemoScenario } from '../../server/seed/demo-scenario';
import { backfillDemoHistory } from './backfill';
import { storedScenarioTimeline } from './stored-timeline';

type Ctx = Awaited<ReturnType<typeof testApp>>;
let ctx: Ctx;
beforeAll(async () => {
  ctx = await testApp();
  await seedDemoScenario(ctx.sequelize, { demoPassword: 'tallyrun-demo', nowMs: Date.parse('2026-12-02T00:00:00Z') });
});
afterAll(() => ctx.close());

const count = async (tag: string, fromMs: number, toMs: number) =>
  (
    await ctx.services.pool.query(
      'SELECT count(*)::int AS n FROM readings r JOIN transmitters t ON t.id = r.transmitter_id WHERE t.tag = $1 AND r.time >= to_timestamp($2 / 1000.0) AND r.time <= to_timestamp($3 / 1000.0)',
      [tag, fromMs, toMs],
    )
  ).rows[0].n as number;

describe('backfillDemoHistory', () => {
  it('writes one reading a minute per transmitter from the first contract day of the demo month, and a second run adds nothing', async () => {
    const { timeline, from } = await storedScenarioTimeline(ctx.services.pool, Date.now());
    expect(from).toBe('database');
    const kfgStart = timeline.historyStartMs.KFG;
    const nowMs = kfgStart + 2 * 3_600_000 + 30_000; // two hours and a half-minute into KFG's month
    const first = await backfillDemoHistory({ pool: ctx.services.pool, timeline, nowMs, batchSize: 1000 });
    expect(first.transmitters).toBe(22);
    expect(first.missingTags).toEqual([]);
    // 0, 1, ..., 120 minutes: 121 readings per KFG transmitter up to the last whole minute.
    for (const tag of ['KFG-101-DPH', 'KFG-101-DPL', 'KFG-102-DP', 'KFG-201-TT'])
      expect(await count(tag, kfgStart, nowMs)).toBe(121);
    // BPM's month starts 11 hours earlier (06:00 CET = 05:00Z against 09:00 MST = 16:00Z): 13 h 0 min → 781.
    expect(await count('BPM-ST1-DP', timeline.historyStartMs.BPM, nowMs)).toBe(781);

    const second = await backfillDemoHistory({ pool: ctx.services.pool, timeline, nowMs });
    expect(second.inserted).toBe(0);
    expect(await count('KFG-101-DPH', kfgStart, nowMs)).toBe(121);
  });

  it('queues the hours it wrote for the history worker (or they are computed already)', async () => {
    const { timeline } = await storedScenarioTimeline(ctx.services.pool, Date.now());
    const { rows } = await ctx.services.pool.query(
      `SELECT count(*)::int AS n FROM (
         SELECT start FROM stale_hours s JOIN meter_runs m ON m.id = s.meter_run_id WHERE m.tag = 'KFG-101' AND s.start = to_timestamp($1 / 1000.0)
         UNION SELECT start FROM hourly_records h JOIN meter_runs m ON m.id = h.meter_run_id WHERE m.tag = 'KFG-101' AND h.start = to_timestamp($1 / 1000.0)) x`,
      [timeline.historyStartMs.KFG],
    );
    expect(rows[0].n).toBe(1);
  });
});
