import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { tooManyRequests } from '../../errors';

/**
 * Limits failed sign-in attempts per address and account: slows guessing without letting one
 * user lock out a shared control room.
 * @param limit failed attempts allowed per account and address in 15 minutes
 */
export function loginLimiter(limit: number) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Only failed attempts count: a control room signing in all day is never locked out.
    skipSuccessfulRequests: true,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase()}`,
    handler: (_req, res) => {
      const err = tooManyRequests('Too many sign-in attempts; wait a few minutes and try again.');
      res.status(err.status).json(err.toJSON());
    },
  });
}
