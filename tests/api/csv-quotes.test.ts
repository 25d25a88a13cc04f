import { testApp } from '../../server/test-support/app';
import { alarmFixture } from '../../server/alarms/alarm-test-fixture';

/**
 * A broken quote in a readings CSV (issue 12, point 4): the lines around it are kept, the error
 * is filed under the line the broken record starts on, and says where parsing resumed. Quoting
 * as RFC 4180 §2 defines it (a quoted field may hold line breaks; a quote inside one is doubled).
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

async function importCsv(text: string) {
  const bytes = Buffer.from(text);
  const res = await t.http().post('/api/imports').set(auth()).field('kind', 'readings').attach('file', bytes, 'q.csv');
  expect(res.status).toBe(202);
  const id = String(res.body.id);
  for (const end = Date.now() + 30_000; Date.now() < end;) {
    const got = await t.http().get(`/api/imports/${id}`).set(auth());
    if (got.body.status !== 'running') {
      const original = await t.http().get(`/api/imports/${id}/original`).set(auth()).buffer(true);
      return { ...got.body, id, originalSame: Buffer.from(original.text ?? '', 'utf8').equals(bytes) };
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`import ${id} did not finish`);
}

/** The readings stored by one import, as (minute, value in the transmitter's unit) pairs. */
async function storedMinutes(importId: string) {
  const res = await t.services.pool.query<{ minute: string }>(
    `SELECT to_char(time AT TIME ZONE 'UTC', 'HH24:MI') AS minute FROM readings WHERE import_id = $1 ORDER BY time`,
    [importId],
  );
  return res.rows.map((r) => r.minute);
}

const at = (hour: number, minute: number) => `2026-01-0${hour}T0${hour}:${String(minute).padStart(2, '0')}:00Z`;

describe('a readings CSV with a broken quote', () => {
  it('keeps the good lines and files an unclosed quote on line 4 under line 4, resuming at line 5', async () => {
    const tag = f.pt.tag;
    const csv = [
      'time,tag,value',
      `${at(1, 0)},${tag},2.0`,
      `${at(1, 1)},${tag},2.1`,
      `${at(1, 2)},"${tag},2.2`,
      `${at(1, 3)},${tag},2.3`,
      `${at(1, 4)},${tag},2.4`,
      '',
    ].join('\n');
    const done = await importCsv(csv);
    expect(done).toMatchObject({ status: 'done', rowsRead: 5, rowsImported: 4, rejected: 1 });
    expect(done.errors).toEqual([
      {
        line: 4,
        message:
          'line 4: a quote opened here is never closed; only this line was set aside and parsing resumed at line 5',
      },
    ]);
    expect(await storedMinutes(done.id)).toEqual(['01:00', '01:01', '01:03', '01:04']);
    expect(done.originalSame).toBe(true);
  });

  it('still reads a quoted value opened and closed across lines, and numbers the lines after it', async () => {
    const tag = f.pt.tag;
    const csv = `time,tag,value,note\n${at(2, 0)},${tag},2.0,"one"\n${at(2, 1)},${tag},2.1,"a\nb"\n${at(2, 2)},${tag},oops\n`;
    const done = await importCsv(csv);
    expect(done).toMatchObject({ status: 'done', rowsImported: 2, rejected: 1 });
    expect(done.errors.map((e: { line: number }) => e.line)).toEqual([5]);
    expect(await storedMinutes(done.id)).toEqual(['02:00', '02:01']);
  });

  it('keeps everything before an unclosed quote on the last line and says nothing after it was lost', async () => {
    const tag = f.pt.tag;
    const csv = `time,tag,value\n${at(3, 0)},${tag},2.0\n${at(3, 1)},${tag},2.1\n${at(3, 2)},${tag},"2.2`;
    const done = await importCsv(csv);
    expect(done).toMatchObject({ status: 'done', rowsImported: 2, rejected: 1 });
    expect(done.errors).toEqual([
      {
        line: 4,
        message:
          "line 4: a quote opened here is never closed; it is on the file's last line, so nothing after it was lost",
      },
    ]);
    expect(await storedMinutes(done.id)).toEqual(['03:00', '03:01']);
  });

  it('reads Windows line ends, a multi-line quoted value with them and a stray quote, with the right lines', async () => {
    const tag = f.pt.tag;
    const csv = [
      'time,tag,value,quality',
      `${at(4, 0)},${tag},2.0,"a`,
      `b"`,
      `${at(4, 1)},${tag},2"1`,
      `${at(4, 2)},${tag},2.2`,
      `${at(4, 3)},"${tag},2.3`,
      `${at(4, 4)},${tag},2.4`,
      '',
    ].join('\r\n');
    const done = await importCsv(csv);
    expect(done.status).toBe('done');
    expect(done.errors).toEqual([
      expect.objectContaining({ line: 2 }),
      {
        line: 4,
        message:
          'line 4: a quote inside an unquoted value (quote the whole value and double each quote inside it); line 4 could not be read; parsing resumed at line 5',
      },
      {
        line: 6,
        message:
          'line 6: a quote opened here is never closed; only this line was set aside and parsing resumed at line 7',
      },
    ]);
    expect(await storedMinutes(done.id)).toEqual(['04:02', '04:04']);
    expect(done.originalSame).toBe(true);
  });

  it('files a bad closing quote under its line and numbers the lines csv-parse resumes at', async () => {
    const tag = f.pt.tag;
    const csv = `time,tag,value\n${at(5, 0)},${tag},2.0\n${at(5, 1)},"${tag}"x,2.1\n${at(5, 2)},"${tag}",2.2\n${at(5, 3)},${tag},oops\n${at(5, 4)},${tag},2.4\n`;
    const done = await importCsv(csv);
    expect(done.status).toBe('done');
    expect(done.errors).toEqual([
      {
        line: 3,
        message:
          'line 3: a closing quote must be followed by a comma or the end of the line; lines 3–4 could not be read; parsing resumed at line 5',
      },
      expect.objectContaining({ line: 5 }),
    ]);
    expect(await storedMinutes(done.id)).toEqual(['05:00', '05:04']);
  });
});
