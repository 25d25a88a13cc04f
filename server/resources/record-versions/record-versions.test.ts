import { testApp } from '../../test-support/app';
import { alarmFixture, MIN, repeat } from '../../alarms/alarm-test-fixture';
import { HistoryWorker } from '../../history/worker';

/**
 * Record versions through the real app, worker and database. A UTC site, contract hour 0, one
 * day of one-minute readings at a constant 20 kPa DP, with a hole at 10:30–10:59 in every
 * transmitter. Worked by hand (compute-hour: a DP sample covers [t, t + maxGap), maxGap 300 s):
 * the 10:29 sample covers to 10:34, so hour 10 flows 34 min = 2040 s and the day 23 h 34 min =
 * 84 840 s. The late readings of 10:30–10:59 make hour 10 flow 3600 s and the day 86 400 s. At a
 * constant rate, mass goes as flowing time, so version 1 / version 2 of the hour is 2040 / 3600,
 * and the day's difference is 1560 / 86 400 of its current mass (P and T vary by 5e-5 and 3e-5
 * relative in the fixture, so ratios are checked to 1e-4).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const dayMs = 86_400_000;
// Two days ago (UTC): a past contract day, and the configuration change below queues few hours after it.
const DAY = Math.floor(Date.now() / dayMs) * dayMs - 2 * dayMs;
const iso = (ms: number) => new Date(ms).toISOString();
const HOUR_10 = DAY + 10 * 60 * MIN;
const constantDp = { dpValue: () => 20 };

beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('accountant')).token;
  f = await alarmFixture(t, (await t.signedIn('engineer')).token);
  await f.writeMinutes(DAY, repeat(630, 0.4), constantDp);
  await f.writeMinutes(DAY + 660 * MIN, repeat(1440 - 660, 0.4), constantDp);
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

const get = (path: string) => t.http().get(path).set('Authorization', `Bearer ${token}`);
const hourVersions = () => get(`/api/meter-runs/${f.meterRunId}/hourly-records/versions?start=${iso(HOUR_10)}`);
const dayVersions = () => get(`/api/meter-runs/${f.meterRunId}/totals/versions?interval=day&start=${iso(DAY)}`);

describe('record versions', () => {
  let firstHourMassKg: number;

  it('holds version 1 of a complete hour and day, caused by nothing but their first computation', async () => {
    const hour = await hourVersions();
    expect(hour.status).toBe(200);
    expect(hour.body.versions).toHaveLength(1);
    expect(hour.body.current).toMatchObject({ version: 1, cause: 'initial', supersededAt: null });
    expect(hour.body.current.flowTimeS).toBeCloseTo(2040, 6);
    expect(hour.body.difference).toEqual({ massKg: 0, volumeM3: 0, standardVolumeM3: 0, energyJ: null });
    firstHourMassKg = hour.body.current.massKg;
    const day = await dayVersions();
    expect(day.status).toBe(200);
    expect(day.body.current).toMatchObject({ version: 1, cause: 'initial', status: 'complete', hours: 24 });
    expect(day.body.current.flowTimeS).toBeCloseTo(84_840, 6);
  });

  it('keeps the hour’s original figures as version 1 when a late reading changes it, and makes version 2 current', async () => {
    await f.writeMinutes(DAY + 630 * MIN, repeat(30, 0.4), constantDp);
    await t.services.history.settle(120_000);
    const res = await hourVersions();
    expect(res.status).toBe(200);
    const { current, first, versions, difference } = res.body;
    expect(versions.map((v: { version: number }) => v.version)).toEqual([1, 2]);
    expect(first).toEqual(versions[0]);
    expect(current).toEqual(versions[1]);
    expect(first).toMatchObject({ version: 1, cause: 'initial', massKg: firstHourMassKg });
    expect(first.supersededAt).not.toBeNull();
    expect(current).toMatchObject({ version: 2, cause: 'late-readings', causeReference: null, supersededAt: null });
    expect(current.flowTimeS).toBeCloseTo(3600, 6);
    expect(Math.abs(first.massKg / current.massKg - 2040 / 3600)).toBeLessThan(1e-4);
    expect(difference.massKg).toBe(current.massKg - first.massKg);
    expect(difference.standardVolumeM3).toBe(current.standardVolumeM3 - first.standardVolumeM3);
    expect(difference.volumeM3).toBe(current.volumeM3 - first.volumeM3);
    // The figures in force are the ones every existing read sees.
    const records = await get(
      `/api/meter-runs/${f.meterRunId}/hourly-records?from=${iso(HOUR_10)}&to=${iso(HOUR_10 + 60 * MIN)}`,
    );
    expect(records.body[0].massKg).toBe(current.massKg);
    // …with the version and the first figures beside them.
    expect(records.body[0]).toMatchObject({
      version: 2,
      firstMassKg: first.massKg,
      firstStandardVolumeM3: first.standardVolumeM3,
    });
  });

  it('gives the contract day a version too, its difference being 1560 s of flow at the day’s rate', async () => {
    const res = await dayVersions();
    expect(res.status).toBe(200);
    const { current, first, versions, difference } = res.body;
    expect(versions).toHaveLength(2);
    expect(first).toMatchObject({ version: 1, cause: 'initial', status: 'complete' });
    expect(current).toMatchObject({ version: 2, cause: 'late-readings', status: 'complete' });
    expect(first.flowTimeS).toBeCloseTo(84_840, 6);
    expect(current.flowTimeS).toBeCloseTo(86_400, 6);
    expect(Math.abs(difference.massKg / current.massKg - 1560 / 86_400)).toBeLessThan(1e-4);
    // The same day named by its date.
    const byDate = await get(
      `/api/meter-runs/${f.meterRunId}/totals/versions?interval=day&start=${iso(DAY).slice(0, 10)}`,
    );
    expect(byDate.body).toEqual(res.body);
    const totals = await get(
      `/api/meter-runs/${f.meterRunId}/totals?interval=day&from=${iso(DAY)}&to=${iso(DAY + dayMs)}`,
    );
    expect(totals.body).toEqual([
      expect.objectContaining({ massKg: current.massKg, version: 2, firstMassKg: first.massKg }),
    ]);
  });

  it('adds no version when a recompute changes nothing', async () => {
    await t.services.history.queueHours([f.meterRunId], DAY, DAY + dayMs);
    await t.services.history.settle(120_000);
    expect((await hourVersions()).body.versions).toHaveLength(2);
    expect((await dayVersions()).body.versions).toHaveLength(2);
    const hour3 = await get(`/api/meter-runs/${f.meterRunId}/hourly-records/versions?start=${iso(DAY + 3 * 60 * MIN)}`);
    expect(hour3.body.versions).toHaveLength(1);
  });

  it('names a back-dated configuration version, by its id, as the cause of the hours it changed', async () => {
    const engineer = (await t.signedIn('engineer')).token;
    const created = await t
      .http()
      .post(`/api/meter-runs/${f.meterRunId}/config-versions`)
      .set('Authorization', `Bearer ${engineer}`)
      .send({
        effectiveFrom: iso(DAY + 20 * 60 * MIN),
        element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.12 },
        fluid: {
          kind: 'ideal-gas',
          molarMassKgPerMol: 0.01804,
          compressibility: 1,
          isentropicExponent: 1.2,
          viscosityPaS: 1.12e-5,
        },
        reason: 'orifice plate changed',
      });
    expect(created.status).toBe(201);
    await t.services.history.settle(120_000);
    const hour20 = await get(
      `/api/meter-runs/${f.meterRunId}/hourly-records/versions?start=${iso(DAY + 20 * 60 * MIN)}`,
    );
    expect(hour20.body.current).toMatchObject({
      version: 2,
      cause: 'configuration-version',
      causeReference: String(created.body.id),
      configVersionId: String(created.body.id),
    });
    // A larger bore passes more gas at the same DP.
    expect(hour20.body.difference.massKg).toBeGreaterThan(0);
    // Hours before the version's effective time are unchanged, so they keep their version.
    const hour19 = await get(
      `/api/meter-runs/${f.meterRunId}/hourly-records/versions?start=${iso(DAY + 19 * 60 * MIN)}`,
    );
    expect(hour19.body.versions).toHaveLength(1);
    const day = await dayVersions();
    expect(day.body.versions.map((v: { cause: string }) => v.cause)).toEqual([
      'initial',
      'late-readings',
      'configuration-version',
    ]);
  });

  it('replaces an hour computed before it ended without a version: a running figure is not yet a record', async () => {
    const run = await alarmFixture(t, (await t.signedIn('engineer')).token);
    const hour = DAY + dayMs + 5 * 60 * MIN;
    await run.writeMinutes(hour, repeat(60, 0.4), constantDp);
    // The same hour computed at 05:30 (a live hour) and again after its end, by workers with set clocks.
    await new HistoryWorker(t.services.pool, () => hour + 30 * MIN).recompute(run.meterRunId, [hour]);
    const running = await get(`/api/meter-runs/${run.meterRunId}/hourly-records/versions?start=${iso(hour)}`);
    expect(running.body.current.flowTimeS).toBeCloseTo(1800, 6);
    await new HistoryWorker(t.services.pool, () => hour + 2 * 60 * MIN).recompute(run.meterRunId, [hour]);
    const res = await get(`/api/meter-runs/${run.meterRunId}/hourly-records/versions?start=${iso(hour)}`);
    expect(res.body.versions).toHaveLength(1);
    expect(res.body.current).toMatchObject({ version: 1, cause: 'initial' });
    expect(res.body.current.flowTimeS).toBeCloseTo(3600, 6);
    await t.services.history.settle(120_000);
  });

  it('refuses to change or remove a kept version', async () => {
    await expect(
      t.services.pool.query('UPDATE hourly_record_versions SET mass_kg = 0 WHERE meter_run_id = $1', [f.meterRunId]),
    ).rejects.toThrow(/permission denied for table hourly_record_versions/);
    await expect(
      t.services.pool.query('DELETE FROM period_total_versions WHERE meter_run_id = $1', [f.meterRunId]),
    ).rejects.toThrow(/permission denied for table period_total_versions/);
  });
});

describe('GET /api/meter-runs/:id/…/versions refusals', () => {
  it('answers 404 for an hour with no record and for an unknown meter run', async () => {
    const none = await get(`/api/meter-runs/${f.meterRunId}/hourly-records/versions?start=2001-01-01T00:00:00Z`);
    expect(none.status).toBe(404);
    expect(none.body.error.message).toBe('Hourly record was not found.');
    const unknown = await get(`/api/meter-runs/999999999/totals/versions?interval=month&start=2001-01-01`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toBe('Meter run was not found.');
  });

  it('refuses a missing start and an interval other than day or month, naming the field', async () => {
    const noStart = await get(`/api/meter-runs/${f.meterRunId}/hourly-records/versions`);
    expect(noStart.status).toBe(400);
    expect(noStart.body.error.field).toBe('start');
    const hour = await get(`/api/meter-runs/${f.meterRunId}/totals/versions?interval=hour&start=${iso(DAY)}`);
    expect(hour.status).toBe(400);
    expect(hour.body.error.field).toBe('interval');
  });
});
