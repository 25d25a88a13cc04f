import { Router, type RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { validate } from '../../http/validate';
import { loginSchema } from './schema';
import { loginLimiter } from './login-limiter';
import { signIn } from './use-cases';
import { usersRepository } from '../users/repository';
import { presentUser } from '../users/presenter';
import { recordAuditEvent } from '../../audit';

/** Sign-in (`POST /login`, public, rate-limited) and the signed-in user (`GET /me`). */
export function authRouter(options: {
  sequelize: Sequelize;
  jwtSecret: string;
  tokenHours: number;
  loginLimit: number;
  authenticate: RequestHandler;
}) {
  const router = Router();
  const users = usersRepository(options.sequelize);

  router.post('/login', loginLimiter(options.loginLimit), async (req, res) => {
    const credentials = validate(loginSchema, req.body);
    const { token, user } = await signIn(users, credentials, options, (event) => recordAuditEvent(event));
    res.json({ token, user: presentUser(user, { brief: true }) });
  });

  router.get('/me', options.authenticate, (req, res) => {
    res.json({ user: req.user });
  });

  return router;
}
