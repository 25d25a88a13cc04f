import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

/**
 * Certificates and next due dates of element calibrations, gas analyses and inspections
 * (issue 11 §2, §3), through the real app and database. The file types are judged by their first
 * bytes: a PDF starts with "%PDF-" (ISO 32000-1 §7.5.2), a PNG with its 8-byte signature
 * (ISO/IEC 15948 §5.2). The meter run's site keeps Pacific/Auckland time, UTC+13 in January
 * and February (New Zealand daylight time, last Sunday of September to first Sunday of April,
 * per the IANA tz database), so a record taken at 2025-01-10T20:00Z is dated 2025-01-11 there.
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
const pdf = Buffer.from(`%PDF-1.4\n% element care certificate ${crypto.randomUUID()}\n%%EOF\n`);
const png = () =>
  Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), crypto.randomBytes(32)]);
const at = '2025-01-10T20:00:00.000Z';

beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
  operator = (await t.signedIn('operator')).token;
  f = await alarmFixture(t, engineer, { timeZone: 'Pacific/Auckland' });
  // A natural gas in force before every record (the fixture's fluid is an ideal gas).
  const gas = await t
    .http()
    .post(`/api/meter-runs/${f.meterRunId}/config-versions`)
    .set('Authorization', `Bearer ${engineer}`)
    .send({
      effectiveFrom: '2021-01-01T00:00:00Z',
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
      fluid: {
        kind: 'natural-gas',
        composition: { methane: 0.95, ethane: 0.03, propane: 0.005, nitrogen: 0.01, 'carbon-dioxide': 0.005 },
      },
      reason: 'natural gas for the certificate tests',
    });
  if (gas.status !== 201) throw new Error(JSON.stringify(gas.body));
}, 60_000);
afterAll(() => t.close());

/**
 * Whether the store holds a file of these bytes (stored files are named by their SHA-256). Other
 * test files store certificates in the same folder at the same time, so a count of files would race.
 */
const stored = (bytes: Buffer) => {
  const sha256 = crypto.createHash('sha256').update(bytes).digest('hex');
  return fs.existsSync(certificatesDir)
    ? fs
        .readdirSync(certificatesDir, { recursive: true, withFileTypes: true })
        .some((e) => e.isFile() && e.name.startsWith(sha256))
    : false;
};

/** Each record type: its route, multipart field, table, a valid body dated `when`, and its download collection. */
const kinds = [
  {
    name: 'an element calibration',
    route: 'element-calibrations',
    field: 'calibration',
    table: 'element_calibrations',
    collection: 'element-calibrations',
    body: (when: string, extra: Record<string, unknown> = {}) => ({
      calibratedAt: when,
      laboratory: 'Test flow laboratory',
      certificate: 'EC-0001',
      uncertaintyPercent: 0.5,
      points: [
        { reynoldsNumber: 1e5, dischargeCoefficient: 0.603 },
        { reynoldsNumber: 1e6, dischargeCoefficient: 0.602 },
      ],
      ...extra,
    }),
  },
  {
    name: 'a gas analysis',
    route: 'gas-analyses',
    field: 'analysis',
    table: 'gas_analyses',
    collection: 'gas-analyses',
    body: (when: string, extra: Record<string, unknown> = {}) => ({
      sampledAt: when,
      laboratory: 'Test gas laboratory',
      certificate: 'GA-0001',
      components: { methane: 94, ethane: 4, propane: 0.5, nitrogen: 1, 'carbon-dioxide': 0.5 },
      ...extra,
    }),
  },
  {
    name: 'an inspection',
    route: 'inspections',
    field: 'inspection',
    table: 'element_inspections',
    collection: 'element-inspections',
    body: (when: string, extra: Record<string, unknown> = {}) => ({
      inspectedAt: when,
      kind: 'orifice-plate',
      measured: { edgeSharp: true, flatnessMm: 0.1 },
      condition: 'clean, edge sharp',
      certificate: 'IN-0001',
      ...extra,
    }),
  },
];

describe.each(kinds)('$name', (kind) => {
  // Each kind takes its own days, so no two records meet at one configuration instant.
  const day = (n: number) => new Date(Date.parse(at) + (kinds.indexOf(kind) * 10 + n) * 86_400_000).toISOString();
  const post = (token: string) =>
    t.http().post(`/api/meter-runs/${f.meterRunId}/${kind.route}`).set('Authorization', `Bearer ${token}`);
  const count = async () =>
    Number(
      (
        await t.services.pool.query<{ n: string }>(`SELECT count(*) AS n FROM ${kind.table} WHERE meter_run_id = $1`, [
          f.meterRunId,
        ])
      ).rows[0].n,
    );
  const versions = async () =>
    Number(
      (
        await t.services.pool.query<{ n: string }>(
          'SELECT count(*) AS n FROM config_versions WHERE meter_run_id = $1',
          [f.meterRunId],
        )
      ).rows[0].n,
    );

  it('keeps a PDF certificate and its next due date, and every signed-in role downloads it', async () => {
    const res = await post(engineer)
      .field(kind.field, JSON.stringify(kind.body(day(0), { nextDue: '2027-12-02' })))
      .attach('certificate', pdf, 'certificate.pdf');
    expect([res.status, res.body.error]).toEqual([201, undefined]);
    expect(res.body.certificate).toMatch(/-0001$/);
    expect(res.body.nextDue).toBe('2027-12-02');
    expect(stored(pdf)).toBe(true);
    expect(res.body.certificateFile).toEqual({
      name: 'certificate.pdf',
      contentType: 'application/pdf',
      sizeBytes: pdf.length,
      sha256: crypto.createHash('sha256').update(pdf).digest('hex'),
      url: `/api/${kind.collection}/${res.body.id}/certificate`,
    });
    const download = await t
      .http()
      .get(res.body.certificateFile.url)
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
      .get(`/api/meter-runs/${f.meterRunId}/${kind.route}`)
      .set('Authorization', `Bearer ${operator}`);
    const listed = list.body.find((r: { id: string }) => r.id === res.body.id);
    expect(listed.certificateFile.url).toBe(res.body.certificateFile.url);
    expect(listed.nextDue).toBe('2027-12-02');
  });

  it('takes JSON as before, with no certificate file, and answers 404 for its certificate', async () => {
    const res = await post(engineer).send(kind.body(day(1)));
    expect([res.status, res.body.error]).toEqual([201, undefined]);
    expect(res.body.certificateFile).toBeNull();
    expect(res.body.nextDue).toBeNull();
    const none = await t
      .http()
      .get(`/api/${kind.collection}/${res.body.id}/certificate`)
      .set('Authorization', `Bearer ${operator}`);
    expect(none.status).toBe(404);
    const missing = await t
      .http()
      .get(`/api/${kind.collection}/999999999/certificate`)
      .set('Authorization', `Bearer ${operator}`);
    expect(missing.status).toBe(404);
  });

  it('never serves a certificate to a signed-out request', async () => {
    const res = await post(engineer)
      .field(kind.field, JSON.stringify(kind.body(day(2))))
      .attach('certificate', png(), 'photo.png');
    expect([res.status, res.body.error]).toEqual([201, undefined]);
    expect(res.body.certificateFile.contentType).toBe('image/png');
    const signedOut = await t.http().get(res.body.certificateFile.url);
    expect(signedOut.status).toBe(401);
  });

  it('refuses a file that is not a PDF, PNG or JPEG by content, whatever its name, and stores nothing', async () => {
    const [records, made] = [await count(), await versions()];
    const html = Buffer.from(`<html>not a certificate ${crypto.randomUUID()}</html>`);
    const res = await post(engineer)
      .field(kind.field, JSON.stringify(kind.body(day(3))))
      .attach('certificate', html, {
        filename: 'cert.pdf',
        contentType: 'application/pdf',
      });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('certificate');
    expect(stored(html)).toBe(false);
    expect(await count()).toBe(records);
    expect(await versions()).toBe(made);
  });

  it('refuses a certificate over 10 MB with 413, and stores nothing', async () => {
    const [records, made] = [await count(), await versions()];
    const big = Buffer.concat([pdf, crypto.randomBytes(16), Buffer.alloc(10 * 1000 * 1000)]);
    const res = await post(engineer)
      .field(kind.field, JSON.stringify(kind.body(day(4))))
      .attach('certificate', big, 'big.pdf');
    expect(res.status).toBe(413);
    expect(res.body.error.field).toBe('certificate');
    expect(stored(big)).toBe(false);
    expect(await count()).toBe(records);
    expect(await versions()).toBe(made);
  });

  it("refuses a next due date before the record's own date in the site's zone, naming nextDue", async () => {
    const [records, made] = [await count(), await versions()];
    // 20:00 UTC is already the next day in Auckland (UTC+13): the UTC date is before the record's date there.
    const when = day(5);
    const utcDate = when.slice(0, 10);
    const res = await post(engineer).send(kind.body(when, { nextDue: utcDate }));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('nextDue');
    expect(await count()).toBe(records);
    expect(await versions()).toBe(made);
    const sameDay = new Date(Date.parse(when) + 86_400_000).toISOString().slice(0, 10);
    const ok = await post(engineer).send(kind.body(when, { nextDue: sameDay }));
    expect([ok.status, ok.body.error]).toEqual([201, undefined]);
    expect(ok.body.nextDue).toBe(sameDay);
  });

  it('names the form field when the record is missing from a multipart form', async () => {
    const res = await post(engineer).attach('certificate', pdf, 'certificate.pdf');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(kind.field);
  });
});
