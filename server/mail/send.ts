import nodemailer from 'nodemailer';

/** The mail transport: nodemailer to the SMTP server on loopback (the stand-in unless configured). */
export function createMailer(options: { host: string; port: number; from?: string }) {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    ignoreTLS: true,
  });
  const from = options.from ?? 'Tallyrun <tallyrun@localhost>';
  return {
    send: (message: { to: string | string[]; subject: string; text: string }) =>
      transport.sendMail({ from, ...message }),
    close: () => transport.close(),
  };
}
