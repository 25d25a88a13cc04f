import { testApp } from '../test-support/app';
import { AlarmEvaluator } from './alarm-evaluator';
import { alarmFixture, MIN, repeat } from './alarm-test-fixture';

/**
 * Readings through the real pipeline (ingest writer → readings → history worker → evaluator)
 * on the jest database. Expected times follow from the default limits by hand: DP low in range
 * below 10 % of span, on-delay 300 s, off-delay 60 s, deadband 2 %; frozen over 30 min; stale
 * after 600 s without a reading.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let evaluator: AlarmEvaluator;
beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('engineer')).token;
  evaluator = new AlarmEvaluator(t.services.pool, { now: () => Date.parse('2026-10-03T00:00:00Z') });
});
afterAll(() => t.close());

const alarms = async (meterRunId: string) =>
  (
    await t.services.pool.query(
      `SELECT id::text, condition, transmitter_id::text, state, onset_at, raised_at, cleared_at, message, notify_status FROM alarms WHERE meter_run_id = $1 ORDER BY raised_at, id`,
      [meterRunId],
    )
  ).rows;
const iso = (d: Date | null) => (d ? d.toISOString() : null);

describe('AlarmEvaluator with readings through the pipeline', () => {
  const T0 = Date.parse('2026-10-01T06:00:00Z');

  it('raises exactly one low-in-range alarm for DP held at 5 % of span, at onset + on-delay, returned to normal when DP rises', async () => {
    const f = await alarmFixture(t, token);
    await f.writeMinutes(T0, [...repeat(10, 0.4), ...repeat(20, 0.05), ...repeat(15, 0.4)]);
    await t.services.history.settle();
    await evaluator.evaluate(f.meterRunId);
    const low = (await alarms(f.meterRunId)).filter((a) => a.condition === 'dp-low-in-range');
    expect(low).toHaveLength(1);
    expect(low[0]).toMatchObject({ transmitter_id: f.dp.id, state: 'returned-unacknowledged' });
    expect(iso(low[0].onset_at)).toBe('2026-10-01T06:10:00.000Z'); // DP fell to 5 % at 06:10
    expect(iso(low[0].raised_at)).toBe('2026-10-01T06:15:00.000Z'); // + 300 s on-delay
    expect(iso(low[0].cleared_at)).toBe('2026-10-01T06:31:00.000Z'); // DP back at 40 % at 06:30, + 60 s off-delay
    expect(low[0].notify_status).toBe('not-needed'); // history, days older than the clock: not mailed one by one
    // A second evaluation over the same readings raises nothing more.
    await evaluator.evaluate(f.meterRunId);
    expect((await alarms(f.meterRunId)).filter((a) => a.condition === 'dp-low-in-range')).toHaveLength(1);
  });

  it('raises no new alarm while DP chatters inside the deadband, across several imports', async () => {
    const f = await alarmFixture(t, token);
    const chatter = Array.from({ length: 40 }, (_, i) => (i % 2 ? 0.115 : 0.09));
    await f.writeMinutes(T0, [...repeat(10, 0.05), ...chatter.slice(0, 20)]);
    await t.services.history.settle();
    await evaluator.evaluate(f.meterRunId);
    await f.writeMinutes(T0 + 30 * MIN, [...chatter.slice(20), ...repeat(10, 0.4)]);
    await t.services.history.settle();
    await evaluator.evaluate(f.meterRunId);
    const low = (await alarms(f.meterRunId)).filter((a) => a.condition === 'dp-low-in-range');
    expect(low).toHaveLength(1);
    expect(iso(low[0].raised_at)).toBe('2026-10-01T06:05:00.000Z');
    expect(iso(low[0].cleared_at)).toBe('2026-10-01T06:51:00.000Z'); // 10 min at 5 % + 40 min of chatter: 40 % from 06:50, + 60 s
  });

  it('finds a frozen DP transmitter and a stale one', async () => {
    const f = await alarmFixture(t, token);
    // DP stuck at exactly 20.0000 kPa from 06:00 for an hour, then nothing from the DP for 30 min while P and T go on.
    await f.writeMinutes(T0, repeat(60, 0.4), { dpValue: () => 20 });
    const pAndT = Array.from({ length: 30 }, (_, i) => [
      {
        meterRunId: f.meterRunId,
        timeZone: 'UTC',
        timeMs: T0 + (60 + i) * MIN,
        transmitterId: f.pt.id,
        value: 2 + (i % 3) * 1e-4,
        quality: 0,
      },
      {
        meterRunId: f.meterRunId,
        timeZone: 'UTC',
        timeMs: T0 + (60 + i) * MIN,
        transmitterId: f.tt.id,
        value: 300 + (i % 2) * 0.01,
        quality: 0,
      },
    ]).flat();
    await t.services.writer.write(pAndT, 'csv');
    await f.writeMinutes(T0 + 90 * MIN, repeat(5, 0.4));
    await t.services.history.settle();
    await evaluator.evaluate(f.meterRunId);
    const list = await alarms(f.meterRunId);
    const frozen = list.filter((a) => a.condition === 'frozen');
    expect(frozen.map((a) => a.transmitter_id)).toEqual([f.dp.id]);
    // A window needs a reading in force at its start; the first reading is at 06:00, so the first
    // covered 30-min window is [06:01, 06:31] (with the 06:00 reading in force at 06:01).
    expect(iso(frozen[0].raised_at)).toBe('2026-10-01T06:31:00.000Z');
    const stale = list.filter((a) => a.condition === 'stale');
    expect(stale.map((a) => [a.transmitter_id, iso(a.raised_at), iso(a.cleared_at)])).toEqual([
      [f.dp.id, '2026-10-01T07:09:00.000Z', '2026-10-01T07:30:00.000Z'], // last DP reading 06:59 + 600 s; next at 07:30
    ]);
  });
});
