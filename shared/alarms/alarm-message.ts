/**
 * The one-line message of a raised alarm, for lists, banners and mail: what is wrong, on which
 * transmitter, with the number that tripped it and the limit.
 */
import { formatDate, formatInstant } from '../format/time';
import type { AlarmCondition } from './alarm-codes';

export type AlarmDetail = Record<string, number | string | null>;

const pct = (share: unknown, digits = 1) => (typeof share === 'number' ? `${(share * 100).toFixed(digits)} %` : '?');
const num = (v: unknown, digits = 2) => (typeof v === 'number' ? v.toFixed(digits) : '?');
const isoUtc = (ms: unknown) => (typeof ms === 'number' ? new Date(ms).toISOString().replace('.000Z', 'Z') : '?');

/**
 * @param condition the condition raised
 * @param subject the transmitter's tag, or the meter run's tag for meter-run conditions
 * @param detail the numbers observed at the onset (shares as fractions, times as epoch ms)
 * @param timeZone the site's IANA zone: times are then said in its local time with the zone named
 *   ("3 Dec 2026, 09:11 CST"); without it, as UTC ISO 8601 instants (messages stored before
 *   issue 14 read so and stay as they are)
 * @returns a sentence
 */
export function alarmMessage(
  condition: AlarmCondition,
  subject: string,
  detail: AlarmDetail,
  timeZone?: string,
): string {
  const iso = (ms: unknown) => (timeZone && typeof ms === 'number' ? formatInstant(ms, timeZone) : isoUtc(ms));
  const day = (date: unknown) =>
    timeZone && typeof date === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(date) ? formatDate(date) : date;
  switch (condition) {
    case 'dp-low-in-range':
      return `${subject} reads ${pct(detail.shareOfSpan)} of its span, below ${pct(detail.thresholdShareOfSpan, 0)}, while it is the DP in use and there is flow: its error is a large share of the reading.`;
    case 'dp-over-range':
      return `${subject} reads ${pct(detail.shareOfSpan)} of its span, above ${pct(detail.thresholdShareOfSpan, 0)}: the DP is over range and flow is under-registered.`;
    case 'stack-disagreement':
      return `${subject}: the stacked DP pair differ by ${pct(detail.differenceShareOfLowSpan, 2)} of the low-range span in their overlap (tolerance ${pct(detail.toleranceShareOfSpan, 2)}).`;
    case 'frozen':
      return `${subject} shows no variation for ${Math.round(Number(detail.windowS) / 60)} min (${detail.count} readings, σ = ${pct(detail.stdDevShareOfSpan, 4)} of span): the transmitter may be frozen.`;
    case 'stale':
      return `${subject} has sent no reading since ${iso(detail.lastReadingMs)} (limit ${Math.round(Number(detail.maxAgeS) / 60)} min).`;
    case 'bad-quality':
      return `${subject} reports bad-quality readings.`;
    case 'outside-standard-limits':
      return `${subject} is outside the limits of its standard (Re_D, β, pressure ratio) in the hour from ${iso(detail.hourStartMs)}.`;
    case 'calibration-due':
      return `${subject} is due for calibration on ${day(detail.calibrationDue)}.`;
    case 'calibration-overdue':
      return `${subject} is overdue for calibration (due ${day(detail.calibrationDue)}).`;
    case 'reconciliation-out-of-tolerance':
      return `${subject}: the contract day from ${iso(detail.dayStartMs)} differs from the field total by ${num(detail.differencePercent)} % (${detail.quantity}), outside the tolerance of ${num(detail.tolerancePercent)} %.`;
    case 'balance-out-of-tolerance':
      return `${subject}: the contract day from ${iso(detail.dayStartMs)} is out of balance by ${num(detail.imbalancePercent)} % of the inlet (${num(detail.imbalanceM3, 0)} m³), outside the tolerance of ${num(detail.tolerancePercent)} %${detail.exceedsUncertainty === 'true' ? '; larger than its own uncertainty' : detail.exceedsUncertainty === 'false' ? '; within its own uncertainty' : ''}.`;
    case 'care-due':
      return `${subject}: element care due soon: ${detail.records}.`;
    case 'care-overdue':
      return `${subject}: element care overdue: ${detail.records}.`;
    case 'reverse-flow':
      // Judged live from the DP (sinceMs) or from an hourly record (hourStartMs).
      if (typeof detail.sinceMs === 'number')
        return `${subject} is a one-way meter run and reads reverse flow since ${iso(detail.sinceMs)} (DP ${pct(detail.shareOfSpan)} of its span below zero): it is not counted as flow.`;
      return `${subject} is a one-way meter run and saw reverse flow in the hour from ${iso(detail.hourStartMs)}: it is not counted as flow.`;
    default:
      return `${subject}: ${condition}.`;
  }
}
