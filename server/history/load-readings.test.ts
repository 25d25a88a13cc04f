/**
 * Issue 15 item 3: the recompute reads readings as epoch milliseconds computed in the database and
 * array rows, not row objects with pg's parsed Date. It must hand computeHour exactly what the old
 * reader did: the same milliseconds (microseconds dropped as Date drops them), values, qualities
 * and order, with the last reading before the window.
 */
import type { Pool } from 'pg';
import { testApp } from '../test-support/app';
import { alarmFixture } from '../alarms/alarm-test-fixture';
import { loadMeterRunContext, loadReadings } from './load-context';

let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
});
afterAll(() => t.close());

/** The reader as it was before issue 15: row objects, the time parsed by pg into a Date. */
async function oldReader(pool: Pool, transmitterId: string, fromMs: number, toMs: number) {
  const { rows } = await pool.query<{ time: Date; value: number; quality: number }>(
    `(SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time < to_timestamp($2 / 1000.0) ORDER BY time DESC LIMIT 1)
     UNION ALL
     (SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time < to_timestamp($3 / 1000.0) ORDER BY time)`,
    [transmitterId, fromMs, toMs],
  );
  return rows.map((r) => ({ timeMs: r.time.getTime(), value: r.value, quality: r.quality }));
}

test('the recompute reads the same milliseconds, values and qualities as the row-object reader did', async () => {
  const f = await alarmFixture(t, engineer);
  const pool = t.services.pool;
  const fromMs = Date.UTC(2026, 2, 10, 4);
  // Whole seconds, milliseconds and microseconds (which a Date drops), one before the window, every quality.
  const times = [
    `${new Date(fromMs - 1500).toISOString().slice(0, -1)}999+00`,
    new Date(fromMs).toISOString(),
    '2026-03-10T04:00:01.001+00',
    '2026-03-10T04:00:02.123456+00',
    '2026-03-10T04:00:02.999999+00',
    '2026-03-10T04:59:59.9995+00',
  ];
  await pool.query(
    `INSERT INTO readings (transmitter_id, time, value, quality, source)
     SELECT $1, t::timestamptz, 20 + i * 0.125, i % 4, 1 FROM unnest($2::text[]) WITH ORDINALITY AS u(t, i)`,
    [f.dp.id, times],
  );
  const ctx = await loadMeterRunContext(pool, f.meterRunId);
  if (!ctx) throw new Error('no context');
  const toMs = fromMs + 3_600_000;
  const series = await loadReadings(pool, ctx, fromMs, toMs);
  const old = await oldReader(pool, f.dp.id, fromMs, toMs);
  expect(old).toHaveLength(times.length);
  // kPa → Pa (the transmitter's unit), quality codes to names: as the old mapping did.
  const qualityNames = ['good', 'uncertain', 'bad', 'substituted'];
  expect(series.dp[0].samples).toEqual(
    old.map((r) => ({ timeMs: r.timeMs, value: r.value * 1000, quality: qualityNames[r.quality] })),
  );
  expect(series.dp[0].samples.map((s) => s.timeMs)).toEqual([
    fromMs - 1500,
    fromMs,
    fromMs + 1001,
    fromMs + 2123,
    fromMs + 2999,
    fromMs + 3_599_999,
  ]);
});
