/**
 * The words of alarm mails: one alarm, a flood summary, the daily digest. Plain text; times in
 * the site's local time with its zone named (shared/format/time.ts), conditions, states and
 * priorities in words (shared/format/alarm-words.ts), never as codes.
 */
import { alarmConditionWords, alarmPriorityWords, alarmStateWords } from '../../shared/format/alarm-words';
import { formatContractDay, formatDate, formatInstant } from '../../shared/format/time';

export interface MailAlarm {
  id: string;
  condition: string;
  priority: string;
  state: string;
  message: string;
  raisedAt: Date;
  clearedAt: Date | null;
  meterRunTag: string;
  transmitterTag: string | null;
}

export interface MailSite {
  code: string;
  name: string;
  timeZone: string;
}

const local = (d: Date, site: MailSite) => formatInstant(d, site.timeZone);
const line = (a: MailAlarm, site: MailSite) =>
  `- ${alarmPriorityWords(a.priority)} priority, ${a.meterRunTag}${a.transmitterTag ? ` / ${a.transmitterTag}` : ''}: ${alarmConditionWords(a.condition)}, raised ${local(a.raisedAt, site)}, ${alarmStateWords(a.state)} — ${a.message}`;

/** The usual caution: the mail may send someone to the line. */
const CAUTION =
  'Before any work on the meter run, follow your site’s isolation, permit and gas-testing procedures and local codes; pressurised lines, steam and sour gas can hurt.';

/** @returns subject and text of the mail for one new alarm */
export function alarmMail(a: MailAlarm, site: MailSite): { subject: string; text: string } {
  return {
    subject: `[Tallyrun] ${alarmPriorityWords(a.priority)}-priority alarm at ${site.code}: ${a.meterRunTag} ${alarmConditionWords(a.condition)}`,
    text: [
      a.message,
      '',
      `Site: ${site.code} ${site.name}`,
      `Meter run: ${a.meterRunTag}${a.transmitterTag ? `, transmitter ${a.transmitterTag}` : ''}`,
      `Condition: ${alarmConditionWords(a.condition)}; ${a.priority} priority; ${alarmStateWords(a.state)}`,
      `Raised: ${local(a.raisedAt, site)}`,
      `Alarm id: ${a.id} — acknowledge or shelve it in Tallyrun (Alarms).`,
      '',
      CAUTION,
    ].join('\n'),
  };
}

/** @returns subject and text of one mail that stands for many alarms at a site (an alarm flood, TRADE.md §7) */
export function floodMail(
  alarms: MailAlarm[],
  site: MailSite,
  windowMinutes: number,
  countInWindow: number,
): { subject: string; text: string } {
  const byCondition = new Map<string, number>();
  for (const a of alarms) {
    const words = alarmConditionWords(a.condition);
    byCondition.set(words, (byCondition.get(words) ?? 0) + 1);
  }
  const shown = alarms.slice(0, 50);
  return {
    subject: `[Tallyrun] Alarm flood at ${site.code}: ${alarms.length} alarms (${countInWindow} in ${windowMinutes} min)`,
    text: [
      `An alarm flood at ${site.code} ${site.name}: ${countInWindow} alarms were raised in the last ${windowMinutes} minutes (a flood is more than 10 in 10 minutes).`,
      `This one mail stands for the ${alarms.length} alarms below instead of one mail each.`,
      '',
      'By condition:',
      ...[...byCondition.entries()].sort((x, y) => y[1] - x[1]).map(([c, n]) => `- ${c}: ${n}`),
      '',
      'Alarms:',
      ...shown.map((a) => line(a, site)),
      ...(alarms.length > shown.length ? [`… and ${alarms.length - shown.length} more (see Alarms in Tallyrun).`] : []),
      '',
      CAUTION,
    ].join('\n'),
  };
}

/**
 * @param bounds the contract day's start and end (to say them: "yesterday" is unambiguous)
 * @returns subject and text of the daily digest for a site's contract day
 */
export function digestMail(
  site: MailSite,
  contractDay: string,
  raised: MailAlarm[],
  open: MailAlarm[],
  bounds?: { startMs: number; endMs: number },
): { subject: string; text: string } {
  const dayWords = bounds
    ? formatContractDay(contractDay, bounds, site.timeZone)
    : `Contract day ${formatDate(contractDay)}`;
  const count = (list: MailAlarm[], p: string) => list.filter((a) => a.priority === p).length;
  return {
    subject: `[Tallyrun] Alarm digest ${site.code} for contract day ${formatDate(contractDay)}: ${raised.length} raised, ${open.length} open`,
    text: [
      `Alarms at ${site.code} ${site.name}. ${dayWords}.`,
      `Raised that day: ${raised.length} (high ${count(raised, 'high')}, medium ${count(raised, 'medium')}, low ${count(raised, 'low')}).`,
      `Open now (not normal): ${open.length}.`,
      '',
      'Raised that day:',
      ...(raised.length ? raised.slice(0, 100).map((a) => line(a, site)) : ['- none']),
      '',
      'Open now:',
      ...(open.length ? open.slice(0, 100).map((a) => line(a, site)) : ['- none']),
    ].join('\n'),
  };
}
