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
const certificatesDir = path.join(
  os.tmpdir(),
  'tallyrun-jest',
  `worker-${process.env.JEST_WORKER_ID ?? process.pid}`,
  'certificates',
);
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

describe('points are judged against the range in force on the calibration date', () => {
  it('judges a calibration dated before a re-range by the old range, and one on the re-range day by the new', async () => {
    // Site on America/Edmonton (UTC−6 in summer); the DP transmitter goes from 0–50 to 0–100 kPa at 10:00 local on 1 August.
    const g = await alarmFixture(t, engineer, { timeZone: 'America/Edmonton' });
    const rerange = await t
      .http()
      .patch(`/api/transmitters/${g.dp.id}`)
      .set('Authorization', `Bearer ${engineer}`)
      .send({ upperRange: 100, effectiveFrom: '2026-08-01T10:00:00-06:00', reason: 'wider range for winter flow' });
    expect(rerange.status).toBe(200);
    const postTo = (b: Record<string, unknown>) =>
      t.http().post(`/api/transmitters/${g.dp.id}/calibrations`).set('Authorization', `Bearer ${engineer}`).send(b);
    // 31 July: the old range 0–50 kPa. (25.06 − 25)/50 × 100 = 0.12 % of span.
    const before = await postTo(body({ calibratedOn: '2026-07-31', nextDue: '2027-07-31' }));
    expect(before.status).toBe(201);
    expect(before.body).toMatchObject({ lowerRange: 0, upperRange: 50 });
    expect(before.body.asFound[1].errorPercentOfSpan).toBeCloseTo(0.12, 9);
    // A point at 60 kPa lies inside today's range but outside the one in force on 31 July.
    const outside = await postTo(
      body({
        calibratedOn: '2026-07-31',
        asFound: [
          { appliedValue: 0, indicatedValue: 0 },
          { appliedValue: 60, indicatedValue: 60 },
        ],
      }),
    );
    expect(outside.status).toBe(400);
    expect(outside.body.error.field).toBe('asFound.1.appliedValue');
    expect(outside.body.error.message).toMatch(/0–50 kPa in force on 2026-07-31/);
    // 1 August: the range in force at the end of that day is the new one. (25.06 − 25)/100 × 100 = 0.06 %.
    const on = await postTo(body({ calibratedOn: '2026-08-01', nextDue: '2027-08-01' }));
    expect(on.status).toBe(201);
    expect(on.body).toMatchObject({ lowerRange: 0, upperRange: 100 });
    expect(on.body.asFound[1].errorPercentOfSpan).toBeCloseTo(0.06, 9);
  }, 60_000);
});

describe('GET /api/calibrations/:id/correction-proposal', () => {
  it('suggests a flow factor 1/√(1+e) over the period since the last good calibration, and creates nothing', async () => {
    const g = await alarmFixture(t, engineer);
    const postTo = (b: Record<string, unknown>) =>
      t.http().post(`/api/transmitters/${g.dp.id}/calibrations`).set('Authorization', `Bearer ${engineer}`).send(b);
    const passing = [
      { appliedValue: 0, indicatedValue: 0 },
      { appliedValue: 25, indicatedValue: 25.01 },
      { appliedValue: 50, indicatedValue: 50 },
    ];
    const good = await postTo(body({ calibratedOn: '2026-03-01', nextDue: '2026-05-01', asFound: passing }));
    expect(good.status).toBe(201);
    expect(good.body.asFoundPass).toBe(true);
    const failed = await postTo(body({ calibratedOn: '2026-05-01', nextDue: '2027-05-01' }));
    expect(failed.status).toBe(201);
    expect(failed.body.asFoundPass).toBe(false);
    const proposals = await t.services.pool.query('SELECT count(*) AS n FROM corrections');
    const res = await t
      .http()
      .get(`/api/calibrations/${failed.body.id}/correction-proposal`)
      .set('Authorization', `Bearer ${engineer}`);
    expect(res.status).toBe(200);
    // By hand: the as-found points away from zero read 25.06 for 25 (e = 0.06/25 = 0.0024) and 49.97 for 50
    // (e = −0.03/50 = −0.0006); mean e = 0.0009. Flow ∝ √Δp (ISO 5167-1:2022 eq. 1), so the flow read
    // √1.0009 too high and the factor is 1/√1.0009 = 0.999550 30 (√1.0009 = 1.000 449 90).
    expect(res.body.factor).toBeCloseTo(0.9995503, 7);
    expect(res.body.meanErrorFractionOfReading).toBeCloseTo(0.0009, 12);
    expect(res.body).toMatchObject({
      calibrationId: failed.body.id,
      transmitterId: g.dp.id,
      meterRunId: g.meterRunId,
      kind: 'adjust',
      since: { kind: 'calibration', calibrationId: good.body.id, calibratedOn: '2026-03-01' },
      // From the end of the good calibration's day to the start of the failed one's, on the site's clock (UTC).
      start: '2026-03-02T00:00:00.000Z',
      end: '2026-05-01T00:00:00.000Z',
      shortened: false,
    });
    expect(res.body.points.map((p: { appliedValue: number }) => p.appliedValue)).toEqual([25, 50]);
    expect(res.body.basis).toMatch(/^Approximation/);
    expect(res.body.basis).toMatch(/1\/√\(1\+e\)/);
    expect(res.body.reason).toMatch(/failed its as-found calibration on 2026-05-01/);
    expect((await t.services.pool.query('SELECT count(*) AS n FROM corrections')).rows).toEqual(proposals.rows);

    // Submitted as it stands, it is an ordinary proposal, pending another person's approval.
    const proposed = await t.http().post('/api/corrections').set('Authorization', `Bearer ${engineer}`).send({
      meterRunId: res.body.meterRunId,
      start: res.body.start,
      end: res.body.end,
      kind: res.body.kind,
      factor: res.body.factor,
      reason: res.body.reason,
    });
    expect(proposed.status).toBe(201);
    expect(proposed.body.status).toBe('proposed');
  }, 60_000);

  it('is a conflict for a calibration that passed as found, and not found for no calibration', async () => {
    const g = await alarmFixture(t, engineer);
    const passed = await t
      .http()
      .post(`/api/transmitters/${g.dp.id}/calibrations`)
      .set('Authorization', `Bearer ${engineer}`)
      .send(body({ tolerancePercentOfSpan: 0.5 }));
    expect(passed.body.asFoundPass).toBe(true);
    const get = (id: string, token = engineer) =>
      t.http().get(`/api/calibrations/${id}/correction-proposal`).set('Authorization', `Bearer ${token}`);
    expect((await get(passed.body.id)).status).toBe(409);
    expect((await get('999999999')).status).toBe(404);
    expect((await get(passed.body.id, operator)).status).toBe(403);
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
