/**
 * Time and codes in words, and no dead ends (issue 14 items 6 and 7), against the real server: an
 * engineer changes a meter run's gap limit through the API; on a 390 × 844 phone the audit log
 * says who (by name) changed what from what to what, with the raw JSON only behind "Details"; the
 * admin's mail outbox says who gets mail for which priorities; the Totals tab shows each meter
 * run's latest contract days and leads to its daily totals; a finished import links to the meter
 * runs it touched; a device credential says which broker to publish to. Screenshots at both sizes
 * go to /work/notes/round10/shots.
 */
import fs from 'node:fs';

import { client, createMeterRun, signIn as apiSignIn, unique, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
let engineer: Client;
let run: Awaited<ReturnType<typeof createMeterRun>>;
let eventId: string;
let engineerName: string;
const shots = process.env.TALLYRUN_SHOTS ?? '/work/notes/round10/shots';

beforeAll(async () => {
  fs.mkdirSync(shots, { recursive: true });
  engineer = client(await apiSignIn(demoEmail('engineer')));
  [browser, run] = await Promise.all([launchBrowser(), createMeterRun(engineer)]);
  const first = await engineer.patch(`/api/meter-runs/${run.meterRun.id}`, { maxGapS: 300 });
  if (first.status !== 200) throw new Error(`gap limit: ${first.status} ${JSON.stringify(first.body)}`);
  const second = await engineer.patch(`/api/meter-runs/${run.meterRun.id}`, { maxGapS: 600 });
  if (second.status !== 200) throw new Error(`gap limit: ${second.status} ${JSON.stringify(second.body)}`);
  const events = await engineer.get(`/api/audit-events?meterRunId=${run.meterRun.id}&kind=configuration`);
  const updates = (events.body as { id: string; action: string; actorName: string }[]).filter(
    (e) => e.action === 'meter-run.update',
  );
  eventId = updates[0].id;
  engineerName = updates[0].actorName;
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

describe('time and codes in words', () => {
  it('shows a gap limit change in the audit log as a sentence and a field diff on a phone, JSON only under Details', async () => {
    for (const size of ['phone', 'wide'] as const) {
      const page = await freshPage(browser, size);
      await signIn(page, demoEmail('engineer'));
      await page.goto(`${baseUrl}/audit`);
      const sentence = page.getByTestId(`audit-sentence-${eventId}`);
      await sentence.waitFor();
      // The update also records a second field (shown in the diff), so the sentence counts them.
      const said = await sentence.innerText();
      expect(said).toMatch(
        new RegExp(`changed (2 fields of meter run ${run.meterRun.tag}|meter run ${run.meterRun.tag}'s gap limit)`),
      );
      // Who, by name: the e-mail is not the subject of the sentence.
      expect(said).not.toMatch(/^\S+@/);
      expect(said.startsWith(engineerName)).toBe(true);
      expect(await page.getByTestId(`audit-diff-${eventId}`).innerText()).toContain('gap limit: 5 min → 10 min');
      const row = page.getByTestId(`audit-event-${eventId}`);
      expect(await row.innerText()).not.toContain('"maxGapS"');
      await row.getByRole('button', { name: 'Details' }).click();
      await row.getByText('"maxGapS": 600').waitFor();
      await row.scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/D-audit-${size}.png` });
      await signOut(page);
      await page.close();
    }
  });

  it('says in the mail outbox who gets mail for which priorities', async () => {
    for (const size of ['phone', 'wide'] as const) {
      const page = await freshPage(browser, size);
      await signIn(page, demoEmail('admin'));
      await page.goto(`${baseUrl}/mail`);
      const rule = page.getByTestId('mail-rule');
      await rule.waitFor();
      expect(await rule.innerText()).toMatch(
        /Mail goes to the (\d+ engineers?|engineers \(there are none yet\)) for each new high- or medium-priority alarm/,
      );
      await page.screenshot({ path: `${shots}/D-mail-${size}.png` });
      await signOut(page);
      await page.close();
    }
  });
});

describe('no dead ends', () => {
  it("shows each meter run's latest contract days on the operator's Totals tab, leading to its daily totals", async () => {
    for (const size of ['phone', 'wide'] as const) {
      const page = await freshPage(browser, size);
      await signIn(page, demoEmail('operator'));
      await page.goto(`${baseUrl}/totals`);
      await choose(page.getByTestId(`monthly-site-${run.site.id}`));
      const card = page.getByTestId(`latest-days-${run.meterRun.tag}`);
      await card.waitFor();
      await card.getByTestId(`latest-days-${run.meterRun.tag}-yesterday`).waitFor();
      // The test site is in America/Denver with a 09:00 contract hour: in December it is on MST (UTC−7).
      expect(await card.innerText()).toMatch(
        /Contract day \d{1,2} \w{3} \d{4}, 09:00 \d{1,2} \w{3} – 09:00 \d{1,2} \w{3} M[SD]T/,
      );
      await page.getByTestId('latest-contract-days').scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/D-totals-${size}.png` });
      await card.getByTestId(`latest-days-${run.meterRun.tag}-link`).click();
      await page.waitForURL(new RegExp(`/meter-runs/${run.meterRun.id}$`));
      await page.getByTestId('daily-totals').waitFor();
      await signOut(page);
      await page.close();
    }
  });

  it('links a finished import to the meter runs it touched', async () => {
    const csv = `time,tag,value\n2025-05-06T07:08:00.000Z,${run.dp.tag},12.5\n`;
    const started = await engineer.upload('/api/imports', `touched-${unique()}.csv`, csv, { kind: 'readings' });
    expect(started.status).toBe(202);
    let detail: { status: string; meterRuns?: { id: string; tag: string }[] } = { status: 'running' };
    for (const end = Date.now() + 60_000; detail.status === 'running' && Date.now() < end;) {
      await new Promise((r) => setTimeout(r, 200));
      detail = (await engineer.get(`/api/imports/${started.body.id}`)).body;
    }
    expect(detail.status).toBe('done');
    expect(detail.meterRuns).toEqual([{ id: String(run.meterRun.id), tag: run.meterRun.tag }]);
    for (const size of ['phone', 'wide'] as const) {
      const page = await freshPage(browser, size);
      await signIn(page, demoEmail('engineer'));
      await page.goto(`${baseUrl}/imports`);
      await page.getByTestId(`import-row-${started.body.id}`).click();
      const link = page.getByTestId(`import-meter-run-${run.meterRun.id}`);
      await link.waitFor();
      expect(await link.innerText()).toContain(run.meterRun.tag);
      await link.scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/D-import-${size}.png` });
      await link.click();
      await page.waitForURL(new RegExp(`/meter-runs/${run.meterRun.id}$`));
      await signOut(page);
      await page.close();
    }
  });

  it('tells a new device credential which broker host and port to publish to', async () => {
    const admin = client(await apiSignIn(demoEmail('admin')));
    const created = await admin.post('/api/devices', { name: `Flow computer ${unique()}`, siteId: run.site.id });
    expect(created.status).toBe(201);
    // No external broker in the tests: the embedded one, on the host the request came to.
    const host = new URL(baseUrl).hostname;
    expect(created.body.broker.url).toMatch(new RegExp(`^mqtt://${host.replace(/\./g, '\\.')}:\\d+$`));
    if (process.env.TALLYRUN_MQTT_PORT)
      expect(created.body.broker.url).toBe(`mqtt://${host}:${process.env.TALLYRUN_MQTT_PORT}`);
    const listed = (await admin.get('/api/devices')).body as { username: string; broker: { url: string } }[];
    expect(listed.find((d) => d.username === created.body.username)?.broker).toEqual(created.body.broker);
    for (const size of ['phone', 'wide'] as const) {
      const page = await freshPage(browser, size);
      await signIn(page, demoEmail('admin'));
      await page.goto(`${baseUrl}/devices`);
      const broker = page.getByTestId(`device-row-${created.body.username}-broker`);
      await broker.waitFor();
      expect(await broker.innerText()).toBe(`Publishes to ${created.body.broker.url}`);
      await broker.scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${shots}/D-device-${size}.png` });
      await signOut(page);
      await page.close();
    }
  });
});
