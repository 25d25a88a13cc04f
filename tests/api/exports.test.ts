import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import type { Response } from 'supertest';
import { testApp } from '../../server/test-support/app';
import { alarmFixture, repeat } from '../../server/alarms/alarm-test-fixture';
import { fromSI } from '../../shared/units';

/**
 * The monthly volumes exports (issue 10 §6), read back with csv-parse and exceljs and compared
 * with `GET /api/monthly-volumes`: an SI site, so mass in t, volumes in m³, energy in GJ
 * (conversions by shared/units: 1 t = 1000 kg, 1 GJ = 1e9 J, SI brochure 9th ed. table 8).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const MONTH = '2026-08';
/** The month of the allocation: two wells (the fixture's run and B) into a sales meter S. */
const ALLOCATION_MONTH = '2026-07';
const auth = () => ({ Authorization: `Bearer ${token}` });

const binary = (res: Response, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('accountant')).token;
  const engineer = await t.signedIn('engineer');
  f = await alarmFixture(t, engineer.token);
  // A name a spreadsheet would take for a formula: the export must neutralise it.
  const renamed = await t
    .http()
    .patch(`/api/meter-runs/${f.meterRunId}`)
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({ name: '=1+2 well' });
  expect(renamed.status).toBe(200);
  await f.writeMinutes(Date.parse(`${MONTH}-12T06:00:00Z`), repeat(121, 0.45));
  const wellB = await addMeterRun(engineer.token, 'B');
  const sales = await addMeterRun(engineer.token, 'S');
  const july = Date.parse(`${ALLOCATION_MONTH}-03T00:00:00Z`);
  await f.writeMinutes(july, repeat(61, 0.2));
  await wellB.writeMinutes(july, 0.6);
  await sales.writeMinutes(july, 0.7);
  const group = await t
    .http()
    .post('/api/balance-groups')
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({
      siteId: f.siteId,
      name: 'Wells to sales',
      inletMeterRunIds: [f.meterRunId, wellB.id],
      outletMeterRunIds: [sales.id],
      allowancePercent: 0,
      tolerancePercent: 1,
    });
  expect(group.status).toBe(201);
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

/** Another meter run at the fixture's site (same element and gas), with DP, P and T and an hour of readings. */
async function addMeterRun(engineerToken: string, suffix: string) {
  const as = { Authorization: `Bearer ${engineerToken}` };
  const run = await t
    .http()
    .post('/api/meter-runs')
    .set(as)
    .send({
      siteId: f.siteId,
      tag: `${f.tag}-${suffix}`,
      name: `Run ${suffix}`,
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
      fluid: {
        kind: 'ideal-gas',
        molarMassKgPerMol: 0.01804,
        compressibility: 1,
        isentropicExponent: 1.2,
        viscosityPaS: 1.12e-5,
      },
      holdLimitS: 3600,
      maxGapS: 300,
      effectiveFrom: '2020-01-01T00:00:00Z',
    });
  expect(run.status).toBe(201);
  const id = String(run.body.id);
  const transmitter = async (kind: string, body: Record<string, unknown>) => {
    const res = await t
      .http()
      .post('/api/transmitters')
      .set(as)
      .send({ meterRunId: id, tag: `${f.tag}-${suffix}-${kind}`, ...body });
    expect(res.status).toBe(201);
    return String(res.body.id);
  };
  const dp = await transmitter('DP', { measures: 'differential-pressure', unit: 'kPa', lowerRange: 0, upperRange: 50 });
  const pt = await transmitter('PT', {
    measures: 'static-pressure',
    unit: 'MPa',
    pressureReference: 'absolute',
    lowerRange: 0,
    upperRange: 4,
  });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });
  /** An hour of readings a minute from startMs at a DP of `share` of 50 kPa, P 2 MPa, T 300 K. */
  const writeMinutes = (startMs: number, share: number) =>
    t.services.writer.write(
      Array.from({ length: 61 }, (_, i) => {
        const base = { meterRunId: id, timeZone: 'UTC', timeMs: startMs + i * 60_000, quality: 0 };
        return [
          { ...base, transmitterId: dp, value: share * 50 + (i % 2) * 0.003 },
          { ...base, transmitterId: pt, value: 2 + (i % 3) * 1e-4 },
          { ...base, transmitterId: tt, value: 300 + (i % 2) * 0.01 },
        ];
      }).flat(),
      'csv',
    );
  return { id, writeMinutes };
}

async function volumes() {
  const res = await t.http().get(`/api/monthly-volumes?siteId=${f.siteId}&month=${MONTH}`).set(auth());
  expect(res.status).toBe(200);
  return res.body;
}

/** The figures an export row must hold for a meter run or the site total, in the site's SI units. */
const expectedFigures = (r: Record<string, number | null>) => [
  fromSI(r.massKg!, 't'),
  fromSI(r.volumeM3!, 'm3'),
  fromSI(r.standardVolumeM3!, 'm3'),
  // The test gas has no heating value, so it has no energy: an empty cell, never a zero.
  r.energyJ === null ? null : fromSI(r.energyJ, 'GJ'),
  r.coverage! * 100,
];
const csvNumber = (text: string) => (text === '' ? null : Number(text));

describe('GET /api/exports/monthly-volumes', () => {
  it('writes a CSV whose header block and numbers match the monthly volumes, with formulas neutralised', async () => {
    const body = await volumes();
    const res = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=${MONTH}&siteId=${f.siteId}&format=csv`)
      .set(auth());
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="monthly-volumes-.*\.csv"/);
    const records: string[][] = parse(res.text, { relax_column_count: true });
    const header = Object.fromEntries(records.slice(0, 8).map(([k, v]) => [k, v]));
    expect(header.Month).toBe(MONTH);
    expect(header.Status).toBe(body.status);
    expect(header['Base conditions']).toBe('101.325 kPa, 15 °C');
    expect(header['Exported by']).toMatch(/^Test accountant <accountant-.*@test\.tallyrun>$/);
    expect(Date.parse(header['Exported at'])).toBeGreaterThan(Date.now() - 60_000);
    const columns = records[9];
    expect(columns.slice(2, 7)).toEqual([
      'Mass (t)',
      'Volume (m³)',
      'Volume at base conditions (m³)',
      'Energy (GJ)',
      'Coverage (%)',
    ]);
    const runRow = records.find((r) => r[0] === body.meterRuns[0].tag) as string[];
    const totalRow = records.find((r) => r[0] === 'Site total') as string[];
    expect(runRow[0]).toBe(body.meterRuns[0].tag);
    expect(runRow[1]).toBe("'=1+2 well");
    expectedFigures(body.meterRuns[0]).forEach((v, i) => expect(csvNumber(runRow[2 + i])).toBe(v));
    expect(totalRow[0]).toBe('Site total');
    expectedFigures(body.totals).forEach((v, i) => expect(csvNumber(totalRow[2 + i])).toBe(v));
  });

  it('writes a workbook with numbers as numbers and units in the headers, equal to the monthly volumes', async () => {
    const body = await volumes();
    const res = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=${MONTH}&siteId=${f.siteId}&format=xlsx`)
      .set(auth())
      .buffer(true)
      .parse(binary);
    expect(res.status).toBe(200);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(res.body as unknown as ArrayBuffer);
    const sheet = workbook.worksheets[0];
    expect(sheet.getRow(2).values).toEqual([undefined, 'Month', MONTH]);
    expect(sheet.getRow(10).getCell(5).value).toBe('Volume at base conditions (m³)');
    const rowOf = (first: string) => {
      let found: ExcelJS.Row | undefined;
      sheet.eachRow((r) => {
        if (r.getCell(1).value === first) found = r;
      });
      if (!found) throw new Error(`no row ${first}`);
      return found;
    };
    const run = rowOf(body.meterRuns[0].tag);
    expect(run.getCell(2).value).toBe("'=1+2 well");
    expectedFigures(body.meterRuns[0]).forEach((v, i) => {
      expect(typeof run.getCell(3 + i).value).toBe(v === null ? 'object' : 'number');
      expect(run.getCell(3 + i).value).toBe(v);
    });
    expect(rowOf('Site total').getCell(5).value).toBe(fromSI(body.totals.standardVolumeM3, 'm3'));
  });

  it('records every export in the audit trail', async () => {
    const [rows] = await t.sequelize.query(
      `SELECT after FROM audit_events WHERE action = 'export.monthly-volumes' AND after->'filters'->>'siteId' = :siteId`,
      { replacements: { siteId: f.siteId } },
    );
    const formats = (rows as { after: { format: string } }[]).map((r) => r.after.format).sort();
    expect(formats).toEqual(['csv', 'xlsx']);
  });

  it('answers 404 with the reason for a month without data, and 400 naming format for another format', async () => {
    const empty = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=2020-02&siteId=${f.siteId}&format=csv`)
      .set(auth());
    expect(empty.status).toBe(404);
    expect(empty.body.error.message).toMatch(/No monthly totals .* in 2020-02/);
    const pdf = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=${MONTH}&siteId=${f.siteId}&format=pdf`)
      .set(auth());
    expect(pdf.status).toBe(400);
    expect(pdf.body.error.field).toBe('format');
  });

  it('refuses the operator', async () => {
    const operator = await t.signedIn('operator');
    const res = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=${MONTH}&siteId=${f.siteId}&format=csv`)
      .set('Authorization', `Bearer ${operator.token}`);
    expect(res.status).toBe(403);
  });
});

describe('allocation rows in the export', () => {
  it('gives each well its pro-rata share of the sales meter, worked by hand from the monthly volumes', async () => {
    const month = await t.http().get(`/api/monthly-volumes?siteId=${f.siteId}&month=${ALLOCATION_MONTH}`).set(auth());
    const v = (tag: string) =>
      (month.body.meterRuns as { tag: string; standardVolumeM3: number }[]).find((r) => r.tag === tag)!
        .standardVolumeM3;
    const [a, b, s] = [v(f.tag), v(`${f.tag}-B`), v(`${f.tag}-S`)];
    // Pro rata: factor_i = V_i / (V_A + V_B); allocated_i = factor_i × V_sales (API MPMS ch. 20.1 allocation by proportion).
    const factorA = a / (a + b);
    // The site's U (k = 2) of three uncorrelated runs: √Σ(U_i·V_i)² / ΣV (GUM, JCGM 100:2008 eq. 10, unit sensitivities).
    const runs = month.body.meterRuns as { standardVolumeM3: number; uncertaintyPercent: number }[];
    const uAbs = Math.sqrt(runs.reduce((acc, r) => acc + (r.uncertaintyPercent * r.standardVolumeM3) ** 2, 0));
    expect(month.body.totals.uncertaintyPercent).toBeCloseTo(uAbs / (a + b + s), 9);
    const res = await t
      .http()
      .get(`/api/exports/monthly-volumes?month=${ALLOCATION_MONTH}&siteId=${f.siteId}&format=csv`)
      .set(auth());
    expect(res.status).toBe(200);
    const records: string[][] = parse(res.text, { relax_column_count: true });
    const allocations = records.filter((r) => r[9] === 'allocation');
    expect(allocations.map((r) => r[0])).toEqual([f.tag, `${f.tag}-B`]);
    expect(allocations[0][1]).toBe(`Allocated from ${f.tag}-S (Wells to sales)`);
    expect(Number(allocations[0][13])).toBeCloseTo(factorA, 12);
    expect(Number(allocations[0][4])).toBeCloseTo(factorA * s, 6);
    expect(Number(allocations[1][4])).toBeCloseTo((1 - factorA) * s, 6);
  });
});

describe('GET /api/exports/monthly-statement', () => {
  it('gives a printable page with the status stamped, page numbers in the print stylesheet, and audits it', async () => {
    const body = await volumes();
    const res = await t
      .http()
      .get(`/api/exports/monthly-statement?month=${MONTH}&siteId=${f.siteId}&format=html`)
      .set(auth());
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.text).toContain(`data-testid="statement-status">${body.status}<`);
    expect(res.text).toMatch(/@page[^}]*counter\(page\)/);
    // A page is not a spreadsheet: the name is shown as written, escaped as HTML.
    expect(res.text).toContain('<td class="text">=1+2 well</td>');
    const [rows] = await t.sequelize.query(
      `SELECT 1 FROM audit_events WHERE action = 'export.monthly-statement' AND after->'filters'->>'siteId' = :siteId`,
      { replacements: { siteId: f.siteId } },
    );
    expect(rows).toHaveLength(1);
  });
});
