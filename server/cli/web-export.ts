import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const sources = [
  'app',
  'components',
  'hooks',
  'constants',
  'shared',
  'assets',
  'public',
  'web-stubs',
  'app.json',
  'metro.config.js',
  'package.json',
];

function newestMtime(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const stat = fs.statSync(p);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of fs.readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

/**
 * Exports the web client to dist/ with Expo when dist/ is missing or older than its sources.
 * Returns the seconds it took (0 when the export was current).
 */
export function exportWebClient(root: string, log: (s: string) => void, options: { force?: boolean } = {}): number {
  const stamp = path.join(root, 'dist', '.export-stamp');
  const stampTime = fs.existsSync(stamp) ? fs.statSync(stamp).mtimeMs : 0;
  const newest = Math.max(...sources.map((s) => newestMtime(path.join(root, s))));
  if (!options.force && stampTime > newest) return 0;
  log('exporting the web client (expo export --platform web) ...');
  const started = Date.now();
  // Export beside dist/ and swap it in at the end: a server (or another test run) reading dist/
  // meanwhile never sees it half-written or emptied, as it did when expo wrote into it in place.
  const next = `dist.next-${process.pid}`;
  fs.rmSync(path.join(root, next), { recursive: true, force: true });
  const result = spawnSync(
    path.join(root, 'node_modules', '.bin', 'expo'),
    ['export', '--platform', 'web', '--output-dir', next],
    {
      cwd: root,
      stdio: ['ignore', 'pipe', 'pipe'],
      encoding: 'utf8',
      env: { ...process.env, EXPO_NO_TELEMETRY: '1', CI: '1' },
    },
  );
  if (result.status !== 0) {
    fs.rmSync(path.join(root, next), { recursive: true, force: true });
    throw new Error(`expo export failed:\n${result.stdout}\n${result.stderr}`);
  }
  const { files, rawBytes, brBytes } = precompressWebClient(path.join(root, next));
  log(`pre-compressed ${files} files: ${kb(rawBytes)} → ${kb(brBytes)} brotli`);
  fs.writeFileSync(path.join(root, next, '.export-stamp'), new Date().toISOString());
  const old = `dist.old-${process.pid}`;
  if (fs.existsSync(path.join(root, 'dist'))) fs.renameSync(path.join(root, 'dist'), path.join(root, old));
  fs.renameSync(path.join(root, next), path.join(root, 'dist'));
  fs.rmSync(path.join(root, old), { recursive: true, force: true });
  const seconds = (Date.now() - started) / 1000;
  log(`web client exported in ${seconds.toFixed(0)} s`);
  return seconds;
}

/** Text that compresses; images and WOFF2 fonts are compressed already. */
const COMPRESSIBLE = /\.(js|css|html|json|svg|txt|map|ico|ttf)$/;
/** Below this a compressed copy saves less than its headers cost. */
const MIN_BYTES = 1024;

const kb = (bytes: number) => `${(bytes / 1024).toFixed(0)} KB`;

/**
 * Writes `<file>.br` (quality 11) and `<file>.gz` (level 9) beside every compressible file of the
 * export, once, so the server sends them without compressing per request (server/web.ts). A copy
 * that would not be smaller is not written.
 */
export function precompressWebClient(dir: string) {
  let files = 0;
  let rawBytes = 0;
  let brBytes = 0;
  for (const file of listFiles(dir)) {
    if (!COMPRESSIBLE.test(file)) continue;
    const raw = fs.readFileSync(file);
    if (raw.length < MIN_BYTES) continue;
    const br = zlib.brotliCompressSync(raw, {
      params: {
        [zlib.constants.BROTLI_PARAM_QUALITY]: 11,
        [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
      },
    });
    const gz = zlib.gzipSync(raw, { level: 9 });
    if (br.length < raw.length) writeBeside(`${file}.br`, br);
    if (gz.length < raw.length) writeBeside(`${file}.gz`, gz);
    files += 1;
    rawBytes += raw.length;
    brBytes += Math.min(br.length, raw.length);
  }
  return { files, rawBytes, brBytes };
}

/** Written under a temporary name and renamed, so a server never sends half a copy. */
function writeBeside(target: string, bytes: Buffer) {
  const temporary = `${target}.${process.pid}.tmp`;
  fs.writeFileSync(temporary, bytes);
  fs.renameSync(temporary, target);
}

function listFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    return entry.isDirectory() ? listFiles(full) : [full];
  });
}
