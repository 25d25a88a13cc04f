import { testApp } from '../../server/test-support/app';
import { alarmFixture } from '../../server/alarms/alarm-test-fixture';

/**
 * Reconciliation against field totals (issue 10 §2), through the real import, a real database and
 * the real alarm store. The site is in UTC with its contract day starting at 06:00, so a contract
 * day runs 06:00Z–06:00Z. Tallyrun's daily totals are written as the history rollup writes them
 * (the arithmetic under test is the comparison, not the integration); the field totals come in
 * as a CSV through POST /api/imports.
 *
 * Worked by hand (difference = Tallyrun − field; percent of the field total; tolerance 0.5 %):
 * - 1 Sep: 100 000 − 99 500 = +500 m³; 500 / 99 500 = 0.502 512 56 % → outside;
 * - 2 Sep: 100 200 − 100 400 = −200 m³; −200 / 100 400 = −0.199 203 19 % → within;
 * - the two days: 200 200 − 199 900 = +300 m³; 300 / 199 900 = 0.150 075 04 % → within, 1 day outside.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
let importBody: Record<string, unknown>;
const auth = () => ({ Authorization: `Bearer ${engineer.token}` });
const DAY1 = '2026-09-01T06:00:00Z';
const DAY2 = '2026-09-02T06:00:00Z';
const DAY3 = '2026-09-03T06:00:00Z';
const window = () => `meterRunId=${f.meterRunId}&from=2026-09-01&to=2026-10-01`;

async function dailyTotal(contractDay: string, start: string, end: string, standardVolumeM3: number) {
  await t.services.pool.query(
    `INSERT INTO daily_totals (meter_run_id, contract_day, start, "end", hours, flow_time_s, mass_kg, volume_m3,
                               standard_volume_m3, energy_j, coverage, flags, uncertainty_percent, status)
     VALUES ($1, $2, $3, $4, 24, 86400, $5 * 0.7, $5 / 50, $5, NULL, 1, '{}', 0.8, 'complete')`,
    [f.meterRunId, contractDay, start, end, standardVolumeM3],
  );
}

beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  f = await alarmFixture(t, engineer.token, { contractHour: 6 });
  await dailyTotal('2026-09-01', DAY1, DAY2, 100_000);
  await dailyTotal('2026-09-02', DAY2, DAY3, 100_200);
  const csv = [
    'start,end,meterRun,quantity,value,unit',
    `${DAY1},${DAY2},${f.tag},standard-volume,99500,m3`,
    `${DAY2},${DAY3},${f.tag},standard-volume,100400,m3`,
    `${DAY1},${DAY2},MR-NO-SUCH-RUN,standard-volume,1,m3`,
    `${DAY1},${DAY2},${f.tag},mass,70000,m3`,
    // Midnight to midnight is not one of this site's contract days: stored, not reconciled.
    `2026-09-05T00:00:00Z,2026-09-06T00:00:00Z,${f.tag},standard-volume,5,m3`,
  ].join('\n');
  const res = await t
    .http()
    .post('/api/imports')
    .set(auth())
    .field('kind', 'field-totals')
    .attach('file', Buffer.from(csv), 'field.csv');
  expect(res.status).toBe(202);
  for (const end = Date.now() + 30_000; Date.now() < end;) {
    importBody = (await t.http().get(`/api/imports/${res.body.id}`).set(auth())).body;
    if (importBody.status !== 'running') break;
    await new Promise((r) => setTimeout(r, 100));
  }
}, 120_000);
afterAll(() => t.close());

describe('importing field totals', () => {
  it('rejects a line for an unknown meter run and one in a unit of another quantity, with their numbers, and keeps the good lines', () => {
    expect(importBody).toMatchObject({ status: 'done', rowsRead: 5, rowsImported: 3, rejected: 2 });
    expect(importBody.errors).toEqual([
      { line: 4, message: 'meterRun: unknown meter run MR-NO-SUCH-RUN' },
      { line: 5, message: 'unit: m3 is not a unit of mass' },
    ]);
  });
});

describe('GET /api/reconciliations', () => {
  it('gives each contract day with a field total: Tallyrun minus field, percent of field, against 0.5 %, as worked by hand', async () => {
    const res = await t.http().get(`/api/reconciliations?${window()}`).set(auth());
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(2);
    const [day1, day2] = res.body;
    expect(Object.keys(day1)).toEqual([
      'start',
      'end',
      'quantity',
      'unit',
      'tallyrunValue',
      'fieldValue',
      'difference',
      'differencePercent',
      'tolerancePercent',
      'withinTolerance',
    ]);
    expect(day1).toMatchObject({
      start: '2026-09-01T06:00:00.000Z',
      end: '2026-09-02T06:00:00.000Z',
      quantity: 'standard-volume',
      unit: 'm3',
      tallyrunValue: 100_000,
      fieldValue: 99_500,
      tolerancePercent: 0.5,
      withinTolerance: false,
    });
    expect(day1.difference).toBeCloseTo(500, 9);
    expect(day1.differencePercent).toBeCloseTo(0.50251256, 8);
    expect(day2).toMatchObject({ start: '2026-09-02T06:00:00.000Z', withinTolerance: true });
    expect(day2.difference).toBeCloseTo(-200, 9);
    expect(day2.differencePercent).toBeCloseTo(-0.19920319, 8);
  });

  it("sums the month's days per quantity and unit", async () => {
    const res = await t.http().get(`/api/reconciliations/summary?${window()}`).set(auth());
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(1);
    expect(res.body[0]).toMatchObject({
      from: '2026-09-01T00:00:00.000Z',
      to: '2026-10-01T00:00:00.000Z',
      quantity: 'standard-volume',
      unit: 'm3',
      days: 2,
      daysOutsideTolerance: 1,
      tallyrunValue: 200_200,
      fieldValue: 199_900,
      withinTolerance: true,
    });
    expect(res.body[0].differencePercent).toBeCloseTo(0.15007504, 8);
  });

  it('answers 404 for an unknown meter run and 400 naming from for a bad instant', async () => {
    const missing = await t
      .http()
      .get('/api/reconciliations?meterRunId=999999999&from=2026-09-01&to=2026-10-01')
      .set(auth());
    expect(missing.status).toBe(404);
    const bad = await t
      .http()
      .get(`/api/reconciliations?meterRunId=${f.meterRunId}&from=yesterday&to=2026-10-01`)
      .set(auth());
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('from');
  });
});

describe('the alarm reconciliation-out-of-tolerance', () => {
  const alarms = async () =>
    (await t.http().get(`/api/alarms?meterRunId=${f.meterRunId}`).set(auth())).body.filter(
      (a: { condition: string }) => a.condition === 'reconciliation-out-of-tolerance',
    );

  it('is raised at the end of the day outside tolerance and returns at the end of the day within it, once', async () => {
    await t.services.alarms.evaluateReconciliation();
    await t.services.alarms.evaluateReconciliation(); // a second round judges nothing again
    const list = await alarms();
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({
      transmitterId: null,
      state: 'returned-unacknowledged',
      raisedAt: '2026-09-02T06:00:00.000Z',
      clearedAt: '2026-09-03T06:00:00.000Z',
    });
    expect(list[0].message).toMatch(/0\.50 % \(standard-volume\), outside the tolerance of 0\.50 %/);
  });
});

describe('PATCH /api/reconciliations/tolerances/:id', () => {
  const patch = (body: Record<string, unknown>) =>
    t.http().patch(`/api/reconciliations/tolerances/${f.meterRunId}`).set(auth()).send(body);
  const verdicts = async () =>
    (await t.http().get(`/api/reconciliations?${window()}`).set(auth())).body.map(
      (d: { withinTolerance: boolean; tolerancePercent: number }) => [d.withinTolerance, d.tolerancePercent],
    );

  it('judges the contract days from its effective instant on by a new tolerance and leaves earlier days as judged, audited with the reason', async () => {
    const wider = await patch({ tolerancePercent: 0.6, effectiveFrom: DAY1, reason: 'field meter re-proved' });
    expect(wider.status).toBe(200);
    expect(wider.body).toMatchObject({
      meterRunId: f.meterRunId,
      tolerancePercent: 0.6,
      effectiveFrom: '2026-09-01T06:00:00.000Z',
    });
    expect(await verdicts()).toEqual([
      [true, 0.6],
      [true, 0.6],
    ]);
    // By hand: 2 Sep differs by −0.199 %, outside ±0.1 %; 1 Sep starts before the change and keeps ±0.6 %.
    const narrower = await patch({ tolerancePercent: 0.1, effectiveFrom: DAY2, reason: 'contract amendment' });
    expect(narrower.status).toBe(200);
    expect(await verdicts()).toEqual([
      [true, 0.6],
      [false, 0.1],
    ]);
    const audit = await t.services.pool.query<{
      before: unknown;
      after: { reconciliationTolerancePercent: number };
      reason: string;
    }>(
      `SELECT before, after, reason FROM audit_events WHERE action = 'meter-run.reconciliation-tolerance' AND entity_id = $1 ORDER BY id`,
      [f.meterRunId],
    );
    expect(audit.rows.map((r) => [r.before, r.after.reconciliationTolerancePercent, r.reason])).toEqual([
      [{ reconciliationTolerancePercent: 0.5 }, 0.6, 'field meter re-proved'],
      [{ reconciliationTolerancePercent: 0.6 }, 0.1, 'contract amendment'],
    ]);
    const versions = (await t.http().get(`/api/reconciliations/tolerances/${f.meterRunId}`).set(auth())).body;
    expect(
      versions.map((v: { tolerancePercent: number; effectiveFrom: string }) => [v.tolerancePercent, v.effectiveFrom]),
    ).toEqual([
      [0.5, '2000-01-01T00:00:00.000Z'],
      [0.6, '2026-09-01T06:00:00.000Z'],
      [0.1, '2026-09-02T06:00:00.000Z'],
    ]);
  });

  it('refuses a change without a reason, naming reason, and one before the meter run’s history, naming effectiveFrom', async () => {
    const noReason = await patch({ tolerancePercent: 0.7 });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.field).toBe('reason');
    const tooEarly = await patch({ tolerancePercent: 0.7, effectiveFrom: '2019-06-01T00:00:00Z', reason: 'typo' });
    expect(tooEarly.status).toBe(400);
    expect(tooEarly.body.error.field).toBe('effectiveFrom');
  });

  it('refuses a tolerance that is not above zero, naming tolerancePercent', async () => {
    const res = await t
      .http()
      .patch(`/api/reconciliations/tolerances/${f.meterRunId}`)
      .set(auth())
      .send({ tolerancePercent: 0, reason: 'test' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('tolerancePercent');
  });
});
