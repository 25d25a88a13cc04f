/**
 * The audit screen against the real server: an engineer makes two meter runs through the API
 * and re-ranges a transmitter of the first, then filters the audit log by that meter run and by
 * kind on a 390-px phone and sees only its configuration events; on a wide screen the filtered
 * log is exported as CSV, and the export shows up in the log as an export.
 */
import fs from 'node:fs';
import type { Page } from 'playwright-core';

import { client, createMeterRun, signIn as apiSignIn, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

let browser: TestBrowser;
let engineer: Client;
let a: Awaited<ReturnType<typeof createMeterRun>>;
let b: Awaited<ReturnType<typeof createMeterRun>>;
const shots = '/tmp/shots-E';

beforeAll(async () => {
  fs.mkdirSync(shots, { recursive: true });
  engineer = client(await apiSignIn(demoEmail('engineer')));
  [browser, a, b] = await Promise.all([launchBrowser(), createMeterRun(engineer), createMeterRun(engineer)]);
  const rerange = await engineer.patch(`/api/transmitters/${a.dp.id}`, { upperRange: 62.5 });
  if (rerange.status !== 200) throw new Error(`re-range: ${rerange.status} ${JSON.stringify(rerange.body)}`);
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

/** Opens the filters (folded on a phone) and narrows them to meter run A and the configuration kind. */
async function filterToRunA(page: Page) {
  if ((await page.getByTestId('audit-filters-open').count()) > 0) await page.getByTestId('audit-filters-open').click();
  await choose(page.getByTestId(`audit-filter-site-${a.site.id}`));
  await choose(page.getByTestId(`audit-filter-meter-run-${a.meterRun.id}`));
  await choose(page.getByTestId('audit-filter-kind-configuration'));
}

/** The ids of the events the list shows, read from their rows' test ids. */
const shownIds = (page: Page) =>
  page
    .locator('[data-testid^="audit-event-"]:not([data-testid$="-kind"])')
    .evaluateAll((rows) => rows.map((row) => (row.getAttribute('data-testid') ?? '').slice('audit-event-'.length)));

describe('the audit screen', () => {
  it('lets an engineer on a phone filter by meter run and kind and see only matching events', async () => {
    const expected = await engineer.get(`/api/audit-events?meterRunId=${a.meterRun.id}&kind=configuration`);
    const ids = (expected.body as { id: string }[]).map((e) => e.id);
    // At least the meter run, its three transmitters and the re-range (the run and what belongs to it).
    expect(ids.length).toBeGreaterThanOrEqual(5);

    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/audit`);
    await page.getByTestId('audit-filters-summary').waitFor();
    await filterToRunA(page);
    await page.getByTestId('audit-filters-close').click();
    expect(await page.getByTestId('audit-filters-summary').innerText()).toBe(
      `Showing: ${a.meterRun.tag} · Configuration · anyone · all time`,
    );
    await page.getByTestId(`audit-event-${ids[0]}`).waitFor();
    await page.waitForFunction((n) => document.querySelectorAll('[data-testid$="-kind"]').length === n, ids.length);
    expect(await shownIds(page)).toEqual(ids);
    const list = await page.getByTestId('audit-list').innerText();
    expect(list).toContain(`transmitter.update`);
    expect(list).not.toContain(`meter-run ${b.meterRun.id}`);
    expect(list).not.toContain(`site ${a.site.id}`);
    await page.screenshot({ path: `${shots}/audit-phone-filtered.png`, fullPage: true });
    await signOut(page);
    await page.close();
  });

  it('exports the filtered events as CSV on a wide screen, and the export is audited', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('accountant'));
    await page.goto(`${baseUrl}/audit`);
    await page.getByTestId('audit-filters').waitFor();
    await filterToRunA(page);
    await page.locator('[data-testid$="-kind"]').first().waitFor();
    await page.screenshot({ path: `${shots}/audit-wide-filtered.png`, fullPage: true });
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-export-csv').click()]);
    const file = await download.path();
    const text = fs.readFileSync(file, 'utf8');
    expect(text.split('\r\n')[0]).toBe(
      'id,chain_seq,occurred_at,kind,action,entity_type,entity_id,actor_id,actor_email,reason,before,after,hash,previous_hash',
    );
    expect(text).toContain(',transmitter.update,transmitter,');
    expect(download.suggestedFilename()).toMatch(/^audit-events-\d{4}-\d\d-\d\d\.csv$/);

    // The export itself, by the accountant, with the filters used.
    await choose(page.getByTestId('audit-filter-site-'));
    await choose(page.getByTestId('audit-filter-kind-export'));
    const exported = page.locator('[data-testid$="-kind"]', { hasText: 'Export' }).first();
    await exported.waitFor();
    expect(await page.getByTestId('audit-list').innerText()).toContain('export.audit-events');
    await page.screenshot({ path: `${shots}/audit-wide-exports.png`, fullPage: true });
    await signOut(page);
    await page.close();
  });
});
