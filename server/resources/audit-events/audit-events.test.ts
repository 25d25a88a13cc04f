import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
let admin: Awaited<ReturnType<typeof t.signedIn>>;
let accountant: Awaited<ReturnType<typeof t.signedIn>>;
beforeAll(async () => {
  t = await testApp();
  admin = await t.signedIn('admin');
  accountant = await t.signedIn('accountant');
});
afterAll(() => t.close());

const get = (token: string, query: string) =>
  t.http().get(`/api/audit-events${query}`).set('Authorization', `Bearer ${token}`);

describe('GET /api/audit-events', () => {
  it('shows who changed a record, when, and the values before and after, newest first', async () => {
    const u = await t.signedIn('operator');
    await t.http().patch(`/api/users/${u.id}`).set('Authorization', `Bearer ${admin.token}`).send({ name: 'First' });
    await t.http().patch(`/api/users/${u.id}`).set('Authorization', `Bearer ${admin.token}`).send({ name: 'Second' });
    const res = await get(accountant.token, `?entityType=user&entityId=${u.id}`);
    expect(res.status).toBe(200);
    expect(res.body.map((e: { after: { name: string } }) => e.after.name)).toEqual(['Second', 'First']);
    expect(res.body[0]).toEqual({
      id: expect.stringMatching(/^\d+$/),
      occurredAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/),
      actorEmail: admin.email,
      action: 'user.update',
      entityType: 'user',
      entityId: u.id,
      before: expect.objectContaining({ name: 'First' }),
      after: expect.objectContaining({ name: 'Second' }),
      reason: null,
      // Its place in the hash chain (the chain itself is checked in server/audit-chain.test.ts).
      chainSeq: expect.stringMatching(/^\d+$/),
      hash: expect.stringMatching(/^[0-9a-f]{64}$/),
      previousHash: expect.stringMatching(/^[0-9a-f]{64}$/),
      actorId: admin.id,
      kind: 'user',
      // Added last (issue 14): the actor's name, so the log says who in words.
      actorName: expect.any(String),
    });
    expect(Number(res.body[0].chainSeq)).toBeGreaterThan(Number(res.body[1].chainSeq));
    expect((await get(accountant.token, `?entityType=user&entityId=${u.id}&limit=1`)).body).toHaveLength(1);
  });

  it('refuses a limit outside 1–1000 naming it', async () => {
    const res = await get(accountant.token, '?limit=5000');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('limit');
  });
});

/** A site with two meter runs, A with a transmitter re-ranged and a new configuration version, B untouched. */
async function twoMeterRuns(engineer: Awaited<ReturnType<typeof t.signedIn>>) {
  const as = (req: ReturnType<ReturnType<typeof t.http>['post']>) =>
    req.set('Authorization', `Bearer ${engineer.token}`);
  const site = await as(t.http().post('/api/sites')).send({
    code: `AE${t.unique()}`,
    name: 'Audit filter site',
    timeZone: 'UTC',
    contractHour: 6,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  expect(site.status).toBe(201);
  const run = async () => {
    const res = await as(t.http().post('/api/meter-runs')).send({
      siteId: site.body.id,
      tag: `AE-${t.unique()}`,
      name: 'Audit filter run',
      element: orifice,
      fluid: { kind: 'steam' },
      effectiveFrom: '2024-01-01T00:00:00Z',
    });
    expect(res.status).toBe(201);
    return res.body.id as string;
  };
  const a = await run();
  const b = await run();
  const transmitter = await as(t.http().post('/api/transmitters')).send({
    meterRunId: a,
    tag: `AE-${t.unique()}-DP`,
    measures: 'differential-pressure',
    unit: 'kPa',
    lowerRange: 0,
    upperRange: 25,
  });
  expect(transmitter.status).toBe(201);
  const rerange = await t
    .http()
    .patch(`/api/transmitters/${transmitter.body.id}`)
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({ upperRange: 50 });
  expect(rerange.status).toBe(200);
  const version = await as(t.http().post(`/api/meter-runs/${a}/config-versions`)).send({
    element: { ...orifice, boreDiameterM: 0.051 },
    fluid: { kind: 'steam' },
    effectiveFrom: '2024-02-01T00:00:00Z',
    reason: 'plate swapped, "B" side\nfound at inspection',
  });
  expect(version.status).toBe(201);
  return { siteId: site.body.id as string, a, b, transmitterId: transmitter.body.id as string };
}

const orifice = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1023, boreDiameterM: 0.05 };
type Event = { action: string; entityType: string; entityId: string | null; actorEmail: string; occurredAt: string };

describe('GET /api/audit-events filters', () => {
  let engineer: Awaited<ReturnType<typeof t.signedIn>>;
  let runs: Awaited<ReturnType<typeof twoMeterRuns>>;
  beforeAll(async () => {
    engineer = await t.signedIn('engineer');
    runs = await twoMeterRuns(engineer);
  });

  it('by meter run: the run itself, its transmitters and its configuration versions, not another run or the site', async () => {
    const res = await get(accountant.token, `?meterRunId=${runs.a}`);
    expect(res.status).toBe(200);
    expect(res.body.map((e: Event) => `${e.action} ${e.entityType} ${e.entityId}`)).toEqual([
      `config-version.create meter-run ${runs.a}`,
      `transmitter.update transmitter ${runs.transmitterId}`,
      `transmitter.create transmitter ${runs.transmitterId}`,
      `meter-run.create meter-run ${runs.a}`,
    ]);
    expect((await get(accountant.token, `?meterRunId=${runs.b}`)).body.map((e: Event) => e.action)).toEqual([
      'meter-run.create',
    ]);
  });

  it('by user: only what that user did', async () => {
    const res = await get(accountant.token, `?userId=${engineer.id}`);
    expect(res.status).toBe(200);
    expect(res.body.length).toBe(6);
    expect(new Set(res.body.map((e: Event) => e.actorEmail))).toEqual(new Set([engineer.email]));
  });

  it('by kind: configuration keeps set-up changes, sign-in keeps sign-ins only', async () => {
    const configuration = await get(accountant.token, `?userId=${engineer.id}&kind=configuration`);
    expect(configuration.body.map((e: Event) => e.action)).toEqual([
      'config-version.create',
      'transmitter.update',
      'transmitter.create',
      'meter-run.create',
      'meter-run.create',
      'site.create',
    ]);
    const signIn = await t.http().post('/api/auth/login').send({ email: engineer.email, password: engineer.password });
    expect(signIn.status).toBe(200);
    const signIns = await get(accountant.token, `?userId=${engineer.id}&kind=sign-in`);
    expect(signIns.body.map((e: Event) => e.action)).toEqual(['auth.sign-in']);
    expect((await get(accountant.token, `?userId=${engineer.id}&kind=device`)).body).toEqual([]);
  });

  it('by period: events in [from, to) only', async () => {
    const all = (await get(accountant.token, `?meterRunId=${runs.a}`)).body as Event[];
    // From the transmitter's re-range (inclusive) to the configuration version's instant (exclusive).
    const from = all[1].occurredAt;
    const to = all[0].occurredAt;
    const res = await get(accountant.token, `?meterRunId=${runs.a}&from=${from}&to=${to}`);
    expect(res.status).toBe(200);
    expect(res.body.every((e: Event) => e.occurredAt >= from && e.occurredAt < to)).toBe(true);
    expect(res.body.map((e: Event) => e.action)).toContain('transmitter.update');
    expect(res.body.map((e: Event) => e.action)).not.toContain('meter-run.create');
  });

  it('refuses a bad filter naming its field', async () => {
    const field = async (query: string) => {
      const res = await get(accountant.token, query);
      expect(res.status).toBe(400);
      return res.body.error.field;
    };
    expect(await field('?meterRunId=abc')).toBe('meterRunId');
    expect(await field('?userId=x1')).toBe('userId');
    expect(await field('?kind=everything')).toBe('kind');
    expect(await field('?from=2026-01-01T00:00:00Z')).toBe('to');
    expect(await field('?to=2026-01-01T00:00:00Z')).toBe('from');
    expect(await field('?from=2026-01-02T00:00:00Z&to=2026-01-01T00:00:00Z')).toBe('to');
    expect(await field('?from=2026-01-01T00:00:00&to=2026-01-02T00:00:00Z')).toBe('from');
    expect(await field('?format=xml')).toBe('format');
  });

  it('exports the filtered events as CSV with a header line, quoting commas, quotes and line breaks', async () => {
    const res = await get(accountant.token, `?meterRunId=${runs.a}&kind=configuration&format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?audit-events-\d{4}-\d\d-\d\d\.csv"?$/);
    const text: string = res.text;
    expect(
      text.startsWith(
        'id,chain_seq,occurred_at,kind,action,entity_type,entity_id,actor_id,actor_email,reason,before,after,hash,previous_hash\r\n',
      ),
    ).toBe(true);
    // The reason holds a comma, quotes and a line break: quoted, quotes doubled (RFC 4180 §2).
    expect(text).toContain(',"plate swapped, ""B"" side\nfound at inspection",');
    const json = (await get(accountant.token, `?meterRunId=${runs.a}&kind=configuration`)).body as { id: string }[];
    const ids = text
      .split('\r\n')
      .slice(1)
      .filter((line) => /^\d+,\d+,\d{4}-/.test(line))
      .map((line) => line.split(',')[0]);
    expect(ids).toEqual(json.map((e) => e.id));
  });

  it('records every CSV export in the audit trail with who, the filters and the rows', async () => {
    const exporter = await t.signedIn('engineer');
    await get(exporter.token, `?meterRunId=${runs.a}&kind=configuration&format=csv`);
    const res = await get(accountant.token, `?userId=${exporter.id}&kind=export`);
    expect(res.body).toHaveLength(1);
    expect(res.body[0]).toMatchObject({
      action: 'export.audit-events',
      entityType: 'export',
      actorEmail: exporter.email,
      kind: 'export',
      after: { what: 'audit-events', format: 'csv', filters: { meterRunId: runs.a, kind: 'configuration' }, rows: 4 },
    });
  });

  it('lists who has acted, for the user filter', async () => {
    const actors = await t.http().get('/api/audit-events/actors').set('Authorization', `Bearer ${accountant.token}`);
    expect(actors.status).toBe(200);
    expect(actors.body).toContainEqual({ id: engineer.id, email: engineer.email });
  });
});
