/**
 * Issue 13, items 6 and 7: a meter run's history starts when the meter run (its first
 * configuration version) starts; nothing before it is a record, and readings before it are
 * refused with the reason; a late reading queues every hour it feeds.
 */
import { testApp } from '../test-support/app';
import { alarmFixture, MIN } from '../alarms/alarm-test-fixture';
import { validateReading } from '../ingest/validate-reading';

let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
});
afterAll(() => t.close());

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;
const auth = () => ({ Authorization: `Bearer ${engineer}` });

/** A UTC site (contract hour 0) and a meter run created without an effective date, with one DP transmitter. */
async function newMeterRunWithoutEffectiveDate() {
  const code = t.unique().toUpperCase();
  const site = await t
    .http()
    .post('/api/sites')
    .set(auth())
    .send({
      code: `H${code}`,
      name: `History start ${code}`,
      timeZone: 'UTC',
      contractHour: 0,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
  expect(site.status).toBe(201);
  const beforeMs = Date.now();
  const run = await t
    .http()
    .post('/api/meter-runs')
    .set(auth())
    .send({
      siteId: site.body.id,
      tag: `HS-${code}`,
      name: `History start run ${code}`,
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
      fluid: {
        kind: 'ideal-gas',
        molarMassKgPerMol: 0.01804,
        compressibility: 1,
        isentropicExponent: 1.2,
        viscosityPaS: 1.12e-5,
      },
    });
  expect(run.status).toBe(201);
  const afterMs = Date.now();
  const dp = await t
    .http()
    .post('/api/transmitters')
    .set(auth())
    .send({
      meterRunId: run.body.id,
      tag: `HS-${code}-DP`,
      measures: 'differential-pressure',
      unit: 'kPa',
      lowerRange: 0,
      upperRange: 50,
    });
  expect(dp.status).toBe(201);
  return { meterRunId: String(run.body.id), dpTag: dp.body.tag as string, beforeMs, afterMs };
}

describe('when a meter run history starts', () => {
  it('starts the history of a meter run created without an effective date at the UTC hour it was created in', async () => {
    const f = await newMeterRunWithoutEffectiveDate();
    const versions = await t.http().get(`/api/meter-runs/${f.meterRunId}/config-versions`).set(auth());
    expect(versions.status).toBe(200);
    expect(versions.body).toHaveLength(1);
    // At a UTC site the hour starts on a multiple of 3600 s since the epoch.
    const expectedMs = [f.beforeMs, f.afterMs].map((ms) => Math.floor(ms / HOUR_MS) * HOUR_MS);
    expect(expectedMs).toContain(Date.parse(versions.body[0].effectiveFrom));
  });

  it('lists no contract days from before the meter run existed: only the day it was created, as provisional', async () => {
    const f = await newMeterRunWithoutEffectiveDate();
    const todayMs = Math.floor(f.afterMs / DAY_MS) * DAY_MS;
    const from = new Date(todayMs - 30 * DAY_MS).toISOString().slice(0, 10);
    const to = new Date(todayMs + DAY_MS).toISOString().slice(0, 10);
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/totals?interval=day&from=${from}&to=${to}`)
      .set(auth());
    expect(res.status).toBe(200);
    // One day (today, still running), not 31 days of zero rows.
    expect(res.body).toEqual([
      expect.objectContaining({
        start: new Date(todayMs).toISOString(),
        end: new Date(todayMs + DAY_MS).toISOString(),
        status: 'provisional',
      }),
    ]);
  });

  it('refuses a reading from before the history starts, naming the start, as MQTT and CSV ingest check it', async () => {
    const f = await newMeterRunWithoutEffectiveDate();
    t.services.catalog.invalidate();
    const transmitter = await t.services.catalog.byTransmitterTag(f.dpTag);
    expect(transmitter).not.toBeNull();
    const startMs = transmitter!.historyStartMs!;
    expect(startMs).toBe(Math.floor(startMs / HOUR_MS) * HOUR_MS);
    expect(validateReading({ time: '1990-06-01T00:00:00Z', value: 1 }, transmitter!, Date.now())).toBe(
      `time: 1990-06-01T00:00:00.000Z is before the history of the meter run of ${f.dpTag} starts (${new Date(startMs).toISOString()})`,
    );
  });
});

describe('a late reading', () => {
  it('queues its own hour and the next one when the hold limit carries it past the hour end', async () => {
    // The fixture's hold limit is 3600 s (gap limit 300 s): a reading at 10:59:30 may stand until
    // 11:59:30 at most, so it feeds the hours starting 10:00 and 11:00 (and no later one).
    const f = await alarmFixture(t, engineer);
    t.services.catalog.invalidate();
    const dp = await t.services.catalog.byTransmitterTag(f.dp.tag);
    expect(dp?.reachS).toBe(3600);
    const hourMs = Date.parse('2026-09-15T10:00:00Z');
    const reading = validateReading({ time: '2026-09-15T10:59:30Z', value: 10 }, dp!, Date.now());
    if (typeof reading === 'string') throw new Error(reading);
    await t.services.writer.write([reading], 'csv');
    const { rows } = await t.services.pool.query<{ start: Date }>(
      'SELECT start FROM stale_hours WHERE meter_run_id = $1 ORDER BY start',
      [f.meterRunId],
    );
    expect(rows.map((r) => r.start.toISOString())).toEqual([
      new Date(hourMs).toISOString(),
      new Date(hourMs + 60 * MIN).toISOString(),
    ]);
  });
});
