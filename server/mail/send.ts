import nodemailer from 'nodemailer';
import type { SmtpAccess } from './smtp-stand-in';

/**
 * The mail transport: nodemailer to the SMTP server on loopback (the stand-in unless configured),
 * signed in with the access the stand-in generated at start and sending as the server's own address.
 */
export function createMailer(options: { host: string; port: number; access: SmtpAccess }) {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    ignoreTLS: true,
    auth: options.access.auth,
  });
  const from = options.access.from;
  return {
    send: (message: { to: string | string[]; subject: string; text: string }) =>
      transport.sendMail({ from, ...message }),
    close: () => transport.close(),
  };
}
