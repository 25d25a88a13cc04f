import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { demoStartDecision, type PasswordCheck } from './production-demo';
import { demoSeeded } from '../env';

/** A stand-in for the policy with the same answer shape: what matters here is that its verdict is obeyed. */
const atLeast12: PasswordCheck = (password) =>
  password.length >= 12 ? { ok: true } : { ok: false, reason: 'must be at least 12 characters' };

describe('the start-up decision about demo data', () => {
  it.each([
    ['development, by default', {}, true],
    ['development, asked off', { TALLYRUN_DEMO: 'off' }, false],
    [
      'development with the shipped password',
      { NODE_ENV: 'development', TALLYRUN_DEMO_PASSWORD: 'tallyrun-demo' },
      true,
    ],
    ['test', { NODE_ENV: 'test' }, true],
    ['production, asked off', { NODE_ENV: 'production', TALLYRUN_DEMO: 'off' }, false],
    [
      'production, asked on with a password of its own',
      { NODE_ENV: 'production', TALLYRUN_DEMO: 'on', TALLYRUN_DEMO_PASSWORD: 'quarry-lantern-ninety' },
      true,
    ],
  ])('starts in %s', (_name, source, seed) => {
    expect(demoStartDecision(source, atLeast12)).toEqual({ ok: true, seed });
  });

  it.each([
    ['production, not asked', { NODE_ENV: 'production' }, 'TALLYRUN_DEMO', /TALLYRUN_DEMO=off/],
    [
      'production, asked on without a password',
      { NODE_ENV: 'production', TALLYRUN_DEMO: 'on' },
      'TALLYRUN_DEMO_PASSWORD',
      /tallyrun-demo/,
    ],
    [
      'production, asked on with the shipped password',
      { NODE_ENV: 'production', TALLYRUN_DEMO: 'on', TALLYRUN_DEMO_PASSWORD: 'tallyrun-demo' },
      'TALLYRUN_DEMO_PASSWORD',
      /not the shipped "tallyrun-demo"/,
    ],
    [
      'production, asked on with a password the policy refuses',
      { NODE_ENV: 'production', TALLYRUN_DEMO: 'on', TALLYRUN_DEMO_PASSWORD: 'short-one' },
      'TALLYRUN_DEMO_PASSWORD',
      /password policy .*at least 12 characters/,
    ],
  ])('refuses %s, naming %s', (_name, source, field, message) => {
    const decision = demoStartDecision(source, atLeast12);
    expect(decision).toMatchObject({ ok: false, field });
    expect(decision.ok || decision.message).toMatch(message);
  });

  it('asks the policy about every demo account the password would be given to', () => {
    const asked: string[] = [];
    demoStartDecision(
      { NODE_ENV: 'production', TALLYRUN_DEMO: 'on', TALLYRUN_DEMO_PASSWORD: 'quarry-lantern-ninety' },
      (_p, { email }) => {
        asked.push(email);
        return { ok: true };
      },
    );
    expect(asked).toContain('admin@demo.tallyrun');
    expect(asked.length).toBeGreaterThanOrEqual(5);
  });
});

describe('the start-up check with the real password policy', () => {
  it('refuses a common demo password in production, naming TALLYRUN_DEMO_PASSWORD and the reason', () => {
    expect(() =>
      demoSeeded({ NODE_ENV: 'production', TALLYRUN_DEMO: 'on', TALLYRUN_DEMO_PASSWORD: 'password1234' }),
    ).toThrow(/TALLYRUN_DEMO_PASSWORD: does not pass the password policy for .*: is a common password/);
  });

  it('accepts a long uncommon demo password in production', () => {
    expect(
      demoSeeded({
        NODE_ENV: 'production',
        TALLYRUN_DEMO: 'on',
        TALLYRUN_DEMO_PASSWORD: 'quarry lantern ninety velvet',
      }),
    ).toBe(true);
  });

  it('keeps development as it was: demo data with the shipped password', () => {
    expect(demoSeeded({ NODE_ENV: 'development' })).toBe(true);
    expect(demoSeeded({})).toBe(true);
  });
});

it('a server process started with NODE_ENV=production and demo data by default exits non-zero naming TALLYRUN_DEMO', () => {
  const root = path.resolve(__dirname, '..', '..');
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', PORT: '0', MQTT_PORT: '0', SMTP_PORT: '0' };
  delete env.TALLYRUN_DEMO;
  delete env.TALLYRUN_DEMO_PASSWORD;
  // Refused before any connection is made, so no database is needed (and none is touched).
  env.DATABASE_URL = 'postgres://nobody@127.0.0.1:1/none';
  const run = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'server', 'index.ts')], {
    cwd: root,
    env,
    encoding: 'utf8',
    timeout: 60_000,
  });
  expect(run.status).not.toBe(0);
  expect(run.status).not.toBeNull();
  expect(run.stdout + run.stderr).toMatch(/TALLYRUN_DEMO: NODE_ENV=production seeds no demo sign-ins unless asked/);
});
