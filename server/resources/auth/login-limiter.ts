import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { tooManyRequests } from '../../errors';
import { accountKey } from '../../auth/email';

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
    // The account as sign-in finds it (trimmed, lower-cased), so spacing or letter case is not a fresh
    // allowance; req.ip honours X-Forwarded-For only when TALLYRUN_TRUST_PROXY names the proxy.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${accountKey(req.body?.email)}`,
    handler: (_req, res) => {
      const err = tooManyRequests('Too many sign-in attempts; wait a few minutes and try again.');
      res.status(err.status).json(err.toJSON());
    },
  });
}
