import jwt from 'jsonwebtoken';
import type { Role } from '../../shared/auth/roles';

export interface TokenClaims {
  sub: string;
  role: Role;
}

export function issueToken(user: { id: string; role: Role }, secret: string, hours: number): string {
  return jwt.sign({ role: user.role }, secret, { subject: String(user.id), expiresIn: Math.round(hours * 3600) });
}
