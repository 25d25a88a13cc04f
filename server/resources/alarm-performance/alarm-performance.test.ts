import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

/**
 * A hand-built alarm history in the real database, read back through the API. Every expected number
 * is worked by hand below from the definitions of ISA-18.2-2016 as remembered (10-minute periods,
 * flood > 10 per 10 min, chattering ≥ 3 in 1 min, stale > 24 h); none is read from the code's output.
 */
let t: Awaited<ReturnType<typeof testApp>>;
const who = {} as Record<'engineer' | 'operator' | 'accountant' | 'admin', { token: string }>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
let g: Awaited<ReturnType<typeof alarmFixture>>;
let siteId: string;
let groupSiteId: string;
const ids: Record<string, string> = {};

/** One alarm occurrence and its log of raises (the first is "raised", the rest "returned-to-alarm"). */
async function alarm(
  name: string,
  point: { meterRunId: string; transmitterId: string | null; condition: string },
  raises: string[],
  clearedAt: string,
) {
  const pool = t.services.pool;
  const { rows } = await pool.query<{ id: string }>(
    `INSERT INTO alarms (meter_run_id, transmitter_id, condition, priority, state, condition_active, onset_at, raised_at,
                         cleared_at, activations, message, notify_status)
     VALUES ($1, $2, $3, 'medium', 'normal', false, $4, $4, $5, $6, 'hand-built', 'not-needed') RETURNING id::text`,
    [point.meterRunId, point.transmitterId, point.condition, raises[0], clearedAt, raises.length],
  );
  ids[name] = rows[0].id;
  for (const [i, when] of raises.entries())
    await pool.query(
      `INSERT INTO alarm_events (alarm_id, occurred_at, action, from_state, to_state)
       VALUES ($1, $2, $3, $4, 'active-unacknowledged')`,
      [rows[0].id, when, i === 0 ? 'raised' : 'returned-to-alarm', i === 0 ? null : 'returned-unacknowledged'],
    );
}

beforeAll(async () => {
  t = await testApp();
  for (const role of ['engineer', 'operator', 'accountant', 'admin'] as const) who[role] = await t.signedIn(role);
  f = await alarmFixture(t, who.engineer.token);
  g = await alarmFixture(t, who.engineer.token);
  const site = async (meterRunId: string) =>
    (
      await t.services.pool.query<{ id: string }>('SELECT site_id::text AS id FROM meter_runs WHERE id = $1', [
        meterRunId,
      ])
    ).rows[0].id;
  siteId = await site(f.meterRunId);
  groupSiteId = await site(g.meterRunId);
  const run = f.meterRunId;
  // Site f, November 2026 (UTC zone: 30 days = 4,320 ten-minute periods).
  // DP stale: 3 raises in 40 s (chattering); PT bad quality: 8 raises a minute apart. 11 in 08:00–08:10: a flood.
  await alarm(
    'dpStale',
    { meterRunId: run, transmitterId: f.dp.id, condition: 'stale' },
    ['2026-11-03T08:00:00Z', '2026-11-03T08:00:20Z', '2026-11-03T08:00:40Z'],
    '2026-11-03T08:30:00Z',
  );
  await alarm(
    'ptBad',
    { meterRunId: run, transmitterId: f.pt.id, condition: 'bad-quality' },
    [1, 2, 3, 4, 5, 6, 7, 8].map((m) => `2026-11-03T08:0${m}:00Z`),
    '2026-11-03T08:09:30Z',
  );
  // TT frozen for 25 h: stale.
  await alarm(
    'ttFrozen',
    { meterRunId: run, transmitterId: f.tt.id, condition: 'frozen' },
    ['2026-11-10T00:00:00Z'],
    '2026-11-11T01:00:00Z',
  );
  await alarm(
    'stack',
    { meterRunId: run, transmitterId: null, condition: 'stack-disagreement' },
    ['2026-11-20T12:00:00Z'],
    '2026-11-20T12:10:00Z',
  );
  // October: outside the month, in neither the counts nor the stale list.
  await alarm(
    'october',
    { meterRunId: run, transmitterId: f.dp.id, condition: 'frozen' },
    ['2026-10-31T23:55:00Z'],
    '2026-10-31T23:58:00Z',
  );
  // Site g: one outage. DP stale first, PT stale 30 s later, TT bad quality 90 s later: one group.
  // DP frozen 10 s later is another family; TT stale at 3 min is past the 2-minute window.
  const grun = g.meterRunId;
  await alarm(
    'gDpStale',
    { meterRunId: grun, transmitterId: g.dp.id, condition: 'stale' },
    ['2026-11-05T06:00:00Z'],
    '2026-11-05T07:00:00Z',
  );
  await alarm(
    'gPtStale',
    { meterRunId: grun, transmitterId: g.pt.id, condition: 'stale' },
    ['2026-11-05T06:00:30Z'],
    '2026-11-05T07:00:00Z',
  );
  await alarm(
    'gTtBad',
    { meterRunId: grun, transmitterId: g.tt.id, condition: 'bad-quality' },
    ['2026-11-05T06:01:30Z'],
    '2026-11-05T07:00:00Z',
  );
  await alarm(
    'gDpFrozen',
    { meterRunId: grun, transmitterId: g.dp.id, condition: 'frozen' },
    ['2026-11-05T06:00:10Z'],
    '2026-11-05T07:00:00Z',
  );
  await alarm(
    'gTtStale',
    { meterRunId: grun, transmitterId: g.tt.id, condition: 'stale' },
    ['2026-11-05T06:03:00Z'],
    '2026-11-05T07:00:00Z',
  );
});
afterAll(() => t.close());

const get = (role: keyof typeof who, url: string) =>
  t.http().get(url).set('Authorization', `Bearer ${who[role].token}`);

describe('GET /api/alarm-performance', () => {
  it('reports a month of hand-built alarms against the ISA-18.2 benchmarks', async () => {
    const res = await get('operator', `/api/alarm-performance?siteId=${siteId}&month=2026-11`);
    expect(res.status).toBe(200);
    const r = res.body;
    expect(r).toMatchObject({
      siteId,
      month: '2026-11',
      from: '2026-11-01T00:00:00.000Z',
      to: '2026-12-01T00:00:00.000Z',
      operatorPositions: 1,
      periods: 4320, // 30 days × 144
      annunciations: 13, // 3 + 8 + 1 + 1
      averagePer10MinPerOperator: 0.003, // 13 / 4320 = 0.00301
      peakPer10MinPerOperator: 11,
      floodPeriods: 1,
      floodPercentOfTime: 0.023, // 1 / 4320 = 0.0231 %
    });
    expect(r.chattering).toEqual([
      expect.objectContaining({ transmitterId: f.dp.id, condition: 'stale', raises: 3, mostInOneMinute: 3 }),
    ]);
    expect(r.stale).toEqual([
      expect.objectContaining({
        alarmId: ids.ttFrozen,
        transmitterTag: f.tt.tag,
        condition: 'frozen',
        raisedAt: '2026-11-10T00:00:00.000Z',
        clearedAt: '2026-11-11T01:00:00.000Z',
        activeHours: 25,
      }),
    ]);
    // 8/13 = 61.5 %, 3/13 = 23.1 %, 1/13 = 7.7 %
    expect(
      r.topTen.map((p: { condition: string; raises: number; sharePercent: number }) => [
        p.condition,
        p.raises,
        p.sharePercent,
      ]),
    ).toEqual(
      expect.arrayContaining([
        ['bad-quality', 8, 61.5],
        ['stale', 3, 23.1],
        ['frozen', 1, 7.7],
        ['stack-disagreement', 1, 7.7],
      ]),
    );
    expect(r.topTen).toHaveLength(4);
    expect(r.topTen[0]).toMatchObject({ transmitterTag: f.pt.tag, meterRunId: f.meterRunId });
    expect(r.benchmarks).toMatchObject({
      averagePer10MinVeryLikelyAcceptable: 1,
      averagePer10MinMaximumManageable: 2,
      floodPercentOfTimeAtMost: 1,
      chatteringAlarms: 0,
      staleAlarms: 0,
    });
  });

  it('reports an empty month as no alarms, every period counted', async () => {
    const res = await get('accountant', `/api/alarm-performance?siteId=${siteId}&month=2026-02`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ periods: 4032, annunciations: 0, peakPer10MinPerOperator: 0, floodPeriods: 0 }); // 28 × 144
    expect(res.body.topTen).toEqual([]);
  });

  it('is read by every role', async () => {
    for (const role of ['operator', 'engineer', 'accountant', 'admin'] as const)
      expect((await get(role, `/api/alarm-performance?siteId=${siteId}&month=2026-11`)).status).toBe(200);
  });

  it('names the field of a bad query and answers 404 for an unknown site', async () => {
    const bad = await get('engineer', `/api/alarm-performance?siteId=${siteId}&month=2026-13`);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/month/);
    const noSite = await get('engineer', '/api/alarm-performance?month=2026-11');
    expect(noSite.status).toBe(400);
    expect(JSON.stringify(noSite.body)).toMatch(/siteId/);
    expect((await get('engineer', '/api/alarm-performance?siteId=999999999&month=2026-11')).status).toBe(404);
  });
});

describe('consequential alarms in GET /api/alarms', () => {
  it('lists one outage as a first-out with its consequential alarms under it', async () => {
    const res = await get('operator', `/api/alarms?siteId=${groupSiteId}`);
    expect(res.status).toBe(200);
    const byId = new Map(res.body.map((a: { id: string }) => [a.id, a]));
    expect(byId.get(ids.gDpStale)).toMatchObject({ groupId: ids.gDpStale, firstOutId: null, consequentialCount: 2 });
    expect(byId.get(ids.gPtStale)).toMatchObject({ groupId: ids.gDpStale, firstOutId: ids.gDpStale });
    expect(byId.get(ids.gTtBad)).toMatchObject({ groupId: ids.gDpStale, firstOutId: ids.gDpStale });
    expect(byId.get(ids.gDpFrozen)).toMatchObject({ groupId: ids.gDpFrozen, firstOutId: null, consequentialCount: 0 });
    expect(byId.get(ids.gTtStale)).toMatchObject({ groupId: ids.gTtStale, firstOutId: null, consequentialCount: 0 });
  });
});
