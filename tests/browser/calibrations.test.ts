/**
 * A transmitter's calibrations in the browser: an engineer on a phone records a calibration of a
 * DP transmitter (0–50 kPa) with its certificate and sees it in the transmitter's history, with
 * each point's error in % of span as the server computed it: (25.06 − 25) / 50 × 100 = 0.12 %,
 * over a 0.1 % tolerance (IEC 61298-2's error in percent of span, worked by hand).
 */
import { client, createMeterRun, signIn as apiSignIn, type Client } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

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

describe('the transmitter calibrations screen', () => {
  it('lets an engineer on a phone record a calibration with a certificate and see it in the history', async () => {
    const f = await createMeterRun(api);
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/transmitters/${f.dp.id}`);
    await page.getByTestId('transmitter-calibrations').waitFor();
    await page.getByText('No calibration recorded yet.').first().waitFor();

    await page.getByTestId('calibration-record').click();
    await page.getByTestId('calibration-date').fill('2026-06-10');
    await page.getByTestId('calibration-laboratory').fill('Northgate Instrument Laboratory');
    await page.getByTestId('calibration-accreditation-number').fill('L-0412');
    await page.getByTestId('calibration-tolerance').fill('0.1');
    await page.getByTestId('calibration-as-found').fill('0 0.02\n25 25.06\n50 49.97');
    await page.getByTestId('calibration-as-left').fill('0 0\n25 25.01\n50 50');
    await page.getByTestId('calibration-performed-by').fill('R. Okafor');
    await page.getByTestId('calibration-next-due').fill('2027-06-10');
    const pdf = Buffer.from('%PDF-1.4\n% test certificate\n%%EOF\n');
    await page
      .getByTestId('certificate-file-input')
      .setInputFiles({ name: 'NIL-2026-0610.pdf', mimeType: 'application/pdf', buffer: pdf });
    await page.getByTestId('certificate-chosen').getByText('NIL-2026-0610.pdf', { exact: false }).waitFor();
    await page.getByTestId('calibration-submit').click();

    await page.getByTestId('calibration-recorded').waitFor();
    const history = page.getByTestId('calibration-history');
    await history.getByText('2026-06-10 · Northgate Instrument Laboratory').waitFor();
    await history.getByText('+0.120 % of span', { exact: false }).waitFor();
    await expect(history.getByText('As found: ▲ fail', { exact: false }).count()).resolves.toBe(1);
    await history.getByText('Certificate: NIL-2026-0610.pdf').waitFor();
    await expect(page.getByTestId('calibration-due').textContent()).resolves.toContain('2027-06-10');
    // The page fits the phone: nothing wider than the viewport.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);

    const list = await api.get<{ certificate: { contentType: string; sizeBytes: number } | null }[]>(
      `/api/transmitters/${f.dp.id}/calibrations`,
    );
    expect(list.status).toBe(200);
    expect(list.body[0].certificate).toMatchObject({ contentType: 'application/pdf', sizeBytes: pdf.length });
  });
});
