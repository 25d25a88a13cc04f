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
 * Bearer-token authentication. The user is re-read on every request so a disabled account or a
 * changed role takes effect at once, not when the token expires.
 */
export function createAuthenticator(secret: string): RequestHandler {
  // A Passport instance per app (not the module's singleton), so two apps in one process keep their own secrets.
  const instance = new passport.Passport();
  instance.use(
    new JwtStrategy(
      { jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), secretOrKey: secret, algorithms: ['HS256'] },
      async (claims: { sub: string }, done: (err: unknown, user?: SignedInUser | false) => void) => {
        try {
          const user = await User.findByPk(claims.sub);
          if (!user || user.disabled) return done(null, false);
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
        const expired = (info as { name?: string } | undefined)?.name === 'TokenExpiredError';
        return next(
          expired ? unauthorized('Your session has expired; sign in again.', 'token_expired') : unauthorized(),
        );
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
