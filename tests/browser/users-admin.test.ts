/** The admin's users screen against the real API: add a person, see them listed, disable them. */
import { baseUrl, choose, freshPage, launchBrowser, signIn, signOut, demoEmail, type TestBrowser } from './support';

let browser: TestBrowser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('the users screen', () => {
  it('lets an admin add a user who then appears in the list, and disable them', async () => {
    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('admin'));
    await page.getByTestId('nav-users').click();
    await page.waitForURL((url) => url.pathname === '/users');
    await page.getByTestId('user-list').waitFor();

    const email = `field-tech-${Date.now()}@test.tallyrun`;
    await page.getByTestId('user-create-name').fill('Field Technician');
    await page.getByTestId('user-create-email').fill(email);
    await choose(page.getByTestId('user-create-role-engineer'));
    await page.getByTestId('user-create-password').fill('a-first-password-1');
    await page.getByTestId('user-create-submit').click();

    const row = page.getByTestId(`user-row-${email}`);
    await row.waitFor();
    const text = await row.innerText();
    expect(text).toContain('Field Technician');
    expect(text).toContain('Engineer');
    // Still there after a reload: it came from the server, not only from the form.
    await page.reload();
    await page.getByTestId(`user-row-${email}`).waitFor();

    await page.getByTestId(`user-disable-${email}`).click();
    await page.getByTestId(`user-disable-confirm-${email}`).click();
    await page.getByTestId(`user-enable-${email}`).waitFor();
    expect(await page.getByTestId(`user-status-${email}`).innerText()).toMatch(/Disabled/);

    await signOut(page);
    await page.close();
  });

  it('shows the reason when the server refuses a new user', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('admin'));
    await page.goto(`${baseUrl}/users`);
    await page.getByTestId('user-create-name').fill('Someone Twice');
    // The demo operator exists already; the server refuses a second account for an email.
    await page.getByTestId('user-create-email').fill(demoEmail('operator'));
    await page.getByTestId('user-create-password').fill('a-first-password-1');
    await page.getByTestId('user-create-submit').click();
    await page.getByTestId('user-create-email-error').waitFor();
    await signOut(page);
    await page.close();
  });
});
