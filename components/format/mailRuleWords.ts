/**
 * What the mail outbox says about when Tallyrun mails, in words; the rule itself lives in
 * server/mail/notifier.ts (keep the two in step): each new high- or medium-priority alarm goes to
 * every engineer, at most one mail per alarm point an hour, a flood as one mail; low-priority
 * alarms, and alarms imported more than an hour after they were raised, only reach the daily
 * digest each site sends its engineers within the hour after its contract hour.
 */

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** @returns the rule as a sentence, naming how many engineers receive the mail */
export function mailRuleWords(engineerCount: number): string {
  const to = engineerCount ? `the ${plural(engineerCount, 'engineer')}` : 'the engineers (there are none yet)';
  return `Mail goes to ${to} for each new high- or medium-priority alarm (at most one an hour per transmitter and condition; a flood of more than 10 alarms in 10 minutes as one mail). Low-priority alarms and imported history reach them in each site's daily digest, sent within the hour after the site's contract hour.`;
}

/**
 * @param unacknowledged the unacknowledged alarms by priority (GET /api/alarms/counts)
 * @param engineerCount enabled engineers
 * @returns why the outbox may hold no mail for them, or null when there are none
 */
export function unmailedAlarmsWords(
  unacknowledged: { high: number; medium: number; low: number },
  engineerCount: number,
): string | null {
  const total = unacknowledged.high + unacknowledged.medium + unacknowledged.low;
  if (!total) return null;
  const all = total === 1 ? 'the one unacknowledged alarm' : `the ${total} unacknowledged alarms`;
  if (!engineerCount) return `No mail can go out: there is no enabled engineer to send ${all} to.`;
  const mailed = unacknowledged.high + unacknowledged.medium;
  if (!mailed)
    return `None of ${all} is high or medium priority: they are not mailed one by one, only listed in the daily digest.`;
  return `${plural(mailed, 'unacknowledged alarm')} of ${total} ${mailed === 1 ? 'is' : 'are'} high or medium priority and mailed when raised, unless imported more than an hour later, shelved or out of service first, or already mailed for the same transmitter and condition within the hour.`;
}
