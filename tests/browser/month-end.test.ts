/**
 * Month end on a phone (issue 10): accountant@demo.tallyrun opens monthly volumes on a 390 × 844
 * screen, finds the meter run of a site with one imported hour last month, closes the month
 * (when the server offers the periods API) and downloads the CSV and Excel exports, which are read
 * back and compared with `GET /api/monthly-volumes`. Screenshots at 390 and 1440 go to /tmp/shots-M/.
 */
import fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';

import { client, createMeterRun, settled, signIn as apiSignIn, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

const MIN = 60_000;
const SHOTS = '/tmp/shots-M';

/** The month before this one (UTC): the screen opens on it. */
const now = new Date();
const lastMonthFirst = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1));
const MONTH = lastMonthFirst.toISOString().slice(0, 7);
const HOUR_MS = lastMonthFirst.getTime() + 26 * 3600_000; // the 2nd, 02:00 UTC

let browser: TestBrowser;
let accountant: Client;
let run: Awaited<ReturnType<typeof createMeterRun>>;

async function importHour() {
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  run = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i <= 60; i++) {
    const iso = new Date(HOUR_MS + i * MIN).toISOString();
    lines.push(
      `${iso},${run.dp.tag},${20 + (i % 2) * 0.003},good`,
      `${iso},${run.pt.tag},${2 + (i % 3) * 0.0001},good`,
      `${iso},${run.tt.tag},${300 + (i % 2) * 0.01},good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'month-end-hour.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, run.meterRun.id);
  accountant = client(await apiSignIn(demoEmail('accountant')));
}

beforeAll(async () => {
  fs.mkdirSync(SHOTS, { recursive: true });
  [browser] = await Promise.all([launchBrowser(), importHour()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

it('the accountant on a phone reviews the month, closes it and downloads both exports', async () => {
  const page = await freshPage(browser, 'phone');
  try {
    await signIn(page, demoEmail('accountant'));
    await page.goto(`${baseUrl}/totals`);
    await page.getByTestId('screen-monthly-volumes').waitFor();
    expect(await page.getByTestId('monthly-month').innerText()).toBe(MONTH);
    await choose(page.getByTestId(`monthly-site-${run.site.id}`));
    const card = page.getByTestId('monthly-card-0');
    await card.getByText(run.meterRun.tag, { exact: false }).waitFor();
    await page.getByTestId('monthly-card-total').waitFor();
    await page.screenshot({ path: `${SHOTS}/monthly-volumes-390.png`, fullPage: true });

    // Drill down: the month's contract days, then the hours of the day with flow.
    await page.getByTestId('monthly-card-0-days').click();
    await page.getByTestId('month-drill-down').waitFor();
    // The 2nd holds the imported hour (02:00).
    await page.getByTestId('drill-day-0').waitFor();
    await page.screenshot({ path: `${SHOTS}/drill-days-390.png`, fullPage: true });
    await page
      .getByTestId('month-drill-down')
      .getByRole('button', { name: `${MONTH}-02` })
      .click();
    await page
      .getByTestId('month-drill-down')
      .getByText(/hours of/)
      .waitFor();
    await page.getByTestId('month-drill-down').getByText('02:00').first().waitFor();
    await page.screenshot({ path: `${SHOTS}/drill-down-390.png`, fullPage: true });

    const period = await accountant.get(`/api/periods/${MONTH}?siteId=${run.site.id}`);
    if (period.status === 200) {
      await page.getByTestId('month-close-start').click();
      // One hour of a month is far from final: the screen says so before it closes.
      await page.getByTestId('month-close-not-final').waitFor();
      await page.screenshot({ path: `${SHOTS}/close-confirm-390.png`, fullPage: true });
      await page.getByTestId('month-close-confirm').click();
      await page
        .getByTestId('month-close-status')
        .getByText(/^Closed/)
        .waitFor();
      const after = await accountant.get(`/api/periods/${MONTH}?siteId=${run.site.id}`);
      expect(after.body.status).toBe('closed');
    }

    const volumes = (await accountant.get(`/api/monthly-volumes?siteId=${run.site.id}&month=${MONTH}`)).body;
    const row = volumes.meterRuns[0];

    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByTestId('monthly-export-csv').click()]);
    expect(csv.suggestedFilename()).toBe(`monthly-volumes-${run.site.code}-${MONTH}.csv`);
    const records: string[][] = parse(fs.readFileSync((await csv.path()) as string, 'utf8'), {
      relax_column_count: true,
    });
    const csvRow = records.find((r) => r[0] === run.meterRun.tag);
    // SI site: volume at base conditions in m³, mass in t (1000 kg).
    expect(Number(csvRow?.[4])).toBe(row.standardVolumeM3);
    expect(Number(csvRow?.[2])).toBe(row.massKg / 1000);

    const [xlsx] = await Promise.all([page.waitForEvent('download'), page.getByTestId('monthly-export-xlsx').click()]);
    expect(xlsx.suggestedFilename()).toBe(`monthly-volumes-${run.site.code}-${MONTH}.xlsx`);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile((await xlsx.path()) as string);
    const sheet = workbook.worksheets[0];
    let found = false;
    sheet.eachRow((r) => {
      if (r.getCell(1).value === run.meterRun.tag) {
        found = true;
        expect(r.getCell(5).value).toBe(row.standardVolumeM3);
      }
    });
    expect(found).toBe(true);
    await page.screenshot({ path: `${SHOTS}/exported-390.png`, fullPage: true });
  } finally {
    await page.close();
  }
});

it('shows the month as one table at 1440 × 900', async () => {
  const page = await freshPage(browser, 'wide');
  try {
    await signIn(page, demoEmail('accountant'));
    await page.goto(`${baseUrl}/totals`);
    await page.getByTestId('screen-monthly-volumes').waitFor();
    await choose(page.getByTestId(`monthly-site-${run.site.id}`));
    await page.getByTestId('monthly-row-0').getByText(run.meterRun.tag).waitFor();
    await page.getByTestId('monthly-row-total').waitFor();
    await page.screenshot({ path: `${SHOTS}/monthly-volumes-1440.png`, fullPage: true });
  } finally {
    await page.close();
  }
});
