/**
 * The operator's live board against the real server: a meter run with fresh readings shows a
 * live rate in its site's units and the DP as a share of span, flags a DP in the bottom tenth
 * of the span, follows new readings over the live stream without a reload, names the DP
 * transmitter in use of a stacked pair, and opens the meter run when tapped.
 */
import type { Page } from 'playwright-core';

import { client, createMeterRun, signIn as apiSignIn, unique, until, type Client } from '../support/api';
import { demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

/** How long the stream may take to bring a reading to an open page on a loaded machine (a ceiling). */
const STREAM_MS = 45_000;

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

/** 1 Mscf = 1000 ft³ and 1 ft = 0.3048 m exactly (international yard and pound, 1959), so 1 Mscf = 28.316846592 m³. */
const cubicMetresPerMscf = 28.316846592;
const secondsPerDay = 86_400;

async function importCsv(lines: string[]) {
  const started = await api.upload(
    '/api/imports',
    `live-${unique()}.csv`,
    ['time,tag,value,quality', ...lines].join('\n') + '\n',
  );
  expect(started.status).toBe(202);
  const done = await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  expect(done).toMatchObject({ status: 'done', rejected: 0 });
}

/** Readings a few seconds old, well inside the last minute. */
function recent(secondsAgo: number): string {
  return new Date(Date.now() - secondsAgo * 1000).toISOString();
}

/**
 * A site and a meter run measured by a stacked DP pair (no single DP: a meter run has one DP
 * transmitter or one pair), with static pressure and temperature; the element and gas are those
 * of tests/support/api.ts createMeterRun.
 */
async function createStackedMeterRun() {
  const id = unique();
  const site = await api.post('/api/sites', {
    code: `P${id}`,
    name: `Stacked pair site ${id}`,
    timeZone: 'America/Denver',
    contractHour: 9,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  expect(site.status).toBe(201);
  const run = await api.post('/api/meter-runs', {
    siteId: site.body.id,
    tag: `SP-${id}`,
    name: `Stacked pair ${id}`,
    element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
    fluid: {
      kind: 'ideal-gas',
      molarMassKgPerMol: 0.01804,
      compressibility: 1,
      isentropicExponent: 1.2,
      viscosityPaS: 1.12e-5,
    },
    effectiveFrom: '2020-01-01T00:00:00Z',
    // Readings count as fresh for an hour (the default is 60 s): a loaded machine may take longer
    // than a minute between the import and the board's first look.
    holdLimitS: 3600,
  });
  expect(run.status).toBe(201);
  const add = async (suffix: string, body: Record<string, unknown>) => {
    const res = await api.post('/api/transmitters', { meterRunId: run.body.id, tag: `SP-${id}-${suffix}`, ...body });
    expect(res.status).toBe(201);
    return res.body as { id: string; tag: string };
  };
  return {
    meterRun: run.body as { id: string; tag: string },
    low: await add('DPL', {
      measures: 'differential-pressure',
      unit: 'kPa',
      lowerRange: 0,
      upperRange: 5,
      stackRole: 'low',
    }),
    high: await add('DPH', {
      measures: 'differential-pressure',
      unit: 'kPa',
      lowerRange: 0,
      upperRange: 100,
      stackRole: 'high',
    }),
    pt: await add('PT', {
      measures: 'static-pressure',
      unit: 'MPa',
      pressureReference: 'absolute',
      lowerRange: 0,
      upperRange: 4,
    }),
    tt: await add('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 }),
  };
}

async function openBoard(page: Page, tag: string) {
  await signIn(page, demoEmail('operator'));
  await page.getByTestId('screen-live').waitFor();
  await page.getByTestId(`live-run-${tag}`).waitFor();
}

describe('the live board', () => {
  it('shows a live rate in Mscf/d and flags a DP at 5 % of span as low in range, then follows new readings', async () => {
    const f = await createMeterRun(api);
    // A US customary site: the board shows gas at base conditions in Mscf/d.
    expect((await api.patch(`/api/sites/${f.site.id}`, { displayUnits: 'us' })).status).toBe(200);
    // DP 2.5 kPa on a 0–50 kPa transmitter: 5 % of span, inside the bottom tenth.
    await importCsv(
      [20, 10, 2].flatMap((s) => [
        `${recent(s)},${f.dp.tag},2.5,good`,
        `${recent(s)},${f.pt.tag},2,good`,
        `${recent(s)},${f.tt.tag},300,good`,
      ]),
    );
    const calc = await api.post('/api/calculations/flow', {
      element: f.element,
      fluid: f.fluid,
      conditions: { differentialPressurePa: 2500, staticPressurePa: 2e6, temperatureK: 300 },
      base: { pressurePa: 101325, temperatureK: 288.15 },
    });
    expect(calc.status).toBe(200);
    const expectedMscfPerDay = (calc.body.standardVolumeFlowM3PerS * secondsPerDay) / cubicMetresPerMscf;

    const page = await freshPage(browser, 'phone');
    await openBoard(page, f.meterRun.tag);
    const card = `live-run-${f.meterRun.tag}`;

    const rateText = await page.getByTestId(`${card}-rate`).innerText();
    const shown = Number(rateText.replace(/[^\d.]/g, ''));
    // The board rounds to whole Mscf/d above 100 and to 0.1 or 0.01 below.
    expect(Math.abs(shown - expectedMscfPerDay)).toBeLessThanOrEqual(Math.max(0.5, expectedMscfPerDay * 1e-3));
    expect(await page.getByTestId(card).innerText()).toContain('Mscf/d');

    // The bottom-tenth state in words and with a shape, not colour alone: the medium-priority ◆, as
    // the DP-low-in-range alarm shows in the alarm banner and list.
    expect(await page.getByTestId(`${card}-dp-label`).innerText()).toBe('DP 5.0 % of span — low in range');
    await page.getByTestId(`${card}-state-dp-low-in-range`).waitFor();
    expect(await page.getByTestId(`${card}-state-dp-low-in-range`).innerText()).toMatch(
      /◆\s*DP low in range \(5\.0 % of span\)/,
    );
    expect(await page.getByTestId(`${card}-stack`).innerText()).toBe(`Single DP transmitter (${f.dp.tag})`);
    // Seconds old when imported; a minute or more only if signing in took that long on a loaded machine.
    expect(await page.getByTestId(`${card}-age`).innerText()).toMatch(/^Newest reading (\d+ s|\d+ min) ago$/);
    await page.getByTestId('live-connection-live').waitFor();
    await page.screenshot({ path: '/tmp/tallyrun-live-board-phone.png' });

    // New readings arrive: the stream brings them to the open page (no reload), the DP leaves the bottom tenth.
    await importCsv([
      `${recent(1)},${f.dp.tag},25,good`,
      `${recent(1)},${f.pt.tag},2,good`,
      `${recent(1)},${f.tt.tag},300,good`,
    ]);
    await until(
      'the board to show the new DP',
      async () => (await page.getByTestId(`${card}-dp-label`).innerText()) === 'DP 50 % of span',
      STREAM_MS,
    );
    expect(await page.getByTestId(`${card}-state-dp-low-in-range`).count()).toBe(0);
    await page.close();
  });

  it('names the DP transmitter in use of a stacked pair and opens the meter run when tapped', async () => {
    // A meter run whose DP is a stacked pair: low range 0–5 kPa, high range 0–100 kPa.
    const pair = await createStackedMeterRun();
    const { low, high } = pair;
    // 3 kPa: 60 % of the low range (below its 90 % switch-up point), 3 % of the high range.
    await importCsv(
      [15, 5].flatMap((s) => [
        `${recent(s)},${low.tag},3,good`,
        `${recent(s)},${high.tag},3,good`,
        `${recent(s)},${pair.pt.tag},2,good`,
        `${recent(s)},${pair.tt.tag},300,good`,
      ]),
    );

    const page = await freshPage(browser, 'wide');
    await openBoard(page, pair.meterRun.tag);
    const card = `live-run-${pair.meterRun.tag}`;
    await until(
      'the low range to be named',
      async () => (await page.getByTestId(`${card}-stack`).innerText()).includes('LOW range in use'),
      STREAM_MS,
    );
    expect(await page.getByTestId(`${card}-stack`).innerText()).toBe(`Stacked pair: LOW range in use (${low.tag})`);
    expect(await page.getByTestId(`${card}-dp-label`).innerText()).toBe('DP 60 % of span');

    // 30 kPa: the low-range transmitter is saturated, the high range takes over.
    await importCsv([
      `${recent(1)},${low.tag},5.2,good`,
      `${recent(1)},${high.tag},30,good`,
      `${recent(1)},${pair.pt.tag},2,good`,
      `${recent(1)},${pair.tt.tag},300,good`,
    ]);
    await until(
      'the high range to be named',
      async () => (await page.getByTestId(`${card}-stack`).innerText()).includes('HIGH range in use'),
      STREAM_MS,
    );
    expect(await page.getByTestId(`${card}-stack`).innerText()).toBe(`Stacked pair: HIGH range in use (${high.tag})`);
    await page.screenshot({ path: '/tmp/tallyrun-live-board-wide.png' });

    await page.getByTestId(card).click();
    await page.waitForURL((url) => url.pathname === `/meter-runs/${pair.meterRun.id}`);
    await page.close();
  });
});
