import { Router } from 'express';

export type Health = { database: 'up' | 'down'; broker: 'up' | 'down' };

/** `GET /api/health`: the real state of the database and the broker, no sign-in needed. */
export function healthRouter(check: () => Promise<Health>) {
  const router = Router();
  router.get('/', async (_req, res) => {
    const health = await check();
    const ok = health.database === 'up' && health.broker === 'up';
    res.status(ok ? 200 : 503).json({ status: ok ? 'ok' : 'degraded', ...health });
  });
  return router;
}
