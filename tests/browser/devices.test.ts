/**
 * The admin's devices screen against the real server: issue MQTT credentials for a field
 * device, see its password once (with a way to copy it), never again after leaving it; then
 * disable and enable the device.
 */
import { client, signIn as apiSignIn, unique } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

let browser: TestBrowser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('the devices screen', () => {
  it.each(['wide', 'phone'] as const)(
    'lets an admin create a device and shows its password once (%s)',
    async (viewport) => {
      const engineer = client(await apiSignIn(demoEmail('engineer')));
      const code = `D${unique()}`;
      const site = await engineer.post('/api/sites', {
        code,
        name: 'Device test site',
        timeZone: 'America/Denver',
        contractHour: 9,
        basePressurePa: 101325,
        baseTemperatureK: 288.15,
        atmosphericPressurePa: 84000,
      });
      expect(site.status).toBe(201);

      const page = await freshPage(browser, viewport);
      await signIn(page, demoEmail('admin'));
      await page.goto(`${baseUrl}/devices`);
      await page.getByTestId('device-create').waitFor();

      // No site chosen: the form says so before asking the server.
      const name = `RTU ${unique()}`;
      await page.getByTestId('device-create-name').fill(name);
      await page.getByTestId('device-create-submit').click();
      await page.getByTestId('device-create-site-error').waitFor();

      await choose(page.getByTestId(`device-create-site-${site.body.id}`));
      await page.getByTestId('device-create-submit').click();
      await page.getByTestId('device-created').waitFor();
      const username = (await page.getByTestId('device-created-username').innerText()).trim();
      const password = (await page.getByTestId('device-created-password').innerText()).trim();
      expect(username.startsWith(code.toLowerCase())).toBe(true);
      expect(password.length).toBeGreaterThanOrEqual(16);
      expect(await page.getByTestId('device-created').innerText()).toMatch(/will not be shown again/);
      await page.getByTestId('device-created-copy').waitFor();
      if (viewport === 'wide') await page.screenshot({ path: '/tmp/tallyrun-devices-created-wide.png' });

      // Once stored, it is gone: not on the screen, not after a reload, not from the API.
      await page.getByTestId('device-created-done').click();
      await page.getByTestId('device-create').waitFor();
      const row = page.getByTestId(`device-row-${username}`);
      await row.waitFor();
      expect(await page.locator('body').innerText()).not.toContain(password);
      await page.reload();
      await page.getByTestId(`device-row-${username}`).waitFor();
      expect(await page.locator('body').innerText()).not.toContain(password);
      const listed = (await client(await apiSignIn(demoEmail('admin'))).get('/api/devices')).body as Record<
        string,
        unknown
      >[];
      expect(JSON.stringify(listed)).not.toContain(password);

      expect(await page.getByTestId(`device-row-${username}-counts`).innerText()).toBe(
        '0 readings accepted · 0 rejected',
      );
      await page.getByTestId(`device-row-${username}-disable`).click();
      await page.getByTestId(`device-row-${username}-disable-confirm`).click();
      await page.getByTestId(`device-row-${username}-enable`).waitFor();
      expect(await page.getByTestId(`device-row-${username}-status`).innerText()).toMatch(/Disabled/);
      await page.getByTestId(`device-row-${username}-enable`).click();
      await page.getByTestId(`device-row-${username}-disable`).waitFor();
      expect(await page.getByTestId(`device-row-${username}-status`).innerText()).toBe('Enabled');
      await page.close();
    },
  );
});
