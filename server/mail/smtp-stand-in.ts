import { SMTPServer, type SMTPServerAuthentication, type SMTPServerSession } from 'smtp-server';
import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { MailMessage } from '../models';

/** The one sender the stand-in accepts: the server's own notifier. */
export const serverSender = 'tallyrun@localhost';

/** What a client needs to hand mail to the stand-in: the credentials made at start and the sender to use. */
export interface SmtpAccess {
  auth: { user: string; pass: string };
  from: string;
}

/**
 * A local stand-in for a hosted mail service: an SMTP server on loopback that stores every
 * message it receives in the database, where the admin's outbox reads them. Nothing leaves the
 * machine. Any local process can reach the port, so a message is taken only from a client that
 * signed in with the credentials generated at start (handed to the server's mailer, never
 * written down) and only with the server's own address as envelope sender and From (issue 12 §11).
 */
export async function startSmtpStandIn(options: { host: string; port: number }) {
  const auth = { user: 'tallyrun-notifier', pass: crypto.randomBytes(24).toString('base64url') };
  const server = new SMTPServer({
    authOptional: false,
    authMethods: ['PLAIN', 'LOGIN'],
    // Loopback without TLS (the stand-in offers no certificate), so sign-in over plain text is allowed.
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onAuth(credentials: SMTPServerAuthentication, _session: SMTPServerSession, callback) {
      const ok = credentials.username === auth.user && sameSecret(credentials.password ?? '', auth.pass);
      if (!ok) return callback(new Error('Invalid username or password'));
      callback(null, { user: auth.user });
    },
    onMailFrom(address, session, callback) {
      if (session.user !== auth.user) return callback(smtpError('Sign in first', 530));
      if (address.address.toLowerCase() !== serverSender)
        return callback(smtpError(`Sender ${address.address} refused: only ${serverSender} may send here`, 553));
      callback();
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        parseMessage(raw)
          .then(({ subject, text, from }) => {
            // The envelope was checked; a forged From header inside the message is refused as well.
            if (from.length !== 1 || from[0] !== serverSender)
              throw smtpError(`From ${from.join(', ') || '(none)'} refused: only ${serverSender} may send here`, 553);
            return MailMessage.create({
              sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
              recipients: session.envelope.rcptTo.map((r) => r.address),
              subject,
              text,
              raw,
            });
          })
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
  const access: SmtpAccess = { auth, from: `Tallyrun <${serverSender}>` };
  return { port, access, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** An SMTP reply with its code (smtp-server sends `responseCode` with the message). */
function smtpError(message: string, responseCode: number) {
  return Object.assign(new Error(message), { responseCode });
}

/** Compares secrets in constant time, so the reply time tells nothing about how much matched. */
function sameSecret(given: string, expected: string) {
  const a = crypto.createHash('sha256').update(given).digest();
  const b = crypto.createHash('sha256').update(expected).digest();
  return crypto.timingSafeEqual(a, b);
}

/** Subject, plain-text body and From addresses of a raw message (mailparser handles MIME, charsets and encodings). */
export async function parseMessage(raw: string): Promise<{ subject: string; text: string; from: string[] }> {
  const parsed = await simpleParser(raw);
  return {
    subject: parsed.subject ?? '',
    text: (parsed.text ?? '').replace(/\r\n/g, '\n').trimEnd(),
    from: (parsed.from?.value ?? []).map((a) => (a.address ?? '').toLowerCase()),
  };
}
