import { client, createMeterRun, engineRate, settled, signIn, until, type Client } from '../support/api';

/**
 * A configuration version dated in the past, in the middle of an hour, through the real server:
 * CSV import → hourly records → back-dated element swap → the history worker recomputes. The
 * expected masses are worked by hand: a constant input gives the engine's constant rate for each
 * element, so an hour is rate × the seconds each element was in force.
 */
let api: Client;
beforeAll(async () => {
  api = client(await signIn('engineer@demo.tallyrun'));
});

const hourMs = 3_600_000;
const relative = (a: number, b: number) => Math.abs(a / b - 1);

describe('a configuration version back-dated into the middle of an hour', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  let rate: number;
  const h0 = Date.parse('2026-09-14T00:00:00Z');

  const hours = async () =>
    (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/totals?interval=hour&from=${new Date(h0).toISOString()}&to=${new Date(h0 + 6 * hourMs).toISOString()}`,
      )
    ).body as { start: string; massKg: number; hours: number }[];

  beforeAll(async () => {
    f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0, maxGapS: 900 });
    rate = await engineRate(api, f.element, f.fluid, 25_000, 2e6, 300);
    // 25 kPa, 2 MPa, 300 K every 10 minutes from 00:00 to 05:50: six whole hours.
    const lines = ['time,tag,value,quality'];
    for (let t = h0; t < h0 + 6 * hourMs; t += 10 * 60_000) {
      const iso = new Date(t).toISOString();
      lines.push(`${iso},${f.dp.tag},25,good`, `${iso},${f.pt.tag},2,good`, `${iso},${f.tt.tag},300,good`);
    }
    const started = await api.upload('/api/imports', 'readings.csv', lines.join('\n') + '\n');
    expect(started.status).toBe(202);
    await until('the import to finish', async () => {
      const r = await api.get(`/api/imports/${started.body.id}`);
      return r.body.status !== 'running' ? r.body : null;
    });
    await settled(api, f.meterRun.id);
  });

  it('recomputes the hour it falls in (half old, half new element) and every hour after it, no hour before', async () => {
    const before = await hours();
    expect(before).toHaveLength(6);
    const newElement = { ...f.element, boreDiameterM: 0.12 };
    const newRate = await engineRate(api, newElement, f.fluid, 25_000, 2e6, 300);
    const version = await api.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
      effectiveFrom: new Date(h0 + 3.5 * hourMs).toISOString(),
      element: newElement,
      fluid: f.fluid,
      reason: 'Plate found swapped at 03:30 (found late)',
    });
    expect(version.status).toBe(201);
    // 03:00, 04:00, 05:00 and 06:00 are computed and change; the hour containing 03:30 starts at
    // 03:00. The 06:00 hour has a record since a reading queues every hour it feeds (issue 13, item 7):
    // the 05:50 DP sample stands for the largest gap, 900 s, until 06:05.
    expect(version.body.recompute).toEqual({ from: new Date(h0 + 3 * hourMs).toISOString(), hours: 4 });
    expect(version.body.changes).toEqual([{ path: 'element.boreDiameterM', before: 0.1, after: 0.12 }]);

    await settled(api, f.meterRun.id);
    const after = await hours();
    // API MPMS 21.1: a constant changed mid-hour gives two records, 03:00–03:30 and 03:30–04:00.
    expect(after.map((h) => h.start)).toEqual(
      [0, 1, 2, 3, 3.5, 4, 5].map((k) => new Date(h0 + k * hourMs).toISOString()),
    );
    for (let i = 0; i < 3; i++) expect(after[i].massKg).toBe(before[i].massKg);
    expect(relative(after[3].massKg, rate * 1800)).toBeLessThan(1e-9);
    expect(relative(after[4].massKg, newRate * 1800)).toBeLessThan(1e-9);
    expect(relative(after[3].massKg + after[4].massKg, rate * 1800 + newRate * 1800)).toBeLessThan(1e-9);
    for (let i = 5; i < 7; i++) expect(relative(after[i].massKg, newRate * 3600)).toBeLessThan(1e-9);
    // Each part counts its share of the hour, so the listed hours still add up to six.
    expect(after.map((h) => h.hours)).toEqual([1, 1, 1, 0.5, 0.5, 1, 1]);
  });

  it('stores each part with its own configuration version, no config-changed flag, and IMV × IV × flow time equal to its mass', async () => {
    const records = (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/hourly-records?from=${new Date(h0 + 3 * hourMs).toISOString()}&to=${new Date(h0 + 4 * hourMs).toISOString()}`,
      )
    ).body as {
      end: string;
      massKg: number;
      flowTimeS: number;
      integralValue: number;
      integralMultiplierValue: number;
      configVersionId: string;
      flags: string[];
    }[];
    expect(records).toHaveLength(2);
    expect(records[0].end).toBe(new Date(h0 + 3.5 * hourMs).toISOString());
    expect(records[0].configVersionId).not.toBe(records[1].configVersionId);
    for (const r of records) {
      expect(r.flags).not.toContain('config-changed');
      expect(r.flowTimeS).toBe(1800);
      expect(relative(r.integralMultiplierValue * r.integralValue * r.flowTimeS, r.massKg)).toBeLessThan(1e-12);
    }
  });
});
