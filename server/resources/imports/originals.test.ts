import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { originalsStore, sha256OfFile } from './originals';

/** The store of kept originals on a folder of its own; hashes checked against coreutils' sha256sum. */
let dataDir: string;
beforeEach(() => {
  // A dot folder on the way, as the test server's `.tallyrun/test` data folder has.
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), '.tallyrun-originals-'));
});
afterEach(() => fs.rmSync(dataDir, { recursive: true, force: true }));

const uploaded = (bytes: string) => {
  const file = path.join(dataDir, `upload-${Math.random().toString(36).slice(2)}`);
  fs.writeFileSync(file, bytes);
  return file;
};
const sha256sum = (file: string) => execFileSync('sha256sum', [file], { encoding: 'utf8' }).split(' ')[0];
const at = new Date('2026-02-03T04:05:06Z');

describe('the originals store', () => {
  it('hashes a file as sha256sum does, streaming it in chunks', async () => {
    // Larger than one 1 MiB read, so the hash spans several chunks.
    const file = uploaded('time,tag,value\n' + '2026-01-01T00:00:00Z,PT-1,1.5\n'.repeat(60_000));
    expect(await sha256OfFile(file)).toBe(sha256sum(file));
  });

  it('moves an upload to originals/<yyyy>/<mm>/<id>-<sha256>.csv, read-only, and finds it there', async () => {
    const store = originalsStore(path.join(dataDir, 'originals'));
    const file = uploaded('abc');
    const sha256 = sha256sum(file);
    const relative = await store.keep(file, { importId: '42', sha256, at });
    expect(relative).toBe(`originals/2026/02/42-${sha256}.csv`);
    expect(fs.existsSync(file)).toBe(false);
    const kept = await store.find(relative);
    expect(kept).toBe(path.join(dataDir, relative));
    expect(fs.readFileSync(kept!, 'utf8')).toBe('abc');
    expect(fs.statSync(kept!).mode & 0o777).toBe(0o444);
    expect(await store.find('originals/2026/02/43-none.csv')).toBeNull();
  });

  it('never replaces a kept file: the same bytes under the same name are kept once, other bytes are refused', async () => {
    const store = originalsStore(path.join(dataDir, 'originals'));
    const first = uploaded('abc');
    const sha256 = sha256sum(first);
    const relative = await store.keep(first, { importId: '7', sha256, at });
    const kept = path.join(dataDir, relative);
    const inode = fs.statSync(kept).ino;
    // Import ids start again on a recreated database: the same name, the same bytes.
    await store.keep(uploaded('abc'), { importId: '7', sha256, at });
    expect(fs.statSync(kept).ino).toBe(inode);
    // The same name claimed for other bytes: refused, the kept file untouched.
    await expect(store.keep(uploaded('abd'), { importId: '7', sha256, at })).rejects.toThrow(/EEXIST/);
    expect(fs.readFileSync(kept, 'utf8')).toBe('abc');
  });

  it('refuses a stored path that leads out of the originals folder', async () => {
    const store = originalsStore(path.join(dataDir, 'originals'));
    await expect(store.find('originals/../uploads/x.csv')).rejects.toThrow(/not a kept original/);
    expect(() => store.absolute('../etc/passwd')).toThrow(/not a kept original/);
  });
});
