import { unauthorized } from '../../errors';
import { checkPassword } from '../../auth/passwords';
import { issueToken } from '../../auth/tokens';
import type { UsersRepository } from '../users/repository';

/**
 * Signs a user in by email (any letter case) and password.
 * @returns a bearer token and the user
 * @throws 401 invalid_credentials for an unknown email or a wrong password alike; 401 account_disabled
 */
export async function signIn(
  users: Pick<UsersRepository, 'findByEmail'>,
  credentials: { email: string; password: string },
  token: { jwtSecret: string; tokenHours: number },
) {
  const user = await users.findByEmail(credentials.email);
  // One message for unknown user and wrong password, so sign-in does not reveal who has an account.
  const valid = user ? await checkPassword(credentials.password, user.passwordHash) : false;
  if (!user || !valid) throw unauthorized('Email or password is not right.', 'invalid_credentials');
  if (user.disabled) throw unauthorized('This account is disabled; ask an administrator.', 'account_disabled');
  return { token: issueToken({ id: user.id, role: user.role }, token.jwtSecret, token.tokenHours), user };
}
