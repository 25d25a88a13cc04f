import { client, createMeterRun, engineRate, settled, signIn, until, type Client } from '../support/api';

/**
 * History through the real server: CSV import → readings → hourly records → contract days, with
 * the history worker running as in production. The expected totals are worked by hand: a
 * constant input gives the engine's constant rate, so a period's mass is rate × its length.
 */
let api: Client;
beforeAll(async () => {
  api = client(await signIn('engineer@demo.tallyrun'));
});

const hourMs = 3_600_000;
const DP_KPA = 25;
const P_MPA = 2;
const T_K = 300;

/** CSV rows for the three transmitters, one sample every `stepMin` minutes in [fromMs, toMs]. */
function constantCsv(
  f: Awaited<ReturnType<typeof createMeterRun>>,
  fromMs: number,
  toMs: number,
  stepMin = 10,
  skip?: (ms: number) => boolean,
) {
  const lines = ['time,tag,value,quality'];
  for (let t = fromMs; t <= toMs; t += stepMin * 60_000) {
    if (skip?.(t)) continue;
    const iso = new Date(t).toISOString();
    lines.push(
      `${iso},${f.dp.tag},${DP_KPA},good`,
      `${iso},${f.pt.tag},${P_MPA},good`,
      `${iso},${f.tt.tag},${T_K},good`,
    );
  }
  return lines.join('\n') + '\n';
}

async function importCsv(csv: string) {
  const started = await api.upload('/api/imports', 'readings.csv', csv);
  expect(started.status).toBe(202);
  return until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
}

const relative = (a: number, b: number) => Math.abs(a / b - 1);

describe('contract days across the US autumn DST change', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  let rate: number;
  // Contract day 2026-10-31 at America/Denver, contract hour 09:00: from 09:00 MDT (UTC−6) on
  // 31 October to 09:00 MST (UTC−7) on 1 November — clocks fall back at 02:00 on 1 November
  // (first Sunday of November, US Energy Policy Act 2005), so the day has 25 hours.
  const dayStart = Date.parse('2026-10-31T09:00:00-06:00');
  const dayEnd = Date.parse('2026-11-01T09:00:00-07:00');
  let csv: string;

  beforeAll(async () => {
    f = await createMeterRun(api, { timeZone: 'America/Denver', contractHour: 9 });
    rate = await engineRate(api, f.element, f.fluid, DP_KPA * 1000, P_MPA * 1e6, T_K);
    csv = constantCsv(f, dayStart - hourMs, dayEnd + hourMs);
    const result = await importCsv(csv);
    expect(result).toMatchObject({ status: 'done', rejected: 0, duplicates: 0 });
    await settled(api, f.meterRun.id);
  });

  it('is 25 hours long and totals exactly rate × 25 h', async () => {
    expect(dayEnd - dayStart).toBe(25 * hourMs); // the hand check of the calendar itself
    const res = await api.get(
      `/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=2026-10-31T16:00:00Z&to=2026-11-01T15:00:00Z`,
    );
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(1);
    const day = res.body[0];
    expect(day).toMatchObject({
      start: new Date(dayStart).toISOString(),
      end: new Date(dayEnd).toISOString(),
      hours: 25,
      status: 'complete',
      coverage: 1,
    });
    expect(relative(day.massKg, rate * 25 * 3600)).toBeLessThan(1e-9);
    expect(relative(day.flowTimeS, 25 * 3600)).toBeLessThan(1e-12);
  });

  it('keeps 25 hourly records for that day, each rate × 1 h', async () => {
    const res = await api.get(
      `/api/meter-runs/${f.meterRun.id}/totals?interval=hour&from=${new Date(dayStart).toISOString()}&to=${new Date(dayEnd).toISOString()}`,
    );
    expect(res.body).toHaveLength(25);
    for (const hour of res.body) expect(relative(hour.massKg, rate * 3600)).toBeLessThan(1e-9);
  });

  it('counts a re-imported file as duplicates and does not change the totals', async () => {
    const before = (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=2026-10-31T16:00:00Z&to=2026-11-01T15:00:00Z`,
      )
    ).body[0];
    const again = await importCsv(csv);
    const rows = csv.trim().split('\n').length - 1;
    expect(again).toMatchObject({ status: 'done', rowsRead: rows, rowsImported: 0, duplicates: rows, rejected: 0 });
    await settled(api, f.meterRun.id);
    const after = (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=2026-10-31T16:00:00Z&to=2026-11-01T15:00:00Z`,
      )
    ).body[0];
    expect(after.massKg).toBe(before.massKg);
  });
});

describe('late data and back-dated configuration', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  let rate: number;
  const h0 = Date.parse('2026-10-05T00:00:00Z');

  beforeAll(async () => {
    f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0, maxGapS: 900 });
    rate = await engineRate(api, f.element, f.fluid, DP_KPA * 1000, P_MPA * 1e6, T_K);
    // Six hours of data, but the second hour lacks 10:20–11:00 of its samples (a 50-minute hole).
    const hole = (t: number) => t > h0 + hourMs + 10 * 60_000 && t < h0 + 2 * hourMs;
    const result = await importCsv(constantCsv(f, h0 - hourMs, h0 + 6 * hourMs, 10, hole));
    expect(result.status).toBe('done');
    await settled(api, f.meterRun.id);
  });

  const hours = async () =>
    (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/totals?interval=hour&from=${new Date(h0).toISOString()}&to=${new Date(h0 + 6 * hourMs).toISOString()}`,
      )
    ).body as {
      massKg: number;
      coverage: number;
      flags: string[];
    }[];

  it('counts a gap longer than the limit as missing time, not flow', async () => {
    const list = await hours();
    // The sample at 01:10 covers 15 min (max gap) to 01:25; 01:25–02:00 (35 min) is missing.
    expect(list[1].coverage).toBeCloseTo(25 / 60, 12);
    expect(relative(list[1].massKg, rate * 25 * 60)).toBeLessThan(1e-9);
    expect(list[1].flags).toContain('missing-data');
    expect(relative(list[0].massKg, rate * 3600)).toBeLessThan(1e-9);
  });

  it('recomputes the hour when the missing readings arrive late', async () => {
    const late = await importCsv(constantCsv(f, h0 + hourMs + 20 * 60_000, h0 + hourMs + 50 * 60_000));
    expect(late).toMatchObject({ status: 'done', rowsImported: 12, duplicates: 0 });
    await settled(api, f.meterRun.id);
    const list = await hours();
    expect(list[1].coverage).toBe(1);
    expect(relative(list[1].massKg, rate * 3600)).toBeLessThan(1e-9);
  });

  it('changes exactly the hours after a back-dated configuration version takes effect', async () => {
    const before = await hours();
    const newElement = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.12 };
    const newRate = await engineRate(api, newElement, f.fluid, DP_KPA * 1000, P_MPA * 1e6, T_K);
    expect(newRate).toBeGreaterThan(rate * 1.3); // a bigger bore passes more at the same DP
    const version = await api.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
      effectiveFrom: new Date(h0 + 3 * hourMs).toISOString(),
      element: newElement,
      fluid: f.fluid,
      reason: 'orifice plate changed for a 120 mm bore (test)',
    });
    expect(version.status).toBe(201);
    await settled(api, f.meterRun.id);
    const after = await hours();
    for (let i = 0; i < 3; i++) expect(after[i].massKg).toBe(before[i].massKg);
    for (let i = 3; i < 6; i++) expect(relative(after[i].massKg, newRate * 3600)).toBeLessThan(1e-9);
  });
});

describe('bad CSV input', () => {
  it('lists every rejected line with its reason and keeps the good lines', async () => {
    const f = await createMeterRun(api);
    const csv = [
      'time,tag,value,quality',
      `2026-10-10T00:00:00Z,${f.dp.tag},10,good`,
      `2026-10-10T00:01:00,${f.dp.tag},10,good`,
      `2026-10-10T00:02:00Z,${f.dp.tag},NaN,good`,
      `2026-10-10T00:03:00Z,${f.dp.tag},ten,good`,
      `2026-10-10T00:04:00Z,NO-SUCH-TAG,10,good`,
      `2999-01-01T00:00:00Z,${f.dp.tag},10,good`,
      `2026-10-10T00:05:00Z,${f.pt.tag},-0.5,good`,
      `2026-10-10T00:06:00Z,${f.dp.tag},10,excellent`,
      `2026-10-10T00:07:00Z,${f.dp.tag},12,good`,
    ].join('\n');
    const result = await importCsv(csv);
    expect(result).toMatchObject({ status: 'done', rowsRead: 9, rowsImported: 2, rejected: 7 });
    expect(result.errors.map((e: { line: number }) => e.line)).toEqual([3, 4, 5, 6, 7, 8, 9]);
    expect(result.errors[0].message).toMatch(/offset/);
    expect(result.errors[1].message).toMatch(/^value/);
    expect(result.errors[3].message).toMatch(/unknown transmitter/);
    expect(result.errors[4].message).toMatch(/future/);
    expect(result.errors[5].message).toMatch(/negative absolute pressure/);
    expect(result.errors[6].message).toMatch(/^quality/);
    const stored = await api.get(
      `/api/readings?transmitterId=${f.dp.id}&from=2026-10-10T00:00:00Z&to=2026-10-11T00:00:00Z`,
    );
    expect(stored.body).toEqual([
      { time: '2026-10-10T00:00:00.000Z', value: 10, quality: 'good', source: 'csv' },
      { time: '2026-10-10T00:07:00.000Z', value: 12, quality: 'good', source: 'csv' },
    ]);
  });

  it('refuses a file whose header lacks the required columns, naming them', async () => {
    const result = await importCsv('when,tag,reading\n2026-10-10T00:00:00Z,X,1\n');
    expect(result.status).toBe('failed');
    expect(result.errors[0].message).toMatch(/missing time, value/);
  });

  it('answers an upload without a file with 400 naming the field', async () => {
    const res = await api.post('/api/imports', {});
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('file');
  });
});

describe('totals windows', () => {
  it('takes a plain date as the contract day that starts on it in the site zone', async () => {
    const f = await createMeterRun(api, { timeZone: 'America/Denver', contractHour: 9 });
    // 2026-11-01 to 2026-11-04: the contract days that start on 1, 2 and 3 November at 09:00 MST
    // (UTC−7, after the fall-back at 02:00 on 1 November): 16:00Z each. The day that started on
    // 31 October is not asked for; a plain date used to be read as local midnight, which fell in
    // it and listed it too (issue 13, item 7).
    const res = await api.get(`/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=2026-11-01&to=2026-11-04`);
    expect(res.status).toBe(200);
    expect(res.body.map((d: { start: string }) => d.start)).toEqual([
      '2026-11-01T16:00:00.000Z',
      '2026-11-02T16:00:00.000Z',
      '2026-11-03T16:00:00.000Z',
    ]);
  });

  it('names the field when a window bound is not a time', async () => {
    const f = await createMeterRun(api);
    const res = await api.get(`/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=yesterday&to=2026-11-04`);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('from');
  });
});
