/**
 * The live board and the alarm list as an operator uses them on a 390 × 844 phone (and a look at
 * 1440 × 900): the board opens worst first, so a meter run with an unacknowledged alarm comes
 * before a healthy one; the alarm banner is one line, leaving the content most of the screen; a
 * card shows its meter run's alarm, and the summary never says "all normal" beside it; and an
 * acknowledged alarm stays listed, under its new state, with a notice saying what happened.
 * The alarm is raised as in alarms.test.ts: DP at 5 % of a 0–50 kPa span for 35 minutes, past the
 * DP-low-in-range on-delay of 300 s (shared/alarms/alarm-limits.ts defaults).
 */
import type { Page } from 'playwright-core';

import { client, createMeterRun, settled, signIn as apiSignIn, until, type Client } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

const MIN = 60_000;
const shots = '/work/notes/round10/shots';

let browser: TestBrowser;
let engineer: Client;
let alarmed: { id: string; tag: string };
let healthy: { id: string; tag: string };
let alarmId: string;

async function importLines(lines: string[]) {
  const started = await engineer.upload('/api/imports', `board-${Date.now()}.csv`, `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
}

/** Whole minutes from 40 min ago to 2 min ago; DP in kPa per minute, the others wobbling so none looks frozen. */
function minutes(run: Awaited<ReturnType<typeof createMeterRun>>, dpKPa: (i: number) => number): string[] {
  const t0 = Math.floor((Date.now() - 40 * MIN) / MIN) * MIN;
  const lines: string[] = [];
  for (let i = 0; i < 39; i++) {
    const iso = new Date(t0 + i * MIN).toISOString();
    lines.push(
      `${iso},${run.dp.tag},${dpKPa(i) + (i % 2) * 0.003},good`,
      `${iso},${run.pt.tag},${2 + (i % 3) * 0.0001},good`,
      `${iso},${run.tt.tag},${300 + (i % 2) * 0.01},good`,
    );
  }
  return lines;
}

beforeAll(async () => {
  browser = await launchBrowser();
  engineer = client(await apiSignIn(demoEmail('engineer')));
  // Readings count for an hour, so neither meter run reads as a silent transmitter on a slow machine.
  const a = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0, holdLimitS: 3600 });
  const b = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0, holdLimitS: 3600 });
  alarmed = a.meterRun;
  healthy = b.meterRun;
  await importLines(['time,tag,value,quality', ...minutes(a, (i) => (i < 5 ? 20 : 2.5)), ...minutes(b, () => 25)]);
  await settled(engineer, a.meterRun.id);
  const alarm = await until(
    'the DP-low-in-range alarm',
    async () => (await engineer.get(`/api/alarms?meterRunId=${a.meterRun.id}&condition=dp-low-in-range`)).body[0],
    90_000,
  );
  alarmId = alarm.id;
}, 240_000);
afterAll(async () => {
  await browser?.close();
});

const cardOrder = (page: Page) =>
  page.locator('a[data-testid^="live-run-"]').evaluateAll((cards) => cards.map((c) => c.getAttribute('data-testid')));

describe('the live board and alarms on a phone', () => {
  it('opens worst first with a one-line banner, shows the alarm on its card and never says all normal beside it', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await page.getByTestId(`live-run-${healthy.tag}`).waitFor();
    const card = `live-run-${alarmed.tag}`;
    await page.getByTestId(`${card}-alarm-count`).waitFor();
    expect(await page.getByTestId(`${card}-alarm-count`).innerText()).toMatch(/^1 open alarm, 1 unacknowledged$/);
    expect(await page.getByTestId(`${card}-alarms`).innerText()).toMatch(/◆\s*Medium/);

    // Worst first: the meter run with an unacknowledged alarm before the healthy one, and the
    // first card on the board carries an alarm.
    const order = await cardOrder(page);
    expect(order.indexOf(card)).toBeLessThan(order.indexOf(`live-run-${healthy.tag}`));
    expect(await page.getByTestId(`${order[0]}-alarms`).count()).toBe(1);
    expect(await page.getByTestId('live-order-worst').getAttribute('aria-checked')).toBe('true');

    // The summary agrees with the alarm list.
    expect(await page.getByTestId('live-all-normal').count()).toBe(0);
    expect(await page.getByTestId('live-attention').innerText()).toMatch(/\d+ of \d+ meter runs? needs? attention/);

    // The banner is compact: one line of badges and count, one line for the newest message; the content keeps most
    // of the 844 px (624 before).
    const banner = await page.getByTestId('alarm-banner').boundingBox();
    const count = await page.getByTestId('alarm-banner-count').boundingBox();
    expect(banner && count).toBeTruthy();
    expect(banner!.height).toBeLessThanOrEqual(72);
    expect(count!.height).toBeLessThanOrEqual(28);
    const content = await page.getByTestId('screen-live').boundingBox();
    expect(content!.height).toBeGreaterThanOrEqual(640);
    await page.screenshot({ path: `${shots}/C-board-phone.png` });

    // By name, the address keeps the choice.
    await page.getByTestId('live-order-name').click();
    await page.waitForURL((url) => url.searchParams.get('order') === 'name');
    await page.close();
  });

  it('keeps an acknowledged alarm listed under its new state with a notice saying what happened', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await page.goto(`${baseUrl}/alarms?meterRunId=${alarmed.id}&state=unacknowledged`);
    await page.getByTestId(`alarm-ack-${alarmId}`).waitFor();
    await page.getByTestId(`alarm-ack-${alarmId}`).click();

    const notice = page.getByTestId(`alarm-done-${alarmId}`);
    await notice.waitFor();
    expect(await notice.innerText()).toMatch(
      /Acknowledged at \d+ \w+ \d{4}, \d\d:\d\d UTC\. Now: Active, acknowledged\./,
    );
    expect(await notice.getAttribute('role')).toBe('status');
    await page.getByTestId(`alarm-state-${alarmId}`).filter({ hasText: 'Active, acknowledged' }).waitFor();
    // The list refreshes (this filter no longer matches the alarm) and the row stays.
    await Promise.all([
      page.waitForResponse((r) => r.url().includes('/api/alarms?') && r.url().includes(`meterRunId=${alarmed.id}`)),
      page.getByTestId('alarm-refresh').click(),
    ]);
    // The response lands, then the list re-renders.
    await page.waitForTimeout(500);
    expect(await page.getByTestId(`alarm-row-${alarmId}`).count()).toBe(1);
    expect((await engineer.get(`/api/alarms/${alarmId}`)).body.state).toBe('active-acknowledged');
    await page.screenshot({ path: `${shots}/C-alarms-ack-phone.png` });
    await page.close();
  });

  it('shows the board and the alarm list on a wide screen', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('operator'));
    await page.getByTestId(`live-run-${alarmed.tag}-alarm-count`).waitFor();
    expect(await page.getByTestId(`live-run-${alarmed.tag}-alarm-count`).innerText()).toBe(
      '1 open alarm, acknowledged',
    );
    await page.screenshot({ path: `${shots}/C-board-wide.png` });
    await page.goto(`${baseUrl}/alarms?meterRunId=${alarmed.id}&state=open`);
    await page.getByTestId(`alarm-row-${alarmId}`).waitFor();
    await page.screenshot({ path: `${shots}/C-alarms-wide.png` });
    await page.close();
  });
});
