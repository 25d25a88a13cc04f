import { MailMessage } from '../../models';

/** A message the SMTP stand-in captured. */
export interface MailMessageRecord {
  id: string;
  recipients: string[];
  subject: string;
  text: string;
  sentAt: Date;
}

export interface MailRepository {
  /** The newest messages first (ties by id), at most `limit`. */
  newest(limit: number): Promise<MailMessageRecord[]>;
}

export function mailRepository(): MailRepository {
  return {
    async newest(limit) {
      const messages = await MailMessage.findAll({
        order: [
          ['sentAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit,
      });
      return messages.map((m) => ({
        id: String(m.id),
        recipients: m.recipients,
        subject: m.subject,
        text: m.text,
        sentAt: m.sentAt,
      }));
    },
  };
}
