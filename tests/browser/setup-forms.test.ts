/**
 * The set-up forms answer where the person is looking, on a 390 × 844 phone: after "Add site"
 * the error summary or the "Added" note is scrolled into view and focused; the time zone offers
 * IANA names for a typed city; US customary units show the base conditions in psia and °F; the
 * gas composition's unit switch converts what was typed once.
 * Expected values: 1 atm = 101325 Pa = 14.6959 psi (NIST SP 811 Appendix B.8, 1 psi =
 * 6894.757293168 Pa); 15 °C = 59 °F = 288.15 K (ISO 80000-5; t/°F = 1.8 t/°C + 32);
 * 1 mol % = 0.01 mole fraction (ISO 80000-1); America/Chicago from the IANA tz database.
 */
import type { Locator, Page } from 'playwright-core';

import { client, signIn as apiSignIn, unique, until, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

const shots = '/work/notes/round10/shots';

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

/** Whether the element is wholly inside the window, top to bottom. */
async function inViewport(element: Locator): Promise<boolean> {
  return element.evaluate((node) => {
    const box = node.getBoundingClientRect();
    return box.height > 0 && box.top >= 0 && box.bottom <= window.innerHeight;
  });
}

/** Whether the focused element is the one with this test id or inside it. */
async function focusIsIn(page: Page, testID: string): Promise<boolean> {
  return page.evaluate((id) => Boolean(document.activeElement?.closest(`[data-testid="${id}"]`)), testID);
}

async function openSetup(page: Page) {
  await signIn(page, demoEmail('engineer'));
  await page.goto(`${baseUrl}/setup`);
  await page.getByTestId('site-create').waitFor();
}

describe('the site form on a phone', () => {
  it('brings the focused error summary into view for a bad zone, offers America/Chicago, and then brings "Added" into view', async () => {
    const page = await freshPage(browser, 'phone');
    await openSetup(page);
    const code = `F${unique()}`;
    await page.getByTestId('site-create-code').fill(code);
    await page.getByTestId('site-create-name').fill('Forms test site');
    await page.getByTestId('site-create-timeZone').fill('Chicago');
    const submit = page.getByTestId('site-create-submit');
    await submit.scrollIntoViewIfNeeded();
    await submit.click();

    const summary = page.getByTestId('site-create-errors');
    await summary.waitFor();
    await until('the error summary to be focused and in view', async () => {
      return (await focusIsIn(page, 'site-create-errors-region')) && (await inViewport(summary));
    });
    expect(await summary.innerText()).toMatch(/Time zone: .*IANA/);
    await page.screenshot({ path: `${shots}/B-site-error-phone.png` });

    // The summary's line takes focus to the field; the field offers the zone for the city typed.
    await page.getByTestId('site-create-errors-go-timeZone').click();
    await until('the time zone field to be focused', () => focusIsIn(page, 'site-create-timeZone'));
    const option = page.getByTestId('site-create-timeZone-option-America-Chicago');
    await option.waitFor();
    await option.click();
    expect(await page.getByTestId('site-create-timeZone').inputValue()).toBe('America/Chicago');

    // US customary units: the base conditions follow, rounded for reading.
    await choose(page.getByTestId('site-create-displayUnits-us'));
    const basePressure = page.getByTestId('site-create-basePressurePa');
    await until('the base pressure in psia', async () => (await basePressure.inputValue()) === '14.696');
    expect(await page.getByTestId('site-create-baseTemperatureK').inputValue()).toBe('59');
    expect(await page.getByTestId('site-create-atmosphericPressurePa').inputValue()).toBe('14.696');
    expect(await page.getByTestId('site-create-basePressurePa-unit-psi').getAttribute('aria-checked')).toBe('true');
    expect(await page.getByTestId('site-create-baseTemperatureK-unit-degF').getAttribute('aria-checked')).toBe('true');
    await page.screenshot({ path: `${shots}/B-site-us-units-phone.png` });

    await submit.scrollIntoViewIfNeeded();
    await submit.click();
    const done = page.getByTestId('site-create-done');
    await done.waitFor();
    await until('the "Added" note to be focused and in view', async () => {
      return (await inViewport(done)) && (await page.evaluate(() => document.activeElement !== document.body));
    });
    expect(await done.innerText()).toContain(`Added ${code}`);
    expect(await page.getByTestId('site-create-done-open').innerText()).toContain(`Open ${code}`);
    await page.screenshot({ path: `${shots}/B-site-added-phone.png` });

    // Rounding for reading did not change what was stored: 101325 Pa and 288.15 K, as the form started.
    const site = ((await api.get('/api/sites')).body as Record<string, unknown>[]).find((s) => s.code === code);
    expect(site).toMatchObject({ timeZone: 'America/Chicago', displayUnits: 'us', basePressurePa: 101325 });
    expect(site!.baseTemperatureK as number).toBeCloseTo(288.15, 9);
    expect(site!.atmosphericPressurePa).toBe(101325);
  });
});

describe('the site form on a wide screen', () => {
  it('brings the error summary into view and focus after a bad zone', async () => {
    const page = await freshPage(browser, 'wide');
    await openSetup(page);
    await page.getByTestId('site-create-code').fill(`W${unique()}`);
    await page.getByTestId('site-create-name').fill('Wide forms test');
    await page.getByTestId('site-create-timeZone').fill('Chicago');
    await page.getByTestId('site-create-submit').click();
    const summary = page.getByTestId('site-create-errors');
    await summary.waitFor();
    await until('the error summary to be focused and in view', async () => {
      return (await focusIsIn(page, 'site-create-errors-region')) && (await inViewport(summary));
    });
    await page.screenshot({ path: `${shots}/B-site-error-wide.png` });
  });
});

describe('the composition unit switch', () => {
  it('turns 90, 5, 2 typed as mol % into mole fractions 0.9, 0.05, 0.02 and back, with the sum in its unit', async () => {
    const sites = (await api.get('/api/sites')).body as { id: string }[];
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/setup?site=${encodeURIComponent(sites[0].id)}`);
    await page.getByTestId('run-create').waitFor();
    await choose(page.getByTestId('run-create-fluid-kind-natural-gas'));
    await choose(page.getByTestId('run-create-fluid-compositionUnit-percent'));
    const field = (name: string) => page.getByTestId(`run-create-fluid-composition-${name}`);
    await field('methane').fill('90');
    await field('ethane').fill('5');
    await field('propane').fill('2');
    const sum = page.getByTestId('run-create-fluid-composition-sum');
    await until('the sum in mol %', async () => (await sum.innerText()) === 'Sum 97.00 mol %');

    await choose(page.getByTestId('run-create-fluid-compositionUnit-fraction'));
    await until('methane as a mole fraction', async () => (await field('methane').inputValue()) === '0.9');
    expect(await field('ethane').inputValue()).toBe('0.05');
    expect(await field('propane').inputValue()).toBe('0.02');
    expect(await sum.innerText()).toBe('Sum 0.9700 (mole fraction)');
    await page
      .getByTestId('run-create-fluid-composition')
      .screenshot({ path: `${shots}/B-composition-fraction-phone.png` });

    await choose(page.getByTestId('run-create-fluid-compositionUnit-percent'));
    await until('methane back in mol %', async () => (await field('methane').inputValue()) === '90');
    expect(await field('ethane').inputValue()).toBe('5');
    expect(await field('propane').inputValue()).toBe('2');
    expect(await sum.innerText()).toBe('Sum 97.00 mol %');
  });
});
