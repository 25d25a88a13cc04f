/**
 * A bi-directional meter run on the screens (issue 13 §11), against the real server: made through
 * set-up with "Flow in both directions", its reverse constants started from the forward ones and
 * confirmed (a cone, C 0.80 forward and 0.78 reverse), the direction from the sign of the DP; fed
 * an hour of forward and an hour of reverse flow through the import API; the meter-run screen then
 * says it is bi-directional and shows forward, reverse and net as separate columns, and the live
 * board shows "Reverse" in words with an arrow while the DP is negative. Phone and wide screens.
 */
import type { Page } from 'playwright-core';

import { client, settled, signIn as apiSignIn, unique, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, openWith, signIn, type TestBrowser } from './support';

const shots = '/work/notes/round10/shots';
const hourMs = 3_600_000;

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

async function importCsv(lines: string[]) {
  const started = await api.upload('/api/imports', `bidir-${unique()}.csv`, `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  const done = await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  expect(done).toMatchObject({ status: 'done', rejected: 0 });
}

/** Creates the meter run through the set-up form of a new site; returns its id. */
async function createThroughSetup(page: Page, siteId: string, tag: string): Promise<string> {
  await signIn(page, demoEmail('engineer'));
  await page.goto(`${baseUrl}/setup?site=${siteId}`);
  await page.getByTestId('run-create').waitFor();
  await page.getByTestId('run-create-tag').fill(tag);
  await page.getByTestId('run-create-name').fill('Storage well, both ways');
  await choose(page.getByTestId('run-create-element-kind-cone'));
  await page.getByTestId('run-create-element-pipeDiameterM').fill('300');
  await page.getByTestId('run-create-element-coneDiameterM').fill('200');
  await page.getByTestId('run-create-element-dischargeCoefficient').fill('0.80');
  await choose(page.getByTestId('run-create-fluid-kind-natural-gas'));
  await choose(page.getByTestId('run-create-fluid-compositionUnit-percent'));
  await page.getByTestId('run-create-fluid-composition-methane').fill('96');
  await page.getByTestId('run-create-fluid-composition-ethane').fill('3');
  await page.getByTestId('run-create-fluid-composition-nitrogen').fill('1');
  await page.getByTestId('run-create-holdLimitS').fill('3600');
  await openWith(page.getByTestId('run-create-effective-toggle'), page.getByTestId('run-create-effectiveFrom'));
  await page.getByTestId('run-create-effectiveFrom').fill('2020-01-01');
  await page.getByTestId('run-create-effectiveTime').fill('00:00');

  // Both directions: without reverse constants the form names the missing field.
  await choose(page.getByTestId('run-create-line-bidirectional-yes'));
  await page.getByTestId('run-create-submit').click();
  await until('the missing reverse element to be named', async () =>
    /reverse flow/.test(await page.getByTestId('run-create-reverseElement-error').innerText()),
  );
  // Start from the forward constants; they are not sent until confirmed.
  await page.getByTestId('run-create-reverse-copy').click();
  await page.getByTestId('run-create-reverse-copied').waitFor();
  expect(await page.getByTestId('run-create-reverseElement-coneDiameterM').inputValue()).toBe('200');
  await page.getByTestId('run-create-reverseElement-dischargeCoefficient').fill('0.78');
  await page.getByTestId('run-create-submit').click();
  await until('the unconfirmed copy to be refused', async () =>
    /not confirmed/.test(await page.getByTestId('run-create-errors').innerText()),
  );
  await page.screenshot({ path: `${shots}/S3-setup-reverse-${page.viewportSize()!.width}.png`, fullPage: true });
  await page.getByTestId('run-create-reverse-confirm').click();
  await page.getByTestId('run-create-submit').click();
  await page.getByTestId(`run-row-${tag}`).waitFor();

  const runs = (await api.get(`/api/meter-runs?siteId=${siteId}`)).body as {
    id: string;
    tag: string;
    element: { dischargeCoefficient: number };
    reverseElement?: { kind: string; coneDiameterM: number; dischargeCoefficient: number };
    directionSource?: string;
  }[];
  const run = runs.find((r) => r.tag === tag)!;
  expect(run.element.dischargeCoefficient).toBe(0.8);
  // 200 mm = 0.2 m.
  expect(run.reverseElement).toMatchObject({ kind: 'cone', coneDiameterM: 0.2, dischargeCoefficient: 0.78 });
  expect(run.directionSource).toBe('dp-sign');
  return run.id;
}

describe.each(['phone', 'wide'] as const)('a bi-directional meter run on a %s screen', (viewport) => {
  it('is made through set-up with reverse constants and shows forward, reverse, net and the direction', async () => {
    const code = unique();
    const site = await api.post('/api/sites', {
      code: `BI${code}`,
      name: `Both ways ${code}`,
      timeZone: 'UTC',
      contractHour: 0,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
    expect(site.status).toBe(201);
    const page = await freshPage(browser, viewport);
    const tag = `BI-${code}`;
    const runId = await createThroughSetup(page, site.body.id, tag);

    // DP read both ways (−50…+50 kPa), P and T.
    const transmitter = async (suffix: string, body: Record<string, unknown>) => {
      const r = await api.post('/api/transmitters', { meterRunId: runId, tag: `${tag}-${suffix}`, ...body });
      expect(r.status).toBe(201);
      return r.body as { tag: string };
    };
    const dp = await transmitter('DP', {
      measures: 'differential-pressure',
      unit: 'kPa',
      lowerRange: -50,
      upperRange: 50,
    });
    const pt = await transmitter('PT', { measures: 'static-pressure', unit: 'MPa', lowerRange: 0, upperRange: 10 });
    const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });

    // Two whole hours before this one: the first forward (+20 kPa), the second reverse (−20 kPa), a
    // reading a minute; then a fresh reverse reading for the live board.
    const hourStart = Math.floor(Date.now() / hourMs) * hourMs;
    const lines = ['time,tag,value,quality'];
    for (let i = 0; i < 120; i++) {
      const iso = new Date(hourStart - 2 * hourMs + i * 60_000).toISOString();
      lines.push(`${iso},${dp.tag},${i < 60 ? 20 : -20},good`, `${iso},${pt.tag},5,good`, `${iso},${tt.tag},300,good`);
    }
    const now = new Date(Date.now() - 2000).toISOString();
    lines.push(`${now},${dp.tag},-20,good`, `${now},${pt.tag},5,good`, `${now},${tt.tag},300,good`);
    await importCsv(lines);
    await settled(api, runId);

    // The API's day: forward and reverse an hour each, net = forward − reverse (S2's figures).
    const day = new Date(hourStart - 2 * hourMs).toISOString().slice(0, 10);
    const totals = await api.get(`/api/meter-runs/${runId}/totals?interval=day&from=${day}&to=${day}T23:59:59Z`);
    expect(totals.status).toBe(200);
    const total = totals.body[0];
    expect(total.reverse.flowTimeS).toBeGreaterThan(0);
    expect(total.net.massKg).toBeCloseTo(total.massKg - total.reverse.massKg, 6);

    // The meter-run screen: bi-directional in the header, forward, reverse and net columns.
    await page.goto(`${baseUrl}/meter-runs/${runId}`);
    const header = page.getByTestId('meter-run-header');
    await header.filter({ hasText: 'Bi-directional' }).waitFor();
    expect(await header.innerText()).toMatch(/Direction from\s+Sign of the DP/);
    expect(await header.innerText()).toMatch(/Reverse element/);
    const table = page.getByTestId('daily-table');
    await table.filter({ hasText: 'Reverse mass' }).waitFor();
    const text = await table.innerText();
    expect(text).toMatch(/Forward mass/);
    expect(text).toMatch(/Net mass \(forward − reverse\)/);
    await page.getByTestId('daily-totals').screenshot({ path: `${shots}/S3-daily-${viewport}.png` });
    await page.getByTestId('hourly-records').screenshot({ path: `${shots}/S3-hourly-${viewport}.png` });
    await header.screenshot({ path: `${shots}/S3-header-${viewport}.png` });

    // The live board: the direction in words with an arrow, not only a sign.
    await page.goto(`${baseUrl}/`);
    await page.getByTestId('screen-live').waitFor();
    const direction = page.getByTestId(`live-run-${tag}-direction`);
    await direction.waitFor({ timeout: 45_000 });
    expect(await direction.innerText()).toBe('← Reverse flow');
    await page.getByTestId(`live-run-${tag}`).screenshot({ path: `${shots}/S3-live-${viewport}.png` });
  });
});
