/**
 * A transmitter's calibration date in words. Overdue is abnormal (shape, words and colour);
 * due within a month is a reminder in words only.
 */
import { DateTime } from 'luxon';

/** Reminder window before a calibration falls due, days. */
const dueSoonDays = 30;

/**
 * @param due the calibration due date, YYYY-MM-DD, or null when none is recorded
 * @param today today's date at the site, YYYY-MM-DD
 * @returns the text to show and whether it is abnormal
 */
export function calibrationState(due: string | null, today: string): { text: string; abnormal: boolean } {
  if (!due) return { text: 'not recorded', abnormal: false };
  const days = Math.round(
    DateTime.fromISO(due, { zone: 'UTC' }).diff(DateTime.fromISO(today, { zone: 'UTC' }), 'days').days,
  );
  if (!Number.isFinite(days)) return { text: due, abnormal: false };
  if (days < 0) return { text: `⚑ ${due}, overdue by ${-days} day${days === -1 ? '' : 's'}`, abnormal: true };
  if (days <= dueSoonDays) return { text: `${due} (in ${days} day${days === 1 ? '' : 's'})`, abnormal: false };
  return { text: due, abnormal: false };
}
