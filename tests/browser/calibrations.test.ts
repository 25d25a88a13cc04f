/**
 * A transmitter's calibrations in the browser: an engineer on a phone records a calibration of a
 * DP transmitter (0–50 kPa) with its certificate and sees it in the transmitter's history, with
 * each point's error in % of span as the server computed it: (25.06 − 25) / 50 × 100 = 0.12 %,
 * over a 0.1 % tolerance (IEC 61298-2's error in percent of span, worked by hand). That failed
 * as-found then offers a correction, which the engineer proposes; it waits for another person.
 */
import { client, createMeterRun, signIn as apiSignIn, type Client } from '../support/api';
import { baseUrl, demoEmail, freshPage, launchBrowser, openWith, signIn, type TestBrowser } from './support';

type Locator = Parameters<typeof openWith>[0];

/**
 * Presses a button that sends something (and is busy, so inactive, while it does) until `done`
 * shows: `openWith`'s press-again for late-moving content, but never pressing while the button is
 * busy or gone, so a slow answer is waited for, not sent twice.
 */
async function sendWith(button: Locator, done: Locator, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if ((await button.isVisible()) && (await button.isEnabled())) await button.click({ timeout: 2000 }).catch(() => {});
    try {
      await done.waitFor({ timeout: 3000 });
      return;
    } catch (err) {
      if (Date.now() > deadline) throw err;
    }
  }
}

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

    await openWith(page.getByTestId('calibration-record'), page.getByTestId('calibration-date'));
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
    // The submit button hides once the calibration is recorded, and is busy (inactive) while it is sent.
    await sendWith(page.getByTestId('calibration-submit'), page.getByTestId('calibration-recorded'));
    const history = page.getByTestId('calibration-history');
    await history.getByText('10 Jun 2026 · Northgate Instrument Laboratory').waitFor();
    await history.getByText('+0.120 % of span', { exact: false }).waitFor();
    await expect(history.getByText('As found: ⚑ fail', { exact: false }).count()).resolves.toBe(1);
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

    // The failed as-found offers a correction; the prefilled proposal is submitted as an ordinary one.
    const calibrationId = (list.body[0] as unknown as { id: string }).id;
    await sendWith(
      page.getByTestId(`calibration-propose-correction-${calibrationId}`),
      page.getByTestId('correction-form'),
    );
    await expect(page.getByTestId('correction-factor').inputValue()).resolves.toMatch(/^0\.999/);
    await expect(page.getByTestId('correction-reason').inputValue()).resolves.toContain('failed its as-found');
    await sendWith(
      page.getByTestId('correction-submit'),
      page.getByTestId(`calibration-correction-proposed-${calibrationId}`),
    );
    const corrections = await api.get<{ status: string; kind: string; factor: number; reason: string }[]>(
      `/api/corrections?meterRunId=${f.meterRun.id}`,
    );
    expect(corrections.status).toBe(200);
    expect(corrections.body).toHaveLength(1);
    expect(corrections.body[0]).toMatchObject({ status: 'proposed', kind: 'adjust' });
    expect(corrections.body[0].reason).toContain('failed its as-found calibration on 2026-06-10');
    const shots = process.env.TALLYRUN_SHOTS_DIR;
    if (shots) await page.screenshot({ path: `${shots}/transmitter-phone.png`, fullPage: true });

    // The meter-run screen's calibration column reads the latest calibration: its due date, its date and as-found.
    const wide = await freshPage(browser, 'wide');
    await signIn(wide, demoEmail('engineer'));
    await wide.goto(`${baseUrl}/meter-runs/${f.meterRun.id}`);
    const last = wide.getByTestId(`transmitter-last-calibration-${f.dp.tag}`);
    await last.getByText('calibrated 2026-06-10 · as found ⚑ fail').waitFor();
    await wide.getByTestId(`transmitter-row-${f.dp.tag}`).getByText('2027-06-10', { exact: false }).first().waitFor();
    if (shots) await wide.screenshot({ path: `${shots}/meter-run-wide.png`, fullPage: true });
  });
});
