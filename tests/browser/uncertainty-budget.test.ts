/**
 * An hourly record's uncertainty budget on the meter-run screen (issue 13 §8): a meter run made
 * through the API with DP, static pressure and temperature transmitters, three hours of readings
 * imported as CSV, and the browser opens an hour's U to read each term with its source.
 */
import { client, settled, signIn as apiSignIn, unique, until } from '../support/api';

import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
const hourMs = 3_600_000;
let meterRunId = '';

/** A UTC site whose contract day began six hours ago, so the readings fall in the screen's default day. */
async function makeMeterRunWithReadings(): Promise<string> {
  const api = client(await apiSignIn(demoEmail('engineer')));
  const id = unique();
  const now = Date.now();
  const site = await api.post('/api/sites', {
    code: `U${id}`,
    name: `Budget test site ${id}`,
    timeZone: 'UTC',
    contractHour: (new Date(now - 6 * hourMs).getUTCHours() + 24) % 24,
    basePressurePa: 101_325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101_325,
  });
  if (site.status !== 201) throw new Error(`site: ${site.status} ${JSON.stringify(site.body)}`);
  const run = await api.post('/api/meter-runs', {
    siteId: site.body.id,
    tag: `UB-${id}`,
    name: `Budget test run ${id}`,
    element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
    fluid: {
      kind: 'ideal-gas',
      molarMassKgPerMol: 0.01804,
      compressibility: 1,
      isentropicExponent: 1.2,
      viscosityPaS: 1.12e-5,
    },
    holdLimitS: 3600,
    maxGapS: 900,
    effectiveFrom: '2020-01-01T00:00:00Z',
  });
  if (run.status !== 201) throw new Error(`meter run: ${run.status} ${JSON.stringify(run.body)}`);
  const transmitter = async (suffix: string, body: Record<string, unknown>) => {
    const res = await api.post('/api/transmitters', { meterRunId: run.body.id, tag: `UB-${id}-${suffix}`, ...body });
    if (res.status !== 201) throw new Error(`transmitter ${suffix}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as { tag: string };
  };
  const dp = await transmitter('DP', { measures: 'differential-pressure', unit: 'kPa', lowerRange: 0, upperRange: 50 });
  const pt = await transmitter('PT', {
    measures: 'static-pressure',
    unit: 'MPa',
    lowerRange: 0,
    upperRange: 4,
    accuracyPercentOfSpan: 0.1,
    accuracyKind: 'rectangular-limit',
  });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });
  const lines = ['time,tag,value,quality'];
  const start = Math.floor((now - 3 * hourMs) / 300_000) * 300_000;
  for (let t = start; t < now - 60_000; t += 300_000) {
    const iso = new Date(t).toISOString();
    lines.push(`${iso},${dp.tag},20,good`, `${iso},${pt.tag},2,good`, `${iso},${tt.tag},300,good`);
  }
  const started = await api.upload('/api/imports', 'readings.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  const done = await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  if (done.status !== 'done' || done.rejected !== 0) throw new Error(`import: ${JSON.stringify(done)}`);
  await settled(api, run.body.id);
  return String(run.body.id);
}

beforeAll(async () => {
  [browser, meterRunId] = await Promise.all([launchBrowser(), makeMeterRunWithReadings()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

describe('the uncertainty budget of an hourly record', () => {
  it('opens from the hour’s U and lists each term with its share and source', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('operator'));
    await page.goto(`${baseUrl}/meter-runs/${meterRunId}`);
    await page.getByTestId('hourly-budget-0').click();
    const budget = page.getByTestId('uncertainty-budget');
    await budget.waitFor();
    const text = await budget.innerText();
    expect(text).toMatch(/Uncertainty budget/);
    expect(text).toMatch(/Discharge coefficient C/);
    expect(text).toMatch(/ISO 5167-2:2003 §5\.3\.3\.1/);
    expect(text).toMatch(/Differential pressure Δp/);
    // The ± 0.1 % limit of the static pressure transmitter, said to be converted by √3 (GUM §4.3.7).
    expect(await page.getByTestId('uncertainty-budget-staticPressure').innerText()).toMatch(/√3/);
    expect(text).toMatch(/Temperature T/);
    await page.getByTestId('uncertainty-budget-close').click();
    await budget.waitFor({ state: 'detached' });
    await signOut(page);
    await page.close();
  });
});
