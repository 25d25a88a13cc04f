/**
 * Time and codes in words (issue 14 item 7), against the real server: an engineer changes a meter
 * run's gap limit through the API; on a 390 × 844 phone the audit log says who changed what from
 * what to what, with the raw JSON only behind "Details"; the admin's mail outbox says who gets
 * mail for which priorities. Screenshots at both sizes go to /work/notes/round10/shots.
 */
import fs from 'node:fs';

import { client, createMeterRun, signIn as apiSignIn, type Client } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
let engineer: Client;
let run: Awaited<ReturnType<typeof createMeterRun>>;
let eventId: string;
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
  const updates = (events.body as { id: string; action: string }[]).filter((e) => e.action === 'meter-run.update');
  eventId = updates[0].id;
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
      expect(await sentence.innerText()).toMatch(
        new RegExp(`changed (2 fields of meter run ${run.meterRun.tag}|meter run ${run.meterRun.tag}'s gap limit)`),
      );
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
