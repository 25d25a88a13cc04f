/**
 * Four eyes on a phone (issue 9 §6): engineer@demo.tallyrun proposes an adjustment of one hour of
 * a meter run on a 390 × 844 screen; engineer2@demo.tallyrun approves it with a reason; the
 * correction then shows the hour's original and corrected figures side by side. The hour is
 * imported by CSV (DP 20 kPa, P 2 MPa, T 300 K for an hour) and computed before the test starts.
 */
import type { Page } from 'playwright-core';

import { client, createMeterRun, settled, signIn as apiSignIn, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

const MIN = 60_000;
const HOUR = '2026-11-02T10:00:00Z';

let browser: TestBrowser;
let engineer: Client;
let meterRun: { id: string; tag: string };

async function importHour() {
  engineer = client(await apiSignIn(demoEmail('engineer')));
  const run = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const t0 = Date.parse(HOUR);
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i <= 60; i++) {
    const iso = new Date(t0 + i * MIN).toISOString();
    lines.push(
      `${iso},${run.dp.tag},${20 + (i % 2) * 0.003},good`,
      `${iso},${run.pt.tag},${2 + (i % 3) * 0.0001},good`,
      `${iso},${run.tt.tag},${300 + (i % 2) * 0.01},good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'one-hour.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, run.meterRun.id);
  meterRun = run.meterRun;
}

beforeAll(async () => {
  [browser] = await Promise.all([launchBrowser(), importHour()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

async function openCorrections(page: Page) {
  await page.goto(`${baseUrl}/corrections`);
  await page.getByTestId('screen-corrections').waitFor();
}

it('an engineer proposes a correction on a phone, a second engineer approves it, and the screen shows original and corrected figures', async () => {
  const page = await freshPage(browser, 'phone');
  try {
    await signIn(page, demoEmail('engineer'));
    await openCorrections(page);
    await page.getByTestId('correction-new').click();
    await choose(page.getByTestId(`correction-meter-run-${meterRun.id}`));
    await page.getByTestId('correction-start-date').fill('2026-11-02');
    await page.getByTestId('correction-start-time').fill('10:00');
    await page.getByTestId('correction-end-date').fill('2026-11-02');
    await page.getByTestId('correction-end-time').fill('11:00');
    await choose(page.getByTestId('correction-mode-factor'));
    await page.getByTestId('correction-factor').fill('1.05');
    await page.getByTestId('correction-reason').fill('DP transmitter read 5 % low against the test set');
    await page.getByTestId('correction-submit').click();

    const created = await until('the proposed correction', async () => {
      const list = await engineer.get(`/api/corrections?meterRunId=${meterRun.id}`);
      return list.body[0] as { id: string; status: string; factor: number } | undefined;
    });
    expect(created).toMatchObject({ status: 'proposed', factor: 1.05 });
    const card = page.getByTestId(`correction-${created.id}`);
    await card.waitFor();
    // Nobody approves their own: the proposer is offered no approve button.
    expect(await page.getByTestId(`correction-${created.id}-approve`).count()).toBe(0);
    await signOut(page);

    await signIn(page, 'engineer2@demo.tallyrun');
    await openCorrections(page);
    await page.getByTestId(`correction-${created.id}-approve`).click();
    await page.getByTestId('correction-approve-reason').fill('test-set record checked');
    await page.getByTestId('correction-approve-confirm').click();
    await page.getByTestId(`correction-${created.id}-decision`).waitFor();
    expect(await page.getByTestId(`correction-${created.id}-decision`).innerText()).toMatch(/Approved by/);

    // The recompute lands a few seconds after the approval; the list refreshes every 10 s.
    const difference = page.getByTestId(`correction-${created.id}-difference`);
    await until(
      'the corrected figures',
      async () => (await difference.isVisible()) && !/[+−]0\.0 kg/.test(await difference.innerText()),
      60_000,
    );
    const shown = await engineer.get(`/api/corrections/${created.id}`);
    const { original, current } = shown.body.figures;
    expect(current.massKg / original.massKg).toBeCloseTo(1.05, 9);
    const kg = (n: number) => `${n.toLocaleString('en', { maximumFractionDigits: 1, minimumFractionDigits: 1 })} kg`;
    expect(await page.getByTestId(`correction-${created.id}-original`).innerText()).toContain(kg(original.massKg));
    expect(await page.getByTestId(`correction-${created.id}-corrected`).innerText()).toContain(kg(current.massKg));
    // Phone first: nothing runs off the side of a 390 px screen.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  } finally {
    await page.close();
  }
}, 180_000);
