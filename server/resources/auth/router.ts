import { Router, type RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { Op, fn, col, where } from 'sequelize';
import { User } from '../../models';
import { validate } from '../../http/validate';
import { loginSchema } from './schema';
import { checkPassword } from '../../auth/passwords';
import { issueToken } from '../../auth/tokens';
import { AppError, unauthorized } from '../../errors';
import { presentUser } from '../users/presenter';

export function authRouter(options: {
  jwtSecret: string;
  tokenHours: number;
  loginLimit: number;
  authenticate: RequestHandler;
}) {
  const router = Router();

  // Per address and account: slows guessing without letting one user lock out a shared control room.
  const loginLimiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: options.loginLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Only failed attempts count: a control room signing in all day is never locked out.
    skipSuccessfulRequests: true,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase()}`,
    handler: (_req, res) => {
      const err = new AppError(429, 'rate_limited', 'Too many sign-in attempts; wait a few minutes and try again.');
      res.status(429).json(err.toJSON());
    },
  });

  router.post('/login', loginLimiter, async (req, res) => {
    const { email, password } = validate(loginSchema, req.body);
    const user = await User.findOne({ where: where(fn('lower', col('email')), { [Op.eq]: email.toLowerCase() }) });
    // One message for unknown user and wrong password, so sign-in does not reveal who has an account.
    const valid = user ? await checkPassword(password, user.passwordHash) : false;
    if (!user || !valid) throw unauthorized('Email or password is not right.', 'invalid_credentials');
    if (user.disabled) throw unauthorized('This account is disabled; ask an administrator.', 'account_disabled');
    const token = issueToken({ id: String(user.id), role: user.role }, options.jwtSecret, options.tokenHours);
    res.json({ token, user: presentUser(user, { brief: true }) });
  });

  router.get('/me', options.authenticate, (req, res) => {
    res.json({ user: req.user });
  });

  return router;
}
