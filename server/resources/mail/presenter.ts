import type { MailMessageRecord } from './repository';

export function presentMailMessage(m: MailMessageRecord) {
  return { id: m.id, to: m.recipients, subject: m.subject, text: m.text, sentAt: m.sentAt.toISOString() };
}
