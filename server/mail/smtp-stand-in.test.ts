import nodemailer from 'nodemailer';
import { testApp } from '../test-support/app';
import { startSmtpStandIn, parseMessage, serverSender } from './smtp-stand-in';
import { createMailer } from './send';
import { MailMessage } from '../models';

let t: Awaited<ReturnType<typeof testApp>>;
let smtp: Awaited<ReturnType<typeof startSmtpStandIn>>;
beforeAll(async () => {
  t = await testApp();
  smtp = await startSmtpStandIn({ host: '127.0.0.1', port: 0 });
});
afterAll(async () => {
  await smtp.close();
  await t.close();
});

/** A local process other than the server, speaking SMTP to the stand-in with what it chooses. */
async function sendAs(options: { auth?: { user: string; pass: string }; envelopeFrom: string; headerFrom?: string }) {
  const transport = nodemailer.createTransport({
    host: '127.0.0.1',
    port: smtp.port,
    secure: false,
    ignoreTLS: true,
    ...(options.auth ? { auth: options.auth } : {}),
  });
  const subject = `Forged ${t.unique()}`;
  try {
    await transport.sendMail({
      envelope: { from: options.envelopeFrom, to: ['admin@demo.tallyrun'] },
      from: options.headerFrom ?? options.envelopeFrom,
      to: 'admin@demo.tallyrun',
      subject,
      text: 'Please reset your password here.',
    });
    return { subject, error: null };
  } catch (err) {
    return { subject, error: err as Error & { responseCode?: number } };
  } finally {
    transport.close();
  }
}

it('stores a message sent through nodemailer, with its recipients, subject and text', async () => {
  const mailer = createMailer({ host: '127.0.0.1', port: smtp.port, access: smtp.access });
  const subject = `Low in range at KFG-101 ${t.unique()} – 8 % of span`;
  try {
    await mailer.send({
      to: ['engineer@demo.tallyrun', 'engineer2@demo.tallyrun'],
      subject,
      text: 'DP has been below 10 % of span for 15 minutes.\nCheck the low-range transmitter.',
    });
  } finally {
    mailer.close();
  }
  const stored = await MailMessage.findOne({ where: { subject } });
  expect(stored).not.toBeNull();
  expect(stored!.sender).toBe(serverSender);
  expect(stored!.recipients).toEqual(['engineer@demo.tallyrun', 'engineer2@demo.tallyrun']);
  expect(stored!.text).toBe('DP has been below 10 % of span for 15 minutes.\nCheck the low-range transmitter.');
});

it('refuses a client that has not signed in, even with the server sender', async () => {
  const { subject, error } = await sendAs({ envelopeFrom: serverSender });
  expect(error).not.toBeNull();
  expect(error!.responseCode).toBe(530);
  expect(await MailMessage.findOne({ where: { subject } })).toBeNull();
});

it('refuses a client with wrong credentials', async () => {
  const { subject, error } = await sendAs({
    auth: { user: smtp.access.auth.user, pass: 'guessed-password' },
    envelopeFrom: serverSender,
  });
  expect(error).not.toBeNull();
  expect(error!.responseCode).toBe(535);
  expect(await MailMessage.findOne({ where: { subject } })).toBeNull();
});

it('refuses a forged envelope sender even from a signed-in client', async () => {
  const { subject, error } = await sendAs({ auth: smtp.access.auth, envelopeFrom: 'admin@demo.tallyrun' });
  expect(error).not.toBeNull();
  expect(error!.responseCode).toBe(553);
  expect(error!.message).toContain(`only ${serverSender} may send here`);
  expect(await MailMessage.findOne({ where: { subject } })).toBeNull();
});

it('refuses a forged From header behind the server envelope sender', async () => {
  const { subject, error } = await sendAs({
    auth: smtp.access.auth,
    envelopeFrom: serverSender,
    headerFrom: 'Payroll <admin@demo.tallyrun>',
  });
  expect(error).not.toBeNull();
  expect(error!.responseCode).toBe(553);
  expect(await MailMessage.findOne({ where: { subject } })).toBeNull();
});

it('generates new credentials at every start', async () => {
  const other = await startSmtpStandIn({ host: '127.0.0.1', port: 0 });
  await other.close();
  expect(other.access.auth.pass).not.toBe(smtp.access.auth.pass);
  expect(other.access.auth.pass.length).toBeGreaterThanOrEqual(32);
});

it('decodes a quoted-printable body and an encoded-word subject', async () => {
  const raw =
    'From: Tallyrun <Tallyrun@localhost>\r\nSubject: =?UTF-8?Q?Caf=C3=A9_meter?=\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n25 =C2=B0C and a soft=\r\n break\r\n';
  expect(await parseMessage(raw)).toEqual({
    subject: 'Café meter',
    text: '25 °C and a soft break',
    from: ['tallyrun@localhost'],
  });
});
