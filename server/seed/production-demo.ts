import { demoUsers } from './demo-users';

/** The password policy's answer (server/auth/password-policy.ts `checkPasswordPolicy`). */
export type PasswordVerdict = { ok: true } | { ok: false; reason: string };
export type PasswordCheck = (password: string, context: { email: string }) => PasswordVerdict;

/** The shipped demo password: fine on a laptop, never on a production server. */
export const defaultDemoPassword = 'tallyrun-demo';

/**
 * Whether the server may start, and whether it seeds the demo sign-ins and demo device
 * (issue 12 §5). Outside production nothing changes: demo data unless TALLYRUN_DEMO=off. In
 * production the demo accounts would be live sign-ins on a real server, so they are seeded only
 * when asked for with TALLYRUN_DEMO=on and a TALLYRUN_DEMO_PASSWORD of the operator's own that
 * passes the password policy; otherwise the server refuses to start and says which setting to change.
 * @param source the raw environment, before defaults: "asked for" means set, not defaulted
 */
export function demoStartDecision(
  source: { NODE_ENV?: string; TALLYRUN_DEMO?: string; TALLYRUN_DEMO_PASSWORD?: string },
  checkPassword: PasswordCheck,
): { ok: true; seed: boolean } | { ok: false; field: string; message: string } {
  if (source.NODE_ENV !== 'production') return { ok: true, seed: source.TALLYRUN_DEMO !== 'off' };
  if (source.TALLYRUN_DEMO === 'off') return { ok: true, seed: false };
  if (source.TALLYRUN_DEMO !== 'on')
    return {
      ok: false,
      field: 'TALLYRUN_DEMO',
      message:
        'NODE_ENV=production seeds no demo sign-ins unless asked: set TALLYRUN_DEMO=off, or TALLYRUN_DEMO=on with a TALLYRUN_DEMO_PASSWORD of your own',
    };
  const password = source.TALLYRUN_DEMO_PASSWORD;
  if (password === undefined || password === defaultDemoPassword)
    return {
      ok: false,
      field: 'TALLYRUN_DEMO_PASSWORD',
      message: `NODE_ENV=production with TALLYRUN_DEMO=on needs a demo password of your own, not the shipped "${defaultDemoPassword}"`,
    };
  // Every demo account gets this password, so it must pass the policy for each of them.
  for (const { email } of demoUsers) {
    const verdict = checkPassword(password, { email });
    if (!verdict.ok)
      return {
        ok: false,
        field: 'TALLYRUN_DEMO_PASSWORD',
        message: `does not pass the password policy for ${email}: ${verdict.reason}`,
      };
  }
  return { ok: true, seed: true };
}
