import { testApp } from '../../test-support/app';
import { AlarmEvaluator } from '../../alarms/alarm-evaluator';

/**
 * Bi-directional meter runs (issue 13 §11) through the real app, ingest writer, history worker and
 * database. A cone meter, D = 0.3 m, cone diameter dc = 0.2 m, forward C = 0.80 and reverse C =
 * 0.78 (fixed, as calibrated per direction); an ideal gas (M = 0.01804 kg/mol, Z = 1, κ = 1.2); DP
 * on a −50…+50 kPa transmitter held at +20 kPa for the first twelve hours of a day and at −20 kPa
 * for the last twelve (a negative DP is reverse flow: directionSource 'dp-sign'); P = 2 MPa, T =
 * 300 K (= the element's reference temperature, so no thermal-expansion correction). Every expected
 * value is worked by hand below from the published equations, not taken from the code:
 * - β of a cone = √(1 − dc²/D²)                                         ISO 5167-5:2016 §3.3.1
 * - qm = C/√(1 − β⁴) · ε · (π/4)(βD)² · √(2 Δp ρ1)                      ISO 5167-5:2016 §4 (eq. 1)
 * - ε = 1 − (0.649 + 0.696 β⁴) Δp/(κ p1)                                ISO 5167-5:2016 §5.4
 * - ρ = p M/(Z R T), R = 8.314462618 J/(mol·K)                          ideal gas; CODATA 2018 R
 * - a contract day's total = Σ rate × flowing time; net = forward − reverse (the design of §11).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
const dayMs = 86_400_000;
const hourMs = 3_600_000;
const MIN = 60_000;
const DAY = Math.floor(Date.now() / dayMs) * dayMs - 2 * dayMs;
const DAY_NAME = new Date(DAY).toISOString().slice(0, 10);
const iso = (ms: number) => new Date(ms).toISOString();
const auth = () => ({ Authorization: `Bearer ${engineer}` });

const D = 0.3;
const dc = 0.2;
const fluid = {
  kind: 'ideal-gas',
  molarMassKgPerMol: 0.01804,
  compressibility: 1,
  isentropicExponent: 1.2,
  viscosityPaS: 1.12e-5,
};
const cone = (C: number) => ({
  kind: 'cone',
  pipeDiameterM: D,
  coneDiameterM: dc,
  dischargeCoefficient: C,
  dischargeCoefficientCalibrated: true,
  calibrationUncertaintyPercent: 0.5,
  referenceTemperatureK: 300,
});

/** The hand calculation of the header: qm in kg/s and standard volume flow in m³/s at |Δp|. */
function byHand(C: number, dpPa: number) {
  const R = 8.314462618;
  const p = 2e6;
  const T = 300;
  const beta = Math.sqrt(1 - (dc * dc) / (D * D)); // √(1 − 0.04/0.09) = √(5/9) = 0.745356
  const beta4 = beta ** 4; // 25/81 = 0.308642
  const rho = (p * fluid.molarMassKgPerMol) / (fluid.compressibility * R * T); // 14.4656 kg/m³
  const eps = 1 - ((0.649 + 0.696 * beta4) * dpPa) / (fluid.isentropicExponent * p); // 0.993698
  const qm = (C / Math.sqrt(1 - beta4)) * eps * (Math.PI / 4) * (beta * D) ** 2 * Math.sqrt(2 * dpPa * rho);
  const rhoBase = (101325 * fluid.molarMassKgPerMol) / (R * 288.15); // base 101.325 kPa, 288.15 K
  return { qm, qv: qm / rhoBase };
}

async function post(path: string, body: Record<string, unknown>) {
  const res = await t.http().post(path).set(auth()).send(body);
  if (res.status !== 201) throw new Error(`${path}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; tag: string };
}

/** A site, a cone meter run (bi-directional or not) and its DP (−50…+50 kPa), P and T transmitters. */
async function meterRun(bidirectional: boolean) {
  const code = t.unique().toUpperCase();
  const site = await post('/api/sites', {
    code: `B${code}`,
    name: `Bi-directional test site ${code}`,
    timeZone: 'UTC',
    contractHour: 0,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  const run = await post('/api/meter-runs', {
    siteId: site.id,
    tag: `BD-${code}`,
    name: `Bi-directional test run ${code}`,
    element: cone(0.8),
    fluid,
    holdLimitS: 3600,
    maxGapS: 300,
    effectiveFrom: '2020-01-01T00:00:00Z',
    ...(bidirectional ? { line: { bidirectional: true }, reverseElement: cone(0.78) } : {}),
  });
  const transmitter = (suffix: string, body: Record<string, unknown>) =>
    post('/api/transmitters', { meterRunId: run.id, tag: `BD-${code}-${suffix}`, ...body });
  const dp = await transmitter('DP', {
    measures: 'differential-pressure',
    unit: 'kPa',
    lowerRange: -50,
    upperRange: 50,
  });
  const pt = await transmitter('PT', { measures: 'static-pressure', unit: 'MPa', lowerRange: 0, upperRange: 4 });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });
  /** One reading a minute of each transmitter from startMs, DP in kPa from `dpKpa(i)`. */
  const writeMinutes = (startMs: number, minutes: number, dpKpa: (i: number) => number) =>
    t.services.writer.write(
      Array.from({ length: minutes }, (_, i) => {
        const base = { meterRunId: String(run.id), timeZone: 'UTC', timeMs: startMs + i * MIN, quality: 0 };
        return [
          { ...base, transmitterId: dp.id, value: dpKpa(i) },
          { ...base, transmitterId: pt.id, value: 2 },
          { ...base, transmitterId: tt.id, value: 300 },
        ];
      }).flat(),
      'csv',
    );
  return { id: String(run.id), tag: run.tag, writeMinutes };
}

interface Figures {
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
}
interface TotalBody extends Figures {
  start: string;
  status: string;
  reverse?: Figures;
  net?: Omit<Figures, 'flowTimeS'>;
}

beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
}, 60_000);
afterAll(() => t.close());

describe('a bi-directional meter run fed a day half forward and half reverse', () => {
  let run: Awaited<ReturnType<typeof meterRun>>;
  beforeAll(async () => {
    run = await meterRun(true);
    await run.writeMinutes(DAY, 24 * 60, (i) => (i < 12 * 60 ? 20 : -20));
    await t.services.history.settle(120_000);
  }, 180_000);

  it('keeps forward and reverse daily totals apart, each worked by hand, and shows net as its own figure', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${run.id}/totals`)
      .query({ interval: 'day', from: DAY_NAME, to: iso(DAY + dayMs) })
      .set(auth());
    expect(res.status).toBe(200);
    const [day] = res.body as TotalBody[];
    expect(day.start).toBe(iso(DAY));
    const forward = byHand(0.8, 20_000);
    const reverse = byHand(0.78, 20_000);
    const flowingS = 12 * 3600; // 00:00–12:00 forward, 12:00–24:00 reverse
    // Forward: C = 0.80 → qm by hand × 43 200 s.
    expect(day.flowTimeS).toBeCloseTo(flowingS, 6);
    expect(day.massKg / (forward.qm * flowingS)).toBeCloseTo(1, 7);
    expect(day.standardVolumeM3 / (forward.qv * flowingS)).toBeCloseTo(1, 7);
    // Reverse: the reverse constants (C = 0.78) with |Δp| = 20 kPa × 43 200 s.
    expect(day.reverse).toBeDefined();
    expect(day.reverse!.flowTimeS).toBeCloseTo(flowingS, 6);
    expect(day.reverse!.massKg / (reverse.qm * flowingS)).toBeCloseTo(1, 7);
    expect(day.reverse!.standardVolumeM3 / (reverse.qv * flowingS)).toBeCloseTo(1, 7);
    // Net = forward − reverse = (0.80 − 0.78)/0.80 of the forward mass: the same hours, the same |Δp|.
    expect(day.net!.massKg / (forward.qm * flowingS * (0.02 / 0.8))).toBeCloseTo(1, 6);
    expect(day.net!.standardVolumeM3).toBeCloseTo(day.standardVolumeM3 - day.reverse!.standardVolumeM3, 6);
  });

  it('gives each hourly record its reverse part, null in forward hours', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${run.id}/hourly-records`)
      .query({ from: iso(DAY + 11 * hourMs), to: iso(DAY + 13 * hourMs) })
      .set(auth());
    expect(res.status).toBe(200);
    const [forwardHour, reverseHour] = res.body as (TotalBody & {
      reverse: (Figures & { averageDpPa: number }) | null;
    })[];
    const reverse = byHand(0.78, 20_000);
    expect(forwardHour.reverse).toMatchObject({ flowTimeS: 0, massKg: 0 });
    expect(forwardHour.flowTimeS).toBeCloseTo(3600, 6);
    expect(reverseHour.flowTimeS).toBe(0);
    expect(reverseHour.massKg).toBe(0);
    expect(reverseHour.reverse!.flowTimeS).toBeCloseTo(3600, 6);
    expect(reverseHour.reverse!.averageDpPa).toBeCloseTo(20_000, 6); // a magnitude
    expect(reverseHour.reverse!.massKg / (reverse.qm * 3600)).toBeCloseTo(1, 7);
  });
});

describe('a one-way meter run that sees reverse flow', () => {
  it('counts no reverse flow, flags the hour and raises the reverse-flow alarm, cleared by forward flow', async () => {
    const run = await meterRun(false);
    // 06:00–07:00 forward, 07:00–08:00 reverse (−20 kPa), 08:00–10:00 forward again (the evaluator judges an hour once a later reading shows it ended).
    const start = DAY + 6 * hourMs;
    await run.writeMinutes(start, 4 * 60, (i) => (i >= 60 && i < 120 ? -20 : 20));
    await t.services.history.settle(120_000);
    const res = await t
      .http()
      .get(`/api/meter-runs/${run.id}/hourly-records`)
      .query({ from: iso(start), to: iso(start + 3 * hourMs) })
      .set(auth());
    const [before, reversed, after] = res.body as (Omit<TotalBody, 'reverse'> & {
      flags: string[];
      coverage: number;
      reverse: null;
    })[];
    expect(before.flags).not.toContain('reverse-flow');
    expect(reversed.flags).toContain('reverse-flow');
    expect(reversed.massKg).toBe(0); // not counted as forward flow
    expect(reversed.coverage).toBeCloseTo(1, 9); // the time is valid: forward flow is known to be zero
    expect(reversed.reverse).toBeNull();
    expect(after.flags).not.toContain('reverse-flow');

    const evaluator = new AlarmEvaluator(t.services.pool, { now: () => start + 4 * hourMs });
    await evaluator.evaluate(run.id);
    const { rows } = await t.services.pool.query<{ condition: string; state: string; onset_at: Date; message: string }>(
      `SELECT condition, state, onset_at, message FROM alarms WHERE meter_run_id = $1 AND condition = 'reverse-flow'`,
      [run.id],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0].onset_at.toISOString()).toBe(iso(start + hourMs));
    expect(rows[0].state).toBe('returned-unacknowledged'); // the next hour flowed forward
    expect(rows[0].message).toContain(run.tag);
  });

  it('keeps the totals of a one-way day in their shape: no reverse and no net', async () => {
    const run = await meterRun(false);
    await run.writeMinutes(DAY, 60, () => 20);
    await t.services.history.settle(120_000);
    const res = await t
      .http()
      .get(`/api/meter-runs/${run.id}/totals`)
      .query({ interval: 'day', from: DAY_NAME, to: iso(DAY + dayMs) })
      .set(auth());
    const [day] = res.body as TotalBody[];
    expect(Object.keys(day)).toEqual([
      'start',
      'end',
      'hours',
      'flowTimeS',
      'massKg',
      'volumeM3',
      'standardVolumeM3',
      'energyJ',
      'coverage',
      'flags',
      'uncertaintyPercent',
      'status',
      'version',
      'firstMassKg',
      'firstStandardVolumeM3',
    ]);
  });
});
