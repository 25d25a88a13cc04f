import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { MailMessage } from '../models';

/**
 * A local stand-in for a hosted mail service: an SMTP server on loopback that stores every
 * message it receives in the database, where the admin's outbox reads them. Nothing leaves the
 * machine.
 */
export async function startSmtpStandIn(options: { host: string; port: number }) {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        parseMessage(raw)
          .then(({ subject, text }) =>
            MailMessage.create({
              sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
              recipients: session.envelope.rcptTo.map((r) => r.address),
              subject,
              text,
              raw,
            }),
          )
          .then(() => callback())
          .catch((err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(options.port, options.host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** Subject and plain-text body of a raw message (mailparser handles MIME, charsets and encodings). */
export async function parseMessage(raw: string): Promise<{ subject: string; text: string }> {
  const parsed = await simpleParser(raw);
  return { subject: parsed.subject ?? '', text: (parsed.text ?? '').replace(/\r\n/g, '\n').trimEnd() };
}
