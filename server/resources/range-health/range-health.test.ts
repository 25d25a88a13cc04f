import { testApp } from '../../test-support/app';
import { alarmFixture, repeat } from '../../alarms/alarm-test-fixture';

/**
 * A constructed day whose bands are known by hand (UTC site, contract hour 0; DP 0–50 kPa):
 * 00–06 h at 5 % of span (band 0–10 %), 06–16 h at 40 % (25–50 %), 16–22 h at 75 % (50–100 %),
 * 22–23 h at 105 % (over range), 23–24 h at zero DP (no flow). Flowing time 23 h.
 * Mass by hand: qm = C ε (π/4) d² √(2 ρ Δp) / √(1 − β⁴) (ISO 5167-1 eq. 1), so at the same P and T
 * the mass of a band goes as hours × √(share): 6√0.05, 10√0.40, 6√0.75, 1√1.05; C and ε change
 * by under 1 % across these DPs (ε from ISO 5167-2 eq. for κ 1.2 at 2 MPa: 0.9996 at 2.5 kPa,
 * 0.9922 at 52.5 kPa), so the shares are checked to 1.5 %.
 */
let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const DAY = Date.parse('2026-10-10T00:00:00Z');
const STEADY_DAY = Date.parse('2026-10-12T00:00:00Z');
beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('engineer')).token;
  f = await alarmFixture(t, token);
  const shares = [
    ...repeat(6 * 60, 0.05),
    ...repeat(10 * 60, 0.4),
    ...repeat(6 * 60, 0.75),
    ...repeat(60, 1.05),
    ...repeat(61, 0),
  ];
  await f.writeMinutes(DAY, shares, { dpValue: (_i, share) => share * 50 });
  // A steady day for the check of issue 13 item 5: six hours at 40 % of span, nothing else.
  await f.writeMinutes(STEADY_DAY, repeat(6 * 60, 0.4), { dpValue: (_i, share) => share * 50 });
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

describe('GET /api/meter-runs/:id/range-health', () => {
  const weights = {
    '0-10': 6 * Math.sqrt(0.05),
    '10-25': 0,
    '25-50': 10 * Math.sqrt(0.4),
    '50-100': 6 * Math.sqrt(0.75),
    over: Math.sqrt(1.05),
  };
  const totalWeight = Object.values(weights).reduce((a, b) => a + b, 0);

  it('gives shares of flow time and of volume per band that add up to 100 %, as worked by hand', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/range-health?from=2026-10-10T00:00:00Z&to=2026-10-11T00:00:00Z`)
      .set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(200);
    const body = res.body;
    expect(body.hours).toBe(24);
    expect(body.flowTimeS).toBeCloseTo(23 * 3600, 6);
    const band = (b: string) => body.bands.find((x: { band: string }) => x.band === b);
    expect(band('0-10').flowTimeShare).toBeCloseTo(6 / 23, 9);
    expect(band('10-25').flowTimeShare).toBe(0);
    expect(band('25-50').flowTimeShare).toBeCloseTo(10 / 23, 9);
    expect(band('50-100').flowTimeShare).toBeCloseTo(6 / 23, 9);
    expect(band('over').flowTimeShare).toBeCloseTo(1 / 23, 9);
    const sum = (k: string) => body.bands.reduce((a: number, b: Record<string, number>) => a + b[k], 0);
    expect(sum('flowTimeShare')).toBeCloseTo(1, 12);
    expect(sum('massShare')).toBeCloseTo(1, 12);
    expect(sum('standardVolumeShare')).toBeCloseTo(1, 12);
    for (const [name, w] of Object.entries(weights)) {
      if (w === 0) expect(band(name).massShare).toBe(0);
      else expect(Math.abs(band(name).massShare / (w / totalWeight) - 1)).toBeLessThan(0.015);
    }
    // Uncertainty: the low band's is the largest (0.075 % of span is 1.5 % of a 5 % reading, ½ of it on flow).
    expect(band('0-10').uncertaintyPercent).toBeGreaterThan(band('25-50').uncertaintyPercent);
    expect(sum('uncertaintyContributionPercent')).toBeCloseTo(body.uncertaintyPercent, 9);
  });

  it('attributes everything to the single DP transmitter, gives the month and a recommendation with numbers', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/range-health?from=2026-10-10T00:00:00Z&to=2026-10-11T00:00:00Z`)
      .set('Authorization', `Bearer ${token}`);
    const [dp] = res.body.transmitters;
    expect(dp).toMatchObject({ transmitterId: f.dp.id, stackRole: 'single', flowTimeShare: 1, massShare: 1 });
    expect(res.body.attribution.apportionedFlowTimeS).toBe(0);
    expect(res.body.months.map((m: { month: string }) => m.month)).toEqual(['2026-10']);
    // An hour over range (4 % of flowing time) calls for re-ranging up.
    expect(res.body.recommendation.kind).toBe('re-range');
    expect(res.body.recommendation.text).toMatch(/up to/);
    expect(res.body.recommendation.numbers.overRangeTimeShare).toBeCloseTo(1 / 23, 9);
  });

  it('gives the same expanded uncertainty in its range check as its hourly records at the same flow', async () => {
    // Six hours at one steady DP (20 kPa of a 0–50 kPa span): every hour has the same rate, so the
    // lowest, typical and highest flow of the recommendation's range check are that rate, and its DP
    // is the recorded one. Both sides then work one budget (shared/history/sample-uncertainty.ts) at
    // one operating point, so they must agree; P and T wobble by 5e-5 and 3e-5 relative in the
    // fixture, which moves U by far less than the 1e-3 % allowed here.
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/range-health?from=2026-10-12T00:00:00Z&to=2026-10-12T06:00:00Z`)
      .set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(200);
    const hourlyU = res.body.uncertaintyPercent as number;
    const flows = res.body.recommendation.rangeCheck.flows as {
      differentialPressurePa: number;
      transmitters: { flowUncertaintyPercent: number }[];
    }[];
    expect(flows).toHaveLength(3);
    for (const flow of flows) {
      expect(flow.differentialPressurePa).toBeCloseTo(20_000, -1);
      expect(Math.abs(flow.transmitters[0].flowUncertaintyPercent - hourlyU)).toBeLessThan(1e-3);
    }
  });

  it('refuses a window that ends before it starts, naming to', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/range-health?from=2026-10-11T00:00:00Z&to=2026-10-10T00:00:00Z`)
      .set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('to');
  });
});
