/**
 * The range health report against the real server. An engineer makes a meter run (one DP
 * transmitter, 0–50 kPa) through the API and imports three hours of readings, one a minute:
 * the first hour at 40 % of span (the 25–50 % band), the next two at 5 % (the 0–10 % band).
 * By hand, about a third of the flowing time is in 25–50 % and two thirds in 0–10 %; whatever
 * the hour boundaries, the five bands' shares must add up to 100 %.
 */
import type { Page } from 'playwright-core';

import { client, createMeterRun, settled, signIn as apiSignIn, until } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

const MIN = 60_000;
const bands = ['0-10', '10-25', '25-50', '50-100', 'over'];

let browser: TestBrowser;
let meterRun: { id: string; tag: string };

async function makeMeterRunLowInRange() {
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  const run = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const t0 = Math.floor((Date.now() - 182 * MIN) / MIN) * MIN;
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i < 180; i++) {
    const iso = new Date(t0 + i * MIN).toISOString();
    const dpKPa = (i < 60 ? 20 : 2.5) + (i % 2) * 0.003;
    lines.push(
      `${iso},${run.dp.tag},${dpKPa},good`,
      `${iso},${run.pt.tag},${2 + (i % 3) * 0.0001},good`,
      `${iso},${run.tt.tag},${300 + (i % 2) * 0.01},good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'range-health.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, run.meterRun.id);
  return run.meterRun;
}

beforeAll(async () => {
  [browser, meterRun] = await Promise.all([launchBrowser(), makeMeterRunLowInRange()]);
  // An import and the history worker on a loaded 2-core machine: a ceiling, not a wait.
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

const percentIn = async (page: Page, testID: string) =>
  Number((await page.getByTestId(testID).innerText()).replace('%', '').trim());

async function expectBands(page: Page) {
  await page.getByTestId('range-health-band-table').waitFor();
  const time = await Promise.all(bands.map((b) => percentIn(page, `range-health-time-share-${b}`)));
  const volume = await Promise.all(bands.map((b) => percentIn(page, `range-health-volume-share-${b}`)));
  // Shown to 0.1 %: five rounded shares add up to 100 % within 5 × 0.05 %.
  expect(Math.abs(time.reduce((a, b) => a + b, 0) - 100)).toBeLessThanOrEqual(0.25);
  expect(Math.abs(volume.reduce((a, b) => a + b, 0) - 100)).toBeLessThanOrEqual(0.25);
  expect(await page.getByTestId('range-health-time-share-total').innerText()).toBe('100.0 %');
  // Two of three flowing hours at 5 % of span, one at 40 % (partial hours at the ends aside).
  expect(time[0]).toBeGreaterThan(55);
  expect(time[0]).toBeLessThan(80);
  expect(time[2]).toBeGreaterThan(20);
  expect(time[1] + time[3] + time[4]).toBeLessThan(1);
  // Flow goes as √DP, so the 5 % band carries a smaller share of the volume than of the time.
  expect(volume[0]).toBeLessThan(time[0]);
}

describe('the range health report', () => {
  it('opens from the meter run screen for an engineer and shows the bands, the trend and the advice (wide)', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/meter-runs/${meterRun.id}`);
    await page.getByTestId('meter-run-range-health-link').click();
    await page.waitForURL(
      (url) => url.pathname === '/range-health' && url.searchParams.get('meterRunId') === meterRun.id,
    );
    await expectBands(page);
    expect(await page.getByTestId('range-health-period-30').getAttribute('aria-checked')).toBe('true');
    await page.locator('[data-testid="range-health-band-chart"] canvas').first().waitFor();
    await page.locator('[data-testid="range-health-trend-chart"] canvas').first().waitFor();
    expect(await page.getByTestId('range-health-month-table').innerText()).toMatch(/\d{4}-\d{2}/);
    expect(await page.getByTestId(`range-health-transmitter-${meterRun.tag}-DP`).innerText()).toMatch(
      /100\.0 % of the meter run's flowing time/,
    );
    expect((await page.getByTestId('range-health-recommendation-text').innerText()).length).toBeGreaterThan(20);
    expect(await page.getByTestId('range-health-numbers').innerText()).toMatch(/Flowing time below 10 % of span/);
    expect(await page.getByTestId('range-health-alarm-limit').innerText()).toMatch(/below 10 % of span held for 5 min/);
    await signOut(page);
    await page.close();
  });

  it('picks the meter run by site on a phone and keeps the shares adding up over another period', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('admin'));
    await page.goto(`${baseUrl}/range-health`);
    const site = (await client(await apiSignIn(demoEmail('engineer'))).get(`/api/meter-runs/${meterRun.id}`)).body
      .siteId;
    await choose(page.getByTestId(`range-health-site-${site}`));
    await choose(page.getByTestId(`range-health-meter-run-${meterRun.id}`));
    await expectBands(page);
    await choose(page.getByTestId('range-health-period-7'));
    await expectBands(page);
    await signOut(page);
    await page.close();
  });

  it('is not offered to an operator', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await page.goto(`${baseUrl}/range-health`);
    await page.getByTestId('not-available').waitFor();
    await signOut(page);
    await page.close();
  });
});
