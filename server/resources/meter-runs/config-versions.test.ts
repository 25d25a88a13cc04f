import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let siteId: string;
beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  const site = await t
    .http()
    .post('/api/sites')
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({
      code: `CV${t.unique()}`,
      name: 'Configuration history site',
      timeZone: 'UTC',
      contractHour: 6,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
  siteId = site.body.id;
});
afterAll(() => t.close());

const hourMs = 3_600_000;
const orifice = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1023, boreDiameterM: 0.05 };
const fluid = { kind: 'steam' };

/** A meter run whose history starts on 1 January 2024. */
async function meterRun() {
  const res = await t
    .http()
    .post('/api/meter-runs')
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({
      siteId,
      tag: `CV-${t.unique()}`,
      name: 'Steam header',
      element: orifice,
      fluid,
      effectiveFrom: '2024-01-01T00:00:00Z',
    });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

const addVersion = (meterRunId: string, body: Record<string, unknown>) =>
  t
    .http()
    .post(`/api/meter-runs/${meterRunId}/config-versions`)
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({ element: orifice, fluid, reason: 'plate swapped', ...body });

const versionsOf = async (meterRunId: string) =>
  (await t.http().get(`/api/meter-runs/${meterRunId}/config-versions`).set('Authorization', `Bearer ${engineer.token}`))
    .body;

describe('PATCH /api/meter-runs/:id', () => {
  it('keeps the line data and dated settings when a PATCH changes only the name (no create defaults applied)', async () => {
    const id = await meterRun();
    const auth = `Bearer ${engineer.token}`;
    const line = { nominalSize: '4 in', schedule: '80' };
    expect((await t.http().patch(`/api/meter-runs/${id}`).set('Authorization', auth).send({ line })).status).toBe(200);
    expect(
      (await t.http().patch(`/api/meter-runs/${id}`).set('Authorization', auth).send({ maxGapS: 120 })).status,
    ).toBe(200);
    const renamed = await t.http().patch(`/api/meter-runs/${id}`).set('Authorization', auth).send({ name: 'Renamed' });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'Renamed', line, maxGapS: 120 });
  });

  it('refuses line.bidirectional: true while the latest configuration version has no reverseElement, and changes nothing', async () => {
    const id = await meterRun();
    const auth = `Bearer ${engineer.token}`;
    const res = await t
      .http()
      .patch(`/api/meter-runs/${id}`)
      .set('Authorization', auth)
      .send({ line: { bidirectional: true } });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('line.bidirectional');
    expect(res.body.error.message).toMatch(/reverseElement/);
    const after = await t.http().get(`/api/meter-runs/${id}`).set('Authorization', auth);
    expect(after.body.line.bidirectional).toBeUndefined();
  });

  it('accepts line.bidirectional: true once the latest version has a reverseElement, then refuses setting it back to false', async () => {
    const id = await meterRun();
    const auth = `Bearer ${engineer.token}`;
    const reverse = await addVersion(id, {
      effectiveFrom: '2024-03-01T00:00:00Z',
      reverseElement: { ...orifice, boreDiameterM: 0.0501 },
      reason: 'bi-directional from March',
    });
    expect(reverse.status).toBe(201);
    const marked = await t
      .http()
      .patch(`/api/meter-runs/${id}`)
      .set('Authorization', auth)
      .send({ line: { bidirectional: true, nominalSize: '4 in' } });
    expect(marked.status).toBe(200);
    expect(marked.body.line).toEqual({ bidirectional: true, nominalSize: '4 in' });
    const back = await t
      .http()
      .patch(`/api/meter-runs/${id}`)
      .set('Authorization', auth)
      .send({ line: { bidirectional: false, nominalSize: '4 in' } });
    expect(back.status).toBe(400);
    expect(back.body.error.field).toBe('line.bidirectional');
    // A one-way version after it makes the run one-way again, and the line may follow.
    expect((await addVersion(id, { effectiveFrom: '2024-04-01T00:00:00Z', reason: 'one-way again' })).status).toBe(201);
    const oneWay = await t
      .http()
      .patch(`/api/meter-runs/${id}`)
      .set('Authorization', auth)
      .send({ line: { bidirectional: false } });
    expect(oneWay.status).toBe(200);
  });
});

describe('configuration history of a meter run', () => {
  it('lists the first version with who made it, its reason, first: true and no changes', async () => {
    const id = await meterRun();
    const [first] = await versionsOf(id);
    expect(first).toMatchObject({
      effectiveFrom: '2024-01-01T00:00:00.000Z',
      reason: 'first configuration',
      createdBy: { email: engineer.email, name: 'Test engineer' },
      changes: [],
      first: true,
    });
  });

  it('keeps the existing keys first, in their order, and adds createdBy, changes and first after them', async () => {
    const [first] = await versionsOf(await meterRun());
    expect(Object.keys(first)).toEqual([
      'id',
      'meterRunId',
      'effectiveFrom',
      'element',
      'fluid',
      'reason',
      'createdAt',
      'createdBy',
      'changes',
      'first',
    ]);
  });

  it('gives a second version its author, reason and the fields it changed from the one before', async () => {
    const id = await meterRun();
    const res = await addVersion(id, {
      effectiveFrom: '2024-03-01T10:30:00Z',
      element: { ...orifice, boreDiameterM: 0.048, taps: 'corner' },
      reason: 'Bore re-measured at the spring inspection',
    });
    expect(res.status).toBe(201);
    const expected = {
      effectiveFrom: '2024-03-01T10:30:00.000Z',
      reason: 'Bore re-measured at the spring inspection',
      createdBy: { email: engineer.email, name: 'Test engineer' },
      changes: [
        { path: 'element.boreDiameterM', before: 0.05, after: 0.048 },
        { path: 'element.taps', before: 'flange', after: 'corner' },
      ],
      first: false,
    };
    expect(res.body).toMatchObject(expected);
    const versions = await versionsOf(id);
    expect(versions).toHaveLength(2);
    expect(versions[1]).toMatchObject(expected);
  });

  it('compares a version dated between two others with the one in force just before it, and the later one with it', async () => {
    const id = await meterRun();
    await addVersion(id, { effectiveFrom: '2024-06-01T00:00:00Z', element: { ...orifice, boreDiameterM: 0.046 } });
    await addVersion(id, { effectiveFrom: '2024-03-01T00:00:00Z', element: { ...orifice, boreDiameterM: 0.048 } });
    const versions = await versionsOf(id);
    expect(versions.map((v: { changes: unknown }) => v.changes)).toEqual([
      [],
      [{ path: 'element.boreDiameterM', before: 0.05, after: 0.048 }],
      [{ path: 'element.boreDiameterM', before: 0.048, after: 0.046 }],
    ]);
  });

  it("refuses a version dated before the meter run's first version with 400 naming effectiveFrom and the limit", async () => {
    const id = await meterRun();
    const res = await addVersion(id, { effectiveFrom: '2023-12-31T23:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('effectiveFrom');
    expect(res.body.error.message).toContain('2024-01-01T00:00:00.000Z');
    expect(await versionsOf(id)).toHaveLength(1);
  });

  it('refuses a version dated more than a day ahead with 400 naming effectiveFrom, and accepts one 23 hours ahead', async () => {
    const id = await meterRun();
    const tooLate = await addVersion(id, { effectiveFrom: new Date(Date.now() + 25 * hourMs).toISOString() });
    expect(tooLate.status).toBe(400);
    expect(tooLate.body.error.field).toBe('effectiveFrom');
    expect(tooLate.body.error.message).toMatch(/at most one day ahead/);
    const tomorrow = await addVersion(id, { effectiveFrom: new Date(Date.now() + 23 * hourMs).toISOString() });
    expect(tomorrow.status).toBe(201);
    expect(tomorrow.body.recompute.hours).toBe(0);
  });

  it('keeps 409 naming effectiveFrom for a second version at the instant of the first', async () => {
    const id = await meterRun();
    const res = await addVersion(id, { effectiveFrom: '2024-01-01T00:00:00Z' });
    expect(res.status).toBe(409);
    expect(res.body.error.field).toBe('effectiveFrom');
  });

  it('says from which hour a back-dated version is recomputed: the hour that contains its effective time', async () => {
    const id = await meterRun();
    const res = await addVersion(id, { effectiveFrom: '2024-03-01T10:30:00Z' });
    expect(res.status).toBe(201);
    // The site keeps UTC, so the hour containing 10:30 starts at 10:00; no hour is computed yet.
    expect(res.body.recompute).toEqual({ from: '2024-03-01T10:00:00.000Z', hours: 0 });
  });

  it('records the new version in the audit trail with its reason', async () => {
    const id = await meterRun();
    await addVersion(id, { effectiveFrom: '2024-02-01T00:00:00Z', reason: 'Gas analysis of 31 January' });
    const [rows] = await t.sequelize.query(
      `SELECT actor_email, reason FROM audit_events WHERE action = 'config-version.create' AND entity_id = :id`,
      { replacements: { id } },
    );
    expect(rows).toEqual([{ actor_email: engineer.email, reason: 'Gas analysis of 31 January' }]);
  });
});
