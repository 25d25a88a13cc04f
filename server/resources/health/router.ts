import { Router } from 'express';
import { serverHealth, type Health } from './use-cases';

export type { Health };

/** `GET /api/health`: the real state of the database and the broker, no sign-in needed; 503 when degraded. */
export function healthRouter(check: () => Promise<Health>) {
  const router = Router();
  router.get('/', async (_req, res) => {
    const { ok, health } = await serverHealth(check);
    res.status(ok ? 200 : 503).json({ status: ok ? 'ok' : 'degraded', ...health });
  });
  return router;
}
