import { testApp } from '../../test-support/app';
import { alarmFixture, repeat } from '../../alarms/alarm-test-fixture';

/**
 * The uncertainty budget stored with each hourly record and shown by the hourly-records API
 * (issue 13 §8), through the real app, worker and database. The fixture's meter run: an orifice,
 * D = 300 mm, d = 100 mm (β = 1/3), an ideal gas; DP held at 20 kPa on a 0–50 kPa transmitter,
 * P ≈ 2 MPa on 0–4 MPa, T ≈ 300 K on 200–400 K, all three stated at 0.075 % of span. The static
 * pressure transmitter is then given a ± 0.1 % of span limit (a rectangular figure) dated from the
 * start of the history, before any reading. Every expected value below is worked by hand:
 * - a term's share of U(qm)/qm is its sensitivity × the input's relative expanded uncertainty
 *   (ISO 5167-1:2003 §8; GUM JCGM 100:2008 §5.1.3); qm ∝ C √(Δp ρ), so C enters with 1, Δp and ρ
 *   with ½, and for an ideal gas ρ ∝ p/T, so p and T reach qm with ½ each;
 * - an accuracy in percent of span is span/reading times larger in percent of the reading;
 * - U(C)/C of an orifice with 0.2 ≤ β ≤ 0.6 and D ≥ 71.12 mm is 0.5 % (ISO 5167-2:2003 §5.3.3.1);
 * - a ± limit a taken as rectangular has u = a/√3 (GUM §4.3.7), so U = 2a/√3 (k = 2, GUM §6.2);
 * - the terms combine by root-sum-square of standard uncertainties (GUM §5.1.2):
 *   u_c = √Σ(Uᵢ/2)², U = 2 u_c.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const dayMs = 86_400_000;
const hourMs = 3_600_000;
const DAY = Math.floor(Date.now() / dayMs) * dayMs - 2 * dayMs;
const iso = (ms: number) => new Date(ms).toISOString();

interface BudgetTerm {
  term: string;
  percent: number;
  source: string;
}
interface HourBody {
  start: string;
  uncertaintyPercent: number | null;
  averageDpPa: number | null;
  averagePressurePa: number | null;
  averageTemperatureK: number | null;
  uncertaintyBudget: BudgetTerm[] | null;
}

const auth = () => ({ Authorization: `Bearer ${engineer}` });
const hours = async () => {
  const res = await t
    .http()
    .get(`/api/meter-runs/${f.meterRunId}/hourly-records`)
    .query({ from: iso(DAY), to: iso(DAY + 3 * hourMs) })
    .set(auth());
  expect(res.status).toBe(200);
  return res.body as HourBody[];
};
const termOf = (hour: HourBody, name: string) => {
  const found = hour.uncertaintyBudget?.find((x) => x.term === name);
  if (!found) throw new Error(`no ${name} term in ${JSON.stringify(hour.uncertaintyBudget)}`);
  return found;
};

beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
  f = await alarmFixture(t, engineer);
  const res = await t.http().patch(`/api/transmitters/${f.pt.id}`).set(auth()).send({
    accuracyPercentOfSpan: 0.1,
    accuracyKind: 'rectangular-limit',
    effectiveFrom: '2020-01-01T00:00:00Z',
    reason: 'The datasheet states a ± limit, not an uncertainty',
  });
  if (res.status !== 200) throw new Error(`transmitter: ${JSON.stringify(res.body)}`);
  await f.writeMinutes(DAY, repeat(3 * 60, 0.4), { dpValue: () => 20 });
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

describe('the uncertainty budget of an hourly record', () => {
  it('lists the DP, static pressure, temperature and C terms, each with its source, at the values worked by hand', async () => {
    const [hour] = await hours();
    expect(hour.uncertaintyBudget).not.toBeNull();
    expect(hour.averageDpPa).toBeCloseTo(20_000, 6);
    // ½ × 0.075 % × 50 kPa / 20 kPa (ISO 5167-1:2003 §8)
    expect(termOf(hour, 'differentialPressure').percent).toBeCloseTo(0.5 * ((0.075 * 50_000) / 20_000), 9);
    // ½ × 0.075 % × 200 K / T (the kelvin reading)
    expect(termOf(hour, 'temperature').percent).toBeCloseTo(0.5 * ((0.075 * 200) / hour.averageTemperatureK!), 6);
    // ISO 5167-2:2003 §5.3.3.1: 0.5 % for 0.2 ≤ β ≤ 0.6
    expect(termOf(hour, 'dischargeCoefficient').percent).toBeCloseTo(0.5, 9);
    expect(termOf(hour, 'staticPressure').percent).toBeGreaterThan(0);
    for (const term of hour.uncertaintyBudget!) expect(term.source.trim().length).toBeGreaterThan(0);
    expect(termOf(hour, 'differentialPressure').source).toMatch(/k = 2/);
    expect(termOf(hour, 'dischargeCoefficient').source).toMatch(/ISO 5167-2/);
  });

  it('has a root-sum-square of its terms (÷ 2 to standard uncertainties, × 2 back) equal to the record’s uncertainty', async () => {
    for (const hour of await hours()) {
      const standard = hour.uncertaintyBudget!.map((x) => x.percent / 2);
      const combined = Math.sqrt(standard.reduce((sum, u) => sum + u * u, 0));
      expect(2 * combined).toBeCloseTo(hour.uncertaintyPercent!, 9);
    }
  });

  it('turns a rectangular ± 0.1 % of span limit into U = 2 × 0.1/√3 = 0.1155 % for the static pressure transmitter', async () => {
    const [hour] = await hours();
    const p = termOf(hour, 'staticPressure');
    // Expanded accuracy 2 × 0.1/√3 % of the 4 MPa span, as % of the ≈ 2 MPa reading, × ½ through ρ:
    // the span/reading ratio of 2 and the ½ cancel, leaving the transmitter's own U.
    expect(p.percent).toBeCloseTo(0.5 * ((2 * 0.1) / Math.sqrt(3)) * (4e6 / hour.averagePressurePa!), 6);
    expect(p.percent).toBeCloseTo(0.1155, 4);
    expect(p.source).toMatch(/√3/);
    expect(p.source).toMatch(/GUM §4\.3\.7/);
  });

  it('keeps the budget a record had in its version when a recompute changes only the budget', async () => {
    const [hour] = await hours();
    const start = hour.start;
    // Stands in for a recompute whose budget differs (a new source wording): the figures stay as they were.
    await t.services.pool.query(
      `UPDATE hourly_records SET uncertainty_budget = '[]'::jsonb, recompute_cause = 'scheduled'
        WHERE meter_run_id = $1 AND start = $2`,
      [f.meterRunId, start],
    );
    const { rows } = await t.services.pool.query<{ version: number; uncertainty_budget: { name: string }[] }>(
      'SELECT version, uncertainty_budget FROM hourly_record_versions WHERE meter_run_id = $1 AND start = $2',
      [f.meterRunId, start],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0].version).toBe(1);
    expect(rows[0].uncertainty_budget.map((x) => x.name).sort()).toEqual(
      hour.uncertaintyBudget!.map((x) => x.term).sort(),
    );
    const [after] = await hours();
    expect(after.uncertaintyBudget).toEqual([]);
  });

  it('shows the transmitter’s accuracy kind and keeps it as a dated setting', async () => {
    const res = await t.http().get(`/api/transmitters/${f.pt.id}`).set(auth());
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ accuracyPercentOfSpan: 0.1, accuracyKind: 'rectangular-limit' });
    const { rows } = await t.services.pool.query<{ accuracy_kind: string; effective_from: Date }>(
      'SELECT accuracy_kind, effective_from FROM transmitter_range_versions WHERE transmitter_id = $1 ORDER BY id',
      [f.pt.id],
    );
    expect(rows.map((r) => r.accuracy_kind)).toEqual(['expanded-k2', 'rectangular-limit']);
  });

  it('refuses an accuracy kind it does not know, naming the field', async () => {
    const res = await t
      .http()
      .patch(`/api/transmitters/${f.pt.id}`)
      .set(auth())
      .send({ accuracyKind: 'typical', reason: 'a test' });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/accuracyKind/);
  });
});
