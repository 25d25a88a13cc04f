/**
 * What alarm mail reads and writes in PostgreSQL: the alarms waiting to be mailed (and their
 * notify_status), the engineers who receive them, and the alarm_mails log that spaces mails out
 * (one per alarm point per interval, one flood mail per window, one digest per site and day).
 */
import type { Pool } from 'pg';
import type { MailAlarm, MailSite } from './alarm-mail-text';

/** What becomes of a pending alarm: mailed, summarised in a flood mail, or not news. */
export type NotifyStatus = 'sent' | 'summarised' | 'not-needed';

/** An alarm with what its mail needs: its words, its site, and its alarm point. */
export interface AlarmToMail {
  alarm: MailAlarm;
  site: MailSite;
  siteId: string;
  meterRunId: string;
  transmitterId: string | null;
}

/** A site with the calendar of its contract day. */
export interface DigestSite extends MailSite {
  id: string;
  contractHour: number;
}

interface AlarmMailRow {
  id: string;
  condition: string;
  priority: string;
  state: string;
  message: string;
  raised_at: Date;
  cleared_at: Date | null;
  meter_run_tag: string;
  transmitter_tag: string | null;
  meter_run_id: string;
  transmitter_id: string | null;
  site_id: string;
  site_code: string;
  site_name: string;
  time_zone: string;
}

interface SiteRow {
  id: string;
  code: string;
  name: string;
  time_zone: string;
  contract_hour: number;
}

const alarmColumns = `a.id::text, a.condition, a.priority, a.state, a.message, a.raised_at, a.cleared_at, m.tag AS meter_run_tag, t.tag AS transmitter_tag,
  a.meter_run_id::text, a.transmitter_id::text, m.site_id::text, s.code AS site_code, s.name AS site_name, s.time_zone`;
const alarmFrom = `FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id JOIN sites s ON s.id = m.site_id LEFT JOIN transmitters t ON t.id = a.transmitter_id`;

const toAlarmToMail = (r: AlarmMailRow): AlarmToMail => ({
  alarm: {
    id: r.id,
    condition: r.condition,
    priority: r.priority,
    state: r.state,
    message: r.message,
    raisedAt: r.raised_at,
    clearedAt: r.cleared_at,
    meterRunTag: r.meter_run_tag,
    transmitterTag: r.transmitter_tag,
  },
  site: { code: r.site_code, name: r.site_name, timeZone: r.time_zone },
  siteId: r.site_id,
  meterRunId: r.meter_run_id,
  transmitterId: r.transmitter_id,
});

/** @returns the alarms whose mail is still pending, oldest first */
export async function pendingAlarms(pool: Pool): Promise<AlarmToMail[]> {
  const { rows } = await pool.query<AlarmMailRow>(
    `SELECT ${alarmColumns} ${alarmFrom} WHERE a.notify_status = 'pending' ORDER BY a.created_at, a.id`,
  );
  return rows.map(toAlarmToMail);
}

/** @returns the e-mail addresses of the engineers whose accounts are enabled, in order */
export async function engineerEmails(pool: Pool): Promise<string[]> {
  const { rows } = await pool.query<{ email: string }>(
    `SELECT email FROM users WHERE role = 'engineer' AND NOT disabled ORDER BY email`,
  );
  return rows.map((r) => r.email);
}

/** Records what became of pending alarms; a mail that went out stamps its time. */
export async function markAlarms(pool: Pool, alarmIds: string[], status: NotifyStatus, nowMs: number): Promise<void> {
  await pool.query(
    `UPDATE alarms SET notify_status = $2, notified_at = CASE WHEN $2 IN ('sent', 'summarised') THEN to_timestamp($3 / 1000.0) ELSE notified_at END WHERE id = ANY($1::bigint[])`,
    [alarmIds, status, nowMs],
  );
}

/** @returns how many alarms the site raised after `sinceMs` (mailed or not) */
export async function alarmsRaisedSince(pool: Pool, siteId: string, sinceMs: number): Promise<number> {
  const { rows } = await pool.query<{ n: number }>(
    `SELECT count(*)::int AS n FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id WHERE m.site_id = $1 AND a.raised_at > to_timestamp($2 / 1000.0)`,
    [siteId, sinceMs],
  );
  return rows[0].n;
}

/** @returns when the site's latest flood mail went out, or null if none ever did */
export async function lastFloodMailMs(pool: Pool, siteId: string): Promise<number | null> {
  const { rows } = await pool.query<{ t: Date | null }>(
    `SELECT max(sent_at) AS t FROM alarm_mails WHERE site_id = $1 AND kind = 'flood'`,
    [siteId],
  );
  return rows[0].t ? rows[0].t.getTime() : null;
}

/** @returns whether a mail about this alarm point (meter run, transmitter, condition) went out after `sinceMs` */
export async function alarmPointMailedSince(
  pool: Pool,
  point: { meterRunId: string; transmitterId: string | null; condition: string },
  sinceMs: number,
): Promise<boolean> {
  const { rowCount } = await pool.query(
    `SELECT 1 FROM alarm_mails x JOIN alarms b ON b.id = x.alarm_id
      WHERE x.kind = 'alarm' AND b.meter_run_id = $1 AND b.transmitter_id IS NOT DISTINCT FROM $2::bigint AND b.condition = $3 AND x.sent_at > to_timestamp($4 / 1000.0) LIMIT 1`,
    [point.meterRunId, point.transmitterId, point.condition, sinceMs],
  );
  return Boolean(rowCount);
}

/** Logs a mail that went out about one alarm. */
export async function recordAlarmMail(
  pool: Pool,
  mail: { siteId: string; alarmId: string; recipients: string[]; subject: string },
  sentMs: number,
): Promise<void> {
  await pool.query(
    `INSERT INTO alarm_mails (site_id, kind, alarm_id, recipients, subject, sent_at) VALUES ($1, 'alarm', $2, $3, $4, to_timestamp($5 / 1000.0))`,
    [mail.siteId, mail.alarmId, mail.recipients, mail.subject, sentMs],
  );
}

/** Logs a flood mail that went out for a site. */
export async function recordFloodMail(
  pool: Pool,
  mail: { siteId: string; recipients: string[]; subject: string },
  sentMs: number,
): Promise<void> {
  await pool.query(
    `INSERT INTO alarm_mails (site_id, kind, recipients, subject, sent_at) VALUES ($1, 'flood', $2, $3, to_timestamp($4 / 1000.0))`,
    [mail.siteId, mail.recipients, mail.subject, sentMs],
  );
}

/** @returns every site with its contract hour, in id order */
export async function digestSites(pool: Pool): Promise<DigestSite[]> {
  const { rows } = await pool.query<SiteRow>(
    'SELECT id::text, code, name, time_zone, contract_hour FROM sites ORDER BY sites.id',
  );
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    name: r.name,
    timeZone: r.time_zone,
    contractHour: r.contract_hour,
  }));
}

/** @returns the site's alarms raised in [fromMs, toMs), in the order they were raised */
export async function alarmsRaisedBetween(
  pool: Pool,
  siteId: string,
  fromMs: number,
  toMs: number,
): Promise<MailAlarm[]> {
  const { rows } = await pool.query<AlarmMailRow>(
    `SELECT ${alarmColumns} ${alarmFrom} WHERE m.site_id = $1 AND a.raised_at >= to_timestamp($2 / 1000.0) AND a.raised_at < to_timestamp($3 / 1000.0) ORDER BY a.raised_at`,
    [siteId, fromMs, toMs],
  );
  return rows.map((r) => toAlarmToMail(r).alarm);
}

/** @returns the site's alarms not back to normal, by priority, then in the order they were raised */
export async function openAlarms(pool: Pool, siteId: string): Promise<MailAlarm[]> {
  const { rows } = await pool.query<AlarmMailRow>(
    `SELECT ${alarmColumns} ${alarmFrom} WHERE m.site_id = $1 AND a.state <> 'normal' ORDER BY a.priority, a.raised_at`,
    [siteId],
  );
  return rows.map((r) => toAlarmToMail(r).alarm);
}

/**
 * Claims a site's digest of a contract day before it is sent (unique per site and day), so two
 * processes never both send it.
 * @returns the claim's id, or null when the day's digest is already claimed
 */
export async function claimDigest(
  pool: Pool,
  digest: { siteId: string; contractDay: string; recipients: string[]; subject: string },
  sentMs: number,
): Promise<string | null> {
  const { rows } = await pool.query<{ id: string }>(
    `INSERT INTO alarm_mails (site_id, kind, contract_day, recipients, subject, sent_at) VALUES ($1, 'digest', $2, $3, $4, to_timestamp($5 / 1000.0))
     ON CONFLICT (site_id, contract_day) WHERE kind = 'digest' DO NOTHING RETURNING id`,
    [digest.siteId, digest.contractDay, digest.recipients, digest.subject, sentMs],
  );
  return rows[0]?.id ?? null;
}

/** Gives a digest claim back (its mail could not be sent), so a later run sends it. */
export async function releaseDigestClaim(pool: Pool, claimId: string): Promise<void> {
  await pool.query('DELETE FROM alarm_mails WHERE id = $1', [claimId]);
}
