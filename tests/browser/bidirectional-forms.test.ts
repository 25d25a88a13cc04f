/**
 * The last screen pieces of a bi-directional meter run (issue 13 §11), against the real server:
 * the month's site total carries the site's reverse flow and net beside the forward figures; a new
 * configuration version starts from the reverse constants and direction source in force and names
 * the missing reverse element when they are cleared; an element calibration says which flow
 * direction its curve is for, and the list says it on each calibration. Phone and wide screens.
 */
import type { Page } from 'playwright-core';

import { client, settled, signIn as apiSignIn, unique, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, openWith, signIn, type TestBrowser } from './support';

jest.setTimeout(180_000);

const shots = '/work/notes/round10/shots';
const hourMs = 3_600_000;

let browser: TestBrowser;
let api: Client;
let site: { id: string };
let runId: string;
let tag: string;
/** The contract month the monthly volumes screen opens on: the one before this one (UTC site, contract hour 0). */
let month: string;

const cone = { kind: 'cone', pipeDiameterM: 0.3, coneDiameterM: 0.2, dischargeCoefficient: 0.8 };

async function importCsv(lines: string[]) {
  const started = await api.upload('/api/imports', `bidir-forms-${unique()}.csv`, `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  const done = await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  expect(done).toMatchObject({ status: 'done', rejected: 0 });
}

/**
 * @param value a figure in the shown unit
 * @returns it to six significant figures with grouped thousands, as the month's figures are shown
 */
function sixFigures(value: number): string {
  const decimals = Math.max(0, Math.min(8, 5 - Math.floor(Math.log10(Math.abs(value)))));
  return value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
  const code = unique();
  const made = await api.post('/api/sites', {
    code: `BF${code}`,
    name: `Both ways forms ${code}`,
    timeZone: 'UTC',
    contractHour: 0,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  expect(made.status).toBe(201);
  site = made.body;
  tag = `BF-${code}`;
  const run = await api.post('/api/meter-runs', {
    siteId: site.id,
    tag,
    name: 'Storage well, both ways',
    element: cone,
    reverseElement: { ...cone, dischargeCoefficient: 0.78 },
    directionSource: 'dp-sign',
    fluid: { kind: 'natural-gas', composition: { methane: 0.96, ethane: 0.03, nitrogen: 0.01 } },
    holdLimitS: 3600,
    line: { bidirectional: true },
    effectiveFrom: '2020-01-01T00:00:00Z',
  });
  expect(run.status).toBe(201);
  runId = run.body.id;
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

  // Last month's 15th: an hour forward (+20 kPa) from 10:00 UTC, then an hour in reverse (−20 kPa).
  const now = new Date();
  const lastMonthStart = Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1);
  month = new Date(lastMonthStart).toISOString().slice(0, 7);
  const start = lastMonthStart + 14 * 24 * hourMs + 10 * hourMs;
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i <= 120; i++) {
    const iso = new Date(start + i * 60_000).toISOString();
    lines.push(`${iso},${dp.tag},${i < 60 ? 20 : -20},good`, `${iso},${pt.tag},5,good`, `${iso},${tt.tag},300,good`);
  }
  await importCsv(lines);
  await settled(api, runId);
});
afterAll(async () => {
  await browser?.close();
});

async function openSetup(page: Page) {
  await signIn(page, demoEmail('engineer'));
  await page.goto(`${baseUrl}/setup?meterRun=${encodeURIComponent(runId)}`);
}

describe.each(['phone', 'wide'] as const)('a bi-directional meter run on a %s screen', (viewport) => {
  it('shows the site’s reverse and net in the month’s site total', async () => {
    // The server's site total: the reverse part summed over the runs, net = forward − reverse.
    const volumes = await api.get(`/api/monthly-volumes?siteId=${site.id}&month=${month}`);
    expect(volumes.status).toBe(200);
    const totals = volumes.body.totals as {
      massKg: number;
      reverse: { massKg: number; standardVolumeM3: number };
      net: { massKg: number; standardVolumeM3: number };
    };
    expect(totals.reverse.massKg).toBeGreaterThan(0);
    expect(totals.net.massKg).toBeCloseTo(totals.massKg - totals.reverse.massKg, 6);

    const page = await freshPage(browser, viewport);
    try {
      await signIn(page, demoEmail('accountant'));
      await page.goto(`${baseUrl}/totals`);
      await page.getByTestId('screen-monthly-volumes').waitFor();
      await choose(page.getByTestId(`monthly-site-${site.id}`));
      const total = page.getByTestId(viewport === 'phone' ? 'monthly-card-total' : 'monthly-row-total');
      // An SI site shows mass in t (1 t = 1000 kg) and volume at base in m³.
      const reverseMass = sixFigures(totals.reverse.massKg / 1000);
      const netVolume = sixFigures(totals.net.standardVolumeM3);
      await total.filter({ hasText: reverseMass }).waitFor();
      const text = await total.innerText();
      expect(text).toContain(netVolume);
      expect(text).toContain(sixFigures(totals.net.massKg / 1000));
      expect(text).toContain(sixFigures(totals.reverse.standardVolumeM3));
      await total.scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/S5-month-total-${viewport}.png`, fullPage: viewport === 'phone' });
    } finally {
      await page.close();
    }
  });

  it('lets an element calibration say its flow direction and starts a new version from the reverse constants', async () => {
    const page = await freshPage(browser, viewport);
    try {
      await openSetup(page);
      // Element care: the direction of the curve, forward by default.
      const panel = page.getByTestId('element-calibrations');
      await page.getByTestId('element-calibration-direction-reverse').waitFor();
      if (viewport === 'wide') {
        await choose(page.getByTestId('element-calibration-direction-reverse'));
        await page.getByTestId('element-calibration-effectiveFrom').fill('2026-01-05');
        await page.getByTestId('element-calibration-effectiveTime').fill('08:00');
        await page.getByTestId('element-calibration-laboratory').fill('Flow laboratory');
        await page.getByTestId('element-calibration-uncertaintyPercent').fill('0.5');
        await page
          .getByTestId('element-calibration-pointsCsv')
          .fill('reynoldsNumber,dischargeCoefficient\n100000,0.781\n1000000,0.779\n');
        await openWith(page.getByTestId('element-calibration-submit'), page.getByTestId('element-calibration-saved'));
        const list = await api.get<{ id: string; direction: string }[]>(
          `/api/meter-runs/${runId}/element-calibrations`,
        );
        expect(list.body[0].direction).toBe('reverse');
        await page.getByTestId(`element-calibration-${list.body[0].id}`).filter({ hasText: 'reverse flow' }).waitFor();
      }
      await page.getByTestId('element-calibration-direction-reverse').scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/S5-element-calibration-${viewport}.png` });
      await panel.getByText('Element calibrations').first().scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/S5-element-calibration-list-${viewport}.png` });

      // A new configuration version: the reverse constants in force are filled in.
      await openWith(page.getByTestId('version-add'), page.getByTestId('version-create'));
      const form = page.getByTestId('version-create');
      await form.getByTestId('version-create-direction').waitFor();
      // 200 mm = 0.2 m, the reverse cone as stored.
      expect(await page.getByTestId('version-create-reverseElement-coneDiameterM').inputValue()).toBe('200');
      await page
        .getByTestId('version-create-line-bidirectional-yes')
        .and(page.locator('[aria-checked="true"]'))
        .waitFor();
      await page
        .getByTestId('version-create-directionSource-dp-sign')
        .and(page.locator('[aria-checked="true"]'))
        .waitFor();

      // Cleared, the version would make the run one-way unnoticed: the form names the missing field.
      await page.getByTestId('version-create-reverse-clear').click();
      await page.getByTestId('version-create-reason').fill('Reverse constants re-checked');
      await page.getByTestId('version-create-submit').click();
      await until('the missing reverse element to be named', async () =>
        /required for a bi-directional meter run/.test(
          await page.getByTestId('version-create-reverseElement-error').innerText(),
        ),
      );
      await page.getByTestId('version-create-direction').scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/S5-version-reverse-${viewport}.png` });

      if (viewport === 'wide') {
        // Copied from forward, changed and confirmed: the version carries them.
        await page.getByTestId('version-create-reverse-copy').click();
        await page.getByTestId('version-create-reverseElement-dischargeCoefficient').fill('0.785');
        await page.getByTestId('version-create-reverse-confirm').click();
        await choose(page.getByTestId('version-create-directionSource-direction-input'));
        await page.getByTestId('version-create-submit').click();
        await page.getByTestId('version-create-done').waitFor();
        const versions = await api.get<
          { reason: string | null; reverseElement?: { dischargeCoefficient: number }; directionSource?: string }[]
        >(`/api/meter-runs/${runId}/config-versions`);
        const latest = versions.body.find((v) => v.reason === 'Reverse constants re-checked')!;
        expect(latest.reverseElement?.dischargeCoefficient).toBe(0.785);
        expect(latest.directionSource).toBe('direction-input');
      }
    } finally {
      await page.close();
    }
  });
});
