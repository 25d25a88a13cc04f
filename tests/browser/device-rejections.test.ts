/**
 * The devices screen shows why a device's readings were refused (issue 12 §12): a message with
 * bad readings, sent over the real broker, ends as counts by reason and the latest refusals.
 */
import mqtt from 'mqtt';
import { client, createMeterRun, mqttPort, signIn as apiSignIn, until } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, openWith, signIn, type TestBrowser } from './support';

let browser: TestBrowser;
let username: string;
beforeAll(async () => {
  browser = await launchBrowser();
  const engineer = client(await apiSignIn(demoEmail('engineer')));
  const admin = client(await apiSignIn(demoEmail('admin')));
  const f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
  const device = (await admin.post('/api/devices', { name: 'Refusal test RTU', siteId: f.site.id })).body;
  username = device.username;
  const c = await new Promise<mqtt.MqttClient>((resolve, reject) => {
    const m = mqtt.connect({
      host: '127.0.0.1',
      port: mqttPort,
      protocolVersion: 4,
      username: device.username,
      password: device.password,
      reconnectPeriod: 0,
    });
    m.once('connect', () => resolve(m));
    m.once('error', reject);
  });
  const now = Date.now();
  await new Promise<void>((resolve, reject) =>
    c.publish(
      `tallyrun/${f.site.code}/${f.dp.tag}`,
      JSON.stringify([
        { t: now - 60_000, v: 4, q: 'good' },
        { t: now - 50_000, v: 'high' },
        { t: now - 40_000, v: null },
        { t: '2026-11-01T10:00:00', v: 1 },
      ]),
      { qos: 1 },
      (err) => (err ? reject(err) : resolve()),
    ),
  );
  c.end(true);
  await until('the refusals to be stored', async () => {
    const r = await admin.get(`/api/devices/${device.id}/rejections`);
    return r.body.latest.length >= 3 ? r.body : null;
  });
});
afterAll(async () => {
  await browser?.close();
});

it.each(['wide', 'phone'] as const)(
  'shows counts by reason and the latest refusals of a device (%s)',
  async (viewport) => {
    const page = await freshPage(browser, viewport);
    await signIn(page, demoEmail('admin'));
    await page.goto(`${baseUrl}/devices`);
    const row = page.getByTestId(`device-row-${username}`);
    await row.waitFor();
    await row.scrollIntoViewIfNeeded();
    const panel = page.getByTestId(`device-row-${username}-refusals`);
    await openWith(page.getByTestId(`device-row-${username}-refusals-toggle`), panel);
    expect(await page.getByTestId(`device-row-${username}-refusals-count-value`).innerText()).toMatch(/^2 × value/);
    expect(await page.getByTestId(`device-row-${username}-refusals-count-time`).innerText()).toMatch(/^1 × time/);
    const text = await panel.innerText();
    expect(text).toMatch(/reading #2/);
    expect(text).toMatch(/reading #4/);
    await panel.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `/tmp/shots-broker-isolation/device-refusals-${viewport}.png` });
  },
);
