/**
 * Alarm mail (nodemailer to the SMTP stand-in, which keeps every message for the admin's
 * outbox):
 * - each new high or medium alarm goes to every engineer (there is no site membership yet: every
 *   engineer counts as a member of every site), unless it was raised more than an hour before
 *   now (imported history: it goes to the digest) or is shelved or out of service by the time the
 *   mail would go;
 * - at most one mail per alarm point (meter run, transmitter, condition) per interval (default
 *   an hour), so a condition that keeps coming back is not a mail each time;
 * - a flood, more than 10 alarms in 10 minutes at a site (TRADE.md §7), or a backlog of more than
 *   10 waiting at a site, is summarised in ONE mail, at most one such mail per 10 minutes;
 * - a daily digest per site at its contract hour (run from node-cron every minute; sent once per
 *   contract day, within the hour after the contract hour, when the site had alarms that day or
 *   has open ones).
 */
import type { Pool } from 'pg';
import { contractDayBounds, contractDayOf } from '../../shared/history/contract-day';
import { componentLogger } from '../log';
import {
  alarmPointMailedSince,
  alarmsRaisedBetween,
  alarmsRaisedSince,
  claimDigest,
  digestSites,
  engineerEmails,
  lastFloodMailMs,
  markAlarms,
  openAlarms,
  pendingAlarms,
  recordAlarmMail,
  recordFloodMail,
  releaseDigestClaim,
  type AlarmToMail,
  type NotifyStatus,
} from './alarm-mail-repository';
import { alarmMail, digestMail, floodMail, type MailSite } from './alarm-mail-text';

const log = componentLogger('mail');

export interface Mailer {
  send(message: { to: string | string[]; subject: string; text: string }): Promise<unknown>;
}

export interface NotifierOptions {
  now?: () => number;
  /** At most one mail per alarm point per this many seconds (default 3600). */
  intervalS?: number;
  /** More than this many alarms in the flood window is a flood (default 10, TRADE.md §7). */
  floodCount?: number;
  floodWindowS?: number;
}

export class AlarmNotifier {
  private running: Promise<unknown> | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private readonly now: () => number;
  private readonly intervalMs: number;
  private readonly floodCount: number;
  private readonly floodWindowMs: number;

  constructor(
    private readonly pool: Pool,
    private readonly mailer: Mailer,
    options: NotifierOptions = {},
  ) {
    this.now = options.now ?? Date.now;
    this.intervalMs = (options.intervalS ?? 3600) * 1000;
    this.floodCount = options.floodCount ?? 10;
    this.floodWindowMs = (options.floodWindowS ?? 600) * 1000;
  }

  /** New alarms were raised: mail them soon (alarms raised together are gathered for a second). */
  requestRun() {
    if (this.timer) return;
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.run().catch((err) => log.error({ err }, 'sending alarm mail failed'));
    }, 1000);
    (this.timer as unknown as { unref?: () => void }).unref?.();
  }

  stop() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  /** Sends what is pending; one run at a time. */
  async run(): Promise<{ alarmMails: number; floodMails: number }> {
    while (this.running) await this.running.catch(() => undefined);
    const work = this.runOnce();
    this.running = work;
    try {
      return await work;
    } finally {
      this.running = null;
    }
  }

  private async runOnce() {
    const nowMs = this.now();
    let alarmMails = 0;
    let floodMails = 0;
    const pending = await pendingAlarms(this.pool);
    if (!pending.length) return { alarmMails, floodMails };
    const to = await engineerEmails(this.pool);
    const mark = (ids: string[], status: NotifyStatus) => markAlarms(this.pool, ids, status, nowMs);
    // Not (or no longer) news: shelved, out of service, normal again and acknowledged, or no one to tell.
    const stale = pending.filter(
      (p) =>
        !['active-unacknowledged', 'active-acknowledged', 'returned-unacknowledged'].includes(p.alarm.state) ||
        !to.length,
    );
    if (stale.length)
      await mark(
        stale.map((p) => p.alarm.id),
        'not-needed',
      );
    const bySite = new Map<string, AlarmToMail[]>();
    for (const p of pending) if (!stale.includes(p)) bySite.set(p.siteId, [...(bySite.get(p.siteId) ?? []), p]);

    for (const [siteId, waiting] of bySite) {
      const site = waiting[0].site;
      const recent = await alarmsRaisedSince(this.pool, siteId, nowMs - this.floodWindowMs);
      const lastFloodMs = await lastFloodMailMs(this.pool, siteId);
      const floodMailedRecently = lastFloodMs !== null && lastFloodMs > nowMs - this.floodWindowMs;
      if (recent > this.floodCount || waiting.length > this.floodCount || floodMailedRecently) {
        // A flood: one mail for all of them, at most one per window (the rest wait for the next one).
        if (floodMailedRecently) continue;
        const mail = floodMail(
          waiting.map((p) => p.alarm),
          site,
          this.floodWindowMs / 60_000,
          Math.max(recent, waiting.length),
        );
        await this.mailer.send({ to, ...mail });
        await recordFloodMail(this.pool, { siteId, recipients: to, subject: mail.subject }, nowMs);
        await mark(
          waiting.map((p) => p.alarm.id),
          'summarised',
        );
        floodMails++;
        continue;
      }
      for (const p of waiting) {
        const point = { meterRunId: p.meterRunId, transmitterId: p.transmitterId, condition: p.alarm.condition };
        if (await alarmPointMailedSince(this.pool, point, nowMs - this.intervalMs)) {
          await mark([p.alarm.id], 'not-needed');
          continue;
        }
        const mail = alarmMail(p.alarm, site);
        await this.mailer.send({ to, ...mail });
        await recordAlarmMail(this.pool, { siteId, alarmId: p.alarm.id, recipients: to, subject: mail.subject }, nowMs);
        await mark([p.alarm.id], 'sent');
        alarmMails++;
      }
    }
    return { alarmMails, floodMails };
  }

  /**
   * Sends each site's digest for the contract day that ended at its latest contract hour, once,
   * within the hour after it.
   * @returns the sites mailed
   */
  async sendDigests(nowMs = this.now()): Promise<string[]> {
    const sent: string[] = [];
    for (const s of await digestSites(this.pool)) {
      const today = contractDayBounds(contractDayOf(nowMs, s.timeZone, s.contractHour), s.timeZone, s.contractHour);
      if (nowMs - today.startMs > 3_600_000) continue; // not within the hour after the contract hour
      const day = contractDayOf(today.startMs - 1, s.timeZone, s.contractHour);
      const bounds = contractDayBounds(day, s.timeZone, s.contractHour);
      const site: MailSite = { code: s.code, name: s.name, timeZone: s.timeZone };
      const raised = await alarmsRaisedBetween(this.pool, s.id, bounds.startMs, bounds.endMs);
      const open = await openAlarms(this.pool, s.id);
      if (!raised.length && !open.length) continue;
      const to = await engineerEmails(this.pool);
      if (!to.length) continue;
      const mail = digestMail(site, day, raised, open, bounds);
      // Claim the day first (unique per site and day), so two processes never both send it.
      const claimId = await claimDigest(
        this.pool,
        { siteId: s.id, contractDay: day, recipients: to, subject: mail.subject },
        nowMs,
      );
      if (claimId === null) continue;
      try {
        await this.mailer.send({ to, ...mail });
        sent.push(s.id);
      } catch (err) {
        await releaseDigestClaim(this.pool, claimId);
        throw err;
      }
    }
    return sent;
  }
}
