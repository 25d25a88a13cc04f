/**
 * Sign-in and the guards: a wrong password is refused with a message, signed-out visitors are
 * sent to sign in and brought back, and an area a role may not open says so when typed in.
 */
import {
  baseUrl,
  demoEmail,
  freshPage,
  launchBrowser,
  signIn,
  signOut,
  submitSignIn,
  type TestBrowser,
} from './support';

let browser: TestBrowser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('signing in', () => {
  it('shows an error and stays on the sign-in screen when the password is wrong', async () => {
    const page = await freshPage(browser, 'phone');
    // The second engineer signs in nowhere else here, which keeps each account's sign-ins
    // well under the server's per-account limit.
    await submitSignIn(page, 'engineer2@demo.tallyrun', 'not-the-password');
    const error = page.getByTestId('sign-in-error');
    await error.waitFor();
    expect((await error.innerText()).trim().length).toBeGreaterThan(0);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(await page.getByTestId('current-user').count()).toBe(0);
    await page.close();
  });

  it('states that Tallyrun does not replace licensed practice and local codes', async () => {
    const page = await freshPage(browser, 'wide');
    await page
      .locator('body')
      .filter({ hasText: /does not replace, licensed measurement practice and local codes/ })
      .waitFor();
    await page.close();
  });

  it('sends a signed-out visitor of a deep link to sign in, then on to the page they asked for', async () => {
    const page = await freshPage(browser, 'wide');
    await page.goto(`${baseUrl}/alarms`);
    await page.getByTestId('sign-in-email').waitFor();
    // The router writes the address after it draws the screen: wait for it rather than read it.
    await page.waitForURL((url) => url.pathname === '/sign-in');
    await signIn(page, 'engineer2@demo.tallyrun');
    await page.waitForURL((url) => url.pathname === '/alarms');
    await page.getByTestId('area-title').filter({ hasText: 'Alarms' }).waitFor();
    expect(await page.getByTestId('area-title').innerText()).toBe('Alarms');
    await signOut(page);
    await page.close();
  });
});

describe('an area typed in that the role may not open', () => {
  // From shared/DESIGN.md "Roles": users and the mail outbox are the admin's, set-up and
  // imports the engineer's and admin's; the operator has no audit log.
  it.each([
    ['operator', '/users'],
    ['operator', '/audit'],
    ['accountant', '/setup'],
    ['engineer', '/mail'],
  ] as const)('shows the %s a not-available message at %s', async (role, path) => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail(role));
    await page.goto(`${baseUrl}${path}`);
    await page.getByTestId('not-available').waitFor();
    expect(await page.getByTestId('not-available').innerText()).toMatch(/not available for your role/);
    expect(new URL(page.url()).pathname).toBe(path);
    // The way out works: the navigation still leads to the role's own areas.
    await page.getByTestId('nav-live').click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.getByTestId('not-available').waitFor({ state: 'detached' });
    await signOut(page);
    await page.close();
  });
});
