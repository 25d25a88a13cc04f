/**
 * Tables, titles and touch targets as a person meets them on a 390 × 844 phone (issue 14 items 1
 * and 9): a demo meter run's daily totals show each contract day on one line, the key column
 * stays in view when the table is swiped sideways, the scrolling region is reachable by keyboard,
 * the page's title names the meter run, and the unit chips of the set-up forms are at least
 * 44 × 44 px (WCAG 2.5.5). A meter run with six hours of imported readings shows its flow chart
 * for the screenshots. Screenshots at both sizes go to /work/notes/round10/shots/A-*.png.
 */
import fs from 'node:fs';
import type { Page } from 'playwright-core';

import { client, createMeterRun, settled, signIn as apiSignIn, until } from '../support/api';
import {
  baseUrl,
  demoEmail,
  freshPage,
  launchBrowser,
  screenshotWhenSettled,
  signIn,
  viewports,
  type TestBrowser,
} from './support';

const SHOTS = '/work/notes/round10/shots';
const MIN = 60_000;

let browser: TestBrowser;
let demoRun: { id: string; tag: string; name: string };
let readingsRun: { id: string; tag: string };

/** A demo meter run (seeded from the scenario), and a new one with six hours of readings to draw. */
async function fixtures() {
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  const runs = await engineer.get('/api/meter-runs');
  if (runs.status !== 200 || !runs.body.length) throw new Error(`meter runs: ${runs.status}`);
  demoRun = runs.body[0];

  const made = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const lines = ['time,tag,value,quality'];
  const start = Math.floor((Date.now() - 6 * 60 * MIN) / (5 * MIN)) * 5 * MIN;
  for (let t = start, i = 0; t < Date.now() - MIN; t += 5 * MIN, i++) {
    const iso = new Date(t).toISOString();
    // DP swinging across most of its 0–50 kPa span, so the flow axis carries numbers in the thousands.
    lines.push(
      `${iso},${made.dp.tag},${(25 + 20 * Math.sin(i / 10)).toFixed(3)},good`,
      `${iso},${made.pt.tag},3.5,good`,
      `${iso},${made.tt.tag},300,good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'tables-on-phone.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, made.meterRun.id);
  readingsRun = made.meterRun;
}

beforeAll(async () => {
  fs.mkdirSync(SHOTS, { recursive: true });
  [browser] = await Promise.all([launchBrowser(), fixtures()]);
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

async function openMeterRun(page: Page, id: string) {
  await page.goto(`${baseUrl}/meter-runs/${id}`);
  await page.getByTestId('daily-row-0').waitFor();
}

describe('tables on a phone', () => {
  it('show each contract day on one line, keep the day in view when swiped, and title the page after the meter run', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await openMeterRun(page, demoRun.id);

    // The header and the browser tab name this meter run, not the area.
    const title = page.getByTestId('area-title');
    await title.filter({ hasText: demoRun.tag }).waitFor();
    expect(await title.innerText()).toBe(`${demoRun.tag} · ${demoRun.name}`);
    expect(await page.title()).toBe(`${demoRun.tag} · ${demoRun.name} · Tallyrun`);

    // Every contract day's date is one line of text, held inside its cell.
    const days = await page.locator('[data-testid^="daily-row-"]').evaluateAll((rows) =>
      rows.map((row) => {
        const cell = row.querySelector('[role="cell"]') as HTMLElement;
        const text = cell.querySelector('div[dir], span, div') as HTMLElement;
        const range = document.createRange();
        range.selectNodeContents(text);
        const lineHeight = parseFloat(getComputedStyle(text).lineHeight);
        const style = getComputedStyle(cell);
        const inner = cell.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
        return {
          text: text.innerText,
          lines: range.getClientRects().length,
          heightPx: text.getBoundingClientRect().height,
          lineHeightPx: lineHeight,
          widthPx: range.getBoundingClientRect().width,
          innerPx: inner,
        };
      }),
    );
    expect(days).toHaveLength(31);
    for (const day of days) {
      expect(day.text).toMatch(/^\d{4}-\d{2}-\d{2}$/);
      expect(day.lines).toBe(1);
      expect(day.heightPx).toBeLessThanOrEqual(day.lineHeightPx + 1);
      expect(day.widthPx).toBeLessThanOrEqual(day.innerPx + 0.5);
    }

    // The table is wider than the phone: its region is focusable and named, and when swiped to
    // the volume the contract day stays at the left edge, uncovered.
    const region = page.getByTestId('daily-table');
    expect(await region.getAttribute('tabindex')).toBe('0');
    expect(await region.getAttribute('aria-label')).toBe('Daily totals by contract day, scrolls sideways');
    await region.scrollIntoViewIfNeeded();
    // scrollLeft, not scrollTo: react-native-web replaces a ScrollView node's scrollTo with its own.
    await region.evaluate((element) => {
      element.scrollLeft = 300;
    });
    await until('the table to scroll', async () => (await region.evaluate((element) => element.scrollLeft)) > 250);
    const regionBox = await region.boundingBox();
    const keyCell = page.getByTestId('daily-row-0').getByRole('cell').first();
    // Sideways scrolling leaves the page where it is; bring the row itself on screen to look at it.
    await keyCell.scrollIntoViewIfNeeded();
    const keyBox = await keyCell.boundingBox();
    expect(regionBox && keyBox).toBeTruthy();
    expect(Math.abs((keyBox?.x ?? 0) - (regionBox?.x ?? 0))).toBeLessThanOrEqual(1);
    const onTop = await keyCell.evaluate((cell) => {
      const box = cell.getBoundingClientRect();
      return cell.contains(document.elementFromPoint(box.x + box.width / 2, box.y + box.height / 2));
    });
    expect(onTop).toBe(true);
    // Numbers carry no unit in the cell: it is in the header.
    const coverage = await page.getByTestId('daily-row-0').getByRole('cell').nth(6).innerText();
    expect(coverage).toMatch(/^[\d.,]+$/);
    await screenshotWhenSettled(page.getByTestId('daily-totals'), `${SHOTS}/A-daily-totals-390-scrolled.png`);
    await region.evaluate((element) => {
      element.scrollLeft = 0;
    });
    await screenshotWhenSettled(page.getByTestId('daily-totals'), `${SHOTS}/A-daily-totals-390.png`);
    await page.close();
  });

  it('draw the flow chart with its axis title clear of the numbers, and the tables at both sizes (screenshots)', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await openMeterRun(page, readingsRun.id);
    await page.locator('[data-testid="trend-chart-flow"] canvas').first().waitFor();
    await screenshotWhenSettled(page.getByTestId('trend-chart-flow'), `${SHOTS}/A-flow-chart-390.png`);
    await page.getByTestId('hourly-row-0').waitFor();
    await screenshotWhenSettled(page.getByTestId('hourly-records'), `${SHOTS}/A-hourly-390.png`);

    await page.setViewportSize(viewports.wide);
    await page.getByTestId('daily-row-0').waitFor();
    // Wide, the whole table fits: no sideways scrolling, so no extra tab stop.
    await until(
      'the wide layout',
      async () => (await page.getByTestId('daily-table').getAttribute('tabindex')) === null,
    );
    await page.locator('[data-testid="trend-chart-flow"] canvas').first().waitFor();
    await screenshotWhenSettled(page.getByTestId('trend-chart-flow'), `${SHOTS}/A-flow-chart-1440.png`);
    await screenshotWhenSettled(page.getByTestId('hourly-records'), `${SHOTS}/A-hourly-1440.png`);
    await screenshotWhenSettled(page.getByTestId('daily-totals'), `${SHOTS}/A-daily-totals-1440.png`);
    await page.close();
  });
});

describe('touch targets', () => {
  it('make every unit chip and choice of the site form at least 44 × 44 px on a phone', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/setup`);
    await page.getByTestId('site-create-basePressurePa-unit-psi').waitFor();
    const targets = page.locator('[data-testid^="site-create-"][role="radio"]');
    const count = await targets.count();
    expect(count).toBeGreaterThanOrEqual(6);
    for (let i = 0; i < count; i++) {
      const box = await targets.nth(i).boundingBox();
      const id = await targets.nth(i).getAttribute('data-testid');
      expect({ id, width: Math.round(box?.width ?? 0) >= 44, height: Math.round(box?.height ?? 0) >= 44 }).toEqual({
        id,
        width: true,
        height: true,
      });
    }
    await page.getByTestId('site-create-basePressurePa').scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/A-site-form-chips-390.png` });
    await page.setViewportSize(viewports.wide);
    // The wider layout re-renders the form: scroll to the chip once the new one is in place.
    await until('the wide form to settle', async () => {
      try {
        await page.getByTestId('site-create-basePressurePa-unit-psi').scrollIntoViewIfNeeded({ timeout: 2000 });
        return true;
      } catch {
        return false;
      }
    });
    await page.screenshot({ path: `${SHOTS}/A-site-form-chips-1440.png` });
    await page.close();
  });
});
