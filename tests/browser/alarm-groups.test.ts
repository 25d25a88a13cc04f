/**
 * Consequential alarms and the monthly alarm performance on the alarms screen, against the real
 * server. The alarm history is written by hand into the server's database (one site outage: three
 * transmitters stale within 90 s; and a flood of 11 raises last month), so the screen has a known
 * group and known measures to show. Screenshots at 390 and 1440 go to /tmp/shots-P.
 */
import { Pool } from 'pg';

import { client, createMeterRun, signIn as apiSignIn } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

const SHOTS = '/tmp/shots-P';
let browser: TestBrowser;
let pool: Pool;
let siteId: string;
const ids: string[] = [];

async function insertAlarm(
  meterRunId: string,
  transmitterId: string,
  condition: string,
  raisedAt: Date,
  open: boolean,
) {
  const { rows } = await pool.query<{ id: string }>(
    `INSERT INTO alarms (meter_run_id, transmitter_id, condition, priority, state, condition_active, onset_at, raised_at,
                         cleared_at, message, notify_status)
     VALUES ($1, $2, $3, 'high', $4, $5, $6, $6, $7, 'No reading for 5 min (hand-built)', 'not-needed') RETURNING id::text`,
    [
      meterRunId,
      transmitterId,
      condition,
      open ? 'active-unacknowledged' : 'normal',
      open,
      raisedAt,
      open ? null : new Date(raisedAt.getTime() + 5 * 60_000),
    ],
  );
  await pool.query(
    `INSERT INTO alarm_events (alarm_id, occurred_at, action, to_state) VALUES ($1, $2, 'raised', 'active-unacknowledged')`,
    [rows[0].id, raisedAt],
  );
  return rows[0].id;
}

beforeAll(async () => {
  pool = new Pool({ connectionString: process.env.TALLYRUN_E2E_DATABASE_URL });
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  const run = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  siteId = String(run.site.id);
  const t0 = Math.floor((Date.now() - 20 * 60_000) / 60_000) * 60_000;
  // The outage: DP stale first, PT stale 30 s later, TT bad quality 90 s later.
  ids.push(await insertAlarm(run.meterRun.id, run.dp.id, 'stale', new Date(t0), true));
  ids.push(await insertAlarm(run.meterRun.id, run.pt.id, 'stale', new Date(t0 + 30_000), true));
  ids.push(await insertAlarm(run.meterRun.id, run.tt.id, 'bad-quality', new Date(t0 + 90_000), true));
  // Last month: 11 raises of the DP frozen point in one 10-minute period (a flood, and chattering).
  const now = new Date();
  const start = Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 3, 8);
  for (let i = 0; i < 11; i++)
    await insertAlarm(run.meterRun.id, run.dp.id, 'frozen', new Date(start + i * 20_000), false);
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await pool?.end();
});

describe('consequential alarms and alarm performance on the alarms screen', () => {
  for (const viewport of ['phone', 'wide'] as const) {
    it(`shows the outage as one first-out with +2 consequential and last month's measures (${viewport})`, async () => {
      const page = await freshPage(browser, viewport);
      await signIn(page, demoEmail('accountant'));
      await page.goto(`${baseUrl}/alarms?siteId=${siteId}&state=open`);
      const toggle = page.getByTestId(`alarm-group-toggle-${ids[0]}`);
      await toggle.waitFor();
      expect(await toggle.innerText()).toContain('+2 consequential');
      expect(await page.getByTestId(`alarm-row-${ids[1]}`).count()).toBe(0);
      await toggle.click();
      await page.getByTestId(`alarm-row-${ids[2]}`).waitFor();
      const performance = page.getByTestId('alarm-performance');
      await performance.waitFor();
      await page.getByTestId('alarm-performance-chattering').waitFor();
      const text = await performance.innerText();
      expect(text).toMatch(/Peak alarms per operator in one 10 min[\s\S]*11/);
      await performance.scrollIntoViewIfNeeded();
      await performance.screenshot({ path: `${SHOTS}/alarm-performance-${viewport === 'phone' ? 390 : 1440}.png` });
      await page.screenshot({
        path: `${SHOTS}/alarms-groups-performance-${viewport === 'phone' ? 390 : 1440}.png`,
        fullPage: true,
      });
    });
  }

  it('lets an operator acknowledge the whole group, each alarm with its own log line', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('operator'));
    await page.goto(`${baseUrl}/alarms?siteId=${siteId}&state=open`);
    const button = page.getByTestId(`alarm-group-acknowledge-${ids[0]}`);
    await button.waitFor();
    await button.click();
    const api = client(await apiSignIn(demoEmail('operator')));
    for (const id of ids) {
      // Acknowledged (or normal, had the condition cleared meanwhile): either way, one log line each.
      const acknowledged = async () =>
        ((await api.get(`/api/alarms/${id}/events`)).body as { action: string }[]).filter(
          (e) => e.action === 'acknowledged',
        ).length;
      for (let tries = 0; tries < 50 && (await acknowledged()) === 0; tries++)
        await new Promise((r) => setTimeout(r, 200));
      expect(await acknowledged()).toBe(1);
      expect(['active-acknowledged', 'normal']).toContain((await api.get(`/api/alarms/${id}`)).body.state);
    }
  });
});
