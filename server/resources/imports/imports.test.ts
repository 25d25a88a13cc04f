import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Response } from 'superagent';
import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

/**
 * Imported files are kept as part of the record (issue 9, item 3): hashed, stored read-only,
 * downloadable byte for byte, audited; field totals imported twice keep both versions.
 * Expected hashes come from outside the code under test: coreutils' `sha256sum` on the same
 * bytes, and the FIPS 180-4 examples (NIST CSRC "Examples with intermediate values", SHA-256:
 * "abc" and the empty message).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  f = await alarmFixture(t, engineer.token);
});
afterAll(() => t.close());

const auth = () => ({ Authorization: `Bearer ${engineer.token}` });

/** SHA-256 of the bytes by coreutils, not by Tallyrun. */
function sha256sum(bytes: Buffer): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-sha-')), 'file');
  fs.writeFileSync(file, bytes);
  const out = execFileSync('sha256sum', [file], { encoding: 'utf8' });
  fs.rmSync(path.dirname(file), { recursive: true, force: true });
  return out.split(' ')[0];
}

async function upload(bytes: Buffer, filename: string, kind = 'readings') {
  const res = await t.http().post('/api/imports').set(auth()).field('kind', kind).attach('file', bytes, filename);
  expect(res.status).toBe(202);
  return String(res.body.id);
}

async function finished(importId: string) {
  for (const end = Date.now() + 30_000; Date.now() < end;) {
    const res = await t.http().get(`/api/imports/${importId}`).set(auth());
    if (res.body.status !== 'running') return res.body;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`import ${importId} did not finish`);
}

/** The response body as raw bytes, whatever its type. */
const download = (importId: string) =>
  t
    .http()
    .get(`/api/imports/${importId}/original`)
    .set(auth())
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    }) as Promise<Response & { body: Buffer }>;

const storedPath = async (importId: string) =>
  (
    await t.services.pool.query<{ original_path: string }>('SELECT original_path FROM imports WHERE id = $1', [
      importId,
    ])
  ).rows[0].original_path;

const auditOf = async (importId: string) =>
  (
    await t.services.pool.query<{ action: string; actor_email: string; after: Record<string, unknown> }>(
      `SELECT action, actor_email, after FROM audit_events WHERE entity_type = 'import' AND entity_id = $1 ORDER BY id`,
      [importId],
    )
  ).rows;

describe('the originals of imports', () => {
  it.each([
    ['"abc"', Buffer.from('abc'), 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    ['the empty file', Buffer.alloc(0), 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  ])('records the FIPS 180-4 SHA-256 of %s, even when the import refuses its content', async (_name, bytes, fips) => {
    const id = await upload(bytes, 'odd.csv');
    await finished(id);
    const got = await t.http().get(`/api/imports/${id}`).set(auth());
    expect(got.body.sha256).toBe(fips);
    expect(sha256sum(bytes)).toBe(fips);
  });

  it('keeps a readings file read-only under originals/<yyyy>/<mm>/ with the hash sha256sum gives', async () => {
    const csv = Buffer.from(`time,tag,value\r\n2025-03-01T00:00:00Z,${f.dp.tag},12.5\r\n`);
    const id = await upload(csv, 'readings.csv');
    const done = await finished(id);
    expect(done).toMatchObject({ status: 'done', rowsImported: 1, sha256: sha256sum(csv) });
    const now = new Date(done.uploadedAt);
    const month = `${now.getUTCFullYear()}/${String(now.getUTCMonth() + 1).padStart(2, '0')}`;
    const relative = await storedPath(id);
    expect(relative).toBe(`originals/${month}/${id}-${sha256sum(csv)}.csv`);
    const file = path.join(t.services.originalsDir, '..', relative);
    expect(fs.readFileSync(file).equals(csv)).toBe(true);
    expect(fs.statSync(file).mode & 0o777).toBe(0o444);
  });

  it('lists and shows the hash, the uploader, the upload time and the meter runs touched beside the keys it had', async () => {
    const csv = Buffer.from(`time,tag,value\n2025-03-01T00:01:00Z,${f.dp.tag},12.5\n`);
    const id = await upload(csv, 'shown.csv');
    const one = await finished(id);
    expect(Object.keys(one)).toEqual([
      'id',
      'kind',
      'filename',
      'status',
      'bytesTotal',
      'bytesRead',
      'rowsRead',
      'rowsImported',
      'duplicates',
      'conflicts',
      'rejected',
      'errors',
      'createdAt',
      'finishedAt',
      'sha256',
      'uploadedBy',
      'uploadedAt',
      // Added last (issue 14): the meter runs the import touched, so a finished import leads on to them.
      'meterRuns',
    ]);
    expect(one).toMatchObject({ sha256: sha256sum(csv), uploadedBy: engineer.email, uploadedAt: one.createdAt });
    expect(one.meterRuns).toEqual([{ id: f.meterRunId, tag: f.tag }]);
    // The list carries the same keys but the touched meter runs, which only the detail looks for.
    const { meterRuns: _touched, ...listed } = one;
    const list = await t.http().get('/api/imports').set(auth());
    expect(list.body.find((i: { id: string }) => i.id === id)).toEqual(listed);
  });

  it('gives back the exact bytes uploaded, named as uploaded, with their hash', async () => {
    // A byte-order mark, CRLF, a Latin-1 byte that is not UTF-8: served untouched.
    const bytes = Buffer.concat([
      Buffer.from([0xef, 0xbb, 0xbf]),
      Buffer.from(`time,tag,value\r\n2025-03-01T00:02:00Z,${f.dp.tag},12.5\r\n`),
      Buffer.from([0xe9, 0x0a]),
    ]);
    const id = await upload(bytes, 'Meter "A" day.csv');
    await finished(id);
    const res = await download(id);
    expect(res.status).toBe(200);
    expect(res.body.equals(bytes)).toBe(true);
    expect(res.headers['content-type']).toBe('text/csv');
    expect(res.headers['x-content-sha256']).toBe(sha256sum(bytes));
    expect(res.headers['content-disposition']).toBe('attachment; filename="Meter \\"A\\" day.csv"');
  });

  it('names a download with a non-ASCII name in UTF-8 (RFC 8187) beside an ASCII fallback', async () => {
    const id = await upload(Buffer.from('time,tag,value\n'), 'Mérida.csv');
    await finished(id);
    expect((await t.http().get(`/api/imports/${id}`).set(auth())).body.filename).toBe('Mérida.csv');
    const res = await download(id);
    // é is U+00E9, C3 A9 in UTF-8.
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="M_rida.csv"; filename*=UTF-8''M%C3%A9rida.csv`,
    );
  });

  it('keeps both originals when the same file is imported twice', async () => {
    const csv = Buffer.from(`time,tag,value\n2025-03-01T00:03:00Z,${f.dp.tag},12.5\n`);
    const first = await upload(csv, 'twice.csv');
    // The second import finds the first one's reading only once the first has committed.
    await finished(first);
    const second = await upload(csv, 'twice.csv');
    expect(second).not.toBe(first);
    expect((await finished(second)).duplicates).toBe(1);
    expect(await storedPath(first)).not.toBe(await storedPath(second));
    for (const id of [first, second]) {
      const res = await download(id);
      expect(res.status).toBe(200);
      expect(res.body.equals(csv)).toBe(true);
    }
  });

  it('answers 404 for an unknown import and for an import whose original was never kept', async () => {
    const unknown = await download('999999999');
    expect(unknown.status).toBe(404);
    expect(JSON.parse(unknown.body.toString()).error.code).toBe('not_found');
    // An import from before originals were kept: no hash, no path.
    const { rows } = await t.services.pool.query<{ id: string }>(
      `INSERT INTO imports (kind, filename, status) VALUES ('readings', 'old.csv', 'done') RETURNING id::text`,
    );
    const old = await download(rows[0].id);
    expect(old.status).toBe(404);
    expect(JSON.parse(old.body.toString()).error.code).toBe('not_found');
    expect((await t.http().get(`/api/imports/${rows[0].id}`).set(auth())).body).toMatchObject({
      sha256: null,
      uploadedBy: null,
    });
  });

  it('audits the start of an import with its hash, and each download of its original', async () => {
    const csv = Buffer.from(`time,tag,value\n2025-03-01T00:04:00Z,${f.dp.tag},12.5\n`);
    const id = await upload(csv, 'audited.csv');
    await finished(id);
    expect(await auditOf(id)).toEqual([
      {
        action: 'import.create',
        actor_email: engineer.email,
        after: { kind: 'readings', filename: 'audited.csv', sizeBytes: csv.length, sha256: sha256sum(csv) },
      },
    ]);
    expect((await download(id)).status).toBe(200);
    expect((await auditOf(id)).map((e) => [e.action, e.actor_email])).toEqual([
      ['import.create', engineer.email],
      ['import.download-original', engineer.email],
    ]);
  });

  it('still deletes an upload refused for its kind, and records no import of it', async () => {
    const before = (await t.services.pool.query<{ n: string }>('SELECT count(*) AS n FROM imports')).rows[0].n;
    const res = await t
      .http()
      .post('/api/imports')
      .set(auth())
      .field('kind', 'invoices')
      .attach('file', Buffer.from('a,b\n'), 'x.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('kind');
    const after = (await t.services.pool.query<{ n: string }>('SELECT count(*) AS n FROM imports')).rows[0].n;
    expect(after).toBe(before);
  });
});

describe('field totals imported twice for the same period', () => {
  it('keep both versions with their import and line, the newest in force', async () => {
    const header = 'start,end,meterRun,quantity,value,unit';
    const period = '2025-03-01T00:00:00Z,2025-03-02T00:00:00Z';
    const first = await upload(
      Buffer.from(`${header}\n${period},${f.tag},standard-volume,100,m3\n`),
      'a.csv',
      'field-totals',
    );
    expect(await finished(first)).toMatchObject({ status: 'done', rowsImported: 1, duplicates: 0 });
    const second = await upload(
      Buffer.from(`${header}\n\n${period},${f.tag},standard-volume,120,m3\n`),
      'b.csv',
      'field-totals',
    );
    // Counted as before: the repeated period is a duplicate of the first.
    expect(await finished(second)).toMatchObject({ status: 'done', rowsImported: 0, duplicates: 1 });

    const inForce = await t.services.pool.query<{ standard_volume_m3: number; import_id: string }>(
      'SELECT standard_volume_m3, import_id::text FROM field_totals WHERE meter_run_id = $1',
      [f.meterRunId],
    );
    expect(inForce.rows).toEqual([{ standard_volume_m3: 120, import_id: second }]);
    const versions = await t.services.pool.query(
      `SELECT quantity, value_si, import_id::text, line FROM field_total_versions WHERE meter_run_id = $1 ORDER BY id`,
      [f.meterRunId],
    );
    expect(versions.rows).toEqual([
      { quantity: 'standard-volume', value_si: 100, import_id: first, line: 2 },
      { quantity: 'standard-volume', value_si: 120, import_id: second, line: 3 },
    ]);
    // The versions are append-only.
    await expect(
      t.services.pool.query('DELETE FROM field_total_versions WHERE import_id = $1', [first]),
    ).rejects.toThrow(/permission denied for table field_total_versions/);
  });
});
