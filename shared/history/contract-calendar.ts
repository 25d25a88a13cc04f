/**
 * Contract days and months when a site's contract hour changes (issue 9: every setting that
 * shapes a result is effective-dated, the contract hour included).
 *
 * The rule, the simplest honest one: a new contract hour takes effect at a contract-day start.
 * A version with a new hour, dated E, takes effect at S, the first start of a contract day (on
 * the old hour) at or after E. Contract days before S keep the old hour. The day that starts at
 * S (named, as always, by the local date D on which it starts) runs until the new hour on D + 1,
 * so it is longer (new hour later than the old) or shorter (earlier) than 24 hours by the
 * difference; from D + 1 on, days start at the new hour. No hour belongs to two days and none is
 * left out, so contract-day totals still add up to the month's.
 * Example: old hour 9, new hour 6 dated 2026-11-10T12:00 local: day 10 November runs 09:00 on
 * 10 November to 09:00 on the 11th (unchanged, E fell inside it); 11 November runs from 09:00 on
 * the 11th to 06:00 on the 12th (21 hours); 12 November starts at 06:00.
 */
import { contractDayBounds, contractDayOf } from './contract-day';
import type { PeriodBounds } from './types';

const MS_PER_HOUR = 3_600_000;

/** A site setting version's contract hour, from its effective time. */
export interface ContractHourVersion {
  effectiveFromMs: number;
  contractHour: number;
}

/** Contract days and months of a site over its whole history. */
export interface ContractCalendar {
  /** The name 'YYYY-MM-DD' of the contract day that contains the instant. */
  dayOf(timeMs: number): string;
  dayBounds(day: string): PeriodBounds;
  /** From the start of contract day YYYY-MM-01 to the start of the 1st of the next month. */
  monthBounds(month: string): PeriodBounds;
}

interface Regime {
  /** Where the regime's first day starts (−∞ for the first regime). */
  fromMs: number;
  contractHour: number;
  /** The day that spans the change, with its bounds; null for the first regime. */
  transition: { day: string; startMs: number; endMs: number } | null;
}

const nextDay = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + 24 * MS_PER_HOUR).toISOString().slice(0, 10);

function nextMonth(month: string): string {
  const [y, m] = month.split('-').map(Number);
  return m === 12 ? `${y + 1}-01` : `${y}-${String(m + 1).padStart(2, '0')}`;
}

/**
 * @param timeZone IANA time zone of the site
 * @param versions the site's contract hours by effective time, sorted (the first applies from the beginning)
 * @param fallbackHour the contract hour when there is no version
 */
export function contractCalendar(
  timeZone: string,
  versions: readonly ContractHourVersion[],
  fallbackHour: number,
): ContractCalendar {
  const regimes: Regime[] = [
    { fromMs: -Infinity, contractHour: versions[0]?.contractHour ?? fallbackHour, transition: null },
  ];
  const dayIn = (regime: Regime, timeMs: number) =>
    regime.transition && timeMs < regime.transition.endMs
      ? regime.transition.day
      : contractDayOf(timeMs, timeZone, regime.contractHour);
  const boundsIn = (regime: Regime, day: string): PeriodBounds => {
    const t = regime.transition;
    if (t && day === t.day) return { startMs: t.startMs, endMs: t.endMs, hours: (t.endMs - t.startMs) / MS_PER_HOUR };
    return contractDayBounds(day, timeZone, regime.contractHour);
  };
  for (const v of versions.slice(1)) {
    const previous = regimes[regimes.length - 1];
    if (v.contractHour === previous.contractHour) continue;
    // The first day start of the previous regime at or after the version's time.
    const fromMs = Math.max(v.effectiveFromMs, previous.transition?.endMs ?? -Infinity);
    const containing = boundsIn(previous, dayIn(previous, fromMs));
    const startMs = containing.startMs === fromMs ? fromMs : containing.endMs;
    const day = dayIn(previous, startMs);
    const endMs = contractDayBounds(nextDay(day), timeZone, v.contractHour).startMs;
    regimes.push({ fromMs: startMs, contractHour: v.contractHour, transition: { day, startMs, endMs } });
  }
  const regimeAt = (timeMs: number) => regimes.filter((r) => r.fromMs <= timeMs).pop() as Regime;
  const regimeOfDay = (day: string) => regimes.filter((r) => !r.transition || day >= r.transition.day).pop() as Regime;
  const dayBounds = (day: string) => boundsIn(regimeOfDay(day), day);
  return {
    dayOf: (timeMs) => dayIn(regimeAt(timeMs), timeMs),
    dayBounds,
    monthBounds(month) {
      const startMs = dayBounds(`${month}-01`).startMs;
      const endMs = dayBounds(`${nextMonth(month)}-01`).startMs;
      return { startMs, endMs, hours: (endMs - startMs) / MS_PER_HOUR };
    },
  };
}
