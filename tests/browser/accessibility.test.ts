/**
 * Every screen each role can open, on a 390 × 844 phone and a 1440 × 900 screen, checked with
 * axe-core 4.14 (the copy in node_modules, evaluated in the page): no critical or serious
 * violation anywhere. One Chromium, one sign-in per role; each role's page is reused for all its
 * screens at both sizes. A failure lists every violation with its rule, its target and the page.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

import { client, signIn as apiSignIn } from '../support/api';
import {
  baseUrl,
  demoEmail,
  freshPage,
  launchBrowser,
  signIn,
  viewports,
  type Role,
  type TestBrowser,
  type ViewportName,
} from './support';

const axeSource = fs.readFileSync(path.join(process.cwd(), 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');

/** The impacts that fail the test (axe-core's two highest of four). */
const failingImpacts = new Set(['critical', 'serious']);

interface Finding {
  rule: string;
  impact: string;
  target: string;
  page: string;
  help: string;
}

interface AxeResult {
  violations: { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] }[];
}

// Written out from the navigation by role (shared/DESIGN.md "Roles", as tests/browser/navigation-by-role.test.ts),
// not imported from the client, plus the screens of one thing that the areas link to.
const everyone = ['/', '/meter-runs', '/meter-runs/:meterRun', '/alarms', '/totals'];
const setUpScreens = [
  '/imports',
  '/setup',
  '/setup?site=:site',
  '/setup?meterRun=:meterRun',
  '/transmitters/:transmitter',
  '/range-check',
  '/range-health',
  '/care-due',
  '/corrections',
];
const screensByRole: Record<Role, string[]> = {
  operator: everyone,
  engineer: [...everyone, ...setUpScreens, '/audit'],
  accountant: [...everyone, '/audit'],
  admin: [...everyone, ...setUpScreens, '/audit', '/users', '/devices', '/mail'],
};
const roles = Object.keys(screensByRole) as Role[];
const sizes = Object.keys(viewports) as ViewportName[];

let browser: TestBrowser;
let ids: Record<'meterRun' | 'site' | 'transmitter', string>;
const findings: Finding[] = [];
/** Every violation of any impact, for the report of counts per rule. */
const counts = new Map<string, number>();

/** The demo site's first meter run and its first transmitter, so the screens of one thing have something to show. */
async function demoIds() {
  const api = client(await apiSignIn(demoEmail('engineer')));
  const runs = (await api.get<{ id: string; siteId: string }[]>('/api/meter-runs')).body;
  if (!runs.length) throw new Error('the demo data has no meter run');
  const run = runs[0];
  const transmitters = (await api.get<{ id: string }[]>(`/api/transmitters?meterRunId=${run.id}`)).body;
  if (!transmitters.length) throw new Error(`meter run ${run.id} has no transmitter`);
  return { meterRun: String(run.id), site: String(run.siteId), transmitter: String(transmitters[0].id) };
}

function routeFor(pattern: string): string {
  return pattern.replace(/:(meterRun|site|transmitter)/g, (_, key: keyof typeof ids) => ids[key]);
}

/** Waits until the screen has drawn its data: no "Loading …" status left, and the layout still. */
async function settled(page: Page): Promise<void> {
  await page.getByTestId('area-title').waitFor();
  await page.waitForFunction(
    () => ![...document.querySelectorAll('[role="status"]')].some((el) => /Loading/.test(el.textContent ?? '')),
    undefined,
    { timeout: 30_000 },
  );
  await page.waitForTimeout(300);
}

async function runAxe(page: Page, label: string): Promise<void> {
  // Evaluated through the debugging protocol: the app's Content Security Policy (rightly) refuses inline scripts.
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(axeSource);
  const result = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: object) => Promise<unknown> } }).axe;
    return axe.run(document, { resultTypes: ['violations'] });
  });
  for (const violation of (result as AxeResult).violations) {
    const impact = violation.impact ?? 'unknown';
    counts.set(`${impact} ${violation.id}`, (counts.get(`${impact} ${violation.id}`) ?? 0) + violation.nodes.length);
    if (!failingImpacts.has(impact)) continue;
    for (const node of violation.nodes) {
      findings.push({
        rule: violation.id,
        impact,
        target: JSON.stringify(node.target),
        page: label,
        help: violation.help,
      });
    }
  }
}

beforeAll(async () => {
  ids = await demoIds();
  browser = await launchBrowser();
  // A screen that fails to draw fails this test by timing out; its error says why.
  browser.context.on('weberror', (error) => process.stdout.write(`page error: ${error.error().message}\n`));
});

afterAll(async () => {
  await browser?.close();
  // The counts of every impact, for people comparing runs (the test fails only on the two highest).
  const lines = [...counts.entries()].sort().map(([rule, n]) => `  ${rule}: ${n}`);
  process.stdout.write(`axe-core violations by impact and rule (nodes, all screens and sizes):\n${lines.join('\n')}\n`);
});

describe('axe-core finds no critical or serious violation', () => {
  it('on the sign-in screen at both sizes', async () => {
    const page = await freshPage(browser, 'phone');
    try {
      for (const size of sizes) {
        await page.setViewportSize(viewports[size]);
        await page.getByTestId('sign-in-email').waitFor();
        await runAxe(page, `/sign-in at ${size}`);
      }
      const mine = findings.filter((f) => f.page.startsWith('/sign-in'));
      expect(mine.map((f) => `${f.impact} ${f.rule} on ${f.target} (${f.page})`)).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it.each(roles)(
    'on every screen the %s can open, at both sizes',
    async (role) => {
      const page = await freshPage(browser, 'phone');
      try {
        await signIn(page, demoEmail(role));
        const before = findings.length;
        // Each screen is loaded once and checked at both sizes: a resize redraws it for the other breakpoint.
        for (const pattern of screensByRole[role]) {
          const route = routeFor(pattern);
          await page.setViewportSize(viewports[sizes[0]]);
          await page.goto(`${baseUrl}${route}`);
          for (const size of sizes) {
            await page.setViewportSize(viewports[size]);
            await settled(page);
            await runAxe(page, `${role} ${route} at ${size}`);
          }
        }
        const mine = findings.slice(before).map((f) => `${f.impact} ${f.rule} on ${f.target} (${f.page}): ${f.help}`);
        expect(mine).toEqual([]);
      } finally {
        await page.close();
      }
    },
    600_000,
  );
});
