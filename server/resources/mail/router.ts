import { Router } from 'express';
import { requireCapability } from '../../auth/passport';
import { mailRepository } from './repository';
import { outbox } from './use-cases';
import { presentMailMessage } from './presenter';

/** The admin's outbox (`GET /api/mail`): every message the SMTP stand-in captured, newest first. */
export function mailRouter() {
  const router = Router();
  const repository = mailRepository();
  router.use(requireCapability('administer'));

  router.get('/', async (_req, res) => {
    res.json((await outbox(repository)).map(presentMailMessage));
  });

  return router;
}
