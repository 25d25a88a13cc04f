/**
 * The imports screen against the real server: an engineer uploads a readings CSV with some bad
 * lines, watches its progress to the end, and reads the counts and each rejected line by its
 * number; uploading the same file again counts every good row as a duplicate. The kept original
 * is shown by its SHA-256 (checked against coreutils' sha256sum) and downloads byte for byte.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import { client, createMeterRun, signIn as apiSignIn, unique, type Client } from '../support/api';
import { baseUrl, choose, demoEmail, freshPage, launchBrowser, signIn, type TestBrowser } from './support';

// The first test makes two imports of 12 000 rows, each waited for up to 60 s on a loaded 2-core
// machine, besides its other steps: more than support.ts's budget per test. A ceiling, not a wait.
jest.setTimeout(180_000);

let browser: TestBrowser;
let api: Client;
beforeAll(async () => {
  browser = await launchBrowser();
  api = client(await apiSignIn(demoEmail('engineer')));
});
afterAll(async () => {
  await browser?.close();
});

/**
 * Line 1 is the header; readings every 10 s for the meter run's DP, with three bad lines put in
 * at known line numbers: a time without an offset, a tag no transmitter has, a value that is
 * not a number. Enough rows (several batches of the server's writer) for the progress to move.
 */
function csvWithBadLines(tags: { dp: string; pt: string; tt: string }, goodRows: number) {
  const lines = ['time,tag,value,quality'];
  const bad = new Map<number, string>();
  const start = Date.parse('2025-03-01T00:00:00Z');
  for (let i = 0; i < goodRows; i++) {
    const line = lines.length + 1;
    if (line === 5) {
      lines.push(`2025-03-01T00:00:00,${tags.dp},12.5,good`);
      bad.set(line, 'time');
      continue;
    }
    if (line === 250) {
      lines.push(`2025-03-01T00:00:00Z,NO-SUCH-TAG-${unique()},12.5,good`);
      bad.set(line, 'tag');
      continue;
    }
    if (line === 9001) {
      lines.push(`2025-03-01T00:00:00Z,${tags.pt},twelve,good`);
      bad.set(line, 'value');
      continue;
    }
    const iso = new Date(start + i * 10_000).toISOString();
    lines.push(`${iso},${[tags.dp, tags.pt, tags.tt][i % 3]},${[12.5, 2, 300][i % 3]},good`);
  }
  return { csv: lines.join('\n') + '\n', bad, rows: lines.length - 1 };
}

describe('the imports screen', () => {
  it('uploads a readings CSV, shows the progress finish, the counts and every rejected line by number', async () => {
    const f = await createMeterRun(api);
    const { csv, bad, rows } = csvWithBadLines({ dp: f.dp.tag, pt: f.pt.tag, tt: f.tt.tag }, 12_000);
    expect(bad.size).toBe(3);

    const page = await freshPage(browser, 'wide');
    await signIn(page, demoEmail('engineer'));
    await page.getByTestId('nav-imports').click();
    await page.waitForURL((url) => url.pathname === '/imports');
    await page.getByTestId('import-upload').waitFor();
    // The columns are explained before anything is uploaded.
    const columns = page.getByTestId('import-columns');
    await columns.filter({ hasText: 'time,tag,value,[quality],[unit]' }).waitFor();
    expect(await columns.innerText()).toMatch(/ISO 8601 with an offset or Z/);

    await choose(page.getByTestId('import-kind-readings'));
    const filename = `readings-${unique()}.csv`;
    await page
      .getByTestId('import-file-input')
      .setInputFiles({ name: filename, mimeType: 'text/csv', buffer: Buffer.from(csv) });
    // The chosen name is drawn on the next render, not by the time setInputFiles returns.
    await page.getByTestId('import-chosen').filter({ hasText: filename }).waitFor();
    await page.getByTestId('import-submit').click();

    // The progress bar is drawn while the import runs, then the import says it finished.
    await page.getByTestId('import-progress').waitFor();
    await page.getByTestId('import-status').filter({ hasText: 'Finished' }).waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('import-progress-label').innerText()).toContain(
      `${rows.toLocaleString('en-US')} rows`,
    );

    const count = async (what: string) =>
      Number((await page.getByTestId(`import-count-${what}`).innerText()).replace(/[^\d]/g, ''));
    expect(await count('read')).toBe(rows);
    expect(await count('imported')).toBe(rows - 3);
    expect(await count('duplicates')).toBe(0);
    expect(await count('rejected')).toBe(3);
    for (const [line, field] of bad) {
      const row = page.getByTestId(`import-error-${line}`);
      await row.waitFor();
      const text = await row.innerText();
      expect(text).toContain(String(line));
      expect(text).toContain(`${field}:`);
    }
    await page.screenshot({ path: '/tmp/tallyrun-imports-wide.png' });

    // The same file again: the good rows are duplicates, not second readings.
    await page
      .getByTestId('import-file-input')
      .setInputFiles({ name: filename, mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByTestId('import-submit').click();
    await page
      .getByTestId('import-count-duplicates')
      .filter({ hasText: (rows - 3).toLocaleString('en-US') })
      .waitFor({ timeout: 60_000 });
    expect(await count('imported')).toBe(0);

    // Both are in the list of recent imports, once the list has been fetched again.
    const name = filename.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    const recent = page.getByTestId('import-recent');
    await recent.filter({ hasText: new RegExp(`${name}[\\s\\S]*${name}`) }).waitFor({ timeout: 30_000 });
    expect((await recent.innerText()).split(filename).length - 1).toBe(2);
    await page.close();
  });

  it('explains the columns of a field-totals file, imports one on a phone and gives back the original', async () => {
    const page = await freshPage(browser, 'phone');
    await signIn(page, demoEmail('engineer'));
    await page.goto(`${baseUrl}/imports`);
    await choose(page.getByTestId('import-kind-field-totals'));
    // The explanation is drawn again for the new kind: wait for it, do not read it at once.
    await page.getByTestId('import-columns').filter({ hasText: 'start,end,meterRun,quantity,value,unit' }).waitFor();
    const bytes = Buffer.from('start,end,meterRun,quantity,value,unit\n');
    await page
      .getByTestId('import-file-input')
      .setInputFiles({ name: 'totals.csv', mimeType: 'text/csv', buffer: bytes });
    await page.getByTestId('import-submit').click();
    // A header with no rows is imported as nothing: finished, with nothing read.
    await page.getByTestId('import-status').filter({ hasText: 'Finished' }).waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('import-count-read').innerText()).toBe('0');

    // The original as kept: its SHA-256 by coreutils, shortened on screen, and the same bytes back.
    const sha256 = execFileSync('sha256sum', { input: bytes, encoding: 'utf8' }).split(' ')[0];
    const shown = page.getByTestId('import-sha256');
    expect(await shown.innerText()).toBe(`${sha256.slice(0, 12)}…${sha256.slice(-8)}`);
    expect(await shown.getAttribute('aria-label')).toBe(`SHA-256 ${sha256}`);
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('import-download-original').click(),
    ]);
    expect(download.suggestedFilename()).toBe('totals.csv');
    expect(fs.readFileSync(await download.path()).equals(bytes)).toBe(true);
    await page.screenshot({ path: '/tmp/tallyrun-imports-phone.png' });
    await page.close();
  });
});
