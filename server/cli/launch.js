#!/usr/bin/env node
// Entry point of `npm start` and `npm test`. Plain JavaScript with no dependencies, because it
// runs before node_modules exists on a fresh machine: it installs what is missing, then hands
// over to the TypeScript launcher (tsx) for the rest.
const { spawnSync, spawn } = require('node:child_process');
const fs = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');
const mode = process.argv[2] === 'test' ? 'test' : 'start';

function installDependencies() {
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  const lock = path.join(root, 'package-lock.json');
  const fresh =
    fs.existsSync(marker) && (!fs.existsSync(lock) || fs.statSync(marker).mtimeMs >= fs.statSync(lock).mtimeMs);
  if (fresh && fs.existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) return;
  const args = fs.existsSync(lock) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  console.log(`[tallyrun] installing npm dependencies (npm ${args[0]}) ...`);
  const started = Date.now();
  const result = spawnSync('npm', args, { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[tallyrun] npm could not install the dependencies; see the messages above.');
    process.exit(result.status || 1);
  }
  console.log(`[tallyrun] dependencies installed in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

installDependencies();
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
// Under `npm test` the in-process test server logs only warnings, so request lines do not bury the report.
const env = mode === 'test' ? { ...process.env, TALLYRUN_TESTING: '1' } : process.env;
const child = spawn(tsx, [path.join(__dirname, `${mode}.ts`), ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
  env,
});
// The terminal sends Ctrl-C to the whole foreground group; forward SIGTERM ourselves.
process.on('SIGTERM', () => child.kill('SIGTERM'));
process.on('SIGINT', () => {});
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
