import { Router } from 'express';
import { MailMessage } from '../../models';
import { requireCapability } from '../../auth/passport';

/** The admin's outbox: every message the SMTP stand-in captured, newest first. */
export function mailRouter() {
  const router = Router();
  router.use(requireCapability('administer'));
  router.get('/', async (_req, res) => {
    const messages = await MailMessage.findAll({
      order: [
        ['sentAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: 500,
    });
    res.json(
      messages.map((m) => ({
        id: String(m.id),
        to: m.recipients,
        subject: m.subject,
        text: m.text,
        sentAt: m.sentAt.toISOString(),
      })),
    );
  });
  return router;
}
