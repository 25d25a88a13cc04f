import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { RequestHandler } from 'express';
import { User } from '../models';
import { forbidden, unauthorized } from '../errors';
import { can, type Capability, type Role } from '../../shared/auth/roles';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    /** passport's Request.user: the signed-in user (this merges with @types/passport's empty one). */
    interface User {
      id: string;
      email: string;
      name: string;
      role: Role;
    }
  }
}

/** The signed-in user, as passport puts it on the request. */
export type SignedInUser = Express.User;

/**
 * Bearer-token authentication. The user is re-read on every request (one primary-key lookup, no
 * cache) so a disabled account takes effect at once, and a token whose version is older than the
 * user's (bumped on a password change, role change or disable) is refused with 401 token_revoked.
 */
export function createAuthenticator(secret: string): RequestHandler {
  // A Passport instance per app (not the module's singleton), so two apps in one process keep their own secrets.
  const instance = new passport.Passport();
  instance.use(
    new JwtStrategy(
      { jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), secretOrKey: secret, algorithms: ['HS256'] },
      async (
        claims: { sub: string; ver?: unknown },
        done: (err: unknown, user?: SignedInUser | false, info?: { revoked: true }) => void,
      ) => {
        try {
          const user = await User.findByPk(claims.sub);
          if (!user) return done(null, false);
          // Tokens from before token versions carry none: they are version 0, as every user starts.
          const version = typeof claims.ver === 'number' ? claims.ver : 0;
          if (user.disabled || version !== user.tokenVersion) return done(null, false, { revoked: true });
          done(null, { id: String(user.id), email: user.email, name: user.name, role: user.role });
        } catch (err) {
          done(err);
        }
      },
    ),
  );
  return (req, res, next) => {
    instance.authenticate('jwt', { session: false }, (err: unknown, user: SignedInUser | false, info: unknown) => {
      if (err) return next(err);
      if (!user) {
        const reason = info as { name?: string; revoked?: boolean } | undefined;
        if (reason?.name === 'TokenExpiredError')
          return next(unauthorized('Your session has expired; sign in again.', 'token_expired'));
        if (reason?.revoked)
          return next(
            unauthorized(
              'This session has ended because the account changed (password, role or disabled); sign in again.',
              'token_revoked',
            ),
          );
        return next(unauthorized());
      }
      req.user = user;
      next();
    })(req, res, next);
  };
}

/** Refuses the request unless the signed-in user's role has the capability (403). */
export const requireCapability =
  (capability: Capability): RequestHandler =>
  (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!can(req.user.role, capability)) return next(forbidden(`The ${req.user.role} role may not do this.`));
    next();
  };
