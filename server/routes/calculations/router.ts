import { Router } from 'express';
import { requireCapability } from '../../auth/passport';

/** Engineering calculations on demand (filled by the flow engine). */
export function calculationsRouter() {
  const router = Router();
  router.use(requireCapability('view'));
  return router;
}
