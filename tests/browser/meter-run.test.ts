/**
 * The meter runs list and a meter run's screen against the real server: a site, a meter run
 * with a stacked DP pair, static pressure and temperature transmitters are made through the
 * API as an engineer would, six hours of readings are imported as CSV, and the history worker
 * turns them into hourly records before the browser looks.
 */
import { client, settled, signIn as apiSignIn, unique, until } from '../support/api';
import type { Page } from 'playwright-core';

import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
const hourMs = 3_600_000;

/** AGA 8 Part 1 "Gulf Coast" example gas, mole fractions (TRADE.md §4). */
const gulfCoastGas = {
  methane: 0.965222,
  nitrogen: 0.002595,
  'carbon-dioxide': 0.005956,
  ethane: 0.018186,
  propane: 0.004596,
  isobutane: 0.000977,
  'n-butane': 0.001007,
  isopentane: 0.000473,
  'n-pentane': 0.000324,
  'n-hexane': 0.000664,
};

interface Fixture {
  meterRun: { id: string; tag: string };
  hours: number;
}
let fixture: Fixture;

/**
 * A US-units site on UTC whose contract day began eight hours ago, so the six hours of readings
 * all fall in today's contract day (the screen's default day), whatever the time of the run.
 */
async function makeMeterRunWithReadings(): Promise<Fixture> {
  const api = client(await apiSignIn(demoEmail('engineer')));
  const id = unique();
  const now = Date.now();
  const contractHour = (new Date(now - 8 * hourMs).getUTCHours() + 24) % 24;
  const site = await api.post('/api/sites', {
    code: `B${id}`,
    name: `Browser test site ${id}`,
    timeZone: 'UTC',
    contractHour,
    basePressurePa: 101_560,
    baseTemperatureK: 288.706,
    atmosphericPressurePa: 84_000,
    displayUnits: 'us',
  });
  if (site.status !== 201) throw new Error(`site: ${site.status} ${JSON.stringify(site.body)}`);
  const run = await api.post('/api/meter-runs', {
    siteId: site.body.id,
    tag: `BT-${id}`,
    name: `Browser test wellhead ${id}`,
    element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.10226, boreDiameterM: 0.0511 },
    fluid: { kind: 'natural-gas', composition: gulfCoastGas },
    holdLimitS: 3600,
    maxGapS: 900,
    effectiveFrom: '2020-01-01T00:00:00Z',
    line: { nominalSize: '4 in', schedule: '40' },
  });
  if (run.status !== 201) throw new Error(`meter run: ${run.status} ${JSON.stringify(run.body)}`);
  const transmitter = async (suffix: string, body: Record<string, unknown>) => {
    const res = await api.post('/api/transmitters', { meterRunId: run.body.id, tag: `BT-${id}-${suffix}`, ...body });
    if (res.status !== 201) throw new Error(`transmitter ${suffix}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as { tag: string };
  };
  const high = await transmitter('DPH', {
    measures: 'differential-pressure',
    unit: 'inH2O-60F',
    lowerRange: 0,
    upperRange: 200,
    stackRole: 'high',
  });
  const low = await transmitter('DPL', {
    measures: 'differential-pressure',
    unit: 'inH2O-60F',
    lowerRange: 0,
    upperRange: 25,
    stackRole: 'low',
  });
  const pt = await transmitter('PT', {
    measures: 'static-pressure',
    unit: 'psi',
    pressureReference: 'gauge',
    lowerRange: 0,
    upperRange: 1000,
  });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'degF', lowerRange: -20, upperRange: 200 });

  // Every 5 minutes for 6 hours: DP rising and falling across the low-range span (which
  // saturates just above its 25 inH2O), steady pressure and temperature.
  const lines = ['time,tag,value,quality'];
  const start = Math.floor((now - 6 * hourMs) / 300_000) * 300_000;
  for (let t = start, i = 0; t < now - 60_000; t += 300_000, i++) {
    const iso = new Date(t).toISOString();
    const dp = 8 + 30 * Math.sin((i / 72) * Math.PI);
    lines.push(`${iso},${high.tag},${dp.toFixed(3)},good`, `${iso},${low.tag},${Math.min(dp, 25.4).toFixed(3)},good`);
    lines.push(`${iso},${pt.tag},560,good`, `${iso},${tt.tag},60,good`);
  }
  const started = await api.upload('/api/imports', 'readings.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  const done = await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  if (done.status !== 'done' || done.rejected !== 0) throw new Error(`import: ${JSON.stringify(done)}`);
  await settled(api, run.body.id);
  return { meterRun: run.body, hours: Math.ceil((now - start) / hourMs) };
}

beforeAll(async () => {
  [browser, fixture] = await Promise.all([launchBrowser(), makeMeterRunWithReadings()]);
  // An import and the history worker on a loaded 2-core machine: a ceiling, not a wait.
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

async function expectMeterRunScreen(page: Page) {
  const header = page.getByTestId('meter-run-header');
  await header.waitFor();
  expect(await header.innerText()).toContain(fixture.meterRun.tag);
  // Both DP transmitters of the stacked pair are listed with their ranges in their own unit.
  const transmitters = await page.getByTestId('meter-run-transmitters').innerText();
  expect(transmitters).toMatch(/0 to 200 inH2O \(60 °F\)/);
  expect(transmitters).toMatch(/low range \(stacked\)/);

  // The trend draws on a canvas (uPlot), DP with its min/max band, and the hourly flow too.
  await page.locator('[data-testid="trend-chart-dp"] canvas').first().waitFor();
  await page.locator('[data-testid="trend-chart-flow"] canvas').first().waitFor();

  // Today's contract day holds the imported hours: at least five records, in US units.
  await page.getByTestId('hourly-row-0').waitFor();
  const rows = await page.locator('[data-testid^="hourly-row-"]').count();
  expect(rows).toBeGreaterThanOrEqual(Math.min(5, fixture.hours - 1));
  expect(await page.getByTestId('hourly-table').innerText()).toMatch(/Volume at base, Mscf/);
  await page.getByTestId('daily-row-0').waitFor();
}

describe('the meter run screens', () => {
  it('lists the meter run and opens it with its trends and hourly records (wide)', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('engineer'));
    await page.getByTestId('nav-meter-runs').click();
    await page.waitForURL((url) => /^\/meter-runs\/?$/.test(url.pathname));
    const row = page.getByTestId(`meter-run-row-${fixture.meterRun.tag}`);
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Orifice, flange taps/);
    await row.click();
    await page.waitForURL((url) => url.pathname === `/meter-runs/${fixture.meterRun.id}`);
    await expectMeterRunScreen(page);
    await signOut(page);
    await page.close();
  });

  it('shows the same on a phone, opened by its address, for an operator', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await page.goto(`${baseUrl}/meter-runs/${fixture.meterRun.id}`);
    await expectMeterRunScreen(page);
    // The window buttons change the trend's span.
    await choose(page.getByTestId('trend-window-7d'));
    await page.locator('[data-testid="trend-chart-dp"] canvas').first().waitFor();
    await signOut(page);
    await page.close();
  });

  it('shows a back-dated version in the event log and a recomputed hour beside its first figures (phone)', async () => {
    const api = client(await apiSignIn(demoEmail('engineer')));
    const run = await api.get(`/api/meter-runs/${fixture.meterRun.id}`);
    // The bore found 0.1 mm larger, three hours ago: the hours from then on are recomputed.
    const effectiveFrom = new Date(Math.floor((Date.now() - 3 * hourMs) / hourMs) * hourMs).toISOString();
    const version = await api.post(`/api/meter-runs/${fixture.meterRun.id}/config-versions`, {
      element: { ...run.body.element, boreDiameterM: 0.0512 },
      fluid: run.body.fluid,
      effectiveFrom,
      reason: 'bore re-measured at inspection',
    });
    expect(version.status).toBe(201);
    await settled(api, fixture.meterRun.id);

    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/meter-runs/${fixture.meterRun.id}`);
    const newest = page.getByTestId('event-log-entry-0');
    await newest.waitFor();
    const entry = await newest.innerText();
    expect(entry).toContain('Configuration version');
    expect(entry).toContain('Why: bore re-measured at inspection');
    expect(entry).toMatch(/element\.boreDiameterM\s+0\.0511 → 0\.0512/);
    await newest.scrollIntoViewIfNeeded();
    await page.screenshot({ path: '/tmp/shots-E/event-log-phone.png' });

    // The hours after it, computed to their end before the version, now have a second version
    // (today's total is still provisional, and a running figure keeps no versions).
    await page.locator('[data-testid^="hourly-versions-"]').first().click();
    await page.getByTestId('record-versions-mass').waitFor();
    const mass = await page.getByTestId('record-versions-mass').innerText();
    expect(mass).toMatch(/Mass, lb/);
    // A larger bore passes more gas: current above first (ISO 5167-2 flow grows with β).
    expect(mass).toMatch(/\+[\d.,]+ %/);
    expect(await page.getByTestId('record-versions-list').innerText()).toMatch(/configuration version/);
    await page.getByTestId('record-versions').scrollIntoViewIfNeeded();
    await page.screenshot({ path: '/tmp/shots-E/record-versions-phone.png' });
    // The same side by side as a table on a wide screen (screenshots for review).
    await page.setViewportSize({ width: 1440, height: 900 });
    // The wide layout is a different shell, so the screen opens afresh.
    await page.locator('[data-testid^="hourly-versions-"]').first().click();
    await page.getByTestId('record-versions').scrollIntoViewIfNeeded();
    await page.screenshot({ path: '/tmp/shots-E/record-versions-wide.png' });
    await page.getByTestId('event-log-entry-0').scrollIntoViewIfNeeded();
    await page.screenshot({ path: '/tmp/shots-E/event-log-wide.png' });
    await signOut(page);
    await page.close();
  });
});
