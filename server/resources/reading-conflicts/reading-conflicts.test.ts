import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

/**
 * Re-sent readings with another value (issue 9, item 3) through CSV imports, on the real server
 * and database: the first reading stays stored, the other is recorded as a conflict, listed and
 * resolved once by an engineer, audited with the reason. An identical re-send stays a silent
 * duplicate. The values compared are the file's own figures, so each expected value is read off
 * the CSV text written here.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let otherEngineer: Awaited<ReturnType<typeof t.signedIn>>;
let accountant: Awaited<ReturnType<typeof t.signedIn>>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  otherEngineer = await t.signedIn('engineer');
  accountant = await t.signedIn('accountant');
  f = await alarmFixture(t, engineer.token);
});
afterAll(() => t.close());

const auth = (who: { token: string }) => ({ Authorization: `Bearer ${who.token}` });

async function importCsv(csv: string) {
  const res = await t
    .http()
    .post('/api/imports')
    .set(auth(engineer))
    .field('kind', 'readings')
    .attach('file', Buffer.from(csv), 'conflicts.csv');
  expect(res.status).toBe(202);
  const id = String(res.body.id);
  for (const end = Date.now() + 30_000; Date.now() < end;) {
    const got = await t.http().get(`/api/imports/${id}`).set(auth(engineer));
    if (got.body.status !== 'running') return got.body as Record<string, unknown> & { id: string };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`import ${id} did not finish`);
}

const conflictsOf = async (query: string, who = engineer) => {
  const res = await t.http().get(`/api/reading-conflicts?meterRunId=${f.meterRunId}${query}`).set(auth(who));
  expect(res.status).toBe(200);
  return res.body as Record<string, unknown>[];
};

const storedAt = async (transmitterId: string, time: string) => {
  const to = new Date(Date.parse(time) + 1).toISOString();
  const res = await t
    .http()
    .get(`/api/readings?transmitterId=${transmitterId}&from=${time}&to=${to}&provenance=true`)
    .set(auth(engineer));
  expect(res.status).toBe(200);
  return res.body;
};

describe('a re-imported reading with another value', () => {
  const time = '2025-04-02T03:04:00.000Z';
  let first: { id: string };
  let second: Record<string, unknown> & { id: string };

  beforeAll(async () => {
    first = await importCsv(`time,tag,value\n${time},${f.pt.tag},4.25\n`);
    second = await importCsv(`time,tag,value\n${time},${f.pt.tag},4.5\n`);
  });

  it('keeps the first value stored, with the first import as its source and its arrival time', async () => {
    const [stored] = await storedAt(f.pt.id, time);
    expect(stored).toMatchObject({
      time,
      value: 4.25,
      quality: 'good',
      source: 'csv',
      importId: first.id,
      deviceId: null,
    });
    expect(Date.parse(stored.arrivedAt)).toBeGreaterThan(Date.now() - 10 * 60_000);
  });

  it('counts it as a duplicate and a conflict in the import, not as a rejected line', () => {
    expect(second).toMatchObject({
      status: 'done',
      rowsRead: 1,
      rowsImported: 0,
      duplicates: 1,
      conflicts: 1,
      rejected: 0,
    });
  });

  it('lists one open conflict with both values, both sources and the unit', async () => {
    const open = (await conflictsOf('&status=open')).filter((c) => c.time === time);
    expect(open).toEqual([
      {
        id: expect.any(String),
        meterRunId: f.meterRunId,
        transmitterId: f.pt.id,
        transmitterTag: f.pt.tag,
        time,
        storedValue: 4.25,
        storedQuality: 'good',
        offeredValue: 4.5,
        offeredQuality: 'good',
        unit: 'MPa',
        storedSource: `import:${first.id}`,
        storedArrivedAt: expect.any(String),
        offeredSource: `import:${second.id}`,
        offeredArrivedAt: expect.any(String),
        status: 'open',
        resolvedBy: null,
        resolvedAt: null,
        resolution: null,
        correctionId: null,
      },
    ]);
  });

  it('adds no conflict when the same file comes again (identical re-send) or the same offer is made again', async () => {
    const again = await importCsv(`time,tag,value\n${time},${f.pt.tag},4.25\n`);
    expect(again).toMatchObject({ duplicates: 1, conflicts: 0, rejected: 0 });
    const offeredAgain = await importCsv(`time,tag,value\n${time},${f.pt.tag},4.5\n`);
    expect(offeredAgain).toMatchObject({ duplicates: 1, conflicts: 0 });
    expect((await conflictsOf('')).filter((c) => c.time === time)).toHaveLength(1);
    expect((await storedAt(f.pt.id, time))[0].value).toBe(4.25);
  });

  it('is listed for every role that sees totals', async () => {
    expect((await conflictsOf('&status=open', accountant)).some((c) => c.time === time)).toBe(true);
  });

  it('is resolved once, with a reason, audited; a second resolve is a conflict (409)', async () => {
    const [open] = (await conflictsOf('&status=open')).filter((c) => c.time === time);
    const missing = await t.http().post(`/api/reading-conflicts/${open.id}/resolve`).set(auth(engineer)).send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error).toMatchObject({ field: 'resolution' });
    const blank = await t
      .http()
      .post(`/api/reading-conflicts/${open.id}/resolve`)
      .set(auth(engineer))
      .send({ resolution: '   ' });
    expect(blank.status).toBe(400);

    const done = await t
      .http()
      .post(`/api/reading-conflicts/${open.id}/resolve`)
      .set(auth(engineer))
      .send({ resolution: 'the first value matches the field log', correctionId: '12' });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({
      id: open.id,
      status: 'resolved',
      resolvedBy: engineer.email,
      resolution: 'the first value matches the field log',
      correctionId: '12',
      storedValue: 4.25,
    });
    expect(Date.parse(done.body.resolvedAt)).toBeGreaterThan(Date.now() - 60_000);

    const twice = await t
      .http()
      .post(`/api/reading-conflicts/${open.id}/resolve`)
      .set(auth(otherEngineer))
      .send({ resolution: 'again' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('already_resolved');

    expect((await conflictsOf('&status=open')).some((c) => c.id === open.id)).toBe(false);
    expect((await conflictsOf('&status=resolved')).map((c) => c.id)).toContain(open.id);
    const audit = await t.services.pool.query<{ action: string; actor_email: string; reason: string }>(
      `SELECT action, actor_email, reason FROM audit_events WHERE entity_type = 'reading-conflict' AND entity_id = $1`,
      [open.id],
    );
    expect(audit.rows).toEqual([
      {
        action: 'reading-conflict.resolve',
        actor_email: engineer.email,
        reason: 'the first value matches the field log',
      },
    ]);
  });
});

it('records a conflict between two lines of one file for the same tag and time, keeping the first line', async () => {
  const time = '2025-04-03T05:06:00.000Z';
  const done = await importCsv(`time,tag,value\n${time},${f.tt.tag},290.5\n${time},${f.tt.tag},291\n`);
  expect(done).toMatchObject({ rowsImported: 1, duplicates: 1, conflicts: 1, rejected: 0 });
  expect((await storedAt(f.tt.id, time))[0].value).toBe(290.5);
  const [c] = (await conflictsOf('&status=open')).filter((x) => x.time === time);
  expect(c).toMatchObject({ storedValue: 290.5, offeredValue: 291, storedSource: `import:${done.id}` });
});

it('counts a re-sent reading with another quality as a conflict', async () => {
  const time = '2025-04-04T05:06:00.000Z';
  await importCsv(`time,tag,value,quality\n${time},${f.tt.tag},290.5,good\n`);
  const again = await importCsv(`time,tag,value,quality\n${time},${f.tt.tag},290.5,bad\n`);
  expect(again).toMatchObject({ duplicates: 1, conflicts: 1 });
  const [c] = (await conflictsOf('')).filter((x) => x.time === time);
  expect(c).toMatchObject({ storedQuality: 'good', offeredQuality: 'bad' });
});

it('refuses a bad filter naming the field, and an unknown meter run or conflict as not found', async () => {
  const bad = await t.http().get('/api/reading-conflicts?status=closed').set(auth(engineer));
  expect(bad.status).toBe(400);
  expect(bad.body.error).toMatchObject({ field: 'status', message: 'status: must be open or resolved' });
  const run = await t.http().get('/api/reading-conflicts?meterRunId=x').set(auth(engineer));
  expect(run.status).toBe(400);
  expect(run.body.error.field).toBe('meterRunId');
  const noRun = await t.http().get('/api/reading-conflicts?meterRunId=999999999').set(auth(engineer));
  expect(noRun.status).toBe(404);
  const noConflict = await t
    .http()
    .post('/api/reading-conflicts/999999999/resolve')
    .set(auth(engineer))
    .send({ resolution: 'x' });
  expect(noConflict.status).toBe(404);
});

it('keeps conflicts and their resolutions append-only in the database', async () => {
  await expect(t.services.pool.query('UPDATE reading_conflicts SET offered_value = 0')).rejects.toThrow(
    /permission denied for table reading_conflicts/,
  );
  await expect(t.services.pool.query('DELETE FROM reading_conflict_resolutions')).rejects.toThrow(
    /permission denied for table reading_conflict_resolutions/,
  );
});
