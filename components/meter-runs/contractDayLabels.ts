/**
 * Today's and yesterday's contract days of a site, each labelled with its date, start and end
 * (shared/format/time.ts formatContractDay), so that "yesterday" never needs guessing when the day
 * starts at, say, 06:00 site time.
 */
import { formatContractDay } from '@/shared/format/time';
import { contractDayBounds, contractDayOf } from '@/shared/history/contract-day';

export interface LabelledContractDay {
  /** The contract day's name, "YYYY-MM-DD" (the local date on which it starts). */
  day: string;
  /** e.g. "Contract day 2 Dec 2026, 06:00 2 Dec – 06:00 3 Dec CST" */
  label: string;
}

/**
 * @param site the site's zone and contract hour
 * @param nowMs the clock
 * @returns the contract day running at nowMs, and the one before it
 */
export function latestContractDays(
  site: { timeZone: string; contractHour: number },
  nowMs: number,
): { today: LabelledContractDay; yesterday: LabelledContractDay } {
  const labelled = (day: string): LabelledContractDay => ({
    day,
    label: formatContractDay(day, contractDayBounds(day, site.timeZone, site.contractHour), site.timeZone),
  });
  const todayName = contractDayOf(nowMs, site.timeZone, site.contractHour);
  const todayStartMs = contractDayBounds(todayName, site.timeZone, site.contractHour).startMs;
  // One millisecond before today's start lies in yesterday, however long yesterday was (23, 24 or 25 h).
  return {
    today: labelled(todayName),
    yesterday: labelled(contractDayOf(todayStartMs - 1, site.timeZone, site.contractHour)),
  };
}
