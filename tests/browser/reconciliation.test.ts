/**
 * The reconciliation panel on a meter run's screen, on a phone, against the real server: readings
 * are imported as CSV and turned into today's contract-day total by the history worker; a field
 * total for the same contract day 2 % below Tallyrun's is imported; the accountant sees the day
 * outside the 0.5 % tolerance, the figures with their unit in the headers, and the daily chart.
 */
import { client, createMeterRun, settled, signIn as apiSignIn, until } from '../support/api';

import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
let meterRunId: string;
const hourMs = 3_600_000;

async function makeReconciledDay() {
  const api = client(await apiSignIn(demoEmail('engineer')));
  const now = Date.now();
  // The contract day began four hours ago, so two hours of readings fall in today's contract day.
  const contractHour = (new Date(now - 4 * hourMs).getUTCHours() + 24) % 24;
  const f = await createMeterRun(api, { timeZone: 'UTC', contractHour });
  const lines = ['time,tag,value,quality'];
  const start = Math.floor((now - 2 * hourMs) / 300_000) * 300_000;
  for (let t = start; t < now - 60_000; t += 300_000) {
    const iso = new Date(t).toISOString();
    lines.push(`${iso},${f.dp.tag},20,good`, `${iso},${f.pt.tag},2,good`, `${iso},${f.tt.tag},300,good`);
  }
  const upload = async (kind: string, name: string, csv: string) => {
    const started = await api.upload('/api/imports', name, csv, { kind });
    if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
    return until('the import to finish', async () => {
      const r = await api.get(`/api/imports/${started.body.id}`);
      return r.body.status !== 'running' ? r.body : null;
    });
  };
  await upload('readings', 'readings.csv', `${lines.join('\n')}\n`);
  await settled(api, f.meterRun.id);
  const from = new Date(now - 2 * 86_400_000).toISOString();
  const to = new Date(now + 86_400_000).toISOString();
  const days = await api.get(`/api/meter-runs/${f.meterRun.id}/totals?interval=day&from=${from}&to=${to}`);
  const day = (days.body as { start: string; end: string; standardVolumeM3: number }[]).find(
    (d) => d.standardVolumeM3 > 0,
  );
  if (!day) throw new Error(`no daily total: ${JSON.stringify(days.body)}`);
  const field = (day.standardVolumeM3 * 0.98).toFixed(6);
  const done = await upload(
    'field-totals',
    'field.csv',
    `start,end,meterRun,quantity,value,unit\n${day.start},${day.end},${f.meterRun.tag},standard-volume,${field},m3\n`,
  );
  if (done.status !== 'done' || done.rowsImported !== 1) throw new Error(`field totals: ${JSON.stringify(done)}`);
  return f.meterRun.id;
}

beforeAll(async () => {
  [browser, meterRunId] = await Promise.all([launchBrowser(), makeReconciledDay()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

it('shows the accountant a day outside tolerance, its figures with units in the headers, and the chart (phone)', async () => {
  const page = await freshPage(browser, 'phone');
  await signIn(page, demoEmail('accountant'));
  await page.goto(`${baseUrl}/meter-runs/${meterRunId}`);
  const panel = page.getByTestId('reconciliation-panel');
  await panel.waitFor();
  await page.getByTestId('reconciliation-outside-count').waitFor();
  expect(await page.getByTestId('reconciliation-outside-count').innerText()).toBe('1 day is outside the tolerance.');
  const text = await panel.innerText();
  expect(text).toContain('Tallyrun, m³');
  expect(text).toContain('Difference, % of field');
  // Tallyrun / field = 1 / 0.98: +2.04 % of the field total.
  expect(await page.getByTestId('reconciliation-row-standard-volume-0').innerText()).toMatch(/\+2\.04 %/);
  await page.locator('[data-testid="reconciliation-chart"] canvas').first().waitFor();
  await signOut(page);
  await page.close();
});
