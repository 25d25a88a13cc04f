import { testApp } from '../../server/test-support/app';
import { alarmFixture, MIN, repeat } from '../../server/alarms/alarm-test-fixture';

/**
 * An approved correction reaches the stored records and totals (issue 9 §6, §8): the history
 * worker recomputes the correction's hours with it (server/history/corrections-overlay.ts), the
 * totals carry 'corrected' (and 'estimated'), and the first version stays readable beside them.
 * A site on UTC with contract hour 0, so contract days are UTC days.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let engineer2: Awaited<ReturnType<typeof t.signedIn>>;
let admin: Awaited<ReturnType<typeof t.signedIn>>;
const H = 3_600_000;

beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  engineer2 = await t.signedIn('engineer');
  admin = await t.signedIn('admin');
});
afterAll(() => t.close());

const get = (path: string) => t.http().get(path).set('Authorization', `Bearer ${engineer.token}`);
const propose = (body: Record<string, unknown>) =>
  t.http().post('/api/corrections').set('Authorization', `Bearer ${engineer.token}`).send(body);
const approve = (id: string, who = engineer2) =>
  t
    .http()
    .post(`/api/corrections/${id}/approve`)
    .set('Authorization', `Bearer ${who.token}`)
    .send({ reason: 'agreed' });

async function totals(meterRunId: string, interval: 'hour' | 'day', from: string, to: string) {
  const res = await get(`/api/meter-runs/${meterRunId}/totals?interval=${interval}&from=${from}&to=${to}`);
  expect(res.status).toBe(200);
  return res.body as {
    start: string;
    massKg: number;
    standardVolumeM3: number;
    uncertaintyPercent: number | null;
    flags: string[];
  }[];
}

describe('an approved adjustment', () => {
  it('multiplies the stored daily total by its factor, flags it corrected and keeps the first version readable', async () => {
    const f = await alarmFixture(t, engineer.token);
    const day = Date.parse('2026-10-20T00:00:00Z');
    await f.writeMinutes(day, repeat(24 * 60, 0.4));
    await t.services.history.settle(120_000);
    const [before] = await totals(f.meterRunId, 'day', '2026-10-20T00:00:00Z', '2026-10-21T00:00:00Z');
    expect(before.massKg).toBeGreaterThan(0);
    expect(before.flags).not.toContain('corrected');

    const created = await propose({
      meterRunId: f.meterRunId,
      start: '2026-10-20T00:00:00Z',
      end: '2026-10-21T00:00:00Z',
      kind: 'adjust',
      factor: 1.1,
      reason: 'plate bore found 10 % under-registering at inspection',
    });
    expect(created.status).toBe(201);
    expect((await approve(created.body.id)).status).toBe(200);
    await t.services.history.settle(120_000);

    const [after] = await totals(f.meterRunId, 'day', '2026-10-20T00:00:00Z', '2026-10-21T00:00:00Z');
    expect(after.massKg / before.massKg).toBeCloseTo(1.1, 9);
    expect(after.standardVolumeM3 / before.standardVolumeM3).toBeCloseTo(1.1, 9);
    expect(after.flags).toContain('corrected');

    const versions = await get(`/api/meter-runs/${f.meterRunId}/totals/versions?interval=day&start=2026-10-20`);
    expect(versions.status).toBe(200);
    expect(versions.body.first.massKg).toBeCloseTo(before.massKg, 6);
    expect(versions.body.current).toMatchObject({ cause: 'correction', causeReference: created.body.id });
    expect(versions.body.difference.massKg).toBeCloseTo(0.1 * before.massKg, 6);

    // The correction shows its period's original and corrected figures side by side.
    const shown = await get(`/api/corrections/${created.body.id}`);
    expect(shown.body.figures.hours).toBe(24);
    expect(shown.body.figures.original.massKg).toBeCloseTo(before.massKg, 6);
    expect(shown.body.figures.current.massKg).toBeCloseTo(1.1 * before.massKg, 6);
    expect(shown.body.figures.difference.massKg).toBeCloseTo(0.1 * before.massKg, 6);
  }, 240_000);
});

describe('approved substituted readings', () => {
  it('fill a DP dropout with the fixed value: the hour flows as an hour with that DP and the same P and T', async () => {
    const f = await alarmFixture(t, engineer.token);
    const hourA = Date.parse('2026-10-22T10:00:00Z');
    const hourB = hourA + H;
    // Hour A: DP 20 kPa all hour; hour B: P and T only (the DP transmitter dropped out).
    await f.writeMinutes(hourA, repeat(60, 0.4), { dpValue: () => 20 });
    await t.services.writer.write(
      repeat(60, 0).flatMap((_, i) => [
        {
          meterRunId: f.meterRunId,
          timeZone: 'UTC',
          timeMs: hourB + i * MIN,
          transmitterId: f.pt.id,
          value: 2 + (i % 3) * 1e-4,
          quality: 0,
        },
        {
          meterRunId: f.meterRunId,
          timeZone: 'UTC',
          timeMs: hourB + i * MIN,
          transmitterId: f.tt.id,
          value: 300 + (i % 2) * 0.01,
          quality: 0,
        },
      ]),
      'csv',
    );
    await t.services.history.settle(120_000);
    const [a, bBefore] = await totals(f.meterRunId, 'hour', '2026-10-22T10:00:00Z', '2026-10-22T12:00:00Z');
    expect(bBefore.massKg).toBeLessThan(a.massKg / 5);

    const created = await propose({
      meterRunId: f.meterRunId,
      start: '2026-10-22T11:00:00Z',
      end: '2026-10-22T12:00:00Z',
      kind: 'substitute',
      substitute: { transmitterId: f.dp.id, value: 20 },
      reason: 'DP transmitter dropped out; the well ran steady at 20 kPa by the chart recorder',
    });
    expect(created.status).toBe(201);
    expect((await approve(created.body.id, admin)).status).toBe(200);
    await t.services.history.settle(120_000);

    const [, b] = await totals(f.meterRunId, 'hour', '2026-10-22T10:00:00Z', '2026-10-22T12:00:00Z');
    // Same DP, same P and T pattern, same length: the same mass (within rounding).
    expect(b.massKg / a.massKg).toBeCloseTo(1, 9);
    expect(b.flags).toEqual(expect.arrayContaining(['substituted', 'corrected']));
  }, 240_000);
});

describe('an estimate for missing time', () => {
  it('is the mean of the same hour over the previous 7 days with a 95 % prediction interval, and fills the gap once approved', async () => {
    const f = await alarmFixture(t, engineer.token);
    const shares = [0.3, 0.35, 0.4, 0.45, 0.4, 0.35, 0.3];
    const first = Date.parse('2026-10-01T10:00:00Z');
    for (const [k, share] of shares.entries()) {
      await f.writeMinutes(first + k * 24 * H, repeat(60, share), { dpValue: () => share * 50 });
    }
    await t.services.history.settle(120_000);
    const masses: number[] = [];
    for (let k = 0; k < 7; k++) {
      const from = new Date(first + k * 24 * H).toISOString();
      const [hour] = await totals(f.meterRunId, 'hour', from, new Date(first + k * 24 * H + H).toISOString());
      masses.push(hour.massKg);
    }
    // By hand: mean, sample standard deviation, t(0.975, 6) = 2.447 (NIST/SEMATECH e-Handbook
    // §1.3.6.7.2), prediction interval t·s·√(1 + 1/7).
    const mean = masses.reduce((a, b) => a + b, 0) / 7;
    const s = Math.sqrt(masses.reduce((a, b) => a + (b - mean) ** 2, 0) / 6);
    const uPercent = ((2.447 * s * Math.sqrt(1 + 1 / 7)) / mean) * 100;

    const gap = { start: '2026-10-08T10:00:00Z', end: '2026-10-08T11:00:00Z' };
    const estimate = await get(
      `/api/corrections/estimate?meterRunId=${f.meterRunId}&start=${gap.start}&end=${gap.end}`,
    );
    expect(estimate.status).toBe(200);
    expect(estimate.body.method).toBe('previous-days');
    expect(estimate.body.massKg).toBeCloseTo(mean, 6);
    expect(estimate.body.uncertaintyPercent).toBeCloseTo(uPercent, 6);
    expect(estimate.body.basis.hours[0].days).toBe(7);

    const created = await propose({
      meterRunId: f.meterRunId,
      ...gap,
      kind: 'substitute',
      origin: 'estimate',
      reason: 'no readings: radio link down; estimated from the previous week',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ origin: 'estimate', massKg: estimate.body.massKg });
    expect((await approve(created.body.id)).status).toBe(200);
    await t.services.history.settle(120_000);

    const [filled] = await totals(f.meterRunId, 'hour', gap.start, gap.end);
    expect(filled.massKg).toBeCloseTo(mean, 6);
    expect(filled.flags).toEqual(expect.arrayContaining(['corrected', 'estimated']));
    const [day] = await totals(f.meterRunId, 'day', '2026-10-08T00:00:00Z', '2026-10-09T00:00:00Z');
    expect(day.flags).toEqual(expect.arrayContaining(['corrected', 'estimated']));
  }, 240_000);

  it('is refused for an hour with fewer than two complete previous days, naming start', async () => {
    const f = await alarmFixture(t, engineer.token);
    const res = await get(
      `/api/corrections/estimate?meterRunId=${f.meterRunId}&start=2026-10-08T10:00:00Z&end=2026-10-08T11:00:00Z`,
    );
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('start');
  });
});

/** Another meter run at a site (the fixture's element and gas), with DP, P and T transmitters. */
async function addMeterRun(siteId: string, tag: string) {
  const as = { Authorization: `Bearer ${engineer.token}` };
  const run = await t
    .http()
    .post('/api/meter-runs')
    .set(as)
    .send({
      siteId,
      tag: `${tag}-${t.unique()}`,
      name: `Estimate test ${tag}`,
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
      .send({ meterRunId: id, tag: `${run.body.tag}-${kind}`, ...body });
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
  /** `minutes` readings a minute from startMs at a DP of `share` of 50 kPa, P near 2 MPa, T near 300 K. */
  const writeMinutes = (startMs: number, minutes: number, share: number) =>
    t.services.writer.write(
      Array.from({ length: minutes }, (_, i) => {
        const base = { meterRunId: id, timeZone: 'UTC', timeMs: startMs + i * MIN, quality: 0 };
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

describe('an estimate for a well behind a sales meter', () => {
  it('is the sales meter over (1 − allowance) minus the other wells, with the members’ uncertainties added in quadrature', async () => {
    // Well A (the fixture) has readings for 10:00–11:00 only; well B and the sales meter S for 10:00–12:00.
    const f = await alarmFixture(t, engineer.token);
    const wellB = await addMeterRun(f.siteId, 'B');
    const sales = await addMeterRun(f.siteId, 'S');
    const hour1 = Date.parse('2026-10-12T10:00:00Z');
    await f.writeMinutes(hour1, repeat(60, 0.3));
    await wellB.writeMinutes(hour1, 121, 0.4);
    await sales.writeMinutes(hour1, 121, 0.8);
    const group = await t
      .http()
      .post('/api/balance-groups')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send({
        siteId: f.siteId,
        name: `Wells to sales ${t.unique()}`,
        inletMeterRunIds: [f.meterRunId, wellB.id],
        outletMeterRunIds: [sales.id],
        allowancePercent: 1,
        tolerancePercent: 1,
      });
    expect(group.status).toBe(201);
    await t.services.history.settle(120_000);

    const gap = { start: '2026-10-12T11:00:00Z', end: '2026-10-12T12:00:00Z' };
    const [s] = await totals(sales.id, 'hour', gap.start, gap.end);
    const [b] = await totals(wellB.id, 'hour', gap.start, gap.end);
    const [aBefore] = await totals(f.meterRunId, 'hour', gap.start, gap.end);
    expect(aBefore?.massKg ?? 0).toBeLessThan(s.massKg / 10);
    const sU = s.uncertaintyPercent ?? Number.NaN;
    const bU = b.uncertaintyPercent ?? Number.NaN;
    expect(sU).toBeGreaterThan(0);
    // By hand: the group balances when A + B − S − 0.01 (A + B) = 0, so A = S / 0.99 − B; its
    // expanded uncertainty (JCGM 100:2008 §5.1.2 eq. 10, uncorrelated, absolute) is
    // √((U_S / 0.99)² + U_B²) with U = mass × U% / 100.
    const wellKg = s.massKg / 0.99 - b.massKg;
    const wellM3 = s.standardVolumeM3 / 0.99 - b.standardVolumeM3;
    const uKg = Math.hypot((s.massKg * sU) / 100 / 0.99, (b.massKg * bU) / 100);

    const estimate = await get(
      `/api/corrections/estimate?meterRunId=${f.meterRunId}&start=${gap.start}&end=${gap.end}`,
    );
    expect(estimate.status).toBe(200);
    expect(estimate.body.method).toBe('sales-minus-other-wells');
    expect(estimate.body.massKg).toBeCloseTo(wellKg, 6);
    expect(estimate.body.uncertaintyPercent).toBeCloseTo((uKg / wellKg) * 100, 6);
    expect(estimate.body.basis).toMatchObject({
      balanceGroup: { id: String(group.body.id) },
      salesMeter: { meterRunId: sales.id },
      otherWells: [{ meterRunId: wellB.id }],
      hours: ['2026-10-12T11:00:00.000Z'],
    });
    expect(estimate.body.basis.standardVolumeM3).toBeCloseTo(wellM3, 6);

    const created = await propose({
      meterRunId: f.meterRunId,
      ...gap,
      kind: 'substitute',
      origin: 'estimate',
      reason: 'well A transmitters lost power; estimated from the sales meter',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ origin: 'estimate', estimate: { method: 'sales-minus-other-wells' } });
    expect((await approve(created.body.id)).status).toBe(200);
    await t.services.history.settle(120_000);
    const [filled] = await totals(f.meterRunId, 'hour', gap.start, gap.end);
    expect(filled.massKg).toBeCloseTo(wellKg, 6);
    expect(filled.flags).toEqual(expect.arrayContaining(['corrected', 'estimated']));

    // An hour where the other well and the sales meter have no records: neither method can estimate it.
    const refused = await get(
      `/api/corrections/estimate?meterRunId=${f.meterRunId}&start=2026-10-12T13:00:00Z&end=2026-10-12T14:00:00Z`,
    );
    expect(refused.status).toBe(400);
    expect(refused.body.error.field).toBe('start');
    expect(refused.body.error.message).toContain('sales minus the other wells');
  }, 240_000);
});
