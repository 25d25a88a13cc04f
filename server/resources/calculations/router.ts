import { Router } from 'express';
import { requireCapability } from '../../auth/passport';
import { calculateFlow } from '../../../shared/flow/calculate-flow';

/**
 * `POST /api/calculations/flow`: the flow calculation case of the design → its result, the same
 * JSON as `npm run flow-calc` (both call calculateFlow). A bad case is a 400 naming the field.
 */
export function calculationsRouter() {
  const router = Router();
  router.use(requireCapability('view'));
  router.post('/flow', (req, res) => {
    const calculation = calculateFlow(req.body);
    if (calculation.ok) res.json(calculation.result);
    else res.status(400).json({ error: calculation.error });
  });
  return router;
}
