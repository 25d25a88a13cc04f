import { DateTime } from 'luxon';
import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';
import { AlarmEvaluator } from '../../alarms/alarm-evaluator';

/**
 * The "what is due" list of a site (issue 11 §4) and the care alarms. The site is in
 * America/Denver so that its date differs from UTC's for seven hours a day; expected dates are
 * worked with the calendar (luxon's plus/minus days in that zone), not taken from the server.
 * Care records are inserted through the app's own connection (the records are append-only).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: { id: string; token: string };
let f: Awaited<ReturnType<typeof alarmFixture>>;
const ZONE = 'America/Denver';
const today = () => DateTime.now().setZone(ZONE).toISODate()!;
const day = (n: number) => DateTime.now().setZone(ZONE).plus({ days: n }).toISODate()!;

async function configVersionOf(meterRunId: string): Promise<string> {
  const { rows } = await t.services.pool.query<{ id: string }>(
    'SELECT id::text FROM config_versions WHERE meter_run_id = $1 ORDER BY effective_from DESC LIMIT 1',
    [meterRunId],
  );
  return rows[0].id;
}

/** An inspection on `doneOn` (noon in the site's zone) naming when the next is due. */
async function insertInspection(meterRunId: string, doneOn: string, nextDue: string | null) {
  await t.services.pool.query(
    `INSERT INTO element_inspections (meter_run_id, inspected_at, kind, measured, condition, created_by, next_due)
     VALUES ($1, ($2::date + time '12:00') AT TIME ZONE $5, 'orifice-plate', '{}', 'edge sharp, plate flat', $3, $4)`,
    [meterRunId, doneOn, engineer.id, nextDue, ZONE],
  );
}

async function insertGasAnalysis(meterRunId: string, doneOn: string, nextDue: string | null) {
  await t.services.pool.query(
    `INSERT INTO gas_analyses (meter_run_id, sampled_at, laboratory, components, composition, sum_tolerance,
                               config_version_id, created_by, next_due)
     VALUES ($1, ($2::date + time '12:00') AT TIME ZONE $6, 'Test laboratory', '[]', '{"methane": 1}', 0.001, $3, $4, $5)`,
    [meterRunId, doneOn, await configVersionOf(meterRunId), engineer.id, nextDue, ZONE],
  );
}

const careDue = (siteId: string, query = '') =>
  t.http().get(`/api/sites/${siteId}/care-due${query}`).set('Authorization', `Bearer ${engineer.token}`);

interface Item {
  kind: string;
  subject: string;
  dueOn: string | null;
  lastDoneOn: string | null;
  state: string;
  daysLeft: number | null;
  transmitterId: string | null;
  recordUrl: string;
  alarmId: string | null;
}

beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  f = await alarmFixture(t, engineer.token, { timeZone: ZONE });
  const patch = (id: string, calibrationDue: string) =>
    t.http().patch(`/api/transmitters/${id}`).set('Authorization', `Bearer ${engineer.token}`).send({ calibrationDue });
  expect((await patch(f.dp.id, day(-1))).status).toBe(200);
  expect((await patch(f.pt.id, day(14))).status).toBe(200);
  // The temperature transmitter has no calibration date at all: not recorded.
  await insertGasAnalysis(f.meterRunId, day(-200), day(15));
  await insertInspection(f.meterRunId, day(-365), today());
}, 60_000);
afterAll(() => t.close());

describe('GET /api/sites/:id/care-due', () => {
  it("lists each duty with its state by the site's date, due dates ascending and never-recorded items last", async () => {
    const res = await careDue(f.siteId);
    expect(res.status).toBe(200);
    expect(res.body.site).toMatchObject({ id: f.siteId, timeZone: ZONE });
    expect(res.body.today).toBe(today());
    const items: Item[] = res.body.items;
    expect(items.map((i) => [i.kind, i.subject.split(' ')[0], i.dueOn, i.state, i.daysLeft])).toEqual([
      ['transmitter-calibration', f.dp.tag, day(-1), 'overdue', -1],
      ['element-inspection', f.tag, today(), 'due-soon', 0],
      ['transmitter-calibration', f.pt.tag, day(14), 'due-soon', 14],
      ['gas-analysis', f.tag, day(15), 'ok', 15],
      ['transmitter-calibration', f.tt.tag, null, 'not-recorded', null],
    ]);
    // An orifice with its standard C has no laboratory calibration to keep up.
    expect(items.some((i) => i.kind === 'element-calibration')).toBe(false);
    expect(items[0]).toMatchObject({ transmitterId: f.dp.id, recordUrl: `/api/transmitters/${f.dp.id}/calibrations` });
    expect(items[1]).toMatchObject({
      transmitterId: null,
      lastDoneOn: day(-365),
      recordUrl: `/api/meter-runs/${f.meterRunId}/inspections`,
    });
  });

  it('sorts latest first with -due, still keeping never-recorded items last', async () => {
    const res = await careDue(f.siteId, '?sort=-due');
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: Item) => i.dueOn)).toEqual([day(15), day(14), today(), day(-1), null]);
  });

  it('lists a cone meter run’s laboratory calibration, not recorded until one is', async () => {
    const run = await t
      .http()
      .post('/api/meter-runs')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send({
        siteId: f.siteId,
        tag: `CONE-${t.unique()}`,
        name: 'Cone run',
        element: { kind: 'cone', pipeDiameterM: 0.0525, coneDiameterM: 0.04, dischargeCoefficient: 0.82 },
        fluid: {
          kind: 'ideal-gas',
          molarMassKgPerMol: 0.01804,
          compressibility: 1,
          isentropicExponent: 1.3,
          viscosityPaS: 1.1e-5,
        },
        holdLimitS: 3600,
        maxGapS: 300,
        effectiveFrom: '2020-01-01T00:00:00Z',
      });
    expect(run.status).toBe(201);
    const items: Item[] = (await careDue(f.siteId)).body.items;
    const mine = items.filter((i) => i.recordUrl.startsWith(`/api/meter-runs/${run.body.id}/`));
    expect(mine.map((i) => [i.kind, i.state])).toEqual([
      ['element-calibration', 'not-recorded'],
      ['element-inspection', 'not-recorded'],
      ['gas-analysis', 'not-recorded'],
    ]);
  });

  it('refuses an unknown sort, naming sort', async () => {
    const res = await careDue(f.siteId, '?sort=name');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('sort');
  });

  it('answers 404 for an unknown site and for an id that cannot name one', async () => {
    expect((await careDue('999999999')).status).toBe(404);
    expect((await careDue('abc')).status).toBe(404);
  });
});

describe('care alarms (care-due, care-overdue)', () => {
  it('raises care-overdue for an overdue inspection, ties it to the list, and clears it when a later record arrives', async () => {
    const g = await alarmFixture(t, engineer.token, { timeZone: ZONE });
    await insertInspection(g.meterRunId, day(-400), day(-3));
    const evaluator = new AlarmEvaluator(t.services.pool);
    const open = async () =>
      (
        await t.services.pool.query<{ id: string; condition: string; detail: Record<string, string>; message: string }>(
          `SELECT id::text, condition, detail, message FROM alarms
            WHERE meter_run_id = $1 AND transmitter_id IS NULL AND condition LIKE 'care-%' AND state <> 'normal' AND condition_active`,
          [g.meterRunId],
        )
      ).rows;
    await evaluator.evaluateCare(Date.now());
    const [alarm, ...others] = await open();
    expect(others).toEqual([]);
    expect(alarm.condition).toBe('care-overdue');
    expect(alarm.detail.kinds).toBe('element-inspection');
    expect(alarm.message).toContain(`element inspection due ${day(-3)}`);
    const item = (await careDue(g.siteId)).body.items.find((i: Item) => i.kind === 'element-inspection');
    expect(item).toMatchObject({ state: 'overdue', daysLeft: -3, alarmId: alarm.id });
    // Judged again with nothing new: no second alarm.
    await evaluator.evaluateCare(Date.now());
    expect((await open()).map((a) => a.id)).toEqual([alarm.id]);
    // The inspection is done today and the next is due in a year: the alarm returns to normal.
    await insertInspection(g.meterRunId, today(), day(365));
    await evaluator.evaluateCare(Date.now());
    expect(await open()).toEqual([]);
    const after = (await careDue(g.siteId)).body.items.find((i: Item) => i.kind === 'element-inspection');
    expect(after).toMatchObject({ state: 'ok', lastDoneOn: today(), alarmId: null });
  });

  it('raises care-due while a gas analysis is within the due-soon window, and nothing for a date beyond it', async () => {
    const g = await alarmFixture(t, engineer.token, { timeZone: ZONE });
    await insertGasAnalysis(g.meterRunId, day(-100), day(15));
    const evaluator = new AlarmEvaluator(t.services.pool);
    const conditions = async () =>
      (
        await t.services.pool.query<{ condition: string }>(
          `SELECT condition FROM alarms WHERE meter_run_id = $1 AND condition LIKE 'care-%' AND state <> 'normal' AND condition_active`,
          [g.meterRunId],
        )
      ).rows.map((r) => r.condition);
    await evaluator.evaluateCare(Date.now());
    expect(await conditions()).toEqual([]);
    // Fourteen days before the due date (the default window) it is due soon.
    await evaluator.evaluateCare(DateTime.now().plus({ days: 1 }).toMillis());
    expect(await conditions()).toEqual(['care-due']);
  });
});
