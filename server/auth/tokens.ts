import jwt from 'jsonwebtoken';
import type { Role } from '../../shared/auth/roles';

export interface TokenClaims {
  sub: string;
  role: Role;
  /** The user's token version when the token was issued (absent in tokens issued before versions: 0). */
  ver?: number;
}

/**
 * Signs a bearer token for the user. It carries the user's token version, which every request
 * checks against the current one, so a password change, role change or disable revokes it.
 */
export function issueToken(
  user: { id: string; role: Role; tokenVersion?: number },
  secret: string,
  hours: number,
): string {
  return jwt.sign({ role: user.role, ver: user.tokenVersion ?? 0 }, secret, {
    subject: String(user.id),
    expiresIn: Math.round(hours * 3600),
  });
}
