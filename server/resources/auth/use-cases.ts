import { unauthorized } from '../../errors';
import { checkPassword } from '../../auth/passwords';
import { issueToken } from '../../auth/tokens';
import type { UsersRepository } from '../users/repository';
import type { recordAuditEvent } from '../../audit';

/** Records one sign-in event in the audit trail. */
export type SignInAudit = (event: Parameters<typeof recordAuditEvent>[0]) => Promise<void>;

/**
 * Signs a user in by email (any letter case) and password. Every attempt goes to the audit
 * trail: a sign-in under the user, a refusal with the email as typed and why (never the password).
 * @returns a bearer token and the user
 * @throws 401 invalid_credentials for an unknown email or a wrong password alike; 401 account_disabled
 */
export async function signIn(
  users: Pick<UsersRepository, 'findByEmail'>,
  credentials: { email: string; password: string },
  token: { jwtSecret: string; tokenHours: number },
  audit: SignInAudit,
) {
  const user = await users.findByEmail(credentials.email);
  // One message for unknown user and wrong password, so sign-in does not reveal who has an account.
  const valid = user ? await checkPassword(credentials.password, user.passwordHash) : false;
  const refused = async (why: 'unknown-email' | 'wrong-password' | 'account-disabled') =>
    audit({
      actor: null,
      action: 'auth.sign-in-refused',
      entityType: 'sign-in',
      entityId: user?.id,
      after: { email: credentials.email, why },
    });
  if (!user || !valid) {
    await refused(user ? 'wrong-password' : 'unknown-email');
    throw unauthorized('Email or password is not right.', 'invalid_credentials');
  }
  if (user.disabled) {
    await refused('account-disabled');
    throw unauthorized('This account is disabled; ask an administrator.', 'account_disabled');
  }
  await audit({
    actor: { id: user.id, email: user.email, role: user.role, name: user.name },
    action: 'auth.sign-in',
    entityType: 'sign-in',
    entityId: user.id,
  });
  return { token: issueToken({ id: user.id, role: user.role }, token.jwtSecret, token.tokenHours), user };
}
