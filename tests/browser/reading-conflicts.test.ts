/**
 * Conflicting readings on the imports screen, on a phone, against the real server: a reading
 * imported again for the same time with another value is listed with both values and sources;
 * resolving it asks for a reason, and once resolved it leaves the list (the stored value stays
 * the first one).
 */
import { client, createMeterRun, signIn as apiSignIn, unique, type Client } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

async function importCsv(csv: string) {
  const started = await api.upload('/api/imports', `conflict-${unique()}.csv`, csv, { kind: 'readings' });
  expect(started.status).toBe(202);
  for (const end = Date.now() + 60_000; Date.now() < end;) {
    const got = await api.get(`/api/imports/${started.body.id}`);
    if (got.body.status !== 'running') return got.body;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`import ${started.body.id} did not finish`);
}

it('lists a conflicting reading on a phone and resolves it with a reason', async () => {
  const f = await createMeterRun(api);
  const time = '2025-05-06T07:08:00.000Z';
  const first = await importCsv(`time,tag,value\n${time},${f.dp.tag},12.5\n`);
  const second = await importCsv(`time,tag,value\n${time},${f.dp.tag},12.75\n`);
  expect(second).toMatchObject({ duplicates: 1, conflicts: 1, rejected: 0 });
  const listed = await api.get(`/api/reading-conflicts?meterRunId=${f.meterRun.id}&status=open`);
  expect(listed.body).toHaveLength(1);
  const conflictId = listed.body[0].id;

  const page = await freshPage(browser, 'phone');
  await signIn(page, demoEmail('engineer'));
  await page.goto(`${baseUrl}/imports`);
  const row = page.getByTestId(`reading-conflict-${conflictId}`);
  await row.waitFor();
  expect(await row.innerText()).toContain(f.dp.tag);
  expect(await page.getByTestId(`reading-conflict-${conflictId}-stored`).innerText()).toBe(
    `Kept: 12.5 kPa from import ${first.id}`,
  );
  expect(await page.getByTestId(`reading-conflict-${conflictId}-offered`).innerText()).toMatch(
    new RegExp(`^Re-sent: 12\\.75 kPa from import ${second.id}, `),
  );
  // Nothing on the page is wider than the phone.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
    page.viewportSize()!.width,
  );
  await row.scrollIntoViewIfNeeded();
  await page.screenshot({ path: '/tmp/tallyrun-reading-conflicts-phone.png' });

  await page.getByTestId(`reading-conflict-${conflictId}-resolve`).click();
  await page.getByTestId('reading-conflict-resolve-confirm').click();
  // No reason: nothing is sent, and the missing reason is named.
  await page.getByText('Give the reason the conflict is settled.').waitFor();
  expect((await api.get(`/api/reading-conflicts?meterRunId=${f.meterRun.id}&status=open`)).body).toHaveLength(1);

  await page.getByTestId('reading-conflict-resolve-reason').fill('the first value matches the logger');
  await page.getByTestId('reading-conflict-resolve-confirm').click();
  await row.waitFor({ state: 'detached' });

  const resolved = await api.get(`/api/reading-conflicts?meterRunId=${f.meterRun.id}&status=resolved`);
  expect(resolved.body).toEqual([
    expect.objectContaining({ id: conflictId, resolution: 'the first value matches the logger' }),
  ]);
  const stored = await api.get(
    `/api/readings?transmitterId=${f.dp.id}&from=${time}&to=${new Date(Date.parse(time) + 1).toISOString()}`,
  );
  expect(stored.body.map((r: { value: number }) => r.value)).toEqual([12.5]);
  await page.close();
});
