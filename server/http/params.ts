import { z } from 'zod';
import { DateTime } from 'luxon';
import { badRequest, notFound } from '../errors';
import { contractDayBounds } from '../../shared/history/contract-day';

/**
 * The one parser for what routes read from a URL: record ids and time windows. Every route uses
 * these, so an id or a window is refused the same way everywhere.
 */

const dayMs = 86_400_000;
const digits = /^\d+$/;
/** The largest PostgreSQL bigint: a longer run of digits names no record, and must not reach SQL as one. */
const maxBigint = 9_223_372_036_854_775_807n;

/** Digits that fit a bigint; an id beyond it would make PostgreSQL fail the whole query ("out of range"). */
const isBigintId = (text: string) => digits.test(text) && BigInt(text) <= maxBigint;

/**
 * A record id from a path (`/:id`). Ids are PostgreSQL bigints, carried as decimal strings so
 * no precision is lost. Anything else cannot name a record, so it is "not found", not a 400.
 * @param value the raw path parameter
 * @param what the record's name as a person says it ("Meter run"), for the 404 message
 */
export function parseId(value: unknown, what: string): string {
  const text = String(value ?? '');
  if (!isBigintId(text)) throw notFound(what);
  return text;
}

/**
 * A zod field for an id given in a query or body ("must be a meter run id"); numbers are accepted too,
 * up to Number.MAX_SAFE_INTEGER (a larger number has already lost digits when JSON was parsed).
 */
export const idField = (what: string) =>
  z
    .union(
      [
        z.number().int().positive().max(Number.MAX_SAFE_INTEGER),
        z.string().regex(digits, `must be a ${what} id`).refine(isBigintId, `must be a ${what} id`),
      ],
      { error: `must be a ${what} id` },
    )
    .transform(String);

/** A zod field for an instant: ISO 8601 with an offset or Z, never a local time without a zone. */
export const isoInstant = z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' });

/** A zod field for an instant, or a plain date YYYY-MM-DD meaning the start of that date in a zone chosen later. */
export const isoInstantOrDate = z.union([isoInstant, z.iso.date()], {
  error: 'must be ISO 8601 with an offset or Z, or a date YYYY-MM-DD',
});

/** A half-open window [fromMs, toMs) in epoch milliseconds. */
export interface TimeWindow {
  fromMs: number;
  toMs: number;
}

/**
 * Turns validated `from`/`to` strings into a window, refusing an empty or reversed window and
 * one longer than `maxDays`, naming `to` as the field at fault.
 * @param timeZone the zone a plain date is read in (a site's zone); without it only instants are valid
 * @param contractHour with timeZone: a plain date names the contract day (or month) that starts on
 *   it, so it is read as that date at the contract hour ("from=2026-11-01" by day begins with the
 *   contract day starting on 1 November, not with the one of 31 October that midnight falls in);
 *   without it, a plain date is the local midnight starting it
 */
export function parseTimeWindow(
  query: { from: string; to: string },
  options: { maxDays: number; timeZone?: string; contractHour?: number; what?: string },
): TimeWindow {
  const instant = (value: string) =>
    value.length === 10 && options.timeZone
      ? options.contractHour !== undefined
        ? contractDayBounds(value, options.timeZone, options.contractHour).startMs
        : DateTime.fromISO(value, { zone: options.timeZone }).toMillis()
      : Date.parse(value);
  const fromMs = instant(query.from);
  const toMs = instant(query.to);
  if (toMs <= fromMs) throw badRequest('to: must be after from', 'to');
  if (toMs - fromMs > options.maxDays * dayMs) {
    throw badRequest(
      `to: at most ${options.maxDays} days${options.what ? ` of ${options.what}` : ''} per request`,
      'to',
    );
  }
  return { fromMs, toMs };
}
