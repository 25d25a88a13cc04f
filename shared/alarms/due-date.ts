/**
 * The one rule for a dated duty (a transmitter's calibration, an element calibration, a gas
 * analysis, an inspection): "due soon" from `dueSoonDays` before the due date up to and
 * including it, "overdue" from the day after. Dates are calendar dates in the site's time zone,
 * so the day turns at the site's midnight. The calibration and care alarms and the per-site
 * "what is due" list all judge with this function.
 */
import { DateTime } from 'luxon';

export type DueState = 'overdue' | 'due-soon' | 'ok';

const DAY_MS = 86_400_000;
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** @returns today's date (YYYY-MM-DD) in the time zone at the instant `nowMs` */
export function todayIn(nowMs: number, timeZone: string): string {
  const date = DateTime.fromMillis(nowMs, { zone: timeZone }).toISODate();
  if (!date) throw new Error(`todayIn: ${timeZone} is not a time zone`);
  return date;
}

/**
 * @param dueOn the due date, YYYY-MM-DD
 * @param today today's date in the same calendar, YYYY-MM-DD
 * @param dueSoonDays how many days before the due date it counts as due soon (0: only on the day)
 * @returns the state and the whole days left until the due date (negative once overdue)
 */
export function judgeDueDate(dueOn: string, today: string, dueSoonDays: number): { state: DueState; daysLeft: number } {
  if (!ISO_DATE.test(dueOn)) throw new Error(`judgeDueDate: dueOn must be YYYY-MM-DD (got ${dueOn})`);
  if (!ISO_DATE.test(today)) throw new Error(`judgeDueDate: today must be YYYY-MM-DD (got ${today})`);
  // Both at UTC midnight: the difference is a whole number of days, whatever the zone's offsets.
  const daysLeft = Math.round((Date.parse(`${dueOn}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / DAY_MS);
  const state: DueState = daysLeft < 0 ? 'overdue' : daysLeft <= dueSoonDays ? 'due-soon' : 'ok';
  return { state, daysLeft };
}
