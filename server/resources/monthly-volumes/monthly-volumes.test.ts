import { testApp } from '../../test-support/app';
import { alarmFixture, repeat } from '../../alarms/alarm-test-fixture';

/**
 * The accountant's month read back against the meter run's own monthly totals
 * (`GET /api/meter-runs/:id/totals?interval=month`, the totals API of issue 4): one hour of flow in
 * October 2026, one in September 2026 and one in October 2025 (a UTC site, contract hour 0).
 * The changes are worked from those totals: (V_oct − V_before) / V_before × 100.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const auth = () => ({ Authorization: `Bearer ${token}` });

async function monthTotal(month: string, next: string) {
  const res = await t
    .http()
    .get(`/api/meter-runs/${f.meterRunId}/totals?interval=month&from=${month}-01&to=${next}-01`)
    .set(auth());
  expect(res.status).toBe(200);
  return res.body[0] as { massKg: number; volumeM3: number; standardVolumeM3: number; energyJ: number | null };
}

beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('engineer')).token;
  f = await alarmFixture(t, token);
  await f.writeMinutes(Date.parse('2026-10-05T00:00:00Z'), repeat(61, 0.4));
  await f.writeMinutes(Date.parse('2026-09-10T00:00:00Z'), repeat(61, 0.3));
  await f.writeMinutes(Date.parse('2025-10-10T00:00:00Z'), repeat(61, 0.5));
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

describe('GET /api/monthly-volumes', () => {
  it('gives each meter run the figures of its stored monthly total and the changes worked from the totals API', async () => {
    const accountant = await t.signedIn('accountant');
    const res = await t
      .http()
      .get(`/api/monthly-volumes?siteId=${f.siteId}&month=2026-10`)
      .set('Authorization', `Bearer ${accountant.token}`);
    expect(res.status).toBe(200);
    const oct = await monthTotal('2026-10', '2026-11');
    const sep = await monthTotal('2026-09', '2026-10');
    const oct25 = await monthTotal('2025-10', '2025-11');
    expect(res.body.month).toBe('2026-10');
    expect(res.body.start).toBe('2026-10-01T00:00:00.000Z');
    expect(res.body.end).toBe('2026-11-01T00:00:00.000Z');
    const [run] = res.body.meterRuns;
    expect(run.meterRunId).toBe(f.meterRunId);
    expect(run.massKg).toBe(oct.massKg);
    expect(run.volumeM3).toBe(oct.volumeM3);
    expect(run.standardVolumeM3).toBe(oct.standardVolumeM3);
    expect(run.energyJ).toBe(oct.energyJ);
    expect(run.status).toBe('provisional');
    expect(run.correctionsInForce).toBe(0);
    expect(run.previousMonth.standardVolumeM3).toBe(sep.standardVolumeM3);
    expect(run.changeFromPreviousMonthPercent).toBeCloseTo(
      ((oct.standardVolumeM3 - sep.standardVolumeM3) / sep.standardVolumeM3) * 100,
      9,
    );
    expect(run.changeFromYearEarlierPercent).toBeCloseTo(
      ((oct.standardVolumeM3 - oct25.standardVolumeM3) / oct25.standardVolumeM3) * 100,
      9,
    );
    // DP share 0.3 → 0.4 → 0.5 at the same P and T: flow goes as √Δp (ISO 5167-1 eq. 1), so Sep < Oct < Oct 2025.
    expect(run.changeFromPreviousMonthPercent).toBeGreaterThan(0);
    expect(run.changeFromYearEarlierPercent).toBeLessThan(0);
    // One meter run: the site's total is its figures, its uncertainty the run's (root-sum-square of one term).
    expect(res.body.totals.standardVolumeM3).toBe(oct.standardVolumeM3);
    expect(res.body.totals.uncertaintyPercent).toBeCloseTo(run.uncertaintyPercent, 9);
  });

  it('counts an approved correction overlapping the month as in force', async () => {
    const proposer = await t.signedIn('engineer');
    const approver = await t.signedIn('engineer');
    const proposed = await t.http().post('/api/corrections').set('Authorization', `Bearer ${proposer.token}`).send({
      meterRunId: f.meterRunId,
      start: '2026-10-05T00:00:00Z',
      end: '2026-10-05T01:00:00Z',
      kind: 'adjust',
      factor: 1.01,
      reason: 'Orifice plate found reversed',
    });
    expect(proposed.status).toBe(201);
    const approved = await t
      .http()
      .post(`/api/corrections/${proposed.body.id}/approve`)
      .set('Authorization', `Bearer ${approver.token}`)
      .send({ reason: 'Checked against the inspection report' });
    expect(approved.status).toBe(200);
    const res = await t.http().get(`/api/monthly-volumes?siteId=${f.siteId}&month=2026-10`).set(auth());
    expect(res.body.meterRuns[0].correctionsInForce).toBe(1);
    expect(res.body.totals.correctionsInForce).toBe(1);
    const september = await t.http().get(`/api/monthly-volumes?siteId=${f.siteId}&month=2026-09`).set(auth());
    expect(september.body.meterRuns[0].correctionsInForce).toBe(0);
  });

  it('refuses a month that is not YYYY-MM, naming month, and an unknown site with 404', async () => {
    const bad = await t.http().get(`/api/monthly-volumes?siteId=${f.siteId}&month=2026-13`).set(auth());
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('month');
    const missing = await t.http().get('/api/monthly-volumes?siteId=999999999&month=2026-10').set(auth());
    expect(missing.status).toBe(404);
  });
});
