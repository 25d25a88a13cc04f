/**
 * The "Care due" screen against the real server and the demo data: the demo seed records the
 * transmitters' calibrations with KFG-102-DP overdue (SCENARIO.md) and KFG-201-DP due within the
 * alarms' 14-day window (server/seed/demo-care.ts), so the KFG list opens with the overdue item.
 */
import { mkdirSync } from 'node:fs';

import { client, signIn as apiSignIn } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, signOut, type TestBrowser } from './support';

const shots = '/tmp/shots-care-due';
let browser: TestBrowser;
let kfgSiteId: string;

beforeAll(async () => {
  mkdirSync(shots, { recursive: true });
  browser = await launchBrowser();
  const sites = (await client(await apiSignIn(demoEmail('engineer'))).get('/api/sites')).body as {
    id: string;
    code: string;
  }[];
  kfgSiteId = String(sites.find((s) => s.code === 'KFG')!.id);
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

describe('the care due screen', () => {
  it("lists the demo site's overdue calibration first, with a due-soon one after it (wide)", async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/care-due`);
    await choose(page.getByTestId(`care-due-site-${kfgSiteId}`));
    const first = page.getByTestId('care-due-row-0');
    await first.getByTestId('care-due-state-overdue').waitFor();
    expect(await first.innerText()).toContain('KFG-102-DP');
    await page.getByTestId('care-due-state-due-soon').first().waitFor();
    await page.screenshot({ path: `${shots}/care-due-1440x900.png` });
    // Latest first: the overdue item moves down, not-recorded items stay last.
    await choose(page.getByTestId('care-due-sort--due'));
    await page.getByTestId('care-due-row-0').getByTestId('care-due-state-ok').waitFor();
    await signOut(page);
    await page.close();
  });

  it('links a transmitter row to its transmitter screen on a phone', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('admin'));
    await page.goto(`${baseUrl}/care-due?siteId=${kfgSiteId}`);
    await page.getByTestId('care-due-row-0').getByTestId('care-due-state-overdue').waitFor();
    await page.screenshot({ path: `${shots}/care-due-390x844.png`, fullPage: true });
    await page.getByTestId('care-due-link-0').click();
    await page.waitForURL((url) => url.pathname.startsWith('/transmitters/'));
    await signOut(page);
    await page.close();
  });
});
