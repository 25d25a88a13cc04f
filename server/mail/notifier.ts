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
import { alarmMail, digestMail, floodMail, type MailAlarm, type MailSite } from './alarm-mail-text';

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

const alarmColumns = `a.id::text, a.condition, a.priority, a.state, a.message, a.raised_at, a.cleared_at, m.tag AS meter_run_tag, t.tag AS transmitter_tag,
  a.meter_run_id::text, a.transmitter_id::text, m.site_id::text, s.code AS site_code, s.name AS site_name, s.time_zone`;
const alarmFrom = `FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id JOIN sites s ON s.id = m.site_id LEFT JOIN transmitters t ON t.id = a.transmitter_id`;
const toMailAlarm = (r: Record<string, unknown>): MailAlarm => ({
  id: r.id as string,
  condition: r.condition as string,
  priority: r.priority as string,
  state: r.state as string,
  message: r.message as string,
  raisedAt: r.raised_at as Date,
  clearedAt: (r.cleared_at as Date | null) ?? null,
  meterRunTag: r.meter_run_tag as string,
  transmitterTag: (r.transmitter_tag as string | null) ?? null,
});
const toSite = (r: Record<string, unknown>): MailSite => ({
  code: r.site_code as string,
  name: r.site_name as string,
  timeZone: r.time_zone as string,
});

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
      void this.run().catch((err) => console.error('[mail] alarm mail:', err));
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

  private async recipients(): Promise<string[]> {
    const { rows } = await this.pool.query(
      `SELECT email FROM users WHERE role = 'engineer' AND NOT disabled ORDER BY email`,
    );
    return rows.map((r) => r.email as string);
  }

  private async runOnce() {
    const nowMs = this.now();
    let alarmMails = 0;
    let floodMails = 0;
    const { rows } = await this.pool.query(
      `SELECT ${alarmColumns} ${alarmFrom} WHERE a.notify_status = 'pending' ORDER BY a.created_at, a.id`,
    );
    if (!rows.length) return { alarmMails, floodMails };
    const to = await this.recipients();
    const mark = (ids: string[], status: string) =>
      this.pool.query(
        `UPDATE alarms SET notify_status = $2, notified_at = CASE WHEN $2 IN ('sent', 'summarised') THEN to_timestamp($3 / 1000.0) ELSE notified_at END WHERE id = ANY($1::bigint[])`,
        [ids, status, nowMs],
      );
    // Not (or no longer) news: shelved, out of service, normal again and acknowledged, or no one to tell.
    const stale = rows.filter(
      (r) =>
        !['active-unacknowledged', 'active-acknowledged', 'returned-unacknowledged'].includes(r.state as string) ||
        !to.length,
    );
    if (stale.length)
      await mark(
        stale.map((r) => r.id),
        'not-needed',
      );
    const bySite = new Map<string, Record<string, unknown>[]>();
    for (const r of rows) if (!stale.includes(r)) bySite.set(r.site_id, [...(bySite.get(r.site_id) ?? []), r]);

    for (const [siteId, pending] of bySite) {
      const site = toSite(pending[0]);
      const recent = (
        await this.pool.query(
          `SELECT count(*)::int AS n FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id WHERE m.site_id = $1 AND a.raised_at > to_timestamp($2 / 1000.0)`,
          [siteId, nowMs - this.floodWindowMs],
        )
      ).rows[0].n as number;
      const lastFlood = (
        await this.pool.query(`SELECT max(sent_at) AS t FROM alarm_mails WHERE site_id = $1 AND kind = 'flood'`, [
          siteId,
        ])
      ).rows[0].t as Date | null;
      const floodMailedRecently = lastFlood !== null && lastFlood.getTime() > nowMs - this.floodWindowMs;
      if (recent > this.floodCount || pending.length > this.floodCount || floodMailedRecently) {
        // A flood: one mail for all of them, at most one per window (the rest wait for the next one).
        if (floodMailedRecently) continue;
        const mail = floodMail(
          pending.map(toMailAlarm),
          site,
          this.floodWindowMs / 60_000,
          Math.max(recent, pending.length),
        );
        await this.mailer.send({ to, ...mail });
        await this.pool.query(
          `INSERT INTO alarm_mails (site_id, kind, recipients, subject, sent_at) VALUES ($1, 'flood', $2, $3, to_timestamp($4 / 1000.0))`,
          [siteId, to, mail.subject, nowMs],
        );
        await mark(
          pending.map((r) => r.id as string),
          'summarised',
        );
        floodMails++;
        continue;
      }
      for (const r of pending) {
        const mailedRecently = (
          await this.pool.query(
            `SELECT 1 FROM alarm_mails x JOIN alarms b ON b.id = x.alarm_id
            WHERE x.kind = 'alarm' AND b.meter_run_id = $1 AND b.transmitter_id IS NOT DISTINCT FROM $2::bigint AND b.condition = $3 AND x.sent_at > to_timestamp($4 / 1000.0) LIMIT 1`,
            [r.meter_run_id, r.transmitter_id, r.condition, nowMs - this.intervalMs],
          )
        ).rowCount;
        if (mailedRecently) {
          await mark([r.id as string], 'not-needed');
          continue;
        }
        const mail = alarmMail(toMailAlarm(r), site);
        await this.mailer.send({ to, ...mail });
        await this.pool.query(
          `INSERT INTO alarm_mails (site_id, kind, alarm_id, recipients, subject, sent_at) VALUES ($1, 'alarm', $2, $3, $4, to_timestamp($5 / 1000.0))`,
          [siteId, r.id, to, mail.subject, nowMs],
        );
        await mark([r.id as string], 'sent');
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
    const sites = (
      await this.pool.query('SELECT id::text, code, name, time_zone, contract_hour FROM sites ORDER BY id')
    ).rows;
    const sent: string[] = [];
    for (const s of sites) {
      const today = contractDayBounds(contractDayOf(nowMs, s.time_zone, s.contract_hour), s.time_zone, s.contract_hour);
      if (nowMs - today.startMs > 3_600_000) continue; // not within the hour after the contract hour
      const day = contractDayOf(today.startMs - 1, s.time_zone, s.contract_hour);
      const bounds = contractDayBounds(day, s.time_zone, s.contract_hour);
      const site: MailSite = { code: s.code, name: s.name, timeZone: s.time_zone };
      const raised = (
        await this.pool.query(
          `SELECT ${alarmColumns} ${alarmFrom} WHERE m.site_id = $1 AND a.raised_at >= to_timestamp($2 / 1000.0) AND a.raised_at < to_timestamp($3 / 1000.0) ORDER BY a.raised_at`,
          [s.id, bounds.startMs, bounds.endMs],
        )
      ).rows.map(toMailAlarm);
      const open = (
        await this.pool.query(
          `SELECT ${alarmColumns} ${alarmFrom} WHERE m.site_id = $1 AND a.state <> 'normal' ORDER BY a.priority, a.raised_at`,
          [s.id],
        )
      ).rows.map(toMailAlarm);
      if (!raised.length && !open.length) continue;
      const to = await this.recipients();
      if (!to.length) continue;
      const mail = digestMail(site, day, raised, open);
      // Claim the day first (unique per site and day), so two processes never both send it.
      const claim = await this.pool.query(
        `INSERT INTO alarm_mails (site_id, kind, contract_day, recipients, subject, sent_at) VALUES ($1, 'digest', $2, $3, $4, to_timestamp($5 / 1000.0))
         ON CONFLICT (site_id, contract_day) WHERE kind = 'digest' DO NOTHING RETURNING id`,
        [s.id, day, to, mail.subject, nowMs],
      );
      if (!claim.rowCount) continue;
      try {
        await this.mailer.send({ to, ...mail });
        sent.push(s.id);
      } catch (err) {
        await this.pool.query('DELETE FROM alarm_mails WHERE id = $1', [claim.rows[0].id]);
        throw err;
      }
    }
    return sent;
  }
}
