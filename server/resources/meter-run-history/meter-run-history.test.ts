import { testApp } from '../../test-support/app';
import { alarmFixture, MIN } from '../../alarms/alarm-test-fixture';
import { meterRunHistoryRepository } from './repository';
import { trendForWindow } from './use-cases';

let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('operator')).token;
});
afterAll(() => t.close());

const get = (path: string) => t.http().get(path).set('Authorization', `Bearer ${token}`);

describe('GET /api/meter-runs/:id/totals', () => {
  let meterRunId: string;
  beforeAll(async () => {
    const engineer = (await t.signedIn('engineer')).token;
    meterRunId = (await alarmFixture(t, engineer, { timeZone: 'America/Denver', contractHour: 9 })).meterRunId;
  });

  it('lists every contract day of the window as missing with coverage 0 when nothing was recorded, the DST day with 25 hours', async () => {
    // US daylight saving time ends on the first Sunday of November at 02:00 (Energy Policy Act of
    // 2005): at America/Denver the contract day that starts on 31 October 2026 at 09:00 MDT (UTC−6)
    // ends on 1 November at 09:00 MST (UTC−7), 25 hours later; the next one has 24. A day that has
    // ended with nothing recorded is missing, not complete (issue 13, item 7).
    const res = await get(`/api/meter-runs/${meterRunId}/totals?interval=day&from=2026-10-31&to=2026-11-02`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual([
      expect.objectContaining({ start: '2026-10-31T15:00:00.000Z', end: '2026-11-01T16:00:00.000Z', hours: 25 }),
      expect.objectContaining({ start: '2026-11-01T16:00:00.000Z', end: '2026-11-02T16:00:00.000Z', hours: 24 }),
    ]);
    for (const day of res.body) {
      expect(day).toMatchObject({ massKg: 0, coverage: 0, flags: ['missing-data'], energyJ: null, status: 'missing' });
    }
  });

  it('reads from=2026-11-01 by day as the contract day that starts on 1 November, not the one of 31 October', async () => {
    // Until issue 13 a plain date was read as local midnight, which falls in the contract day that
    // started on 31 October at 09:00; a plain date names the contract day starting on it. By hand:
    // 1 November 2026 09:00 MST (UTC−7) is 16:00Z, and 2 November 09:00 MST is 16:00Z.
    const res = await get(`/api/meter-runs/${meterRunId}/totals?interval=day&from=2026-11-01&to=2026-11-02`);
    expect(res.status).toBe(200);
    expect(res.body.map((d: { start: string; end: string }) => [d.start, d.end])).toEqual([
      ['2026-11-01T16:00:00.000Z', '2026-11-02T16:00:00.000Z'],
    ]);
  });

  it('reads from=2026-11-01 by month as the contract month that starts at 09:00 on 1 November', async () => {
    const res = await get(`/api/meter-runs/${meterRunId}/totals?interval=month&from=2026-11-01&to=2026-12-01`);
    expect(res.status).toBe(200);
    // By hand: 1 December 2026 09:00 MST is 16:00Z too; November has 30 days of 24 hours after the
    // fall-back on 1 November at 02:00, which is before 09:00: 720 hours.
    expect(res.body).toEqual([
      expect.objectContaining({ start: '2026-11-01T16:00:00.000Z', end: '2026-12-01T16:00:00.000Z', hours: 720 }),
    ]);
  });

  it('refuses more than 62 days of hourly totals, naming to', async () => {
    const res = await get(
      `/api/meter-runs/${meterRunId}/totals?interval=hour&from=2026-01-01T00:00:00Z&to=2026-03-05T00:00:00Z`,
    );
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ field: 'to', message: 'to: at most 62 days of hourly totals per request' });
  });

  it('answers 404 for a meter run that does not exist or an id that cannot name one', async () => {
    for (const id of ['999999999', 'abc']) {
      const res = await get(`/api/meter-runs/${id}/totals?interval=day&from=2026-11-01&to=2026-11-02`);
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe('Meter run was not found.');
    }
    for (const tail of ['recompute-status', 'hourly-records?from=2026-11-01T00:00:00Z&to=2026-11-02T00:00:00Z']) {
      expect((await get(`/api/meter-runs/999999999/${tail}`)).status).toBe(404);
    }
  });
});

describe('GET /api/meter-runs/:id/trend', () => {
  const HOUR = Date.parse('2026-09-15T10:00:00Z');
  let f: Awaited<ReturnType<typeof alarmFixture>>;
  beforeAll(async () => {
    f = await alarmFixture(t, (await t.signedIn('engineer')).token);
    // One DP reading a minute for an hour, the value in kPa equal to the minute's number (0 … 59).
    await f.writeMinutes(HOUR, new Array<number>(60).fill(0.5), { dpValue: (i) => i });
    await t.services.history.settle(120_000);
  }, 180_000);

  it('reduces each of the equal time slices to min, max, mean and count, worked by hand', async () => {
    const from = new Date(HOUR).toISOString();
    const to = new Date(HOUR + 60 * MIN).toISOString();
    const res = await get(`/api/meter-runs/${f.meterRunId}/trend?from=${from}&to=${to}&buckets=10`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ from, to, buckets: 10 });
    const dp = res.body.series.find((s: { transmitterId: string }) => s.transmitterId === f.dp.id);
    expect(dp).toMatchObject({ tag: f.dp.tag, measures: 'differential-pressure', unit: 'kPa', lowerRange: 0 });
    // Ten slices of 6 minutes: slice k holds the minutes 6k … 6k + 5, so min 6k, max 6k + 5, mean 6k + 2.5.
    expect(dp.points).toEqual(
      Array.from({ length: 10 }, (_, k) => ({
        time: new Date(HOUR + k * 6 * MIN).toISOString(),
        min: 6 * k,
        max: 6 * k + 5,
        mean: 6 * k + 2.5,
        count: 6,
      })),
    );
  });

  it('gives the flow of each hour as the hour record divided by its length in seconds', async () => {
    const from = new Date(HOUR).toISOString();
    const to = new Date(HOUR + 60 * MIN).toISOString();
    const [trend, hours] = await Promise.all([
      get(`/api/meter-runs/${f.meterRunId}/trend?from=${from}&to=${to}`),
      get(`/api/meter-runs/${f.meterRunId}/hourly-records?from=${from}&to=${to}`),
    ]);
    expect(hours.body).toHaveLength(1);
    expect(trend.body.flow).toEqual([
      {
        time: from,
        massFlowKgPerS: hours.body[0].massKg / 3600,
        standardVolumeFlowM3PerS: hours.body[0].standardVolumeM3 / 3600,
        coverage: hours.body[0].coverage,
        partial: false,
      },
    ]);
  });

  it('gives the hour still in progress as partial, its rate over the seconds elapsed so far', async () => {
    // Asked 30 minutes into the hour, the record holds 1800 s: its rate is the quantity over 1800 s
    // (over 3600 s it would read half the true rate, the plunge issue 13 describes).
    const nowMs = HOUR + 30 * MIN;
    const repository = meterRunHistoryRepository(t.services.pool);
    const [trend, records] = await Promise.all([
      trendForWindow(repository, { meterRunId: f.meterRunId, fromMs: HOUR, toMs: HOUR + 60 * MIN, buckets: 10 }, nowMs),
      repository.hourlyRecords(f.meterRunId, HOUR, HOUR + 60 * MIN, 10),
    ]);
    expect(records).toHaveLength(1);
    expect(trend.flow).toEqual([
      {
        startMs: HOUR,
        massFlowKgPerS: records[0].massKg / 1800,
        standardVolumeFlowM3PerS: records[0].standardVolumeM3 / 1800,
        coverage: records[0].coverage,
        partial: true,
      },
    ]);
  });

  it('refuses a window that ends before it starts, naming to', async () => {
    const res = await get(`/api/meter-runs/${f.meterRunId}/trend?from=2026-09-15T11:00:00Z&to=2026-09-15T10:00:00Z`);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ field: 'to', message: 'to: must be after from' });
  });
});
