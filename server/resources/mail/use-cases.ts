import type { MailRepository } from './repository';

/** The outbox shows this many messages; older ones stay in the table. */
const OUTBOX_SIZE = 500;

/** The admin's outbox: the newest messages the SMTP stand-in captured. */
export function outbox(repository: MailRepository) {
  return repository.newest(OUTBOX_SIZE);
}
