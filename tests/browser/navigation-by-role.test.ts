/**
 * Each role, on a phone and on a wide screen, is offered exactly the areas the product design
 * gives it, sees who is signed in, and can sign out.
 */
import type { Page } from 'playwright-core';

import {
  baseUrl,
  demoEmail,
  freshPage,
  launchBrowser,
  offeredAreas,
  signIn,
  signOut,
  type Role,
  type TestBrowser,
  type ViewportName,
} from './support';

// Written out from shared/DESIGN.md "Roles" and the Foundation issue's list of areas, not
// imported from the client, so a slip in the client's own table shows up here:
// everyone: live view, meter runs, alarms, totals; engineer and admin: imports, set-up (sites,
// meter runs, transmitters, calibrations), range check, range health, corrections; engineer, accountant and
// admin: audit log (read); admin only: users, device credentials, mail outbox.
const allAreas = [
  'live',
  'meter-runs',
  'alarms',
  'totals',
  'imports',
  'setup',
  'range-check',
  'range-health',
  'care-due',
  'corrections',
  'audit',
  'users',
  'devices',
  'mail',
];
const expectedAreas: Record<Role, string[]> = {
  operator: ['live', 'meter-runs', 'alarms', 'totals'],
  engineer: [
    'live',
    'meter-runs',
    'alarms',
    'totals',
    'imports',
    'setup',
    'range-check',
    'range-health',
    'care-due',
    'corrections',
    'audit',
  ],
  accountant: ['live', 'meter-runs', 'alarms', 'totals', 'audit'],
  admin: allAreas,
};
// The role names the header shows (the client's wording for the four roles of DESIGN.md).
const roleWords: Record<Role, string> = {
  operator: 'Operator',
  engineer: 'Engineer',
  accountant: 'Accountant',
  admin: 'Administrator',
};

let browser: TestBrowser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const cases: [Role, ViewportName][] = (['operator', 'engineer', 'accountant', 'admin'] as const).flatMap((role) =>
  (['phone', 'wide'] as const).map((viewport): [Role, ViewportName] => [role, viewport]),
);

describe.each(cases)('the %s on a %s screen', (role, viewport) => {
  let page: Page;
  beforeEach(async () => {
    page = await freshPage(browser, viewport);
  });
  afterEach(async () => {
    await page.close();
  });

  it('is offered exactly the areas of their role, sees their name and role, and signs out', async () => {
    await signIn(page, demoEmail(role));
    // The router writes the address after it draws the screen: wait for it rather than read it.
    await page.waitForURL((url) => url.pathname === '/');

    const who = (await page.getByTestId('current-user').innerText()).trim();
    expect(who).toContain(roleWords[role]);
    expect(who.replace(roleWords[role], '').trim().length).toBeGreaterThan(0);

    const offered = await offeredAreas(page);
    expect([...offered].sort()).toEqual([...expectedAreas[role]].sort());
    for (const forbidden of allAreas.filter((area) => !expectedAreas[role].includes(area))) {
      expect(await page.getByTestId(`nav-${forbidden}`).count()).toBe(0);
    }

    await signOut(page);
    await page.waitForURL((url) => url.pathname === '/sign-in');
    // The session is gone, not just hidden: the live board sends us back to sign in.
    await page.goto(`${baseUrl}/`);
    await page.getByTestId('sign-in-email').waitFor();
    await page.waitForURL((url) => url.pathname === '/sign-in');
  });
});

describe('moving between areas', () => {
  it('opens an area from the phone navigation and names it in the header', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.getByTestId('nav-alarms').click();
    await page.waitForURL((url) => url.pathname === '/alarms');
    // The header names the area on the render after the address changes.
    const title = page.getByTestId('area-title');
    await title.filter({ hasText: 'Alarms' }).waitFor();
    expect(await title.innerText()).toBe('Alarms');

    await page.getByTestId('nav-more').click();
    await page.getByTestId('nav-audit').click();
    await page.waitForURL((url) => url.pathname === '/audit');
    await title.filter({ hasText: 'Audit log' }).waitFor();
    expect(await title.innerText()).toBe('Audit log');
    // The menu closes once an area is chosen.
    await page.getByTestId('more-menu').waitFor({ state: 'detached' });

    await signOut(page);
    await page.close();
  });
});
