import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const sources = ['app', 'components', 'hooks', 'constants', 'shared', 'assets', 'app.json', 'package.json'];

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
  const result = spawnSync(
    path.join(root, 'node_modules', '.bin', 'expo'),
    ['export', '--platform', 'web', '--output-dir', 'dist'],
    {
      cwd: root,
      stdio: ['ignore', 'pipe', 'pipe'],
      encoding: 'utf8',
      env: { ...process.env, EXPO_NO_TELEMETRY: '1', CI: '1' },
    },
  );
  if (result.status !== 0) throw new Error(`expo export failed:\n${result.stdout}\n${result.stderr}`);
  fs.writeFileSync(stamp, new Date().toISOString());
  const seconds = (Date.now() - started) / 1000;
  log(`web client exported in ${seconds.toFixed(0)} s`);
  return seconds;
}
