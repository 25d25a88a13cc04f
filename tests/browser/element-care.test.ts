/**
 * Element care in the browser (issue 11 §3): an engineer on a phone records a gas analysis
 * sampled a week ago, on the site's clock, with a PNG certificate (the PNG signature of ISO/IEC
 * 15948 §5.2 followed by bytes), and sees it in the analyses history with its certificate and next
 * due date, and as a configuration version from its sample time in the configuration history.
 */
import crypto from 'node:crypto';
import { client, createMeterRun, signIn as apiSignIn, type Client } from '../support/api';
import {
  baseUrl,
  demoEmail,
  freshPage,
  launchBrowser,
  openWith,
  screenshotWhenSettled,
  signIn,
  type TestBrowser,
} from './support';

jest.setTimeout(120_000);

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

describe('the element care panels of the meter-run set-up screen', () => {
  it('let an engineer on a phone record a gas analysis with a PNG certificate and see it in both histories', async () => {
    const f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0 });
    // The run burns natural gas from well before the sample (the fixture's fluid is not natural gas).
    const gas = await api.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
      effectiveFrom: '2021-01-01T00:00:00Z',
      element: f.element,
      fluid: {
        kind: 'natural-gas',
        composition: { methane: 0.95, ethane: 0.03, propane: 0.005, nitrogen: 0.01, 'carbon-dioxide': 0.005 },
      },
      reason: 'natural gas before the analysis',
    });
    expect(gas.status).toBe(201);
    const sampleDate = new Date(Date.now() - 7 * 86_400_000).toISOString().slice(0, 10);
    const nextDue = new Date(Date.now() + 173 * 86_400_000).toISOString().slice(0, 10);

    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/setup?meterRun=${encodeURIComponent(f.meterRun.id)}`);
    const panel = page.getByTestId('gas-analyses');
    await panel.getByText('No gas analysis recorded.').waitFor();

    await page.getByTestId('gas-analysis-effectiveFrom').fill(sampleDate);
    await page.getByTestId('gas-analysis-effectiveTime').fill('08:00');
    await page.getByTestId('gas-analysis-laboratory').fill('Test gas laboratory');
    await page.getByTestId('gas-analysis-certificate').fill('GA-7');
    await page.getByTestId('gas-analysis-nextDue').fill(nextDue);
    await page
      .getByTestId('gas-analysis-components')
      .fill('methane 94\nethane 4\npropane 0.5\nnitrogen 1\ncarbon-dioxide 0.5');
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), crypto.randomBytes(64)]);
    await page
      .getByTestId('gas-analysis-certificate-file-input')
      .setInputFiles({ name: 'GA-7.png', mimeType: 'image/png', buffer: png });
    await page.getByTestId('gas-analysis-certificate-chosen').getByText('GA-7.png', { exact: false }).waitFor();
    await openWith(page.getByTestId('gas-analysis-submit'), page.getByTestId('gas-analysis-saved'));

    const list = await api.get<{ id: string; configVersionId: string; certificateFile: { contentType: string } }[]>(
      `/api/meter-runs/${f.meterRun.id}/gas-analyses`,
    );
    expect(list.status).toBe(200);
    expect(list.body).toHaveLength(1);
    const recorded = list.body[0];
    expect(recorded.certificateFile).toMatchObject({ contentType: 'image/png', sizeBytes: png.length });

    const line = page.getByTestId(`gas-analysis-${recorded.id}`);
    await line
      .getByText(`${Number(sampleDate.slice(8))} `, { exact: false })
      .first()
      .waitFor();
    await line.getByText('08:00 UTC · Test gas laboratory · certificate GA-7', { exact: false }).waitFor();
    await line.getByText('became a configuration version', { exact: false }).waitFor();
    // The due date in words, as every date on screen (shared/format/time.ts formatDate): "24 May 2027".
    const monthNames = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
    const dueWords = `${Number(nextDue.slice(8))} ${monthNames[Number(nextDue.slice(5, 7)) - 1]} ${nextDue.slice(0, 4)}`;
    await line.getByText(`Next due ${dueWords}`).waitFor();
    await page.getByTestId(`gas-analysis-${recorded.id}-certificate`).getByText('Certificate: GA-7.png').waitFor();
    const version = page.getByTestId(`version-row-${recorded.configVersionId}`);
    await version.getByText('08:00 UTC', { exact: false }).waitFor();
    // The page fits the phone: nothing wider than the viewport.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await line.screenshot({ path: '/tmp/shots-helperA/gas-analysis-line-phone.png' });
    await page.screenshot({ path: '/tmp/shots-helperA/setup-phone.png' });
    await page.setViewportSize({ width: 1440, height: 900 });
    await screenshotWhenSettled(panel, '/tmp/shots-helperA/gas-analyses-desktop.png');
    await screenshotWhenSettled(page.getByTestId('inspections'), '/tmp/shots-helperA/inspections-desktop.png');
  });
});
