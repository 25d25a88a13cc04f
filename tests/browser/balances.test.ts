/**
 * Balances on phones (issue 10 §3): a site with two meter runs, each with one imported hour last
 * month, the second at a lower differential pressure. engineer@demo.tallyrun defines a balance
 * group in set-up (the first run in, the second out, 0.5 % allowance), after a tolerance the server
 * refuses is shown next to its field; accountant@demo.tallyrun then finds the group's balance on
 * the month screen, and the outlet's reconciliation against a field total 2 % below it. Screenshots at 390 × 844 and 1440 × 900 go to /tmp/shots-S/.
 */
import fs from 'node:fs';

import { client, createMeterRun, settled, signIn as apiSignIn, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

const MIN = 60_000;
const SHOTS = '/tmp/shots-S';

/** The month before this one (UTC): the month screen opens on it. */
const now = new Date();
const lastMonthFirst = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1));
const MONTH = lastMonthFirst.toISOString().slice(0, 7);
const HOUR_MS = lastMonthFirst.getTime() + 26 * 3600_000; // the 2nd, 02:00 UTC

let browser: TestBrowser;
let engineer: Client;
let inlet: Awaited<ReturnType<typeof createMeterRun>>;
let outlet: { id: string; tag: string };

/** A second meter run at the first one's site, with its three transmitters. */
async function secondMeterRun() {
  const tag = `${inlet.meterRun.tag}-OUT`;
  const run = await engineer.post('/api/meter-runs', {
    siteId: inlet.site.id,
    tag,
    name: 'Sales meter',
    element: inlet.element,
    fluid: inlet.fluid,
    holdLimitS: 3600,
    maxGapS: 900,
    effectiveFrom: '2020-01-01T00:00:00Z',
  });
  if (run.status !== 201) throw new Error(`meter run: ${run.status} ${JSON.stringify(run.body)}`);
  const transmitters = [
    { suffix: 'DP', measures: 'differential-pressure', unit: 'kPa', lowerRange: 0, upperRange: 50 },
    {
      suffix: 'PT',
      measures: 'static-pressure',
      unit: 'MPa',
      pressureReference: 'absolute',
      lowerRange: 0,
      upperRange: 4,
    },
    { suffix: 'TT', measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 },
  ];
  for (const { suffix, ...body } of transmitters) {
    const res = await engineer.post('/api/transmitters', { meterRunId: run.body.id, tag: `${tag}-${suffix}`, ...body });
    if (res.status !== 201) throw new Error(`transmitter ${suffix}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return { id: String(run.body.id), tag };
}

/** One hour last month on each meter run; the outlet's DP is 2 % lower, so about 1 % less gas leaves. */
async function importHours() {
  engineer = client(await apiSignIn(demoEmail('engineer')));
  inlet = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  outlet = await secondMeterRun();
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i <= 60; i++) {
    const iso = new Date(HOUR_MS + i * MIN).toISOString();
    lines.push(
      `${iso},${inlet.dp.tag},20,good`,
      `${iso},${inlet.pt.tag},2,good`,
      `${iso},${inlet.tt.tag},300,good`,
      `${iso},${outlet.tag}-DP,19.6,good`,
      `${iso},${outlet.tag}-PT,2,good`,
      `${iso},${outlet.tag}-TT,300,good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'balance-hours.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, inlet.meterRun.id);
  await settled(engineer, outlet.id);
  // A field total for the outlet's contract day, 2 % below Tallyrun's: the month screen reconciles that run first.
  const from = `${MONTH}-01T00:00:00Z`;
  const to = new Date(lastMonthFirst.getTime() + 5 * 86_400_000).toISOString();
  const days = (await engineer.get(`/api/meter-runs/${outlet.id}/totals?interval=day&from=${from}&to=${to}`)).body as {
    start: string;
    end: string;
    standardVolumeM3: number;
  }[];
  const day = days.find((d) => d.standardVolumeM3 > 0);
  if (!day) throw new Error(`no daily total: ${JSON.stringify(days)}`);
  const csv = `start,end,meterRun,quantity,value,unit\n${day.start},${day.end},${outlet.tag},standard-volume,${(day.standardVolumeM3 * 0.98).toFixed(6)},m3\n`;
  const field = await engineer.upload('/api/imports', 'balance-field.csv', csv, { kind: 'field-totals' });
  if (field.status !== 202) throw new Error(`field totals: ${field.status} ${JSON.stringify(field.body)}`);
  await until(
    'the field totals',
    async () => (await engineer.get(`/api/imports/${field.body.id}`)).body.status === 'done',
  );
}

beforeAll(async () => {
  fs.mkdirSync(SHOTS, { recursive: true });
  [browser] = await Promise.all([launchBrowser(), importHours()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

const groupName = 'Station in and out';

it('an engineer on a phone defines a balance group in set-up, seeing the refused field named beside it', async () => {
  const page = await freshPage(browser, 'phone');
  try {
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/setup?site=${encodeURIComponent(inlet.site.id)}`);
    await page.getByTestId('balance-group-panel').waitFor();
    await page.getByTestId('balance-group-panel').getByText('This site has no balance group yet.').waitFor();
    await page.getByTestId('balance-group-name').fill(groupName);
    await choose(page.getByTestId(`balance-group-side-${inlet.meterRun.tag}-inlet`));
    await choose(page.getByTestId(`balance-group-side-${outlet.tag}-outlet`));
    await page.getByTestId('balance-group-allowance').fill('0.5');
    // Above the server's 100 %: its 400 names tolerancePercent and the form shows it under that field.
    await page.getByTestId('balance-group-tolerancePercent').fill('150');
    await page.getByTestId('balance-group-submit').click();
    const error = page.getByTestId('balance-group-tolerancePercent-error');
    await error.waitFor();
    expect(await error.innerText()).toContain('must be at most 100');
    await page.screenshot({ path: `${SHOTS}/setup-balance-group-error-390.png`, fullPage: true });

    await page.getByTestId('balance-group-tolerancePercent').fill('5');
    await page.getByTestId('balance-group-submit').click();
    await page.getByTestId('balance-group-created').waitFor();
    const row = page.getByTestId(`balance-group-row-${groupName}`);
    await row.waitFor();
    expect(await row.innerText()).toContain(`In: ${inlet.meterRun.tag} · out: ${outlet.tag}`);
    await page.screenshot({ path: `${SHOTS}/setup-balance-group-390.png`, fullPage: true });
    await page.getByTestId('balance-group-panel').screenshot({ path: `${SHOTS}/setup-balance-group-panel-390.png` });
  } finally {
    await page.close();
  }
  const groups = (await engineer.get(`/api/balance-groups?siteId=${inlet.site.id}`)).body;
  expect(groups).toEqual([
    expect.objectContaining({
      name: groupName,
      inletMeterRunIds: [inlet.meterRun.id],
      outletMeterRunIds: [outlet.id],
      allowancePercent: 0.5,
      allowanceDailyM3: null,
      tolerancePercent: 5,
    }),
  ]);
});

it('the accountant on a phone sees the group’s balance for the month on the month screen', async () => {
  const accountant = client(await apiSignIn(demoEmail('accountant')));
  const volumes = (await accountant.get(`/api/monthly-volumes?siteId=${inlet.site.id}&month=${MONTH}`)).body;
  const volumeOf = (id: string) =>
    (volumes.meterRuns as { meterRunId: string; standardVolumeM3: number }[]).find((r) => r.meterRunId === id)!
      .standardVolumeM3;
  const vIn = volumeOf(inlet.meterRun.id);
  const vOut = volumeOf(outlet.id);
  expect(vIn).toBeGreaterThan(vOut);
  // The definition, worked here from the monthly totals: imbalance = in − out − allowance,
  // the allowance 0.5 % of the inlet, in percent of the inlet.
  const imbalancePercent = ((vIn - vOut - 0.005 * vIn) / vIn) * 100;

  const page = await freshPage(browser, 'phone');
  try {
    await signIn(page, demoEmail('accountant'));
    await page.goto(`${baseUrl}/totals`);
    await page.getByTestId('screen-monthly-volumes').waitFor();
    expect(await page.getByTestId('monthly-month').innerText()).toBe(MONTH);
    await choose(page.getByTestId(`monthly-site-${inlet.site.id}`));
    const panel = page.getByTestId('monthly-balance');
    await panel.getByText(groupName).waitFor();
    const row = panel.getByTestId(`balance-row-${MONTH}-01`);
    await row.waitFor();
    const text = await row.innerText();
    const sign = imbalancePercent < 0 ? '−' : '+';
    expect(text).toContain(`${sign}${Math.abs(imbalancePercent).toFixed(2)}`);
    // The verdict on the tolerance and whether the imbalance is larger than its own uncertainty.
    expect(text).toMatch(/Within|Outside/);
    expect(await panel.innerText()).toContain('Beyond its U?');
    await panel.screenshot({ path: `${SHOTS}/month-balance-panel-390.png` });
    await page.screenshot({ path: `${SHOTS}/month-balance-390.png`, fullPage: true });

    // The contract days fold away on a phone; opened, the 2nd holds both hours.
    await page.getByTestId('monthly-balance-days-toggle').click();
    await page.getByTestId('monthly-balance-days').getByTestId(`balance-row-${MONTH}-02`).waitFor();
    // The outlet is the site's meter run with field totals, so it is the one reconciled, its day outside 0.5 %.
    await page.locator(`[data-testid="monthly-reconcile-run-${outlet.id}"][aria-checked="true"]`).waitFor();
    await page.getByTestId('monthly-reconciliation').getByTestId('reconciliation-outside-count').waitFor();
    expect(await page.getByTestId('reconciliation-outside-count').innerText()).toBe('1 day is outside the tolerance.');
    await page.screenshot({ path: `${SHOTS}/month-balance-days-390.png`, fullPage: true });
    await page.getByTestId('monthly-reconciliation').screenshot({ path: `${SHOTS}/month-reconciliation-390.png` });
  } finally {
    await page.close();
  }
});

it('shows the balances and the reconciliation beside the month at 1440 × 900', async () => {
  const page = await freshPage(browser, 'wide');
  try {
    await signIn(page, demoEmail('accountant'));
    await page.goto(`${baseUrl}/totals`);
    await page.getByTestId('screen-monthly-volumes').waitFor();
    await choose(page.getByTestId(`monthly-site-${inlet.site.id}`));
    await page.getByTestId('monthly-balance').getByTestId(`balance-row-${MONTH}-01`).waitFor();
    await page.getByTestId('monthly-balance-days').getByTestId(`balance-row-${MONTH}-02`).waitFor();
    await choose(page.getByTestId(`monthly-reconcile-run-${inlet.meterRun.id}`));
    await page.getByTestId('monthly-reconciliation').getByText('No field totals for contract days').waitFor();
    await choose(page.getByTestId(`monthly-reconcile-run-${outlet.id}`));
    await page.getByTestId('reconciliation-chart').waitFor();
    await page.screenshot({ path: `${SHOTS}/month-balance-1440.png`, fullPage: true });
  } finally {
    await page.close();
  }
});

it('an engineer on a phone sets a meter run’s reconciliation tolerance in set-up from the first of the month, with a reason', async () => {
  const page = await freshPage(browser, 'phone');
  try {
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/setup?meterRun=${encodeURIComponent(outlet.id)}`);
    const current = page.getByTestId('run-tolerance-current');
    // Read back from the outlet's reconciliation: a meter run starts at 0.5 %.
    await current.filter({ hasText: 'In force: ±0.5 %' }).waitFor();
    await page.getByTestId('run-tolerance-tolerancePercent').fill('0');
    await page.getByTestId('run-tolerance-submit').click();
    await page
      .getByTestId('run-tolerance-tolerancePercent-error')
      .filter({ hasText: 'must be a number above 0' })
      .waitFor();
    await page.getByTestId('run-tolerance-tolerancePercent').fill('2.5');
    // A new tolerance judges the contract days starting from its time on: back-date it to the month's start.
    await page.getByTestId('run-tolerance-effectiveFrom').fill(`${MONTH}-01`);
    await page.getByTestId('run-tolerance-effectiveTime').fill('00:00');
    await page.getByTestId('run-tolerance-reason').fill('balance allowance agreed for the month');
    await page.getByTestId('run-tolerance-submit').click();
    await page.getByTestId('run-tolerance-saved').waitFor();
    await page.getByTestId('run-tolerance-versions').filter({ hasText: 'balance allowance agreed' }).waitFor();
    await current.filter({ hasText: 'In force: ±2.5 %' }).waitFor();
    await page.getByTestId('run-tolerance').screenshot({ path: `${SHOTS}/setup-tolerance-390.png` });
  } finally {
    await page.close();
  }
  const days = await engineer.get(
    `/api/reconciliations?meterRunId=${outlet.id}&from=${MONTH}-01&to=${new Date(Date.now() + 86_400_000).toISOString().slice(0, 10)}`,
  );
  expect(days.body).toEqual([expect.objectContaining({ tolerancePercent: 2.5, withinTolerance: true })]);
});
