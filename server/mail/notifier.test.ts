import { testApp } from '../test-support/app';
import { startSmtpStandIn } from './smtp-stand-in';
import { createMailer } from './send';
import { AlarmNotifier } from './notifier';
import { MailMessage } from '../models';
import { AlarmEvaluator } from '../alarms/alarm-evaluator';
import { applySignal } from '../alarms/alarm-store';
import { alarmFixture, MIN, repeat } from '../alarms/alarm-test-fixture';
import type { AlarmCondition } from '../../shared/alarms/alarm-codes';

/** Alarm mail through nodemailer into the SMTP stand-in, which stores it for the admin's outbox. */
let t: Awaited<ReturnType<typeof testApp>>;
let smtp: Awaited<ReturnType<typeof startSmtpStandIn>>;
let mailer: ReturnType<typeof createMailer>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let admin: Awaited<ReturnType<typeof t.signedIn>>;
beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  admin = await t.signedIn('admin');
  smtp = await startSmtpStandIn({ host: '127.0.0.1', port: 0 });
  mailer = createMailer({ host: '127.0.0.1', port: smtp.port, access: smtp.access });
});
afterAll(async () => {
  mailer.close();
  await smtp.close();
  await t.close();
});

const mailsAbout = async (text: string) =>
  (await MailMessage.findAll()).filter((m) => m.subject.includes(text) || m.text.includes(text));

describe('AlarmNotifier', () => {
  it('mails a new medium alarm to the engineers; it arrives in the stand-in and in the outbox (GET /api/mail)', async () => {
    const f = await alarmFixture(t, engineer.token);
    const now = Date.now();
    const start = Math.floor((now - 40 * MIN) / MIN) * MIN;
    await f.writeMinutes(start, [...repeat(10, 0.4), ...repeat(29, 0.05)]);
    await t.services.history.settle();
    await new AlarmEvaluator(t.services.pool).evaluate(f.meterRunId);
    const notifier = new AlarmNotifier(t.services.pool, mailer, { floodCount: 1000 });
    const sent = await notifier.run();
    expect(sent.alarmMails).toBeGreaterThanOrEqual(1);
    const mails = (await mailsAbout(f.tag)).filter((m) => m.subject.includes('DP low in range'));
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/Medium-priority alarm/);
    expect(mails[0].recipients).toContain(engineer.email);
    expect(mails[0].recipients).not.toContain(admin.email);
    expect(mails[0].text).toMatch(/5\.0 % of its span/);
    expect(mails[0].text).toMatch(/Condition: DP low in range; medium priority; active, unacknowledged/);
    expect(mails[0].text).not.toMatch(/dp-low-in-range|active-unacknowledged/);
    const outbox = await t.http().get('/api/mail').set('Authorization', `Bearer ${admin.token}`);
    expect(outbox.body.some((m: { subject: string }) => m.subject === mails[0].subject)).toBe(true);
    // This alarm is not mailed twice (other files' alarms may be mailed by the same run).
    await notifier.run();
    expect((await mailsAbout(f.tag)).filter((m) => m.subject.includes('DP low in range'))).toHaveLength(1);
  });

  it('sends at most one mail per alarm point per interval when the condition comes back', async () => {
    const f = await alarmFixture(t, engineer.token);
    const now = Date.now();
    const notifier = new AlarmNotifier(t.services.pool, mailer, { floodCount: 1000 });
    const signal = (kind: 'raise' | 'clear', timeMs: number) => ({
      kind,
      condition: 'bad-quality' as const,
      transmitterId: f.pt.id,
      timeMs,
      onsetMs: timeMs,
      message: `${f.pt.tag} reports bad-quality readings.`,
      detail: {},
    });
    await applySignal(t.services.pool, f.meterRunId, signal('raise', now - 5 * MIN), 'medium', now);
    await notifier.run();
    await applySignal(t.services.pool, f.meterRunId, signal('clear', now - 4 * MIN), 'medium', now);
    await applySignal(t.services.pool, f.meterRunId, signal('raise', now - 3 * MIN), 'medium', now); // back to alarm, unacknowledged
    await notifier.run();
    expect((await mailsAbout(f.tag)).filter((m) => m.subject.includes('Bad-quality readings'))).toHaveLength(1);
  });

  it('summarises a flood (more than 10 alarms in 10 minutes at a site) in one mail', async () => {
    const f = await alarmFixture(t, engineer.token);
    const now = Date.now();
    const conditions: AlarmCondition[] = ['frozen', 'stale', 'bad-quality', 'calibration-overdue'];
    let n = 0;
    for (const tr of [f.dp, f.pt, f.tt]) {
      for (const condition of conditions) {
        await applySignal(
          t.services.pool,
          f.meterRunId,
          {
            kind: 'raise',
            condition,
            transmitterId: tr.id,
            timeMs: now - n * 10_000,
            onsetMs: now - n * 10_000,
            message: `${tr.tag} ${condition} (test)`,
            detail: {},
          },
          'medium',
          now,
        );
        n++;
      }
    }
    const result = await new AlarmNotifier(t.services.pool, mailer).run();
    expect(result.floodMails).toBeGreaterThanOrEqual(1);
    const site = (
      await t.services.pool.query('SELECT code FROM sites s JOIN meter_runs m ON m.site_id = s.id WHERE m.id = $1', [
        f.meterRunId,
      ])
    ).rows[0].code;
    const mails = await mailsAbout(site);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(new RegExp(`Alarm flood at ${site}: 12 alarms`));
    expect(mails[0].text).toMatch(/Transmitter frozen: 3/);
  });

  it('sends one digest per site for the contract day just ended, within the hour after the contract hour', async () => {
    const f = await alarmFixture(t, engineer.token, { timeZone: 'America/Denver', contractHour: 9 });
    const dayStart = Date.parse('2026-10-20T09:00:00-06:00'); // contract day 2026-10-20 starts at 09:00 MDT
    await applySignal(
      t.services.pool,
      f.meterRunId,
      {
        kind: 'raise',
        condition: 'stale',
        transmitterId: f.dp.id,
        timeMs: dayStart + 3_600_000,
        onsetMs: dayStart + 3_600_000,
        message: `${f.dp.tag} stale (test)`,
        detail: {},
      },
      'medium',
      Date.now(),
    );
    const notifier = new AlarmNotifier(t.services.pool, mailer);
    const nextDay = dayStart + 24 * 3_600_000;
    expect(await notifier.sendDigests(nextDay - 60_000)).not.toContain(f.siteId); // before the contract hour
    expect(await notifier.sendDigests(nextDay + 10 * MIN)).toContain(f.siteId);
    expect(await notifier.sendDigests(nextDay + 20 * MIN)).not.toContain(f.siteId); // once per day
    const site = (await t.services.pool.query('SELECT code FROM sites WHERE id = $1', [f.siteId])).rows[0].code;
    const digest = (await mailsAbout(`Alarm digest ${site}`))[0];
    expect(digest.subject).toBe(`[Tallyrun] Alarm digest ${site} for contract day 20 Oct 2026: 1 raised, 1 open`);
    // 09:00 MDT: Denver keeps daylight saving time until the first Sunday of November.
    expect(digest.text).toContain('Contract day 20 Oct 2026, 09:00 20 Oct – 09:00 21 Oct MDT.');
  });
});
