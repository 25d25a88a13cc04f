import { testApp } from '../test-support/app';
import { startSmtpStandIn, parseMessage } from './smtp-stand-in';
import { createMailer } from './send';
import { MailMessage } from '../models';

let t: Awaited<ReturnType<typeof testApp>>;
beforeAll(async () => {
  t = await testApp();
});
afterAll(() => t.close());

it('stores a message sent through nodemailer, with its recipients, subject and text', async () => {
  const smtp = await startSmtpStandIn({ host: '127.0.0.1', port: 0 });
  const mailer = createMailer({ host: '127.0.0.1', port: smtp.port });
  const subject = `Low in range at KFG-101 ${t.unique()} – 8 % of span`;
  try {
    await mailer.send({
      to: ['engineer@demo.tallyrun', 'engineer2@demo.tallyrun'],
      subject,
      text: 'DP has been below 10 % of span for 15 minutes.\nCheck the low-range transmitter.',
    });
  } finally {
    mailer.close();
    await smtp.close();
  }
  const stored = await MailMessage.findOne({ where: { subject } });
  expect(stored).not.toBeNull();
  expect(stored!.recipients).toEqual(['engineer@demo.tallyrun', 'engineer2@demo.tallyrun']);
  expect(stored!.text).toBe('DP has been below 10 % of span for 15 minutes.\nCheck the low-range transmitter.');
});

it('decodes a quoted-printable body and an encoded-word subject', async () => {
  const raw =
    'Subject: =?UTF-8?Q?Caf=C3=A9_meter?=\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n25 =C2=B0C and a soft=\r\n break\r\n';
  expect(await parseMessage(raw)).toEqual({ subject: 'Café meter', text: '25 °C and a soft break' });
});
