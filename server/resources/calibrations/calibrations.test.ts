import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';
import { AlarmEvaluator } from '../../alarms/alarm-evaluator';
import { sniffCertificateType } from '../../certificates/store';

/**
 * Calibrations of a transmitter (issue 11 §1) on the test fixture's DP transmitter, 0–50 kPa.
 * The error of a point is (indicated − applied) / span × 100, the error in percent of span of
 * IEC 61298-2 §4 (and ISA-51.1's "percent of span"); worked by hand below for each point.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
let operator: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const certificatesDir = path.join(os.tmpdir(), 'tallyrun-jest', 'certificates');
// A minimal PDF (ISO 32000: the file starts with "%PDF-") and a PNG signature (ISO/IEC 15948 §5.2).
const pdf = Buffer.from(`%PDF-1.4\n% calibration certificate ${crypto.randomUUID()}\n%%EOF\n`);
const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), crypto.randomBytes(32)]);

beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
  operator = (await t.signedIn('operator')).token;
  f = await alarmFixture(t, engineer);
}, 60_000);
afterAll(() => t.close());

const body = (overrides: Record<string, unknown> = {}) => ({
  calibratedOn: '2026-06-10',
  laboratory: 'Northgate Instrument Laboratory',
  accreditation: { standard: 'ISO/IEC 17025', number: 'L-0412' },
  tolerancePercentOfSpan: 0.1,
  asFound: [
    { appliedValue: 0, indicatedValue: 0.02 },
    { appliedValue: 25, indicatedValue: 25.06 },
    { appliedValue: 50, indicatedValue: 49.97 },
  ],
  asLeft: [
    { appliedValue: 0, indicatedValue: 0 },
    { appliedValue: 25, indicatedValue: 25.01 },
    { appliedValue: 50, indicatedValue: 50 },
  ],
  performedBy: 'R. Okafor',
  nextDue: '2027-06-10',
  ...overrides,
});
const post = (token: string) =>
  t.http().post(`/api/transmitters/${f.dp.id}/calibrations`).set('Authorization', `Bearer ${token}`);
const storedFiles = () =>
  fs.existsSync(certificatesDir)
    ? fs.readdirSync(certificatesDir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).length
    : 0;
const count = async () =>
  Number(
    (
      await t.services.pool.query<{ n: string }>(
        'SELECT count(*) AS n FROM transmitter_calibrations WHERE transmitter_id = $1',
        [f.dp.id],
      )
    ).rows[0].n,
  );

describe('POST /api/transmitters/:id/calibrations', () => {
  it('computes each point’s error in % of span and judges it against the tolerance, as worked by hand', async () => {
    const res = await post(engineer).send(body());
    expect(res.status).toBe(201);
    // (0.02 − 0)/50 × 100 = 0.04 %; (25.06 − 25)/50 × 100 = 0.12 % (over 0.1: fails); (49.97 − 50)/50 × 100 = −0.06 %.
    expect(res.body.asFound.map((p: { errorPercentOfSpan: number }) => p.errorPercentOfSpan)).toEqual([
      expect.closeTo(0.04, 9),
      expect.closeTo(0.12, 9),
      expect.closeTo(-0.06, 9),
    ]);
    expect(res.body.asFound.map((p: { pass: boolean }) => p.pass)).toEqual([true, false, true]);
    expect(res.body.asFoundPass).toBe(false);
    // As left: 0, (25.01 − 25)/50 × 100 = 0.02 %, 0: all within 0.1 %.
    expect(res.body.asLeft[1].errorPercentOfSpan).toBeCloseTo(0.02, 9);
    expect(res.body.asLeftPass).toBe(true);
    expect(res.body).toMatchObject({
      transmitterId: f.dp.id,
      unit: 'kPa',
      lowerRange: 0,
      upperRange: 50,
      accreditation: { standard: 'ISO/IEC 17025', number: 'L-0412' },
      nextDue: '2027-06-10',
      certificate: null,
      current: true,
    });
    const audit = await t.services.pool.query(
      "SELECT action FROM audit_events WHERE entity_type = 'calibration' AND entity_id = $1",
      [res.body.id],
    );
    expect(audit.rows.map((r) => r.action)).toEqual(['calibration.create']);
  });

  it('keeps a PDF certificate sent with the form, judged by content, and serves the same bytes to every signed-in role', async () => {
    const res = await post(engineer)
      .field('calibration', JSON.stringify(body({ calibratedOn: '2026-07-01', nextDue: '2027-07-01' })))
      .attach('certificate', pdf, { filename: 'certificate.bin', contentType: 'application/octet-stream' });
    expect(res.status).toBe(201);
    expect(res.body.certificate).toMatchObject({
      contentType: 'application/pdf',
      sizeBytes: pdf.length,
      sha256: crypto.createHash('sha256').update(pdf).digest('hex'),
      fileName: 'certificate.bin',
    });
    const download = await t
      .http()
      .get(res.body.certificate.url)
      .set('Authorization', `Bearer ${operator}`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(download.status).toBe(200);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(download.body as Buffer, pdf)).toBe(0);
    const list = await t
      .http()
      .get(`/api/transmitters/${f.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${operator}`);
    expect(list.status).toBe(200);
    expect(list.body[0].id).toBe(res.body.id);
    expect(list.body.map((c: { calibratedOn: string }) => c.calibratedOn)).toEqual(['2026-07-01', '2026-06-10']);
  });

  it('never serves a certificate to a signed-out request', async () => {
    const res = await post(engineer)
      .field('calibration', JSON.stringify(body({ calibratedOn: '2026-07-02', nextDue: '2027-07-02' })))
      .attach('certificate', png, 'photo.png');
    expect(res.status).toBe(201);
    expect(res.body.certificate.contentType).toBe('image/png');
    const signedOut = await t.http().get(res.body.certificate.url);
    expect(signedOut.status).toBe(401);
    expect(signedOut.headers['content-type']).toMatch(/json/);
    const badToken = await t.http().get(res.body.certificate.url).set('Authorization', 'Bearer not-a-token');
    expect(badToken.status).toBe(401);
  });

  it('refuses a certificate that is not a PDF, PNG or JPEG by content, whatever its name, and stores nothing', async () => {
    const [files, records] = [storedFiles(), await count()];
    const res = await post(engineer)
      .field('calibration', JSON.stringify(body()))
      .attach('certificate', Buffer.from('<html>not a certificate</html>'), {
        filename: 'cert.pdf',
        contentType: 'application/pdf',
      });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('certificate');
    expect(storedFiles()).toBe(files);
    expect(await count()).toBe(records);
  });

  it('refuses a certificate over 10 MB with 413, and stores nothing', async () => {
    const [files, records] = [storedFiles(), await count()];
    const big = Buffer.concat([pdf, Buffer.alloc(10 * 1000 * 1000)]);
    const res = await post(engineer).field('calibration', JSON.stringify(body())).attach('certificate', big, 'big.pdf');
    expect(res.status).toBe(413);
    expect(res.body.error.field).toBe('certificate');
    expect(storedFiles()).toBe(files);
    expect(await count()).toBe(records);
  });

  it('refuses an as-found point outside the transmitter’s range, naming the point', async () => {
    const res = await post(engineer).send(
      body({
        asFound: [
          { appliedValue: 0, indicatedValue: 0 },
          { appliedValue: 60, indicatedValue: 60 },
        ],
      }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('asFound.1.appliedValue');
  });

  it('refuses a due date before the calibration date, naming nextDue, and stores no certificate sent with it', async () => {
    const files = storedFiles();
    const res = await post(engineer)
      .field('calibration', JSON.stringify(body({ nextDue: '2026-06-01' })))
      .attach('certificate', Buffer.concat([pdf, crypto.randomBytes(8)]), 'c.pdf');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('nextDue');
    expect(storedFiles()).toBe(files);
  });

  it('refuses a multipart form without the calibration JSON, naming calibration', async () => {
    const res = await post(engineer).attach('certificate', pdf, 'c.pdf');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('calibration');
  });

  it('is refused to an operator, and a calibration of no transmitter is not found', async () => {
    expect((await post(operator).send(body())).status).toBe(403);
    const res = await t
      .http()
      .post('/api/transmitters/999999999/calibrations')
      .set('Authorization', `Bearer ${engineer}`)
      .send(body());
    expect(res.status).toBe(404);
  });
});

describe('calibrations are append-only; a correction is a new record', () => {
  it('refuses to change a stored calibration in the database', async () => {
    await expect(
      t.services.pool.query("UPDATE transmitter_calibrations SET laboratory = 'x' WHERE transmitter_id = $1", [
        f.dp.id,
      ]),
    ).rejects.toThrow();
    await expect(
      t.services.pool.query('DELETE FROM transmitter_calibrations WHERE transmitter_id = $1', [f.dp.id]),
    ).rejects.toThrow();
  });

  it('drives the calibration alarms from the latest calibration in force, the transmitter’s date otherwise', async () => {
    const g = await alarmFixture(t, engineer);
    const evaluator = new AlarmEvaluator(t.services.pool);
    const now = Date.parse('2026-11-20T12:00:00Z');
    const open = async () =>
      (
        await t.services.pool.query<{ condition: string }>(
          "SELECT condition FROM alarms WHERE transmitter_id = $1 AND state <> 'normal' AND condition_active ORDER BY condition",
          [g.dp.id],
        )
      ).rows.map((r) => r.condition);
    // The transmitter's own date, far off: nothing due.
    await t
      .http()
      .patch(`/api/transmitters/${g.dp.id}`)
      .set('Authorization', `Bearer ${engineer}`)
      .send({ calibrationDue: '2030-01-01' });
    await evaluator.evaluateCalibration(now);
    expect(await open()).toEqual([]);
    // The latest calibration says it was due on 1 November: overdue on 20 November.
    const late = await t
      .http()
      .post(`/api/transmitters/${g.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${engineer}`)
      .send(body({ calibratedOn: '2025-11-01', nextDue: '2026-11-01' }));
    expect(late.status).toBe(201);
    await evaluator.evaluateCalibration(now);
    expect(await open()).toEqual(['calibration-overdue']);
    // A correction of that record (the due date was mistyped) clears it; the corrected record stays in the history.
    const fixed = await t
      .http()
      .post(`/api/transmitters/${g.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${engineer}`)
      .send(body({ calibratedOn: '2025-11-01', nextDue: '2027-11-01', correctsId: late.body.id }));
    expect(fixed.status).toBe(201);
    await evaluator.evaluateCalibration(now);
    expect(await open()).toEqual([]);
    const list = await t
      .http()
      .get(`/api/transmitters/${g.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${engineer}`);
    expect(list.body.map((c: { id: string; current: boolean }) => [c.id, c.current])).toEqual([
      [fixed.body.id, true],
      [late.body.id, false],
    ]);
    // A record is corrected once: a second correction of it is a conflict.
    const again = await t
      .http()
      .post(`/api/transmitters/${g.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${engineer}`)
      .send(body({ correctsId: late.body.id }));
    expect(again.status).toBe(409);
  }, 60_000);
});

describe('sniffCertificateType', () => {
  it('knows PDF, PNG and JPEG by their first bytes and nothing else', () => {
    expect(sniffCertificateType(Buffer.from('%PDF-1.7'))).toBe('application/pdf');
    expect(sniffCertificateType(png)).toBe('image/png');
    expect(sniffCertificateType(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]))).toBe('image/jpeg');
    expect(sniffCertificateType(Buffer.from('%PDF'))).toBeNull();
    expect(sniffCertificateType(Buffer.from('GIF89a'))).toBeNull();
    expect(sniffCertificateType(Buffer.alloc(0))).toBeNull();
  });
});
