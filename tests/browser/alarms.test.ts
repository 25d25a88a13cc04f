/**
 * The alarm banner, the alarm list and a meter run's alarm history against the real server.
 * An engineer makes a site, a meter run and its transmitters through the API and imports a CSV
 * of the last 40 minutes in which the DP sits at 5 % of its 0–50 kPa span after five minutes at
 * 40 %. With the default limits (below 10 % of span, on-delay 300 s; shared/alarms/alarm-limits.ts)
 * that raises one DP-low-in-range alarm, still active, which the browser then works on.
 */
import type { Page, Route } from 'playwright-core';

import { client, createMeterRun, settled, signIn as apiSignIn, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

const MIN = 60_000;

interface Fixture {
  engineer: Client;
  meterRun: { id: string; tag: string };
  dpTag: string;
  alarmId: string;
}

let browser: TestBrowser;
let f: Fixture;

async function makeLowInRangeAlarm(): Promise<Fixture> {
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  const run = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  // Whole minutes from 40 min ago to 2 min ago: DP 20 kPa (40 %) for 5 min, then 2.5 kPa (5 %).
  // Every signal wobbles a little so no transmitter looks frozen.
  const t0 = Math.floor((Date.now() - 40 * MIN) / MIN) * MIN;
  const lines = ['time,tag,value,quality'];
  for (let i = 0; i < 39; i++) {
    const iso = new Date(t0 + i * MIN).toISOString();
    const dpKPa = (i < 5 ? 20 : 2.5) + (i % 2) * 0.003;
    lines.push(
      `${iso},${run.dp.tag},${dpKPa},good`,
      `${iso},${run.pt.tag},${2 + (i % 3) * 0.0001},good`,
      `${iso},${run.tt.tag},${300 + (i % 2) * 0.01},good`,
    );
  }
  const started = await engineer.upload('/api/imports', 'low-in-range.csv', `${lines.join('\n')}\n`);
  if (started.status !== 202) throw new Error(`import: ${started.status} ${JSON.stringify(started.body)}`);
  await until('the import', async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done');
  await settled(engineer, run.meterRun.id);
  const alarm = await until(
    'the DP-low-in-range alarm',
    async () => (await engineer.get(`/api/alarms?meterRunId=${run.meterRun.id}&condition=dp-low-in-range`)).body[0],
    45_000,
  );
  return { engineer, meterRun: run.meterRun, dpTag: run.dp.tag, alarmId: alarm.id };
}

beforeAll(async () => {
  [browser, f] = await Promise.all([launchBrowser(), makeLowInRangeAlarm()]);
  // An import, the history worker and the alarm evaluator on a loaded 2-core machine: a ceiling, not a wait.
}, 180_000);
afterAll(async () => {
  await browser?.close();
});

const alarmState = async () => (await f.engineer.get(`/api/alarms/${f.alarmId}`)).body.state as string;

/** Waits until the row's state reads `words` (the list refreshes after each action). */
async function expectRowState(page: Page, words: string | RegExp) {
  await page.getByTestId(`alarm-state-${f.alarmId}`).filter({ hasText: words }).waitFor();
}

async function openRunAlarms(page: Page, state = 'open') {
  await page.goto(`${baseUrl}/alarms?meterRunId=${f.meterRun.id}&state=${state}`);
  await page.getByTestId(`alarm-row-${f.alarmId}`).waitFor();
}

describe('alarms on screen', () => {
  it('shows an operator the banner with the count, opens the list from it, and acknowledges with one tap (phone)', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    const banner = page.getByTestId('alarm-banner');
    await banner.waitFor();
    const count = Number(/(\d+) unacknowledged/.exec(await page.getByTestId('alarm-banner-count').innerText())?.[1]);
    expect(count).toBeGreaterThanOrEqual(1);
    // Priority by shape and word as well as colour: the medium alarm's badge reads "Medium n".
    expect(await page.getByTestId('alarm-banner-medium').innerText()).toMatch(/◆\s*Medium \d+/);
    await page.getByTestId('alarm-banner-message').waitFor();

    await banner.click();
    await page.waitForURL((url) => url.pathname === '/alarms');
    await page.getByTestId('alarm-list').waitFor();

    await openRunAlarms(page);
    const row = page.getByTestId(`alarm-row-${f.alarmId}`);
    const text = await row.innerText();
    expect(text).toContain('DP low in range');
    expect(text).toContain(f.meterRun.tag);
    expect(text).toContain(f.dpTag);
    expect(text).toMatch(/5\.0 % of its span/);
    await expectRowState(page, 'Active, unacknowledged');
    // Maintenance actions are for engineers and admins.
    expect(await page.getByTestId(`alarm-oos-${f.alarmId}`).count()).toBe(0);

    await page.getByTestId(`alarm-ack-${f.alarmId}`).click();
    await expectRowState(page, 'Active, acknowledged');
    expect(await page.getByTestId(`alarm-ack-${f.alarmId}`).count()).toBe(0);
    expect(await alarmState()).toBe('active-acknowledged');
    await signOut(page);
    await page.close();
  });

  it('lets an accountant read the list and the log but offers no acknowledge or shelve (wide)', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('accountant'));
    await page.getByTestId('alarm-banner').or(page.getByTestId('area-title')).first().waitFor();
    await openRunAlarms(page, 'all');
    await expectRowState(page, 'Active, acknowledged');
    expect(await page.getByTestId(`alarm-ack-${f.alarmId}`).count()).toBe(0);
    expect(await page.getByTestId(`alarm-shelve-${f.alarmId}`).count()).toBe(0);
    expect(await page.getByTestId(`alarm-oos-${f.alarmId}`).count()).toBe(0);

    // The state filter: the alarm is open, so "Normal (closed)" hides it and "Open" brings it back.
    await choose(page.getByTestId('alarm-filter-state-normal'));
    await page.getByTestId('alarm-empty').waitFor();
    // The filter is kept in the address, written by the router after the screen is drawn.
    await page.waitForURL((url) => url.searchParams.get('state') === 'normal');
    await choose(page.getByTestId('alarm-filter-state-open'));
    await page.getByTestId(`alarm-row-${f.alarmId}`).waitFor();

    await page.getByTestId(`alarm-log-toggle-${f.alarmId}`).click();
    const log = page.getByTestId(`alarm-log-${f.alarmId}`);
    await log.getByText(/Acknowledged · by operator@demo\.tallyrun/).waitFor();
    expect(await log.innerText()).toMatch(/Raised · by Tallyrun/);

    // The meter run's own screen lists its alarm history and links to the list.
    await page.goto(`${baseUrl}/meter-runs/${f.meterRun.id}`);
    await page.getByTestId(`meter-run-alarm-${f.alarmId}`).waitFor();
    const historyRow = await page.getByTestId(`meter-run-alarm-${f.alarmId}`).innerText();
    expect(historyRow).toContain('DP low in range');
    expect(historyRow).toContain('Active, acknowledged');
    expect(await page.getByTestId('meter-run-range-health-link').count()).toBe(0);
    await page.getByTestId('meter-run-alarms-link').click();
    await page.waitForURL((url) => url.pathname === '/alarms' && url.searchParams.get('meterRunId') === f.meterRun.id);
    await page.getByTestId(`alarm-row-${f.alarmId}`).waitFor();
    await signOut(page);
    await page.close();
  });

  it('asks an operator for how long and why before shelving, then unshelves (phone)', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await openRunAlarms(page);
    await page.getByTestId(`alarm-shelve-${f.alarmId}`).click();
    await page.getByTestId('shelve-dialog').waitFor();
    // No reason: refused on the form, nothing sent.
    await page.getByTestId('shelve-confirm').click();
    await page.getByTestId('shelve-reason-error').waitFor();
    expect(await alarmState()).toBe('active-acknowledged');

    await choose(page.getByTestId('shelve-minutes-30'));
    await page.getByTestId('shelve-reason').fill('Transmitter being checked by the instrument tech');
    // The button names the chosen time on the render after the click.
    await page.getByTestId('shelve-confirm').filter({ hasText: 'Shelve for 30 min' }).waitFor();
    await page.getByTestId('shelve-confirm').click();
    await expectRowState(page, /^Shelved until /);
    expect(await page.getByTestId(`alarm-row-${f.alarmId}`).innerText()).toContain(
      'Shelved: Transmitter being checked by the instrument tech',
    );
    const shelved = (await f.engineer.get(`/api/alarms/${f.alarmId}`)).body;
    expect(shelved.state).toBe('shelved');
    // 30 minutes from now, give or take the round trip.
    expect(Math.abs(Date.parse(shelved.shelvedUntil) - Date.now() - 30 * MIN)).toBeLessThan(MIN);

    // The condition still holds, so unshelving annunciates it again (ISA-18.2).
    await page.getByTestId(`alarm-unshelve-${f.alarmId}`).click();
    await expectRowState(page, 'Active, unacknowledged');
    await signOut(page);
    await page.close();
  });

  it('says politely when someone else acknowledged first, and shows the alarm as it now is (phone)', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('operator'));
    await openRunAlarms(page);
    const ack = page.getByTestId(`alarm-ack-${f.alarmId}`);
    await ack.waitFor();
    // The list re-reads itself every 10 s; a re-read between the engineer's acknowledgement and
    // the operator's tap would take the button away before the tap. Such re-reads are held back
    // until the server has answered the tap, then go through to the server as they are.
    let releaseList = () => {};
    const listHeld = new Promise<void>((resolve) => (releaseList = resolve));
    const holdListReads = async (route: Route) => {
      if (route.request().method() === 'GET') await listHeld;
      await route.continue().catch(() => undefined); // the page may have given up on it meanwhile
    };
    const alarmList = (url: URL) => url.pathname === '/api/alarms';
    await page.route(alarmList, holdListReads);
    const tapAnswered = page.waitForResponse(
      (r) => r.request().method() === 'POST' && new URL(r.url()).pathname === `/api/alarms/${f.alarmId}/acknowledge`,
    );
    expect((await f.engineer.post(`/api/alarms/${f.alarmId}/acknowledge`)).status).toBe(200);
    await ack.click();
    expect((await tapAnswered).status()).toBe(409);
    // The screen shows the refusal once it has re-read the list, so let the re-reads go now.
    releaseList();
    await page.unroute(alarmList, holdListReads);
    const notice = page.getByTestId(`alarm-notice-${f.alarmId}`);
    await notice.waitFor();
    expect(await notice.innerText()).toMatch(/already acknowledged/);
    // Information, not an alarm: a status, not an alert.
    expect(await notice.getAttribute('role')).toBe('status');
    await expectRowState(page, 'Active, acknowledged');
    await signOut(page);
    await page.close();
  });

  it('lets an engineer take the alarm out of service with a reason and return it (wide)', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('engineer'));
    await openRunAlarms(page);
    await page.getByTestId(`alarm-oos-${f.alarmId}`).click();
    await page.getByTestId('out-of-service-confirm').click();
    await page.getByTestId('out-of-service-reason-error').waitFor();
    await page.getByTestId('out-of-service-reason').fill('DP transmitter removed for repair');
    await page.getByTestId('out-of-service-confirm').click();
    await expectRowState(page, 'Out of service');
    const returned = page.waitForResponse(
      (r) =>
        r.request().method() === 'POST' && new URL(r.url()).pathname === `/api/alarms/${f.alarmId}/return-to-service`,
    );
    await page.getByTestId(`alarm-rts-${f.alarmId}`).click();
    expect((await returned).status()).toBe(200);
    await expectRowState(page, 'Active, unacknowledged');
    // The log is read once it holds the return (the screen may be drawn before the list is re-read).
    type LoggedEvent = {
      id: string;
      action: string;
      userEmail: string | null;
      note: string | null;
      occurredAt: string;
    };
    const log = await until('the return to service in the alarm log', async () => {
      const list = (await f.engineer.get(`/api/alarms/${f.alarmId}/events`)).body as LoggedEvent[];
      return list.some((e) => e.action === 'returned-to-service') ? list : null;
    });
    // The log ends with the engineer's removal, with its reason, and the return. (It once came
    // back in the order of ids read as text, 1000 before 999; see server/sql-order.test.ts.)
    expect(log.slice(-2).map((e) => [e.action, e.note, e.userEmail])).toEqual([
      ['removed-from-service', 'DP transmitter removed for repair', demoEmail('engineer')],
      ['returned-to-service', null, demoEmail('engineer')],
    ]);
    await signOut(page);
    await page.close();
  });
});
