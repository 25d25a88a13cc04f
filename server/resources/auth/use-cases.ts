import { unauthorized } from '../../errors';
import { checkAgainstDummyHash, checkPassword } from '../../auth/passwords';
import { issueToken } from '../../auth/tokens';
import type { UsersRepository } from '../users/repository';
import type { recordAuditEvent } from '../../audit';

/** Records one sign-in event in the audit trail. */
export type SignInAudit = (event: Parameters<typeof recordAuditEvent>[0]) => Promise<void>;

/**
 * Signs a user in by email (spaces around it and letter case ignored) and password. Every attempt
 * goes to the audit trail: a sign-in under the user, a refusal with the email as typed and the true
 * reason (never the password).
 * @returns a bearer token (carrying the user's token version) and the user
 * @throws 401 invalid_credentials, the same answer for an unknown email, a wrong password and a
 *   disabled account, so sign-in does not tell who has an account
 */
export async function signIn(
  users: Pick<UsersRepository, 'findByEmail'>,
  credentials: { email: string; password: string },
  token: { jwtSecret: string; tokenHours: number },
  audit: SignInAudit,
) {
  const user = await users.findByEmail(credentials.email);
  // An unknown email still costs one bcrypt comparison (against a dummy hash of the same cost), so
  // the time taken does not reveal whether the account exists either.
  const valid = user
    ? await checkPassword(credentials.password, user.passwordHash)
    : await checkAgainstDummyHash(credentials.password);
  const refused = async (why: 'unknown-email' | 'wrong-password' | 'account-disabled') =>
    audit({
      actor: null,
      action: 'auth.sign-in-refused',
      entityType: 'sign-in',
      entityId: user?.id,
      after: { email: credentials.email, why },
    });
  if (!user || !valid || user.disabled) {
    await refused(!user ? 'unknown-email' : !valid ? 'wrong-password' : 'account-disabled');
    // One code and message for all three: a disabled account with the right password must not
    // confirm that the password was right.
    throw unauthorized('Email or password is not right.', 'invalid_credentials');
  }
  await audit({
    actor: { id: user.id, email: user.email, role: user.role, name: user.name },
    action: 'auth.sign-in',
    entityType: 'sign-in',
    entityId: user.id,
  });
  const issued = issueToken(
    { id: user.id, role: user.role, tokenVersion: user.tokenVersion },
    token.jwtSecret,
    token.tokenHours,
  );
  return { token: issued, user };
}
