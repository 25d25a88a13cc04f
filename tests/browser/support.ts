/**
 * Helpers for the browser tests: Debian's Chromium driven by playwright-core against the real
 * server serving the exported client (started by `npm test`, see server/cli/test.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';

/**
 * Sign-in, navigation and the first fetches fit well inside this on a 2-core machine, even with
 * the other test files (a second Chromium, the server, PostgreSQL) busy beside it. A ceiling, not
 * a wait: a passing test takes what it needs and no more.
 */
jest.setTimeout(120_000);

export const baseUrl = (process.env.TALLYRUN_BASE_URL ?? 'http://127.0.0.1:8080').replace(/\/+$/, '');
export const demoPassword = process.env.TALLYRUN_DEMO_PASSWORD ?? 'tallyrun-demo';

export const viewports = {
  phone: { width: 390, height: 844 },
  wide: { width: 1440, height: 900 },
} as const;
export type ViewportName = keyof typeof viewports;

export type Role = 'operator' | 'engineer' | 'accountant' | 'admin';

/** The demo sign-ins of shared/DESIGN.md ("Interfaces that checks rely on"). */
export function demoEmail(role: Role): string {
  return `${role}@demo.tallyrun`;
}

const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface TestBrowser {
  context: BrowserContext;
  close: () => Promise<void>;
}

/** Starts one Chromium with a fresh profile; a test file launches it once, in beforeAll. */
export async function launchBrowser(): Promise<TestBrowser> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-browser-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: chromiumArgs,
    viewport: viewports.phone,
  });
  // Each action and wait ends as soon as its condition holds; this only bounds a failing one.
  context.setDefaultTimeout(30_000);
  return {
    context,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Opens a page at the given size, signed out (tests in one file share the profile's storage).
 * @returns the page, closed by the caller
 */
export async function freshPage(browser: TestBrowser, viewport: ViewportName): Promise<Page> {
  const page = await browser.context.newPage();
  await page.setViewportSize(viewports[viewport]);
  await page.goto(`${baseUrl}/sign-in`);
  await page.evaluate(() => window.localStorage.clear());
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByTestId('sign-in-email').waitFor();
  return page;
}

/** Fills in the sign-in form and submits it (the page must be on the sign-in screen). */
export async function submitSignIn(page: Page, email: string, password: string = demoPassword): Promise<void> {
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
}

/**
 * Signs in and waits for the signed-in header. A refusal fails at once with the screen's
 * message; the server allows TALLYRUN_LOGIN_LIMIT sign-ins per address and account in 15
 * minutes (default 10), so re-running against a long-lived server can hit it.
 */
export async function signIn(page: Page, email: string, password: string = demoPassword): Promise<void> {
  await submitSignIn(page, email, password);
  const header = page.getByTestId('current-user');
  const error = page.getByTestId('sign-in-error');
  await header.or(error).first().waitFor();
  if (await error.isVisible()) throw new Error(`signing in as ${email} was refused: ${await error.innerText()}`);
}

/** Signs out from the header and waits for the sign-in screen. */
export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('sign-out').click();
  await page.getByTestId('sign-in-email').waitFor();
}

/**
 * The area keys the navigation offers, read from the `nav-<area>` test ids. On a phone the
 * areas beyond the bottom bar sit under "More", which is opened first.
 */
export async function offeredAreas(page: Page): Promise<string[]> {
  await page.getByTestId('nav-live').waitFor();
  if ((await page.getByTestId('nav-more').count()) > 0) {
    await page.getByTestId('nav-more').click();
    await page.getByTestId('more-menu').waitFor();
  }
  const ids = await page
    .locator('[data-testid^="nav-"]')
    .evaluateAll((elements) =>
      elements
        .filter((element) => element.checkVisibility())
        .map((element) => element.getAttribute('data-testid') ?? ''),
    );
  return ids.filter((id) => id !== 'nav-more').map((id) => id.slice('nav-'.length));
}

/**
 * Picks an option of a choice group or unit switch (role="radio") and waits until it reads as
 * chosen, clicking again if a click did not take. Content that arrives late above a screen (the
 * alarm banner appears when its counts come in, up to 10 s after a page opens) moves what is
 * below it, and a click whose press and release land on different elements reaches no option.
 * Pressing an option that is already chosen changes nothing, so the second click is harmless.
 */
export async function choose(option: Locator, timeoutMs = 30_000): Promise<void> {
  const chosen = option.and(option.page().locator('[aria-checked="true"]'));
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    await option.click();
    try {
      await chosen.waitFor({ timeout: Math.max(1000, Math.min(3000, deadline - Date.now())) });
      return;
    } catch (err) {
      if (Date.now() >= deadline) throw err;
    }
  }
}

/**
 * Presses a button that opens something and waits for it, pressing again if a press did not take
 * (the same cause as in `choose`: content arriving late above the button moves it between press
 * and release). Only for buttons whose second press is harmless, e.g. one that hides once it opened.
 */
export async function openWith(button: Locator, opened: Locator, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (await button.isVisible()) await button.click();
    try {
      await opened.waitFor({ timeout: Math.max(1000, Math.min(3000, deadline - Date.now())) });
      return;
    } catch (err) {
      if (Date.now() >= deadline) throw err;
    }
  }
}

/**
 * Takes an element's screenshot for people to look at, after a layout change (a viewport resize
 * re-renders the screen for the other breakpoint, so the element found a moment ago may be replaced):
 * waits for it and tries again while it is being replaced. A screenshot is evidence, not an
 * assertion, so the last failure is the only one that counts.
 */
export async function screenshotWhenSettled(element: Locator, path: string, attempts = 5): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await element.waitFor();
      await element.screenshot({ path, timeout: 10_000 });
      return;
    } catch (err) {
      if (attempt >= attempts) throw err;
    }
  }
}
